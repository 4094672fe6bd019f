import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationPreviewSchema } from '../../../../shared/schemas/auth';
import { apiRequest } from '../../../lib/api-client';

export const fetchInvitationPreview = (token: string, signal?: AbortSignal) =>
  apiRequest(`/api/auth/invitations/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema, allowUnauthenticated: true, signal });

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitation-preview', token] as const,
    queryFn: ({ signal }) => fetchInvitationPreview(token, signal),
    enabled: token.length > 0,
    staleTime: Infinity,
  });

export const useInvitationPreview = (token: string) => useQuery(invitationPreviewQueryOptions(token));

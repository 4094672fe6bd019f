import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationSchema } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';

export const fetchInvitations = (signal?: AbortSignal) => apiRequest('/api/invitations', { schema: invitationSchema.array(), signal });

export const invitationsQueryOptions = () =>
  queryOptions({
    queryKey: ['invitations'] as const,
    queryFn: ({ signal }) => fetchInvitations(signal),
  });

export const useInvitations = () => useQuery(invitationsQueryOptions());

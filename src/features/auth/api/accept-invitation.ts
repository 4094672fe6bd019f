import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meSchema, type AcceptInvitationInput } from '../../../../shared/schemas/auth';
import { apiRequest } from '../../../lib/api-client';
import { replaceSession } from './get-me';

export const acceptInvitation = (input: AcceptInvitationInput) =>
  apiRequest('/api/auth/accept-invitation', { method: 'POST', body: input, schema: meSchema, allowUnauthenticated: true });

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (me) => replaceSession(queryClient, me),
  });
}

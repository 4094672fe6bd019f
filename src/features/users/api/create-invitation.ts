import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, type CreateInvitationInput } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';
import { invitationsQueryOptions } from './get-invitations';

export const createInvitation = (input: CreateInvitationInput) => apiRequest('/api/invitations', { method: 'POST', body: input, schema: invitationSchema });

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions().queryKey }),
  });
}

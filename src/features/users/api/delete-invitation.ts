import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { invitationsQueryOptions } from './get-invitations';

/** Revokes a pending invitation. */
export const deleteInvitation = (invitationId: string) => apiRequest(`/api/invitations/${encodeURIComponent(invitationId)}`, { method: 'DELETE' });

export function useDeleteInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions().queryKey }),
  });
}

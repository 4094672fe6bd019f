import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { membersQueryOptions } from './get-members';

export const deleteMember = (membershipId: string) => apiRequest(`/api/members/${encodeURIComponent(membershipId)}`, { method: 'DELETE' });

export function useDeleteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions().queryKey }),
  });
}

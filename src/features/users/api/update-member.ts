import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateMemberInput } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';
import { membersQueryOptions } from './get-members';

export const updateMember = ({ membershipId, input }: { membershipId: string; input: UpdateMemberInput }) =>
  apiRequest(`/api/members/${encodeURIComponent(membershipId)}`, { method: 'PATCH', body: input });

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions().queryKey }),
  });
}

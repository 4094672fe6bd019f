import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { vesselsQueryOptions } from './get-vessels';

export const deleteGenset = ({ vesselId, gensetId }: { vesselId: string; gensetId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/gensets/${encodeURIComponent(gensetId)}`, { method: 'DELETE' });

export function useDeleteGenset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteGenset,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vesselsQueryOptions().queryKey }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { vesselQueryOptions } from './get-vessel';
import { vesselsQueryOptions } from './get-vessels';

export const deleteVessel = (vesselId: string) => apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}`, { method: 'DELETE' });

export function useDeleteVessel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteVessel,
    onSuccess: (_void, vesselId) => {
      queryClient.removeQueries({ queryKey: vesselQueryOptions(vesselId).queryKey });
      return queryClient.invalidateQueries({ queryKey: vesselsQueryOptions().queryKey });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { VesselUpdate } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';
import { vesselsQueryOptions } from './get-vessels';

export const updateVessel = ({ vesselId, changes }: { vesselId: string; changes: VesselUpdate }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}`, { method: 'PATCH', body: changes });

export function useUpdateVessel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateVessel,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vesselsQueryOptions().queryKey }),
  });
}

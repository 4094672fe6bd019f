import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fuelLotSchema, type FuelLotInput } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { fuelLotsQueryOptions } from './get-fuel-lots';

export const saveFuelLot = ({ vesselId, lotId, input }: { vesselId: string; lotId?: string; input: FuelLotInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/fuel-lots${lotId ? `/${encodeURIComponent(lotId)}` : ''}`, {
    method: lotId ? 'PATCH' : 'POST',
    body: input,
    schema: fuelLotSchema,
  });

export function useSaveFuelLot(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveFuelLot, onSuccess: () => queryClient.invalidateQueries({ queryKey: fuelLotsQueryOptions(vesselId).queryKey }) });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { vesselDetailSchema, type VesselInput } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';
import { vesselsQueryOptions } from './get-vessels';

export const createVessel = (input: VesselInput) => apiRequest('/api/vessels', { method: 'POST', body: input, schema: vesselDetailSchema });

export function useCreateVessel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createVessel,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vesselsQueryOptions().queryKey }),
  });
}

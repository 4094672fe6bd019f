import { useMutation, useQueryClient } from '@tanstack/react-query';
import { gensetSchema, type GensetInput } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';
import { vesselsQueryOptions } from './get-vessels';

export const createGenset = ({ vesselId, input }: { vesselId: string; input: GensetInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/gensets`, { method: 'POST', body: input, schema: gensetSchema });

export function useCreateGenset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createGenset,
    // Installed kW and set counts in the fleet list change too, so the whole ['vessels'] prefix goes stale.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vesselsQueryOptions().queryKey }),
  });
}

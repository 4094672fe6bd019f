import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GensetInput } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';
import { vesselsQueryOptions } from './get-vessels';

export const updateGenset = ({ vesselId, gensetId, input }: { vesselId: string; gensetId: string; input: GensetInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/gensets/${encodeURIComponent(gensetId)}`, { method: 'PATCH', body: input });

export function useUpdateGenset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateGenset,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vesselsQueryOptions().queryKey }),
  });
}

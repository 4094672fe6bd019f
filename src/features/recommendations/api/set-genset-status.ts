import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GensetStatusInput } from '../../../../shared/schemas/recommendations';
import { apiRequest } from '../../../lib/api-client';
import { recommendationKeys } from './keys';

export const setGensetStatus = ({ vesselId, gensetId, status }: { vesselId: string; gensetId: string; status: GensetStatusInput }) =>
  apiRequest<unknown>(`/api/vessels/${encodeURIComponent(vesselId)}/gensets/${encodeURIComponent(gensetId)}/status`, { method: 'PUT', body: status });

export function useSetGensetStatus() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setGensetStatus,
    onSuccess: (_d, v) => queryClient.invalidateQueries({ queryKey: recommendationKeys.vessel(v.vesselId) }),
  });
}

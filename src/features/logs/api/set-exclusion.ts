import { useMutation, useQueryClient } from '@tanstack/react-query';
import { logRowSchema, type ExclusionInput } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

export const setExclusion = ({ vesselId, logId, input }: { vesselId: string; logId: string; input: ExclusionInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/logs/${encodeURIComponent(logId)}/exclusion`, { method: 'POST', body: input, schema: logRowSchema });

export function useSetExclusion(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: setExclusion, onSuccess: () => queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }) });
}

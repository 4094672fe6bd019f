import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

export const deleteLog = ({ vesselId, logId }: { vesselId: string; logId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/logs/${encodeURIComponent(logId)}`, { method: 'DELETE' });

export function useDeleteLog(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteLog, onSuccess: () => queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }) });
}

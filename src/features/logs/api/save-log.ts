import { useMutation, useQueryClient } from '@tanstack/react-query';
import { logRowSchema, type LogEntryInput } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

/** Creates a day (no logId) or replaces an existing day's raw values. */
export const saveLog = ({ vesselId, logId, input }: { vesselId: string; logId?: string; input: LogEntryInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/logs${logId ? `/${encodeURIComponent(logId)}` : ''}`, {
    method: logId ? 'PATCH' : 'POST',
    body: input,
    schema: logRowSchema,
  });

export function useSaveLog(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveLog, onSuccess: () => queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }) });
}

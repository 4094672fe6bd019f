import { useMutation, useQueryClient } from '@tanstack/react-query';
import { modeHoursRowSchema, type ModeHoursInput } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

export const putModeHours = ({ vesselId, logDate, input }: { vesselId: string; logDate: string; input: ModeHoursInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/mode-hours/${encodeURIComponent(logDate)}`, { method: 'PUT', body: input, schema: modeHoursRowSchema });

export function usePutModeHours(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: putModeHours, onSuccess: () => queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }) });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meterReplacementSchema, type MeterReplacementInput } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';
import { logsKeys } from './keys';

export const createMeterReplacement = ({ vesselId, input }: { vesselId: string; input: MeterReplacementInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/meter-replacements`, { method: 'POST', body: input, schema: meterReplacementSchema });

export function useCreateMeterReplacement(vesselId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createMeterReplacement, onSuccess: () => queryClient.invalidateQueries({ queryKey: logsKeys.all(vesselId) }) });
}

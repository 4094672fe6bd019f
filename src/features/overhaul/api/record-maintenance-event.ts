import { useMutation, useQueryClient } from '@tanstack/react-query';
import { maintenanceEventSchema, type MaintenanceEventInput } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

export const recordMaintenanceEvent = ({ vesselId, input }: { vesselId: string; input: MaintenanceEventInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/maintenance-events`, { method: 'POST', body: input, schema: maintenanceEventSchema });

/** Completed work changes every count and due date (and the curves' windows), so everything overhaul refetches. */
export function useRecordMaintenanceEvent() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordMaintenanceEvent,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: overhaulKeys.all }), queryClient.invalidateQueries({ queryKey: ['curves'] })]),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { hourBudgetPlanSchema, type StaggerRequest } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

/** Stores a stagger proposal as a proposed hour-budget plan. */
export const saveHourBudget = ({ vesselId, input }: { vesselId: string; input: StaggerRequest }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/hour-budgets`, { method: 'POST', body: input, schema: hourBudgetPlanSchema });

export function useSaveHourBudget() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: saveHourBudget, onSuccess: (_d, v) => queryClient.invalidateQueries({ queryKey: overhaulKeys.vessel(v.vesselId) }) });
}

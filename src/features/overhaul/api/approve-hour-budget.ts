import { useMutation, useQueryClient } from '@tanstack/react-query';
import { hourBudgetPlanSchema } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

/** Approves a proposed plan: voyage plans of the vessel then keep to its hour budgets. */
export const approveHourBudget = ({ vesselId, planId }: { vesselId: string; planId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/hour-budgets/${encodeURIComponent(planId)}/approve`, { method: 'POST', schema: hourBudgetPlanSchema });

export function useApproveHourBudget() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: approveHourBudget,
    onSuccess: (_d, v) => Promise.all([queryClient.invalidateQueries({ queryKey: overhaulKeys.vessel(v.vesselId) }), queryClient.invalidateQueries({ queryKey: ['plans', v.vesselId] })]),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { planDetailSchema } from '../../../../shared/schemas/plans';
import { apiRequest } from '../../../lib/api-client';
import { planKeys } from './get-plans';

export const approvePlan = ({ vesselId, planId }: { vesselId: string; planId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plans/${encodeURIComponent(planId)}/approve`, { method: 'POST', schema: planDetailSchema });

export function useApprovePlan() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: approvePlan, onSuccess: (_d, v) => queryClient.invalidateQueries({ queryKey: planKeys.vessel(v.vesselId) }) });
}

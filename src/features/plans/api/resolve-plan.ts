import { useMutation, useQueryClient } from '@tanstack/react-query';
import { planDetailSchema } from '../../../../shared/schemas/plans';
import { apiRequest } from '../../../lib/api-client';
import { planKeys } from './get-plans';

export const resolvePlan = ({ vesselId, planId }: { vesselId: string; planId: string }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plans/${encodeURIComponent(planId)}/resolve`, { method: 'POST', schema: planDetailSchema });

export function useResolvePlan() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resolvePlan, onSuccess: (_d, v) => queryClient.invalidateQueries({ queryKey: planKeys.vessel(v.vesselId) }) });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { planDetailSchema, type PlanInput } from '../../../../shared/schemas/plans';
import { apiRequest } from '../../../lib/api-client';
import { planKeys } from './get-plans';

export const createPlan = ({ vesselId, input }: { vesselId: string; input: PlanInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plans`, { method: 'POST', body: input, schema: planDetailSchema });

export function useCreatePlan() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createPlan, onSuccess: (_d, v) => queryClient.invalidateQueries({ queryKey: planKeys.vessel(v.vesselId) }) });
}

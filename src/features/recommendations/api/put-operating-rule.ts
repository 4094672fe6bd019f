import { useMutation, useQueryClient } from '@tanstack/react-query';
import { operatingRulesSchema, type OperatingModeName, type OperatingRuleInput } from '../../../../shared/schemas/recommendations';
import { apiRequest } from '../../../lib/api-client';
import { recommendationKeys } from './keys';

export const putOperatingRule = ({ vesselId, mode, rule }: { vesselId: string; mode: OperatingModeName; rule: OperatingRuleInput }) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/operating-rules/${mode}`, { method: 'PUT', body: rule, schema: operatingRulesSchema });

export function usePutOperatingRule() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: putOperatingRule,
    onSuccess: (_d, v) => queryClient.invalidateQueries({ queryKey: recommendationKeys.vessel(v.vesselId) }),
  });
}

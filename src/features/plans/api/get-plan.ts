import { queryOptions, useQuery } from '@tanstack/react-query';
import { planDetailSchema } from '../../../../shared/schemas/plans';
import { apiRequest } from '../../../lib/api-client';
import { planKeys } from './get-plans';

export const fetchPlan = (vesselId: string, planId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plans/${encodeURIComponent(planId)}`, { schema: planDetailSchema, signal });

/** Polls every second while the plan is queued or solving. */
export const planQueryOptions = (vesselId: string, planId: string) =>
  queryOptions({
    queryKey: [...planKeys.vessel(vesselId), 'plan', planId] as const,
    queryFn: ({ signal }) => fetchPlan(vesselId, planId, signal),
    refetchInterval: (q) => (q.state.data && (q.state.data.status === 'queued' || q.state.data.status === 'solving') ? 1000 : false),
  });

export const usePlan = (vesselId: string, planId: string) => useQuery(planQueryOptions(vesselId, planId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { planSummarySchema } from '../../../../shared/schemas/plans';
import { apiRequest } from '../../../lib/api-client';

export const planKeys = { vessel: (vesselId: string) => ['plans', vesselId] as const };

export const fetchPlans = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plans`, { schema: z.array(planSummarySchema), signal });

export const plansQueryOptions = (vesselId: string) =>
  queryOptions({ queryKey: [...planKeys.vessel(vesselId), 'list'] as const, queryFn: ({ signal }) => fetchPlans(vesselId, signal) });

export const usePlans = (vesselId: string) => useQuery(plansQueryOptions(vesselId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { hourBudgetPlanSchema } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

export const fetchHourBudgets = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/hour-budgets`, { schema: z.array(hourBudgetPlanSchema), signal });

export const hourBudgetsQueryOptions = (vesselId: string) =>
  queryOptions({ queryKey: [...overhaulKeys.vessel(vesselId), 'budgets'] as const, queryFn: ({ signal }) => fetchHourBudgets(vesselId, signal) });

export const useHourBudgets = (vesselId: string) => useQuery(hourBudgetsQueryOptions(vesselId));

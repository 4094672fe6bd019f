import { queryOptions, useQuery } from '@tanstack/react-query';
import { operatingRulesSchema } from '../../../../shared/schemas/recommendations';
import { apiRequest } from '../../../lib/api-client';
import { recommendationKeys } from './keys';

export const fetchOperatingRules = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/operating-rules`, { schema: operatingRulesSchema, signal });

export const operatingRulesQueryOptions = (vesselId: string) =>
  queryOptions({ queryKey: [...recommendationKeys.vessel(vesselId), 'rules'] as const, queryFn: ({ signal }) => fetchOperatingRules(vesselId, signal) });

export const useOperatingRules = (vesselId: string) => useQuery(operatingRulesQueryOptions(vesselId));

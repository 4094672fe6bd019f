import { queryOptions, useQuery } from '@tanstack/react-query';
import { fleetOverhaulSchema } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

export const fetchFleetOverhaul = (windowDays: 30 | 90, signal?: AbortSignal) =>
  apiRequest(`/api/fleet/overhaul?windowDays=${windowDays}`, { schema: fleetOverhaulSchema, signal });

export const fleetOverhaulQueryOptions = (windowDays: 30 | 90) =>
  queryOptions({ queryKey: [...overhaulKeys.fleet(), windowDays] as const, queryFn: ({ signal }) => fetchFleetOverhaul(windowDays, signal) });

export const useFleetOverhaul = (windowDays: 30 | 90) => useQuery(fleetOverhaulQueryOptions(windowDays));

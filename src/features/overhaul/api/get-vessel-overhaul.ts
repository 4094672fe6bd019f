import { queryOptions, useQuery } from '@tanstack/react-query';
import { vesselOverhaulSchema } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

export type OverhaulUsage = { usage: 'recent'; windowDays: 30 | 90 } | { usage: 'plan'; windowDays: 30 | 90; planId: string; planStartDate?: string };

function queryString(u: OverhaulUsage): string {
  const q = new URLSearchParams({ usage: u.usage, windowDays: String(u.windowDays) });
  if (u.usage === 'plan') {
    q.set('planId', u.planId);
    if (u.planStartDate) q.set('planStartDate', u.planStartDate);
  }
  return q.toString();
}

export const fetchVesselOverhaul = (vesselId: string, usage: OverhaulUsage, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/overhaul?${queryString(usage)}`, { schema: vesselOverhaulSchema, signal });

export const vesselOverhaulQueryOptions = (vesselId: string, usage: OverhaulUsage) =>
  queryOptions({ queryKey: [...overhaulKeys.vessel(vesselId), 'due', usage] as const, queryFn: ({ signal }) => fetchVesselOverhaul(vesselId, usage, signal) });

export const useVesselOverhaul = (vesselId: string, usage: OverhaulUsage) => useQuery(vesselOverhaulQueryOptions(vesselId, usage));

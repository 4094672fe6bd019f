import { queryOptions, useQuery } from '@tanstack/react-query';
import { vesselCurvesSchema, type CurveWindowKind } from '../../../../shared/schemas/curves';
import { apiRequest } from '../../../lib/api-client';

/** A window as the curve endpoints take it; `from`/`to` only for 'custom'. */
export interface CurveWindowChoice {
  kind: CurveWindowKind;
  from?: string;
  to?: string;
}

export function windowSearch(w: CurveWindowChoice): string {
  const q = new URLSearchParams({ window: w.kind });
  if (w.kind === 'custom') {
    if (w.from) q.set('from', w.from);
    if (w.to) q.set('to', w.to);
  }
  return q.toString();
}

export const fetchVesselCurves = (vesselId: string, w: CurveWindowChoice, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/curves?${windowSearch(w)}`, { schema: vesselCurvesSchema, signal });

/** Key ['curves', vesselId, ...]: every curve query of a vessel shares the prefix, so one invalidation refreshes them. */
export const vesselCurvesQueryOptions = (vesselId: string, w: CurveWindowChoice) =>
  queryOptions({
    queryKey: ['curves', vesselId, 'sets', w.kind, w.from ?? null, w.to ?? null] as const,
    queryFn: ({ signal }) => fetchVesselCurves(vesselId, w, signal),
  });

export const useVesselCurves = (vesselId: string, w: CurveWindowChoice, enabled = true) =>
  useQuery({ ...vesselCurvesQueryOptions(vesselId, w), enabled });

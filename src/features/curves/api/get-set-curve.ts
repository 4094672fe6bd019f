import { queryOptions, useQuery } from '@tanstack/react-query';
import { curveSetDetailSchema } from '../../../../shared/schemas/curves';
import { apiRequest } from '../../../lib/api-client';
import { windowSearch, type CurveWindowChoice } from './get-vessel-curves';

export const fetchSetCurve = (vesselId: string, gensetId: string, w: CurveWindowChoice, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/curves/${encodeURIComponent(gensetId)}?${windowSearch(w)}`, {
    schema: curveSetDetailSchema,
    signal,
  });

export const setCurveQueryOptions = (vesselId: string, gensetId: string, w: CurveWindowChoice) =>
  queryOptions({
    queryKey: ['curves', vesselId, 'set', gensetId, w.kind, w.from ?? null, w.to ?? null] as const,
    queryFn: ({ signal }) => fetchSetCurve(vesselId, gensetId, w, signal),
  });

export const useSetCurve = (vesselId: string, gensetId: string | null, w: CurveWindowChoice, enabled = true) =>
  useQuery({ ...setCurveQueryOptions(vesselId, gensetId ?? '', w), enabled: enabled && gensetId !== null });

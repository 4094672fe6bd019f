import { queryOptions, useQuery } from '@tanstack/react-query';
import { guidelineSchema } from '../../../../shared/schemas/recommendations';
import { apiRequest } from '../../../lib/api-client';
import { recommendationKeys } from './keys';

/** The current guideline (a new version is stored by the server when curves, rules or plant changed). */
export const fetchCurrentGuideline = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/guidelines/current`, { method: 'POST', schema: guidelineSchema, signal });

export const fetchGuidelineVersion = (vesselId: string, version: number, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/guidelines/${version}`, { schema: guidelineSchema, signal });

export const guidelineQueryOptions = (vesselId: string, version: number | null) =>
  queryOptions({
    queryKey: [...recommendationKeys.vessel(vesselId), 'guideline', version ?? 'current'] as const,
    queryFn: ({ signal }) => (version === null ? fetchCurrentGuideline(vesselId, signal) : fetchGuidelineVersion(vesselId, version, signal)),
  });

export const useGuideline = (vesselId: string, version: number | null) => useQuery(guidelineQueryOptions(vesselId, version));

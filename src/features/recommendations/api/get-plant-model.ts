import { queryOptions, useQuery } from '@tanstack/react-query';
import { plantModelSchema } from '../../../../shared/schemas/recommendations';
import { apiRequest } from '../../../lib/api-client';
import { recommendationKeys } from './keys';

export const fetchPlantModel = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/plant-model`, { schema: plantModelSchema, signal });

export const plantModelQueryOptions = (vesselId: string) =>
  queryOptions({ queryKey: [...recommendationKeys.vessel(vesselId), 'plant'] as const, queryFn: ({ signal }) => fetchPlantModel(vesselId, signal) });

export const usePlantModel = (vesselId: string) => useQuery(plantModelQueryOptions(vesselId));

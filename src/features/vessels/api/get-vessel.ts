import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import { vesselDetailSchema } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';
import { vesselsQueryOptions } from './get-vessels';

export const fetchVessel = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}`, { schema: vesselDetailSchema, signal });

export const vesselQueryOptions = (vesselId: string) =>
  queryOptions({
    queryKey: [...vesselsQueryOptions().queryKey, vesselId] as const,
    queryFn: ({ signal }) => fetchVessel(vesselId, signal),
  });

export const useVessel = (vesselId: string) => useQuery(vesselQueryOptions(vesselId));

/** Several vessels' details at once (the fleet overview lists each vessel's sets). */
export const useVesselDetails = (vesselIds: readonly string[]) => useQueries({ queries: vesselIds.map((id) => vesselQueryOptions(id)) });

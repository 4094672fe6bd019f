import { queryOptions, useQuery } from '@tanstack/react-query';
import { vesselSummarySchema } from '../../../../shared/schemas/vessels';
import { apiRequest } from '../../../lib/api-client';

export const fetchVessels = (signal?: AbortSignal) => apiRequest('/api/vessels', { schema: vesselSummarySchema.array(), signal });

/** Key ['vessels']: also the prefix of every vessel's detail, so one invalidation refreshes list and details. */
export const vesselsQueryOptions = () =>
  queryOptions({
    queryKey: ['vessels'] as const,
    queryFn: ({ signal }) => fetchVessels(signal),
  });

export const useVessels = () => useQuery(vesselsQueryOptions());

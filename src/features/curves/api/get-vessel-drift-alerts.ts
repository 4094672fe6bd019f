import { queryOptions, useQuery } from '@tanstack/react-query';
import { vesselDriftAlertsSchema } from '../../../../shared/schemas/curves';
import { apiRequest } from '../../../lib/api-client';

export const fetchVesselDriftAlerts = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/curves/alerts`, { schema: vesselDriftAlertsSchema, signal });

export const vesselDriftAlertsQueryOptions = (vesselId: string) =>
  queryOptions({
    queryKey: ['curves', vesselId, 'alerts'] as const,
    queryFn: ({ signal }) => fetchVesselDriftAlerts(vesselId, signal),
  });

export const useVesselDriftAlerts = (vesselId: string) => useQuery(vesselDriftAlertsQueryOptions(vesselId));

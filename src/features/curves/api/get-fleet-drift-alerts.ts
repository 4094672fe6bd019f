import { queryOptions, useQuery } from '@tanstack/react-query';
import { fleetDriftAlertsSchema } from '../../../../shared/schemas/curves';
import { apiRequest } from '../../../lib/api-client';

export const fetchFleetDriftAlerts = (signal?: AbortSignal) => apiRequest('/api/curves/alerts', { schema: fleetDriftAlertsSchema, signal });

export const fleetDriftAlertsQueryOptions = () =>
  queryOptions({
    queryKey: ['curves', 'fleet-alerts'] as const,
    queryFn: ({ signal }) => fetchFleetDriftAlerts(signal),
  });

export const useFleetDriftAlerts = () => useQuery(fleetDriftAlertsQueryOptions());

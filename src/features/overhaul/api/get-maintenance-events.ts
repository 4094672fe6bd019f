import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { maintenanceEventSchema } from '../../../../shared/schemas/overhaul';
import { apiRequest } from '../../../lib/api-client';
import { overhaulKeys } from './keys';

export const fetchMaintenanceEvents = (vesselId: string, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/maintenance-events`, { schema: z.array(maintenanceEventSchema), signal });

export const maintenanceEventsQueryOptions = (vesselId: string) =>
  queryOptions({ queryKey: [...overhaulKeys.vessel(vesselId), 'events'] as const, queryFn: ({ signal }) => fetchMaintenanceEvents(vesselId, signal) });

export const useMaintenanceEvents = (vesselId: string) => useQuery(maintenanceEventsQueryOptions(vesselId));

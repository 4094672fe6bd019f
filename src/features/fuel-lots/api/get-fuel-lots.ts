import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { fuelLotSchema } from '../../../../shared/schemas/logs';
import { apiRequest } from '../../../lib/api-client';

export const fuelLotsQueryOptions = (vesselId: string) =>
  queryOptions({
    queryKey: ['vessels', vesselId, 'fuel-lots'] as const,
    queryFn: ({ signal }) => apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/fuel-lots`, { schema: z.array(fuelLotSchema), signal }),
  });

export const useFuelLots = (vesselId: string) => useQuery(fuelLotsQueryOptions(vesselId));

export const attachmentUrl = (vesselId: string, lotId: string) => `/api/vessels/${encodeURIComponent(vesselId)}/fuel-lots/${encodeURIComponent(lotId)}/attachment`;

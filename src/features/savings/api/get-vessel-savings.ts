import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { VesselSavingsReport } from '../../../../shared/schemas/savings';
import { apiRequest } from '../../../lib/api-client';

/** Shallow check of the answer's shape (the full type is the shared VesselSavingsReport). */
const vesselSavingsReportSchema = z.custom<VesselSavingsReport>(
  (v) => typeof v === 'object' && v !== null && 'period' in v && Array.isArray((v as { days?: unknown }).days) && Array.isArray((v as { byMonth?: unknown }).byMonth),
);

export interface SavingsPeriod {
  from: string;
  to: string;
}

export const fetchVesselSavings = (vesselId: string, p: SavingsPeriod, signal?: AbortSignal) =>
  apiRequest(`/api/vessels/${encodeURIComponent(vesselId)}/savings?${new URLSearchParams({ from: p.from, to: p.to })}`, { schema: vesselSavingsReportSchema, signal });

export const vesselSavingsQueryOptions = (vesselId: string, p: SavingsPeriod) =>
  queryOptions({
    queryKey: ['savings', vesselId, p.from, p.to] as const,
    queryFn: ({ signal }) => fetchVesselSavings(vesselId, p, signal),
  });

export const useVesselSavings = (vesselId: string, p: SavingsPeriod) => useQuery(vesselSavingsQueryOptions(vesselId, p));

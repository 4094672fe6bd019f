import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { FleetBenchmark } from '../../../../shared/schemas/fleet';
import { apiRequest } from '../../../lib/api-client';

/** Shallow check of the answer's shape (the full type is the shared FleetBenchmark). */
const fleetBenchmarkSchema = z.custom<FleetBenchmark>(
  (v) => typeof v === 'object' && v !== null && Array.isArray((v as { vessels?: unknown }).vessels) && Array.isArray((v as { sets?: unknown }).sets) && typeof (v as { method?: unknown }).method === 'object',
);

export interface BenchmarkPeriod {
  from: string;
  to: string;
}

export const fetchFleetBenchmark = (p: BenchmarkPeriod, signal?: AbortSignal) =>
  apiRequest(`/api/fleet/benchmark?${new URLSearchParams({ from: p.from, to: p.to })}`, { schema: fleetBenchmarkSchema, signal });

export const fleetBenchmarkQueryOptions = (p: BenchmarkPeriod) =>
  queryOptions({
    queryKey: ['fleet-benchmark', p.from, p.to] as const,
    queryFn: ({ signal }) => fetchFleetBenchmark(p, signal),
  });

export const useFleetBenchmark = (p: BenchmarkPeriod) => useQuery(fleetBenchmarkQueryOptions(p));

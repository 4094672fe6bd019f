import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { FuelPriceRow } from '../../../../shared/schemas/savings';
import { apiRequest } from '../../../lib/api-client';

/** Shallow check of the list (rows are the shared FuelPriceRow). */
export const fuelPriceRowsSchema = z.custom<FuelPriceRow[]>((v) => Array.isArray(v));

export const fetchFuelPrices = (signal?: AbortSignal) => apiRequest('/api/fuel-prices', { schema: fuelPriceRowsSchema, signal });

/** The company's fuel prices per grade and valid-from date. */
export const fuelPricesQueryOptions = () =>
  queryOptions({
    queryKey: ['fuel-prices'] as const,
    queryFn: ({ signal }) => fetchFuelPrices(signal),
  });

export const useFuelPrices = () => useQuery(fuelPricesQueryOptions());

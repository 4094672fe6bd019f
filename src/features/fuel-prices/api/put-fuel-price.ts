import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FuelPriceInput } from '../../../../shared/schemas/savings';
import { apiRequest } from '../../../lib/api-client';
import { fuelPriceRowsSchema, fuelPricesQueryOptions } from './get-fuel-prices';

/** Sets the price of a grade from a date (replacing one of the same grade and date); answers the whole list. */
export const putFuelPrice = (input: FuelPriceInput) => apiRequest('/api/fuel-prices', { method: 'PUT', body: input, schema: fuelPriceRowsSchema });

export function usePutFuelPrice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: putFuelPrice,
    onSuccess: (rows) => {
      queryClient.setQueryData(fuelPricesQueryOptions().queryKey, rows);
      // Costs on the savings, benchmark and report pages use these prices.
      void queryClient.invalidateQueries({ queryKey: ['savings'] });
      void queryClient.invalidateQueries({ queryKey: ['reports'] });
      void queryClient.invalidateQueries({ queryKey: ['fleet-benchmark'] });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { fuelPricesQueryOptions } from './get-fuel-prices';

/** Removes one fuel price. */
export const deleteFuelPrice = (priceId: string) => apiRequest(`/api/fuel-prices/${encodeURIComponent(priceId)}`, { method: 'DELETE' });

export function useDeleteFuelPrice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteFuelPrice,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: fuelPricesQueryOptions().queryKey });
      void queryClient.invalidateQueries({ queryKey: ['savings'] });
      void queryClient.invalidateQueries({ queryKey: ['reports'] });
      void queryClient.invalidateQueries({ queryKey: ['fleet-benchmark'] });
    },
  });
}

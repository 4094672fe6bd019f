import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { subscriptionsQueryOptions } from './get-subscriptions';

/** Ends one of the signed-in member's subscriptions. */
export const deleteSubscription = (subscriptionId: string) => apiRequest(`/api/subscriptions/${encodeURIComponent(subscriptionId)}`, { method: 'DELETE' });

export function useDeleteSubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSubscription,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: subscriptionsQueryOptions().queryKey }),
  });
}

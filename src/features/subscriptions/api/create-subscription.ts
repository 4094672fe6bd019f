import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SubscriptionInput } from '../../../../shared/schemas/reports';
import { apiRequest } from '../../../lib/api-client';
import { subscriptionRowsSchema, subscriptionsQueryOptions } from './get-subscriptions';

/** Subscribes the signed-in member; answers the whole list of their subscriptions. */
export const createSubscription = (input: SubscriptionInput) => apiRequest('/api/subscriptions', { method: 'POST', body: input, schema: subscriptionRowsSchema });

export function useCreateSubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSubscription,
    onSuccess: (rows) => queryClient.setQueryData(subscriptionsQueryOptions().queryKey, rows),
  });
}

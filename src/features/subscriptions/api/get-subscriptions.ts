import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { SubscriptionRow } from '../../../../shared/schemas/reports';
import { apiRequest } from '../../../lib/api-client';

/** Shallow check of the list (rows are the shared SubscriptionRow). */
export const subscriptionRowsSchema = z.custom<SubscriptionRow[]>((v) => Array.isArray(v));

export const fetchSubscriptions = (signal?: AbortSignal) => apiRequest('/api/subscriptions', { schema: subscriptionRowsSchema, signal });

/** The signed-in member's own subscriptions. */
export const subscriptionsQueryOptions = () =>
  queryOptions({
    queryKey: ['subscriptions'] as const,
    queryFn: ({ signal }) => fetchSubscriptions(signal),
  });

export const useSubscriptions = () => useQuery(subscriptionsQueryOptions());

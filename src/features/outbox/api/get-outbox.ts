import { queryOptions, useQuery } from '@tanstack/react-query';
import { outboxMessageSchema } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';

export const fetchOutbox = (signal?: AbortSignal) => apiRequest('/api/outbox', { schema: outboxMessageSchema.array(), signal });

export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: ['outbox'] as const,
    queryFn: ({ signal }) => fetchOutbox(signal),
    staleTime: 5_000,
  });

export const useOutbox = () => useQuery(outboxQueryOptions());

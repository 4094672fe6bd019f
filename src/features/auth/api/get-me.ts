import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { meSchema, type Me } from '../../../../shared/schemas/auth';
import { apiRequest, isApiError } from '../../../lib/api-client';

/** The signed-in member, or null when there is no session. */
export async function fetchMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await apiRequest('/api/auth/me', { schema: meSchema, allowUnauthenticated: true, signal });
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: ['me'] as const,
    queryFn: ({ signal }) => fetchMe(signal),
    staleTime: 5 * 60_000,
  });

export const useMe = () => useQuery(meQueryOptions());

/**
 * Records a new session (or its end, with null). Everything cached belonged to the previous member, so it goes.
 */
export function replaceSession(queryClient: QueryClient, me: Me | null): void {
  const meKey = meQueryOptions().queryKey;
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meKey[0] });
  queryClient.setQueryData(meKey, me);
}

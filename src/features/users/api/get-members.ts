import { queryOptions, useQuery } from '@tanstack/react-query';
import { memberSchema } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';

export const fetchMembers = (signal?: AbortSignal) => apiRequest('/api/members', { schema: memberSchema.array(), signal });

export const membersQueryOptions = () =>
  queryOptions({
    queryKey: ['members'] as const,
    queryFn: ({ signal }) => fetchMembers(signal),
  });

export const useMembers = () => useQuery(membersQueryOptions());

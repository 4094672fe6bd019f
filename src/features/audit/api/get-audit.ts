import { queryOptions, useQuery } from '@tanstack/react-query';
import { auditEntrySchema } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';

export const fetchAudit = (signal?: AbortSignal) => apiRequest('/api/audit', { schema: auditEntrySchema.array(), signal });

export const auditQueryOptions = () =>
  queryOptions({
    queryKey: ['audit'] as const,
    queryFn: ({ signal }) => fetchAudit(signal),
  });

export const useAudit = () => useQuery(auditQueryOptions());

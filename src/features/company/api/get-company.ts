import { queryOptions, useQuery } from '@tanstack/react-query';
import { companySettingsSchema } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';

export const fetchCompany = (signal?: AbortSignal) => apiRequest('/api/company', { schema: companySettingsSchema, signal });

export const companyQueryOptions = () =>
  queryOptions({
    queryKey: ['company'] as const,
    queryFn: ({ signal }) => fetchCompany(signal),
  });

export const useCompany = () => useQuery(companyQueryOptions());

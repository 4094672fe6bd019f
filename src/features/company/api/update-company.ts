import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CompanySettings } from '../../../../shared/schemas/users';
import { apiRequest } from '../../../lib/api-client';
import { companyQueryOptions } from './get-company';

export const updateCompany = (input: Partial<CompanySettings>) => apiRequest('/api/company', { method: 'PATCH', body: input });

export function useUpdateCompany() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCompany,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: companyQueryOptions().queryKey }),
  });
}

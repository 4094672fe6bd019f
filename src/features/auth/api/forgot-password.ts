import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';

export const requestPasswordReset = (input: { email: string }) =>
  apiRequest('/api/auth/forgot-password', { method: 'POST', body: input, allowUnauthenticated: true });

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });

import { useMutation } from '@tanstack/react-query';
import type { ResetPasswordInput } from '../../../../shared/schemas/auth';
import { apiRequest } from '../../../lib/api-client';

export const resetPassword = (input: ResetPasswordInput) =>
  apiRequest('/api/auth/reset-password', { method: 'POST', body: input, allowUnauthenticated: true });

export const useResetPassword = () => useMutation({ mutationFn: resetPassword });

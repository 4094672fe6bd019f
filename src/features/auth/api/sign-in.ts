import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meSchema, type SignInInput } from '../../../../shared/schemas/auth';
import { apiRequest } from '../../../lib/api-client';
import { replaceSession } from './get-me';

export const signIn = (input: SignInInput) =>
  apiRequest('/api/auth/sign-in', { method: 'POST', body: input, schema: meSchema, allowUnauthenticated: true });

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => replaceSession(queryClient, me),
  });
}

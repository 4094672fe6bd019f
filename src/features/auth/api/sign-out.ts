import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { replaceSession } from './get-me';

export const signOut = () => apiRequest('/api/auth/sign-out', { method: 'POST', allowUnauthenticated: true });

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => replaceSession(queryClient, null),
  });
}

import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import { replaceSession } from '../features/auth/api/get-me';
import { onUnauthenticated } from '../lib/api-client';
import { createQueryClient } from '../lib/query-client';

/** Query cache for the whole app. A 401 from any request ends the session here; the signed-in layout then sends the user to sign-in. */
export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createQueryClient);
  useEffect(() => onUnauthenticated(() => replaceSession(queryClient, null)), [queryClient]);
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}

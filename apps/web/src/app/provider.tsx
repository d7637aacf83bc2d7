import { useEffect, useState, type ReactNode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { setUnauthenticatedHandler } from '../lib/api-client';
import { sessionKeys } from '../lib/auth';
import { createQueryClient } from './query-client';

/**
 * App-wide providers. A 401 from any request forgets the session; the route guard then
 * sends the person to sign-in and back to where they were afterwards.
 */
export function AppProvider({
  children,
  queryClient,
}: {
  children: ReactNode;
  queryClient?: QueryClient;
}) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  useEffect(() => {
    setUnauthenticatedHandler(() => client.setQueryData(sessionKeys.me(), null));
    return () => setUnauthenticatedHandler(() => {});
  }, [client]);
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}

import { QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { sessionQueryKey } from '../features/auth/api/get-session.api';
import { isApiError } from '../lib/api-client';
import { createQueryClient } from '../lib/query-client';

/** When any request says the session is gone, the app forgets it and the guard signs out. */
export function watchForExpiredSession(queryClient: QueryClient): QueryClient {
  const cache: QueryCache = queryClient.getQueryCache();
  cache.config.onError = (error, query) => {
    if (isApiError(error) && error.status === 401 && query.queryKey[0] !== sessionQueryKey[0]) {
      queryClient.setQueryData(sessionQueryKey, null);
    }
  };
  return queryClient;
}

export function AppProviders({ children, queryClient }: { children: ReactNode; queryClient?: QueryClient }) {
  const [client] = useState(() => queryClient ?? watchForExpiredSession(createQueryClient()));
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}

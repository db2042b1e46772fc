// The QueryClient's defaults, in one place.
import { QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

export function createQueryClient(onUnauthorized: () => void = () => undefined): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({
      onError: (err) => {
        if (err instanceof ApiError && err.status === 401) onUnauthorized();
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: true,
        // Client errors will not fix themselves; server and network errors get two more tries.
        retry: (count, err) => !(err instanceof ApiError && err.status >= 400 && err.status < 500) && count < 2,
        throwOnError: (err) => err instanceof ApiError && err.status >= 500 && err.status !== 503,
      },
      mutations: { retry: false },
    },
  });
}

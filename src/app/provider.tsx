// Providers around the whole app: the QueryClient and the router.
import { QueryClientProvider } from '@tanstack/react-query';
import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { createQueryClient } from '../lib/query-client';
import { createAppRouter } from './router';

export function App() {
  const [{ queryClient, router }] = useState(() => {
    let router: ReturnType<typeof createAppRouter> | null = null;
    // A 401 on any query means the session ended: forget cached data and go to sign-in.
    const queryClient = createQueryClient(() => {
      if (!router || router.state.location.pathname === '/sign-in') return;
      queryClient.clear();
      void router.navigate(`/sign-in?next=${encodeURIComponent(router.state.location.pathname)}`);
    });
    router = createAppRouter(queryClient);
    return { queryClient, router };
  });
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}

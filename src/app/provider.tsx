// Providers around the whole app: the QueryClient and the router, made once before the first render.
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import type { FirstGlance } from '../lib/first-glance';
import { createQueryClient } from '../lib/query-client';
import { seedFirstGlance } from './first-glance';
import { createAppRouter } from './router';

export interface AppClients {
  queryClient: QueryClient;
  router: ReturnType<typeof createAppRouter>;
}

/** The query cache (seeded with the page's first glance, if any) and the router, which starts loading at once. */
export function createAppClients(glance: FirstGlance | null): AppClients {
  let router: ReturnType<typeof createAppRouter> | null = null;
  // A 401 on any query means the session ended: forget cached data and go to sign-in.
  const queryClient = createQueryClient(() => {
    if (!router || router.state.location.pathname === '/sign-in') return;
    queryClient.clear();
    void router.navigate(`/sign-in?next=${encodeURIComponent(router.state.location.pathname)}`);
  });
  seedFirstGlance(queryClient, glance);
  router = createAppRouter(queryClient);
  return { queryClient, router };
}

/**
 * Resolves once the router has loaded the first page (its guard, data and code). Rendering before that would
 * draw an empty page over the first glance the server drew; after it, the first render is the whole page.
 */
export function firstPageLoaded({ router }: AppClients): Promise<void> {
  return new Promise((resolve) => {
    if (router.state.initialized) return resolve();
    const stop = router.subscribe((state) => {
      if (!state.initialized) return;
      stop();
      resolve();
    });
  });
}

export function App({ clients }: { clients: AppClients }) {
  return (
    <QueryClientProvider client={clients.queryClient}>
      <RouterProvider router={clients.router} />
    </QueryClientProvider>
  );
}

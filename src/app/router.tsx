// The route table: every screen, its guard and its loader. Pages load on demand.
import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, redirect, type RouteObject } from 'react-router-dom';
import { ANY_ROLE, ATHLETE, HEAD_COACH, STAFF, homeFor, requireUser, type LoaderMaker } from './guards';
import { AppLayout, type PageHandle } from './routes/app-layout';
import { RouteError } from './routes/route-error';
import { NotFound } from './routes/not-found';
import { makeLoader as myWeekLoader } from './routes/my-week.loader';
import type { Role } from '../../shared/schemas';

interface PageModule {
  Component: React.ComponentType;
  makeLoader?: LoaderMaker;
}

/**
 * A lazily loaded page guarded by role; its own loader (if any) runs after the guard. With `eager` (a
 * loader kept out of the page module), the page's data is requested at once, beside the guard and the
 * page's code, instead of after them.
 */
function page(
  queryClient: QueryClient,
  roles: Role[] | null,
  load: () => Promise<PageModule>,
  eager?: LoaderMaker,
): Pick<RouteObject, 'lazy' | 'loader'> {
  if (eager) {
    const own = eager(queryClient);
    return {
      loader: async (args) => {
        const data = own(args);
        // A guard that redirects wins; the data request's own failure is then of no interest.
        data.catch(() => undefined);
        if (roles) await requireUser(queryClient, args.request, roles);
        return data;
      },
      lazy: async () => ({ Component: (await load()).Component }),
    };
  }
  return {
    lazy: async () => {
      const mod = await load();
      const own = mod.makeLoader?.(queryClient);
      return {
        Component: mod.Component,
        loader: async (args: { request: Request; params: Record<string, string | undefined> }) => {
          if (roles) await requireUser(queryClient, args.request, roles);
          return own ? own(args) : null;
        },
      };
    },
  };
}

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    {
      errorElement: <RouteError />,
      children: [
        { path: '/sign-in', ...page(queryClient, null, () => import('./routes/sign-in')) },
        { path: '/forgot-password', ...page(queryClient, null, () => import('./routes/forgot-password')) },
        { path: '/reset-password', ...page(queryClient, null, () => import('./routes/reset-password')) },
        { path: '/accept-invitation', ...page(queryClient, null, () => import('./routes/accept-invitation')) },
        {
          path: '/',
          element: <AppLayout />,
          loader: ({ request }) => requireUser(queryClient, request),
          children: [
            {
              index: true,
              loader: async ({ request }) => redirect(homeFor(await requireUser(queryClient, request))),
            },
            {
              path: 'board',
              ...page(queryClient, STAFF, () => import('./routes/board')),
              handle: { skipLink: { href: '#board-grid', label: 'Skip to the board' } } satisfies PageHandle,
            },
            { path: 'library', ...page(queryClient, STAFF, () => import('./routes/library')) },
            { path: 'accessories', ...page(queryClient, STAFF, () => import('./routes/accessories')) },
            { path: 'roster', ...page(queryClient, STAFF, () => import('./routes/roster')) },
            { path: 'athletes/:athleteId', ...page(queryClient, STAFF, () => import('./routes/athlete')) },
            {
              path: 'athletes/:athleteId/weeks/:week',
              ...page(queryClient, STAFF, () => import('./routes/athlete-week')),
            },
            { path: 'meets', ...page(queryClient, STAFF, () => import('./routes/meets')) },
            { path: 'meets/:meetId/day', ...page(queryClient, STAFF, () => import('./routes/meet-day')) },
            { path: 'meets/:meetId/sheet', ...page(queryClient, STAFF, () => import('./routes/meet-sheet')) },
            { path: 'rules', ...page(queryClient, HEAD_COACH, () => import('./routes/rules')) },
            { path: 'fees', ...page(queryClient, HEAD_COACH, () => import('./routes/fees')) },
            { path: 'my-week', ...page(queryClient, ATHLETE, () => import('./routes/my-week'), myWeekLoader) },
            { path: 'my-history', ...page(queryClient, ATHLETE, () => import('./routes/my-history')) },
            { path: 'my-fee', ...page(queryClient, ATHLETE, () => import('./routes/my-fee')) },
            { path: 'devices', ...page(queryClient, ANY_ROLE, () => import('./routes/devices')) },
            { path: '*', element: <NotFound /> },
          ],
        },
        { path: '*', element: <NotFound /> },
      ],
    },
  ]);
}

// Loader helpers: who may open a page, and where each role lands.
import type { QueryClient } from '@tanstack/react-query';
import { redirect } from 'react-router-dom';
import type { Me, Role } from '../../shared/schemas';
import { isApiError } from '../lib/api-client';
import { meQueryOptions } from '../lib/me';

export const STAFF: Role[] = ['head_coach', 'coach'];
export const HEAD_COACH: Role[] = ['head_coach'];
export const ATHLETE: Role[] = ['athlete'];
export const ANY_ROLE: Role[] = ['head_coach', 'coach', 'athlete'];

export function homeFor(me: Pick<Me, 'role'>): string {
  return me.role === 'athlete' ? '/my-week' : '/board';
}

/** The signed-in user, or a redirect to sign-in (coming back here after) or to the role's home page. */
export async function requireUser(queryClient: QueryClient, request: Request, roles?: Role[]): Promise<Me> {
  let me: Me;
  try {
    me = await queryClient.ensureQueryData(meQueryOptions());
  } catch (err) {
    if (isApiError(err, 401)) {
      const url = new URL(request.url);
      throw redirect(`/sign-in?next=${encodeURIComponent(url.pathname + url.search)}`);
    }
    throw err;
  }
  if (roles && !roles.includes(me.role)) throw redirect(homeFor(me));
  return me;
}

export type LoaderMaker = (
  queryClient: QueryClient,
) => (args: { request: Request; params: Record<string, string | undefined> }) => Promise<unknown>;

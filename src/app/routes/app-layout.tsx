// The signed-in frame: the ink-blue bar with the role's navigation, and the page below it.
import type { MouseEvent } from 'react';
import { NavLink, Outlet, useMatches, useNavigation } from 'react-router-dom';
import type { Role } from '../../../shared/schemas';
import { SKIP_LINK_CLASS } from '../../components/ui/page';
import { useMe } from '../../lib/me';
import { useSignOut } from '../../features/auth/api/use-sign-out';
import { AccountMenu } from '../../features/auth/components/account-menu';
import { NoticeMenu } from '../../features/notices/components/notice-menu';
import { useLiveEvents } from '../live-events';

const NAV: { to: string; label: string; roles: Role[] }[] = [
  { to: '/board', label: 'Board', roles: ['head_coach', 'coach'] },
  { to: '/library', label: 'Library', roles: ['head_coach', 'coach'] },
  { to: '/accessories', label: 'Accessories', roles: ['head_coach', 'coach'] },
  { to: '/roster', label: 'Roster', roles: ['head_coach', 'coach'] },
  { to: '/meets', label: 'Meets', roles: ['head_coach', 'coach'] },
  { to: '/rules', label: 'Rules', roles: ['head_coach'] },
  { to: '/fees', label: 'Fees', roles: ['head_coach'] },
  { to: '/my-week', label: 'My week', roles: ['athlete'] },
  { to: '/my-history', label: 'My history', roles: ['athlete'] },
  { to: '/my-fee', label: 'Coaching fee', roles: ['athlete'] },
];

/** What a route may tell the frame: a skip link of its own, offered before "Skip to main content". */
export interface PageHandle {
  skipLink?: { href: string; label: string };
}

/** Moves the focus to the link's target itself (not only the scroll position), without touching the URL. */
function skipTo(e: MouseEvent<HTMLAnchorElement>) {
  const target = document.querySelector(e.currentTarget.hash);
  if (!(target instanceof HTMLElement)) return;
  e.preventDefault();
  target.focus();
}

export function AppLayout() {
  const { data: me } = useMe();
  useLiveEvents(me?.role);
  const signOut = useSignOut();
  const navigation = useNavigation();
  const skipLinks = useMatches().flatMap((m) => (m.handle as PageHandle | undefined)?.skipLink ?? []);
  if (!me) return null;
  const links = NAV.filter((n) => n.roles.includes(me.role));

  return (
    <div className="min-h-dvh">
      {/* The first stops for the Tab key: the page's own skip link (the board has one), then the main content. */}
      {skipLinks.map((s) => (
        <a key={s.href} href={s.href} onClick={skipTo} className={SKIP_LINK_CLASS}>
          {s.label}
        </a>
      ))}
      <a href="#main" onClick={skipTo} className={SKIP_LINK_CLASS}>
        Skip to main content
      </a>
      <header className="bg-ink-900 text-chalk-100 print:hidden">
        <div className="mx-auto flex max-w-screen-2xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <NavLink to="/" className="flex items-center gap-2 text-xl font-bold tracking-wide text-chalk-50">
            <span aria-hidden className="inline-block h-4 w-6 rounded-sm border-x-4 border-rust-500 bg-chalk-100" />
            Rackturn
          </NavLink>
          <nav aria-label="Main" className="order-3 w-full overflow-x-auto sm:order-none sm:w-auto">
            <ul className="flex gap-1">
              {links.map((l) => (
                <li key={l.to}>
                  <NavLink
                    to={l.to}
                    className={({ isActive }) =>
                      `flex min-h-11 items-center whitespace-nowrap rounded-md px-3 font-semibold ${
                        isActive
                          ? 'bg-ink-700 text-chalk-50 shadow-[inset_0_-3px_0_#c4582f]'
                          : 'text-ink-200 hover:bg-ink-800 hover:text-chalk-50'
                      }`
                    }
                  >
                    {l.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            {me.role === 'athlete' ? null : <NoticeMenu />}
            <AccountMenu me={me} />
            <button
              type="button"
              onClick={() => signOut.mutate()}
              className="min-h-11 rounded-md border border-ink-500 px-3 font-semibold text-chalk-100 hover:bg-ink-800"
            >
              Sign out
            </button>
          </div>
        </div>
        {navigation.state === 'loading' ? (
          <div className="h-0.5 animate-pulse bg-rust-500" aria-hidden />
        ) : (
          <div className="h-0.5" />
        )}
      </header>
      <main id="main" tabIndex={-1} className="mx-auto outline-none max-w-screen-2xl px-3 py-4 sm:px-6 sm:py-6">
        <Outlet />
      </main>
    </div>
  );
}

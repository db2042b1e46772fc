// Live updates: one EventSource per signed-in tab on /api/events. Each event names what changed (topic,
// athlete, weeks) and only the matching queries are asked again. The browser reconnects by itself; after
// a reconnect everything the stream covers is asked again, since events may have been missed meanwhile.
import { useEffect } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { LiveEvent, Role } from '../../shared/schemas';
import { planKeys } from '../features/board/api/queries';
import { messageKeys } from '../features/messages/api/queries';
import { myWeekKeys } from '../features/my-week/api/queries';
import { noticeKeys } from '../features/notices/api/queries';

export function invalidateFor(queryClient: QueryClient, role: Role, e: LiveEvent): void {
  const again = (queryKey: readonly unknown[]) => void queryClient.invalidateQueries({ queryKey });
  switch (e.topic) {
    case 'plan':
      if (role === 'athlete') {
        // The current week's page is kept under its own key, whichever week that is.
        again(myWeekKeys.week(null));
        for (const w of e.weeks) again(myWeekKeys.week(w));
      } else {
        again(planKeys.all);
      }
      return;
    case 'messages':
      if (e.athleteId !== null) for (const w of e.weeks) again(messageKeys.thread(e.athleteId, w));
      again(messageKeys.lists());
      return;
    case 'notices':
      again(noticeKeys.list());
      return;
  }
}

/** Asks again for everything the stream covers (only what was read before `before`, when given). */
export function invalidateAll(queryClient: QueryClient, role: Role, before?: number) {
  const keys = role === 'athlete' ? [myWeekKeys.all, messageKeys.all] : [planKeys.all, messageKeys.all, noticeKeys.all];
  for (const queryKey of keys) {
    void queryClient.invalidateQueries({
      queryKey,
      ...(before === undefined ? {} : { predicate: (q) => q.state.dataUpdatedAt < before }),
    });
  }
}

export function useLiveEvents(role: Role | undefined): void {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!role || typeof EventSource === 'undefined') return;
    // Opened once the first screen has had its turn (an idle moment, at most a few seconds): on a slow
    // phone the stream's request would otherwise go out before the page's own content is shown.
    let source: EventSource | null = null;
    let closed = false;
    const open = () => {
      if (!closed) source = listen(queryClient, role);
    };
    const idle =
      typeof window.requestIdleCallback === 'function'
        ? window.requestIdleCallback(open, { timeout: 3000 })
        : window.setTimeout(open, 500);
    return () => {
      closed = true;
      if (typeof window.cancelIdleCallback === 'function') window.cancelIdleCallback(idle);
      else window.clearTimeout(idle);
      source?.close();
    };
  }, [queryClient, role]);
}

function listen(queryClient: QueryClient, role: Role): EventSource {
  const started = Date.now();
  const source = new EventSource('/api/events');
  let opened = false;
  source.addEventListener('open', () => {
    // A reconnect may have missed events: everything is asked again. The first opening comes a moment after
    // the page's data (see above): what was read before the stream began is asked again, in case it changed.
    invalidateAll(queryClient, role, opened ? undefined : started);
    opened = true;
  });
  source.addEventListener('change', (m) => {
    try {
      invalidateFor(queryClient, role, JSON.parse((m as MessageEvent<string>).data) as LiveEvent);
    } catch {
      // A malformed event is ignored; the next one or a reconnect brings the page up to date.
    }
  });
  return source;
}

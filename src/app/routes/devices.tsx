// Signed-in devices: every browser or phone signed in to this account, with when it was last used; any
// other one can be signed out here, or all of them at once.
import { useQuery, type QueryClient } from '@tanstack/react-query';
import type { SessionItem } from '../../../shared/schemas';
import { Button } from '../../components/ui/button';
import { Loading, Notice, PageHeader } from '../../components/ui/page';
import { sessionsQueryOptions } from '../../features/auth/api/queries';
import { useEndSession } from '../../features/auth/api/use-end-session';
import { useSignOutEverywhere } from '../../features/auth/api/use-sign-out';

export function makeLoader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(sessionsQueryOptions());
    return null;
  };
}

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** "just now", "5 min ago", "3 h ago", else the date. */
function lastSeen(iso: string): string {
  const minutes = Math.round((Date.now() - Date.parse(iso)) / 60_000);
  if (minutes < 2) return 'just now';
  if (minutes < 60) return `${minutes} min ago`;
  if (minutes < 24 * 60) return `${Math.round(minutes / 60)} h ago`;
  return when(iso);
}

function DeviceRow({ item }: { item: SessionItem }) {
  const end = useEndSession();
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 border-b border-chalk-300 py-3 last:border-b-0">
      <div>
        <p className="font-semibold text-ink-900">
          {item.device}
          {item.current ? (
            <span className="ml-2 rounded bg-ink-200 px-2 py-0.5 text-sm text-ink-800">This device</span>
          ) : null}
        </p>
        <p className="text-sm text-ink-600">
          Last used {item.current ? 'now' : lastSeen(item.lastSeenAt)} · signed in {when(item.createdAt)}
        </p>
        {end.error ? (
          <p role="alert" className="text-sm text-breach-700">
            {end.error.message}
          </p>
        ) : null}
      </div>
      {item.current ? null : (
        <Button
          variant="secondary"
          size="sm"
          onClick={() => end.mutate(item.id)}
          disabled={end.isPending}
          aria-label={`Sign out ${item.device}, last used ${lastSeen(item.lastSeenAt)}`}
        >
          Sign out
        </Button>
      )}
    </li>
  );
}

export function Component() {
  const { data, isPending, error } = useQuery(sessionsQueryOptions());
  const everywhere = useSignOutEverywhere();
  return (
    <section className="mx-auto max-w-2xl">
      <PageHeader
        title="Signed-in devices"
        subtitle="Every browser and phone where your account is signed in. Sign out any you do not recognise."
        actions={
          <Button variant="danger" onClick={() => everywhere.mutate()} disabled={everywhere.isPending}>
            Sign out everywhere
          </Button>
        }
      />
      {everywhere.error ? <Notice tone="error">{everywhere.error.message}</Notice> : null}
      {isPending ? <Loading /> : null}
      {error ? <Notice tone="error">{error.message}</Notice> : null}
      {data ? (
        <ul aria-label="Signed-in devices" className="rounded-md border border-chalk-300 bg-chalk-50 px-4">
          {data.items.map((item) => (
            <DeviceRow key={item.id} item={item} />
          ))}
        </ul>
      ) : null}
    </section>
  );
}

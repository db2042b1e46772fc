// Meets (coaches): upcoming and past meets on the left, the chosen meet with its entries, weight
// classes and attempt plans on the right. The chosen meet is in the URL (`?meet=`).
import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Dialog } from '../../components/ui/dialog';
import { Loading, Notice, PageHeader, TrainingCaution } from '../../components/ui/page';
import { meetListOptions, meetOptions } from '../../features/meets/api/queries';
import { MeetDetail } from '../../features/meets/components/meet-detail';
import { MeetForm } from '../../features/meets/components/meet-form';
import { dateText, meetWhen } from '../../features/meets/components/when';
import { athleteListOptions } from '../../features/roster/api/queries';
import type { LoaderMaker } from '../guards';

const ALL_ATHLETES = { q: '', includeArchived: false, sort: 'name' };

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    const chosen = Number(new URL(request.url).searchParams.get('meet'));
    await Promise.all([
      queryClient.ensureQueryData(meetListOptions()),
      queryClient.ensureQueryData(athleteListOptions(ALL_ATHLETES)),
      Number.isInteger(chosen) && chosen > 0
        ? queryClient.ensureQueryData(meetOptions(chosen)).catch(() => null)
        : null,
    ]);
    return null;
  };

export function Component() {
  const [params, setParams] = useSearchParams();
  const { data: list } = useSuspenseQuery(meetListOptions());
  const roster = useQuery(athleteListOptions(ALL_ATHLETES));
  const [adding, setAdding] = useState(false);
  const today = new Date().toISOString().slice(0, 10);
  const upcoming = list.items.filter((m) => m.date >= today);
  const past = list.items.filter((m) => m.date < today).reverse();
  const fromUrl = Number(params.get('meet'));
  const chosenId = Number.isInteger(fromUrl) && fromUrl > 0 ? fromUrl : (upcoming[0]?.id ?? past[0]?.id ?? null);
  const chosen = useQuery({ ...meetOptions(chosenId ?? 0), enabled: chosenId !== null });
  const choose = (id: number | null) => setParams(id ? { meet: String(id) } : {}, { replace: true });

  const item = (m: (typeof list.items)[number]) => (
    <li key={m.id}>
      <button
        type="button"
        onClick={() => choose(m.id)}
        aria-current={m.id === chosenId ? 'true' : undefined}
        className={`flex w-full flex-col rounded-md border px-3 py-2 text-left ${
          m.id === chosenId
            ? 'border-ink-800 bg-ink-800 text-chalk-50'
            : 'border-chalk-300 bg-chalk-50 hover:bg-chalk-200'
        }`}
      >
        <span className="font-semibold">{m.name}</span>
        <span className={`text-sm ${m.id === chosenId ? 'text-ink-200' : 'text-ink-600'}`}>
          {dateText(m.date)} · {meetWhen(m.date)} · {m.entries.length} entered
        </span>
      </button>
    </li>
  );

  return (
    <section className="flex flex-col gap-4">
      <PageHeader
        title="Meets"
        subtitle="Who competes where, in which class, and the attempts planned for each lift."
        actions={<Button onClick={() => setAdding(true)}>Add meet</Button>}
      />
      <TrainingCaution />
      <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
        <nav aria-label="Meets" className="flex flex-col gap-3">
          <h2 className="text-sm font-bold uppercase tracking-wide text-ink-600">Upcoming</h2>
          {upcoming.length ? (
            <ul className="flex flex-col gap-2">{upcoming.map(item)}</ul>
          ) : (
            <p className="text-ink-600">None planned.</p>
          )}
          {past.length ? (
            <>
              <h2 className="text-sm font-bold uppercase tracking-wide text-ink-600">Past</h2>
              <ul className="flex flex-col gap-2">{past.map(item)}</ul>
            </>
          ) : null}
        </nav>
        <div>
          {chosenId === null ? (
            <p className="text-ink-600">Add a meet to start planning attempts.</p>
          ) : chosen.isPending ? (
            <Loading />
          ) : chosen.error ? (
            <Notice tone="error">{chosen.error.message}</Notice>
          ) : chosen.data ? (
            <MeetDetail
              key={chosen.data.id}
              meet={chosen.data}
              athletes={roster.data?.items ?? []}
              onDeleted={() => choose(null)}
            />
          ) : null}
        </div>
      </div>
      <Dialog open={adding} onClose={() => setAdding(false)} title="Add a meet">
        <MeetForm
          meet={null}
          onSaved={(m) => {
            setAdding(false);
            choose(m.id);
          }}
        />
      </Dialog>
    </section>
  );
}

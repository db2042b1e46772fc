// Roster (coaches): every athlete with their restrictions, equipment, next meet and own rules, and a
// way to add one. Each athlete's page holds the details.
import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Dialog } from '../../components/ui/dialog';
import { CheckboxField } from '../../components/ui/choices';
import { TextField } from '../../components/ui/field';
import { Notice, PageHeader } from '../../components/ui/page';
import { athleteListOptions, rosterFiltersFromSearch, type RosterFilters } from '../../features/roster/api/queries';
import { AthleteProfileForm } from '../../features/roster/components/athlete-profile-form';
import { RosterTable } from '../../features/roster/components/roster-table';
import { rulesOptions } from '../../features/rules/api/queries';
import { InvitePanel } from '../../features/invitations/components/invite-panel';
import type { LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    const filters = rosterFiltersFromSearch(new URL(request.url).searchParams);
    await Promise.all([
      queryClient.ensureQueryData(athleteListOptions(filters)),
      queryClient.ensureQueryData(rulesOptions()),
    ]);
    return null;
  };

function toSearch(f: RosterFilters) {
  const p = new URLSearchParams();
  if (f.q) p.set('q', f.q);
  if (f.includeArchived) p.set('archived', 'shown');
  return p;
}

export function Component() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const filters = rosterFiltersFromSearch(params);
  const list = useQuery(athleteListOptions(filters));
  const { data: rules } = useSuspenseQuery(rulesOptions());
  const [adding, setAdding] = useState(false);
  const [q, setQ] = useState(filters.q);
  const set = (next: Partial<RosterFilters>) =>
    setParams((prev) => toSearch({ ...rosterFiltersFromSearch(prev), ...next }), { replace: true });

  useEffect(() => {
    if (q === filters.q) return;
    const timer = setTimeout(() => set({ q }), 250);
    return () => clearTimeout(timer);
  });

  const athletes = list.data?.items ?? [];
  const restricted = athletes.filter((a) => a.restrictions.some((r) => r.active)).length;
  return (
    <section className="flex flex-col gap-4">
      <PageHeader
        title="Roster"
        subtitle={
          list.data
            ? `${list.data.total} ${list.data.total === 1 ? 'athlete' : 'athletes'} · ${restricted} with a restriction in force`
            : undefined
        }
        actions={<Button onClick={() => setAdding(true)}>Add athlete</Button>}
      />
      <div
        role="search"
        aria-label="Filter the roster"
        className="grid gap-3 rounded-lg border border-chalk-300 bg-chalk-100 p-3 sm:grid-cols-[2fr_auto] sm:items-end"
      >
        <TextField label="Search" type="search" placeholder="Name" value={q} onChange={(e) => setQ(e.target.value)} />
        <CheckboxField
          label="Show archived"
          checked={filters.includeArchived}
          onChange={(on) => set({ includeArchived: on })}
        />
      </div>
      {list.error ? <Notice tone="error">{list.error.message}</Notice> : null}
      <RosterTable athletes={athletes} gymEquipment={rules.equipment} />
      <InvitePanel />
      <Dialog open={adding} onClose={() => setAdding(false)} title="Add an athlete">
        <p className="mb-3 text-sm text-ink-600">
          They start with the gym&apos;s equipment and the team rules; change either on their page.
        </p>
        <AthleteProfileForm athlete={null} onSaved={(a) => navigate(`/athletes/${a.id}`)} />
      </Dialog>
    </section>
  );
}

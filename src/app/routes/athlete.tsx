// Athlete (coaches): one athlete's profile, restrictions, equipment, meets, own rules, and the history
// of picks and results. Each panel saves on its own, with the athlete's version.
import { SEX_LABEL } from '../../../shared/labels';
import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { formatWeight } from '../../../shared/calc';
import { weekOfDate } from '../../../shared/engine/weeks';
import type { Athlete } from '../../../shared/schemas';
import { Button } from '../../components/ui/button';
import { Notice, PageHeader, TrainingCaution } from '../../components/ui/page';
import { useMe } from '../../lib/me';
import { accountsOptions, athleteHistoryOptions, athleteOptions } from '../../features/roster/api/queries';
import { athleteKeys } from '../../lib/query-keys';
import { useArchiveAthlete, useUpdateAthlete } from '../../features/roster/api/use-save-athlete';
import { AthleteMeetsPanel } from '../../features/roster/components/athlete-meets-panel';
import { AthleteProfileForm } from '../../features/roster/components/athlete-profile-form';
import { EquipmentPanel } from '../../features/roster/components/equipment-panel';
import { HistoryPanel } from '../../features/roster/components/history-panel';
import { DIVISION_LABEL, formatDate, maxRiskText } from '../../features/roster/components/labels';
import { OverridesPanel } from '../../features/roster/components/overrides-panel';
import { Panel } from '../../features/roster/components/panel';
import { RestrictionsPanel } from '../../features/roster/components/restrictions-panel';
import { rulesOptions } from '../../features/rules/api/queries';
import { LiftCharts } from '../../features/history/components/lift-charts';
import { VariantHistory } from '../../features/history/components/variant-history';
import { AthleteReview } from '../../features/review/components/athlete-review';
import { AthleteThreads } from '../../features/messages/components/athlete-threads';
import type { LoaderMaker } from '../guards';

function idOf(params: Record<string, string | undefined>): number {
  const id = Number(params.athleteId);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ params }) => {
    const id = idOf(params);
    // Not awaited: the history panel shows its own loading state.
    void queryClient.prefetchQuery(athleteHistoryOptions(id));
    await Promise.all([
      queryClient.ensureQueryData(athleteOptions(id)),
      queryClient.ensureQueryData(rulesOptions()),
      queryClient.ensureQueryData(accountsOptions()),
    ]);
    return null;
  };

export function Component() {
  const id = idOf(useParams());
  const queryClient = useQueryClient();
  const { data: athlete } = useSuspenseQuery(athleteOptions(id));
  const { data: rules } = useSuspenseQuery(rulesOptions());
  const { data: me } = useMe();
  const archive = useArchiveAthlete();
  const restore = useUpdateAthlete();
  const [notice, setNotice] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);

  // Someone else saved this athlete first: show their version everywhere and say so.
  const onConflict = (current: Athlete, message: string) => {
    queryClient.setQueryData(athleteKeys.detail(id), current);
    setNotice({ tone: 'error', text: message });
  };
  const slotLabels = Object.fromEntries(rules.rules.slots.map((s) => [s.id, s.label]));
  const age = athlete.birthYear ? new Date().getFullYear() - athlete.birthYear : null;

  return (
    <section className="flex flex-col gap-4">
      <p className="text-sm">
        <Link to="/roster" className="text-ink-700 underline underline-offset-2">
          ← Roster
        </Link>
      </p>
      <PageHeader
        title={athlete.name}
        subtitle={[
          `Heaviest risk allowed: ${maxRiskText(athlete.maxRisk).toLowerCase()}`,
          `${DIVISION_LABEL[athlete.division]} · ${SEX_LABEL[athlete.sex].toLowerCase()}`,
          age ? `about ${age}` : null,
          athlete.latestBodyweight
            ? `${formatWeight(athlete.latestBodyweight.weightKg, me?.unit ?? 'kg')} on ${formatDate(athlete.latestBodyweight.measuredOn)}`
            : null,
          athlete.archived ? 'archived' : null,
        ]
          .filter(Boolean)
          .join(' · ')}
        actions={
          athlete.archived ? (
            <Button
              variant="secondary"
              onClick={() => restore.mutate({ id, body: { archived: false, version: athlete.version } })}
            >
              Restore athlete
            </Button>
          ) : (
            <>
              <Link
                to={`/athletes/${id}/weeks/${weekOfDate(new Date())}`}
                className="inline-flex min-h-11 items-center rounded-md border border-ink-600 bg-chalk-50 px-4 font-semibold text-ink-900 hover:bg-chalk-200"
              >
                Training week
              </Link>
              <Button variant="secondary" onClick={() => archive.mutate(id)}>
                Archive athlete
              </Button>
            </>
          )
        }
      />
      <TrainingCaution />
      {notice ? <Notice tone={notice.tone}>{notice.text}</Notice> : null}

      <div className="grid gap-4 lg:grid-cols-2">
        <Panel title="Profile">
          <AthleteProfileForm
            key={athlete.version}
            athlete={athlete}
            onSaved={() => setNotice({ tone: 'success', text: 'Profile saved.' })}
            onConflict={onConflict}
          />
        </Panel>
        <div className="flex flex-col gap-4">
          <RestrictionsPanel athlete={athlete} />
          <AthleteMeetsPanel athlete={athlete} />
        </div>
        <EquipmentPanel
          key={`e${athlete.version}`}
          athlete={athlete}
          gymEquipment={rules.equipment}
          onConflict={onConflict}
        />
        <OverridesPanel key={`o${athlete.version}`} athlete={athlete} team={rules.rules} onConflict={onConflict} />
        <HistoryPanel athleteId={id} unit={me?.unit ?? 'kg'} slotLabels={slotLabels} />
      </div>
      <AthleteThreads athleteId={id} thisWeek={weekOfDate(new Date())} slotLabels={slotLabels} />
      {/* More panels about this athlete go below, each a section of its own. */}
      <AthleteReview
        athleteId={id}
        history={(data, unit) => (
          <>
            <LiftCharts series={data.series} unit={unit} />
            <VariantHistory variants={data.variants} unit={unit} athleteId={id} />
          </>
        )}
      />
    </section>
  );
}

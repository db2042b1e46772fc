// The athlete's week as it was computed before the answer was rebuilt on fewer queries (one per concern):
// kept, frozen, as the reference the rebuilt service must match answer for answer on the demo data.
import { openingRange, weightClass } from '../../shared/calc';
import { addWeeks, weekOfDate, weeksBetween } from '../../shared/engine/weeks';
import { SCHEME_REPS, type MyWeek, type MyWeekCheckin, type MyWeekPick } from '../../shared/schemas';
import type { AppContext } from '../../server/context';
import { NotFoundError } from '../../server/lib/errors';
import { allBodyweights } from '../../server/modules/bodyweights/bodyweights.repository';
import { daysUntil, gainCaution, sevenDayChange } from '../../server/modules/bodyweights/caution';
import { recentCheckins, readRulesOfTeam, tissueWorkFor } from '../../server/modules/tissue/tissue.service';
import { findNextMeet, findPrescription } from '../../server/modules/tissue/tissue.repository';
import { topSetsOfWeek } from '../../server/modules/top-sets/top-sets.repository';
import { variantSummary } from '../../server/modules/top-sets/top-sets.service';
import { findTeamAthlete } from '../../server/modules/athletes/athletes.service';
import { isWeekPublished } from '../../server/modules/my-week/my-week.repository';
import { weekPicks } from '../../server/modules/plans/plans.repository';
import { getAthleteWeek } from '../../server/modules/week/week.service';
import { restWeeks, sessionLogs } from '../../server/db/schema';
import { and, eq } from 'drizzle-orm';

const DAY_MS = 86_400_000;
/** Bodyweight readings shown on the page: the last four weeks. */
const RECENT_DAYS = 28;

function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

export async function referenceMyWeek(
  ctx: Pick<AppContext, 'database'>,
  who: { teamId: number; athleteId: number; unit: 'kg' | 'lb' },
  requestedWeek: string | undefined,
  now = new Date(),
): Promise<MyWeek> {
  const db = ctx.database.db;
  const { teamId, athleteId } = who;
  const athlete = await findTeamAthlete(db, teamId, athleteId);
  if (!athlete) throw new NotFoundError('A roster entry linked to your account');
  const today = isoDay(now);
  const week = requestedWeek ?? weekOfDate(now);

  // A week the coach has not published is a draft the athlete does not see; weeks gone by are history.
  const thisWeek = weekOfDate(now);
  const [rules, rows, logged, tissue, checkins, meet, readings, published] = await Promise.all([
    readRulesOfTeam(db, teamId),
    weekPicks(db, teamId, athleteId, week),
    topSetsOfWeek(db, teamId, athleteId, week),
    tissueWorkFor(db, teamId, athleteId, week),
    recentCheckins(db, teamId, athleteId, 20),
    findNextMeet(db, teamId, athleteId, today),
    allBodyweights(db, teamId, athleteId, isoDay(new Date(now.getTime() - RECENT_DAYS * DAY_MS))),
    week < thisWeek ? true : isWeekPublished(db, teamId, athleteId, week),
  ]);

  const slotOrder = rules.slots.map((s) => s.id);
  const ordered = (published ? [...rows] : []).sort((a, b) => {
    const [x, y] = [slotOrder.indexOf(a.slotId), slotOrder.indexOf(b.slotId)];
    return (x < 0 ? 99 : x) - (y < 0 ? 99 : y) || a.slotId.localeCompare(b.slotId);
  });
  const picks: MyWeekPick[] = await Promise.all(
    ordered.map(async (r) => {
      const { lastTime, record } = await variantSummary(db, teamId, athleteId, r.variant.id, week);
      return {
        planEntryId: r.planEntryId,
        slotId: r.slotId,
        slotLabel: rules.slots.find((s) => s.id === r.slotId)?.label ?? r.slotId,
        scheme: r.variant.scheme,
        schemeReps: SCHEME_REPS[r.variant.scheme],
        variant: {
          id: r.variant.id,
          name: r.variant.name,
          lift: r.variant.lift,
          family: r.variant.family,
          bar: r.variant.bar,
          specificity: Number(r.variant.specificity),
          notes: r.variant.notes,
        },
        lastTime,
        record,
        logged: logged.filter((s) => s.planEntryId === r.planEntryId),
        // Never done: 75–85 % of a triple/single/five from the competition lift's current estimate.
        opening:
          record.bestE1rm === null
            ? await getAthleteWeek(ctx, teamId, athleteId, week).then((w) => {
                const max = w.maxes[r.variant.lift];
                return max ? openingRange([max.e1rmKg], SCHEME_REPS[r.variant.scheme]) : null;
              })
            : null,
      };
    }),
  );

  // Last week's work too: the next-day check-in often lands after the week has turned.
  const lastWeek = addWeeks(week, -1);
  const lastWork = await findPrescription(db, teamId, athleteId, lastWeek);
  const checkinWeeks: MyWeekCheckin[] = [
    { week, kind: tissue.kind, done: checkins.filter((c) => c.week === week) },
    { week: lastWeek, kind: lastWork?.items[0]?.kind ?? null, done: checkins.filter((c) => c.week === lastWeek) },
  ];

  const latest = readings[readings.length - 1] ?? null;
  const division = meet?.division ?? athlete.division;
  const meetInfo = meet && {
    name: meet.name,
    date: meet.date,
    daysOut: daysUntil(today, meet.date),
    weeksOut: weeksBetween(week, weekOfDate(new Date(`${meet.date}T00:00:00Z`))),
  };
  // The training week, read on its own: the coach's view of the week and the athlete's logs.
  const plan = published ? await getAthleteWeek(ctx, teamId, athleteId, week) : null;
  const logs = plan
    ? await ctx.database.db
        .select()
        .from(sessionLogs)
        .where(and(eq(sessionLogs.teamId, teamId), eq(sessionLogs.athleteId, athleteId), eq(sessionLogs.week, week)))
    : [];
  const sessions = (plan?.sessions ?? []).map((s) => {
    const l = logs.find((x) => x.sessionId === s.id);
    return {
      ...s,
      log: l
        ? {
            sessionId: l.sessionId,
            speedSetsDone: l.speedSetsDone,
            accessorySetsDone: l.accessorySetsDone,
            backOffDone: l.backOffDone,
            done: l.done,
            version: l.version,
          }
        : null,
    };
  });
  // Back-off sets after the top sets, unless the week is a rest or deload week for max effort.
  const rest = await ctx.database.db
    .select()
    .from(restWeeks)
    .where(and(eq(restWeeks.teamId, teamId), eq(restWeeks.athleteId, athleteId), eq(restWeeks.week, week)));
  const noMaxEffort = rest.length > 0 || (plan?.deload ?? false);
  return {
    week,
    published,
    today,
    unit: who.unit,
    athlete: { id: athlete.id, name: athlete.name, sex: athlete.sex, division: athlete.division },
    picks,
    backOff: rules.backOff.sets > 0 && !noMaxEffort ? rules.backOff : null,
    deload: plan?.deload ?? false,
    sessions,
    tissue,
    checkins: checkinWeeks,
    meet: meetInfo || null,
    bodyweight: {
      latest,
      recent: readings,
      weightClass: latest ? weightClass(latest.weightKg, athlete.sex, { division }) : null,
      enteredClass: meet?.weightClass ?? null,
      sex: athlete.sex,
      division,
      change7d: sevenDayChange(readings),
      thresholdKg: rules.bodyweightGainCautionKg,
      caution: gainCaution({ readings, today, meet, thresholdKg: rules.bodyweightGainCautionKg }),
    },
  };
}

// The athlete's week in one answer: picks with last time and records, tissue work, check-ins,
// bodyweight with weight class and the pre-meet gain caution, the next meet, and the week's sessions.
// Read in one round of queries, one per concern (never one per pick), all scoped to the team.
import { weightClass } from '../../../shared/calc';
import { addWeeks, mondayOf, weekOfDate, weeksBetween } from '../../../shared/engine/weeks';
import { SCHEME_REPS, type MyWeek, type MyWeekCheckin, type MyWeekPick } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { NotFoundError } from '../../lib/errors';
import { allBodyweights, daysUntil, gainCaution, sevenDayChange } from '../bodyweights/bodyweights.service';
import {
  findTeamRulesText,
  listCheckins,
  listPrescriptionsThrough,
  meetsFrom,
  rulesFromText,
  tissueWorkFrom,
  toCheckinRow,
} from '../tissue/tissue.service';
import { recordOf, topSetsAroundWeek } from '../top-sets/top-sets.service';
import { engineRestrictionsOf, findTeamAthlete, isRestWeek } from '../athletes/athletes.service';
import { keptAnswer } from './answer-cache';
import { isWeekPublished, weekFingerprint } from './my-week.repository';
import { weekPicks } from '../plans/plans.service';
import { myWeekSessions, openingFor, weekInputs } from '../week/week.service';
import { isoDay } from '../../lib/days';

const DAY_MS = 86_400_000;
/** Bodyweight readings shown on the page: the last four weeks. */
const RECENT_DAYS = 28;
/** Check-ins the page looks through for this week's and last week's. */
const RECENT_CHECKINS = 20;

/** The first day of the bodyweight readings shown. */
const recentSince = (now: Date) => isoDay(new Date(now.getTime() - RECENT_DAYS * DAY_MS));

export async function myWeek(
  ctx: Pick<AppContext, 'database'>,
  who: { teamId: number; athleteId: number; unit: 'kg' | 'lb' },
  requestedWeek: string | undefined,
  now = new Date(),
): Promise<MyWeek> {
  const db = ctx.database.db;
  const { teamId, athleteId } = who;
  const today = isoDay(now);
  const week = requestedWeek ?? weekOfDate(now);
  const lastWeek = addWeeks(week, -1);
  const monday = isoDay(mondayOf(week));

  // A week the coach has not published is a draft the athlete does not see; weeks gone by are history.
  const thisWeek = weekOfDate(now);
  const [
    athlete,
    rulesText,
    rows,
    sets,
    prescriptions,
    checkinRows,
    upcoming,
    readings,
    published,
    weekParts,
    restrictions,
    restWeek,
  ] = await Promise.all([
    findTeamAthlete(db, teamId, athleteId),
    findTeamRulesText(db, teamId),
    weekPicks(db, teamId, athleteId, week),
    topSetsAroundWeek(db, teamId, athleteId, week),
    listPrescriptionsThrough(db, teamId, athleteId, week),
    listCheckins(db, teamId, athleteId),
    // From the earlier of today and the week's Monday: the page shows the next meet from today, the
    // tissue work counts down to the next one from the week's start.
    meetsFrom(db, teamId, athleteId, today < monday ? today : monday),
    allBodyweights(db, teamId, athleteId, recentSince(now)),
    week < thisWeek ? true : isWeekPublished(db, teamId, athleteId, week),
    weekInputs(db, teamId, athleteId, week),
    engineRestrictionsOf(db, teamId, athleteId),
    isRestWeek(db, teamId, athleteId, week),
  ]);
  if (!athlete) throw new NotFoundError('A roster entry linked to your account');
  const rules = rulesFromText(teamId, rulesText);
  const meet = upcoming.find((m) => m.date >= today) ?? null;
  const tissue = await tissueWorkFrom(
    db,
    who,
    week,
    {
      team: rules,
      history: prescriptions.filter((p) => p.week < week),
      checkins: checkinRows,
      meet: upcoming.find((m) => m.date >= monday) ?? null,
      picks: rows,
      restrictions,
      stored: prescriptions.find((p) => p.week === week) ?? null,
    },
    now,
  );
  const checkins = checkinRows.slice(0, RECENT_CHECKINS).map(toCheckinRow);

  const slotOrder = rules.slots.map((s) => s.id);
  const ordered = (published ? [...rows] : []).sort((a, b) => {
    const [x, y] = [slotOrder.indexOf(a.slotId), slotOrder.indexOf(b.slotId)];
    return (x < 0 ? 99 : x) - (y < 0 ? 99 : y) || a.slotId.localeCompare(b.slotId);
  });
  // Newest first, as last time and the records read them; the week's own sets oldest first.
  const logged = sets.filter((s) => s.week === week).reverse();
  const picks: MyWeekPick[] = ordered.map((r) => {
    const onVariant = sets.filter((s) => s.variantId === r.variant.id);
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
      lastTime: onVariant.find((s) => s.week < week) ?? null,
      record: recordOf(onVariant),
      logged: logged.filter((s) => s.planEntryId === r.planEntryId),
      opening:
        onVariant.length === 0 && published
          ? openingFor(weekParts.sets, week, r.variant.lift, SCHEME_REPS[r.variant.scheme])
          : null,
    };
  });

  // Last week's work too: the next-day check-in often lands after the week has turned.
  const lastWork = prescriptions.find((p) => p.week === lastWeek);
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
  const training = myWeekSessions(rules, athleteId, week, weekParts, published);
  return {
    week,
    published,
    today,
    unit: who.unit,
    athlete: { id: athlete.id, name: athlete.name, sex: athlete.sex, division: athlete.division },
    picks,
    // A rest or deload week has no max-effort work, so no back-off sets either.
    backOff: rules.backOff.sets > 0 && !restWeek && !training.deload ? rules.backOff : null,
    ...training,
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

/**
 * The athlete's week as JSON text, as myWeek() answers it: a copy kept by this instance is sent while the
 * fingerprint of everything it was read from is unchanged (one query), otherwise it is read afresh. The
 * answer depends on the day only through `now`, so the day is part of the key.
 */
export async function myWeekJson(
  ctx: Pick<AppContext, 'database'>,
  who: { teamId: number; athleteId: number; unit: 'kg' | 'lb' },
  requestedWeek: string | undefined,
  now = new Date(),
): Promise<string> {
  const week = requestedWeek ?? weekOfDate(now);
  const fingerprint = await weekFingerprint(ctx.database.pool, who, week, recentSince(now));
  const key = `${who.teamId}:${who.athleteId}:${week}:${who.unit}:${isoDay(now)}`;
  return keptAnswer(ctx.database, key, fingerprint, () => myWeek(ctx, who, week, now));
}

// Twelve invented weeks of training for the demo athletes, planned by the same engine and rules as the
// board (so the history obeys them), with invented top sets and bodyweights; the current week is planned
// but not yet trained. Every number here is made up for the demo.
import { eq } from 'drizzle-orm';
import seedrandom from 'seedrandom';
import { setE1rm } from '../../../shared/calc';
import { addWeeks, generatePlan, mondayOf, weekOfDate, type PlanResult } from '../../../shared/engine';
import { buildPlanRequests, type PlanningFacts } from '../../../shared/planning';
import { readTeamRules } from '../../../shared/schemas/rules';
import type { BoardAthlete, BoardVariant } from '../../../shared/schemas/plans';
import type { Tx } from '../client';
import { athleteWeekPublications, bodyweights, planEntries, planEntryHistory, teamRules, topSets } from '../schema';
import { DEMO_EQUIPMENT, DEMO_LIBRARY, type DemoVariant } from './demo-library';
import { pastMeetDay } from './demo-meet-day';
import { DEMO_ATHLETES, PAST_MEET, type DemoAthlete } from './demo-people';

export interface HistoryContext {
  teamId: number;
  today: Date;
  athleteIds: Map<string, number>;
  variantIds: Map<string, number>;
  coachId: number | null;
}

export const HISTORY_WEEKS = 12;
const DAY_MS = 86_400_000;

/** How heavy a variant goes relative to the competition lift: partial ranges go heavier, hard positions lighter. */
export function variantFactor(v: Pick<DemoVariant, 'specificity' | 'emphasis' | 'equipment'>): number {
  const partial = v.emphasis === 'lockout' && v.equipment.some((e) => ['rack pins', 'boards', 'blocks'].includes(e));
  const emphasis = v.emphasis === 'lockout' ? 0.08 : v.emphasis === 'bottom' ? -0.03 : 0;
  return 0.55 + 0.45 * v.specificity + emphasis + (partial ? 0.2 : 0);
}

/** An opener single is a rehearsal at about 91 % of the max (common practice, from memory), not a max. */
function workFactor(v: Pick<DemoVariant, 'name' | 'specificity' | 'emphasis' | 'equipment'>): number {
  return variantFactor(v) * (v.name.includes('opener') ? 0.91 : 1);
}

const REPS = { single: 1, triple: 3, five: 5 } as const;

function isoDay(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}

export async function seedDemoHistory(tx: Tx, ctx: HistoryContext): Promise<void> {
  const thisWeek = weekOfDate(ctx.today);
  const weeks = Array.from({ length: HISTORY_WEEKS + 1 }, (_, i) => addWeeks(thisWeek, i - HISTORY_WEEKS));
  const [stored] = await tx.select().from(teamRules).where(eq(teamRules.teamId, ctx.teamId));
  const rules = readTeamRules(stored?.rules);
  const byId = new Map<string, DemoVariant>();
  const variants: BoardVariant[] = DEMO_LIBRARY.map((v) => {
    const id = ctx.variantIds.get(v.name)!;
    byId.set(String(id), v);
    return { ...v, id, meetPhaseWeeks: v.meetPhaseWeeks ?? null, archived: false };
  });
  const sunday = (week: string) => isoDay(mondayOf(week).getTime() + 6 * DAY_MS);
  const pastMeet = pastMeetDay(ctx.today);
  const athletes: BoardAthlete[] = DEMO_ATHLETES.map((a) => ({
    id: ctx.athleteIds.get(a.key)!,
    name: a.name,
    equipment: DEMO_EQUIPMENT.filter((e) => !a.lacks?.includes(e)),
    restrictions: (a.restrictions ?? []).map((r) => ({
      joint: r.joint ?? null,
      maxStress: r.maxStress ?? null,
      emphasis: r.emphasis ?? [],
      families: r.families ?? [],
      fromDate: isoDay(mondayOf(addWeeks(thisWeek, r.fromInWeeks)).getTime()),
      toDate: r.toInWeeks === undefined ? null : sunday(addWeeks(thisWeek, r.toInWeeks)),
      note: r.note,
    })),
    meet: a.meetInWeeks
      ? {
          id: 0,
          name: 'meet',
          date: sunday(addWeeks(thisWeek, a.meetInWeeks)),
          week: addWeeks(thisWeek, a.meetInWeeks),
        }
      : PAST_MEET.athletes.includes(a.key)
        ? // The weeks before the club's past meet were its taper: planned toward it, as the coach did then.
          { id: 0, name: PAST_MEET.name, ...pastMeet }
        : null,
    ruleOverrides: {},
    maxRisk: a.maxRisk ?? null,
    restWeeks: (a.restInWeeks ?? []).map((w) => addWeeks(thisWeek, w)),
  }));
  // The same request builder as the board and the server, over the stored shapes of the demo's facts.
  const facts: PlanningFacts = {
    rules,
    seed: stored?.seed ?? 'demo',
    slots: rules.slots,
    variants,
    athletes,
  };
  const results: PlanResult[] = buildPlanRequests(facts, { weeks, entries: [] }).map((g) => generatePlan(g.request));
  const plan = { entries: results.flatMap((r) => r.entries) };

  const people = new Map(DEMO_ATHLETES.map((a) => [String(ctx.athleteIds.get(a.key)), a]));
  for (const e of plan.entries) {
    const [row] = await tx
      .insert(planEntries)
      .values({
        teamId: ctx.teamId,
        athleteId: Number(e.athleteId),
        week: e.week,
        slotId: e.slotId,
        variantId: Number(e.variantId),
        source: 'engine',
        pinned: false,
        reasons: e.reasons,
        updatedBy: ctx.coachId,
      })
      .$returningId();
    await tx.insert(planEntryHistory).values({
      teamId: ctx.teamId,
      planEntryId: row!.id,
      athleteId: Number(e.athleteId),
      week: e.week,
      slotId: e.slotId,
      oldVariantId: null,
      newVariantId: Number(e.variantId),
      source: 'engine',
      pinned: false,
      reason: null,
      version: 1,
      changedBy: ctx.coachId,
    });
    if (e.week === thisWeek) continue;
    const who = people.get(e.athleteId)!;
    await tx.insert(topSets).values(topSetFor(ctx, who, byId.get(e.variantId)!, e, row!.id, weeks.indexOf(e.week)));
  }

  // This week was published to the athletes; next week is the coach's draft.
  for (const a of DEMO_ATHLETES) {
    const athleteId = ctx.athleteIds.get(a.key)!;
    const picks = plan.entries
      .filter((e) => e.week === thisWeek && e.athleteId === String(athleteId))
      .map((e) => ({ slotId: e.slotId, variantId: Number(e.variantId), variantName: byId.get(e.variantId)!.name }));
    await tx
      .insert(athleteWeekPublications)
      .values({ teamId: ctx.teamId, athleteId, week: thisWeek, picks, publishedBy: ctx.coachId });
  }

  for (const a of DEMO_ATHLETES) {
    await tx.insert(bodyweights).values(bodyweightsFor(ctx, a, thisWeek));
  }
}

function topSetFor(
  ctx: HistoryContext,
  who: DemoAthlete,
  v: DemoVariant,
  e: { athleteId: string; week: string; slotId: string; variantId: string },
  planEntryId: number,
  weekIndex: number,
) {
  const rng = seedrandom(`demo-top-set:${who.key}:${e.week}:${e.slotId}`);
  // Slow, noisy progress over the block: about +0.4 % a week.
  const progress = 1 + 0.004 * weekIndex + (rng() - 0.5) * 0.03;
  const e1rmTarget = who.maxes[v.lift] * workFactor(v) * progress;
  const reps = REPS[v.scheme];
  // Gym numbers: whole 2.5 kg steps.
  const weightKg = Math.max(25, Math.floor(e1rmTarget / (1 + reps / 30) / 2.5) * 2.5);
  const rpe = 7.5 + Math.floor(rng() * 5) * 0.5; // 7.5 … 9.5
  const day = mondayOf(e.week).getTime() + (e.slotId === 'upper' ? 3 : 1) * DAY_MS;
  return {
    teamId: ctx.teamId,
    athleteId: Number(e.athleteId),
    planEntryId,
    variantId: Number(e.variantId),
    week: e.week,
    performedOn: isoDay(day),
    weightKg,
    reps,
    rpe,
    e1rmKg: setE1rm(weightKg, reps, rpe),
    note: rng() < 0.15 ? 'Moved well; last rep slowed down.' : null,
  };
}

function bodyweightsFor(ctx: HistoryContext, a: DemoAthlete, thisWeek: string) {
  const rng = seedrandom(`demo-bodyweight:${a.key}`);
  const start = mondayOf(addWeeks(thisWeek, -HISTORY_WEEKS)).getTime();
  // Athletes with a meet drift slowly toward their class; the rest wander around their weight.
  const drift = a.meetInWeeks ? -0.03 : 0;
  const rows: { teamId: number; athleteId: number; measuredOn: string; weightKg: number }[] = [];
  for (let d = 0; d < HISTORY_WEEKS * 7; d += 2 + Math.floor(rng() * 2)) {
    const w = a.bodyweight + drift * (d - HISTORY_WEEKS * 7) + (rng() - 0.5) * 0.8;
    rows.push({
      teamId: ctx.teamId,
      athleteId: ctx.athleteIds.get(a.key)!,
      measuredOn: isoDay(start + d * DAY_MS),
      weightKg: Math.round(w * 10) / 10,
    });
  }
  return rows;
}

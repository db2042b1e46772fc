// What planning needs to know about a team, read once per request: rules and seed, the library, and each
// athlete's equipment, restrictions, next meet and effective rules, in the engine's terms.
import type { AthleteInput, PlanEntry, Rules, Variant } from '../../../shared/engine';
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine';
import {
  readRuleOverrides,
  readTeamRules,
  toEngineRules,
  toEngineVariant,
  type AthleteRuleOverrides,
  type BoardAthlete,
  type BoardRestriction,
  type BoardSlot,
  type BoardVariant,
  type TeamRules,
} from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import {
  listAthletes,
  readRulesRow,
  restrictionsFor,
  teamVariants,
  upcomingMeets,
  type AthleteRow,
  type EntryRow,
} from './plans.repository';

const DAY_MS = 86_400_000;

export function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/** The calendar days of a span of ISO weeks, Monday of the first to Sunday of the last. */
export function daysOfWeeks(first: string, last: string): [string, string] {
  return [isoDay(mondayOf(first)), isoDay(new Date(mondayOf(last).getTime() + 6 * DAY_MS))];
}

export interface Today {
  day: string;
  week: string;
  next: string;
}

export function today(now = new Date()): Today {
  const week = weekOfDate(now);
  return { day: isoDay(now), week, next: addWeeks(week, 1) };
}

export interface PlanningAthlete {
  board: BoardAthlete;
  /** The engine's view, without history (added per request). */
  input: Omit<AthleteInput, 'history'>;
  rules: Rules;
  /** Same string for athletes whose effective rules are the same. */
  rulesKey: string;
}

export interface Planning {
  rules: TeamRules;
  seed: string;
  rulesVersion: number;
  gymEquipment: string[];
  slots: BoardSlot[];
  variants: BoardVariant[];
  engineVariants: Variant[];
  variantById: Map<number, BoardVariant>;
  athletes: PlanningAthlete[];
  athleteById: Map<number, PlanningAthlete>;
}

function boardVariant(v: Awaited<ReturnType<typeof teamVariants>>[number]): BoardVariant {
  return {
    id: v.id,
    name: v.name,
    lift: v.lift,
    family: v.family,
    bar: v.bar,
    equipment: v.equipment,
    emphasis: v.emphasis,
    stress: v.stress,
    risk: v.risk as 1 | 2 | 3,
    specificity: Number(v.specificity),
    scheme: v.scheme,
    archived: v.archivedAt !== null,
  };
}

/**
 * Reads the team's planning facts. `athletes` defaults to everyone on the board; restrictions count when
 * they are in force on some day of `restrictionDays`.
 */
export async function loadPlanning(
  db: Queryable,
  teamId: number,
  opts: { athletes?: AthleteRow[]; restrictionDays: [string, string]; today: Today; seed?: string },
): Promise<Planning> {
  const [rulesRow, variantRows, athleteRows] = await Promise.all([
    readRulesRow(db, teamId),
    teamVariants(db, teamId),
    opts.athletes ? Promise.resolve(opts.athletes) : listAthletes(db, teamId),
  ]);
  const ids = athleteRows.map((a) => a.id);
  const [restrictionRows, meetRows] = await Promise.all([
    restrictionsFor(db, teamId, ids, opts.restrictionDays[0], opts.restrictionDays[1]),
    upcomingMeets(db, teamId, ids, opts.today.day),
  ]);

  const rules = readTeamRules(rulesRow?.rules);
  const seed = opts.seed ?? rulesRow?.seed ?? 'default';
  const gymEquipment = rulesRow?.equipment ?? [];
  const gym = new Set(gymEquipment);
  const variants = variantRows.map(boardVariant);

  const restrictionsOf = new Map<number, BoardRestriction[]>();
  for (const r of restrictionRows) {
    const list = restrictionsOf.get(r.athleteId) ?? [];
    list.push({ joint: r.joint, maxStress: r.maxStress, fromDate: r.fromDate, toDate: r.toDate, note: r.note });
    restrictionsOf.set(r.athleteId, list);
  }
  const meetOf = new Map<number, BoardAthlete['meet']>();
  for (const m of meetRows) {
    if (meetOf.has(m.athleteId)) continue;
    meetOf.set(m.athleteId, {
      id: m.id,
      name: m.name,
      date: m.date,
      week: weekOfDate(new Date(`${m.date}T00:00:00Z`)),
    });
  }

  const athletes = athleteRows.map((row): PlanningAthlete => {
    const ruleOverrides: AthleteRuleOverrides = readRuleOverrides(row.ruleOverrides);
    const board: BoardAthlete = {
      id: row.id,
      name: row.name,
      equipment: row.equipment.filter((e) => gym.has(e)),
      restrictions: restrictionsOf.get(row.id) ?? [],
      meet: meetOf.get(row.id) ?? null,
      ruleOverrides,
    };
    const engineRules = toEngineRules(rules, seed, ruleOverrides);
    return {
      board,
      input: {
        id: String(row.id),
        equipment: board.equipment,
        restrictions: board.restrictions.map((r) => ({ joint: r.joint, maxStress: r.maxStress })),
        ...(board.meet ? { meetWeek: board.meet.week } : {}),
      },
      rules: engineRules,
      rulesKey: JSON.stringify(engineRules),
    };
  });

  return {
    rules,
    seed,
    rulesVersion: rulesRow?.version ?? 0,
    gymEquipment,
    slots: rules.slots.map((s) => ({ id: s.id, label: s.label, lifts: [...s.lifts] })),
    variants,
    engineVariants: variants.map(toEngineVariant),
    variantById: new Map(variants.map((v) => [v.id, v])),
    athletes,
    athleteById: new Map(athletes.map((a) => [a.board.id, a])),
  };
}

/** Entries that hold a variant, in the engine's terms. */
export function engineEntries(rows: Pick<EntryRow, 'athleteId' | 'week' | 'slotId' | 'variantId' | 'pinned'>[]) {
  const out: PlanEntry[] = [];
  for (const r of rows) {
    if (r.variantId === null) continue;
    out.push({
      athleteId: String(r.athleteId),
      week: r.week,
      slotId: r.slotId,
      variantId: String(r.variantId),
      pinned: r.pinned,
    });
  }
  return out;
}

/** Athletes with the same effective rules, so one engine request can serve them all. */
export function groupByRules<T extends { athlete: PlanningAthlete }>(
  items: T[],
  extraKey: (t: T) => string = () => '',
) {
  const groups = new Map<string, T[]>();
  for (const item of items) {
    const key = `${item.athlete.rulesKey}|${extraKey(item)}`;
    const list = groups.get(key);
    if (list) list.push(item);
    else groups.set(key, [item]);
  }
  return [...groups.values()];
}

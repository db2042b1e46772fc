// What planning needs to know about a team, read once per request: rules and seed, the library, and each
// athlete's equipment, restrictions, rest weeks, risk ceiling and next meet, as stored. The engine's
// requests are built from these facts by the shared request builder, exactly as the board builds them.
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine';
import type { PlanningFacts } from '../../../shared/planning';
import {
  readRuleOverrides,
  readTeamRules,
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
  restWeeksFor,
  restrictionsFor,
  teamVariants,
  upcomingMeets,
  type AthleteRow,
} from './plans.repository';
import { isoDay } from '../../lib/days';
import { variantTraits } from '../variants/variants.service';

export interface Today {
  day: string;
  week: string;
  next: string;
}

export function today(now = new Date()): Today {
  const week = weekOfDate(now);
  return { day: isoDay(now), week, next: addWeeks(week, 1) };
}

export interface Planning extends PlanningFacts {
  rules: TeamRules;
  seed: string;
  rulesVersion: number;
  gymEquipment: string[];
  slots: BoardSlot[];
  variants: BoardVariant[];
  variantById: Map<number, BoardVariant>;
  athletes: BoardAthlete[];
  athleteById: Map<number, BoardAthlete>;
}

function boardVariant(v: Awaited<ReturnType<typeof teamVariants>>[number]): BoardVariant {
  return { id: v.id, ...variantTraits(v), archived: v.archivedAt !== null };
}

/**
 * Reads the team's planning facts. `athletes` defaults to everyone on the board. Every restriction that
 * has not ended before this week is read, whatever weeks the caller plans: the request builder hands each
 * to the engine with its own weeks, so the board and the server judge a cell from the same facts.
 */
export async function loadPlanning(
  db: Queryable,
  teamId: number,
  opts: { athletes?: AthleteRow[]; today: Today; seed?: string },
): Promise<Planning> {
  const [rulesRow, variantRows, athleteRows] = await Promise.all([
    readRulesRow(db, teamId),
    teamVariants(db, teamId),
    opts.athletes ? Promise.resolve(opts.athletes) : listAthletes(db, teamId),
  ]);
  const ids = athleteRows.map((a) => a.id);
  const [restrictionRows, meetRows, restRows] = await Promise.all([
    restrictionsFor(db, teamId, ids, isoDay(mondayOf(opts.today.week))),
    upcomingMeets(db, teamId, ids, opts.today.day),
    restWeeksFor(db, teamId, ids),
  ]);

  const rules = readTeamRules(rulesRow?.rules);
  const seed = opts.seed ?? rulesRow?.seed ?? 'default';
  const gymEquipment = rulesRow?.equipment ?? [];
  const gym = new Set(gymEquipment);
  const variants = variantRows.map(boardVariant);

  const restrictionsOf = new Map<number, BoardRestriction[]>();
  for (const r of restrictionRows) {
    const list = restrictionsOf.get(r.athleteId) ?? [];
    list.push({
      joint: r.joint,
      maxStress: r.maxStress,
      emphasis: r.emphasis,
      families: r.families,
      fromDate: r.fromDate,
      toDate: r.toDate,
      note: r.note,
    });
    restrictionsOf.set(r.athleteId, list);
  }
  const restOf = new Map<number, string[]>();
  for (const r of restRows) {
    const list = restOf.get(r.athleteId) ?? [];
    list.push(r.week);
    restOf.set(r.athleteId, list);
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

  const athletes = athleteRows.map((row): BoardAthlete => ({
    id: row.id,
    name: row.name,
    equipment: row.equipment.filter((e) => gym.has(e)),
    restrictions: restrictionsOf.get(row.id) ?? [],
    meet: meetOf.get(row.id) ?? null,
    ruleOverrides: readRuleOverrides(row.ruleOverrides) satisfies AthleteRuleOverrides,
    maxRisk: row.maxRisk === null ? null : (Math.min(3, Math.max(1, row.maxRisk)) as 1 | 2 | 3),
    restWeeks: restOf.get(row.id) ?? [],
  }));

  return {
    rules,
    seed,
    rulesVersion: rulesRow?.version ?? 0,
    gymEquipment,
    slots: rules.slots.map((s) => ({ id: s.id, label: s.label, lifts: [...s.lifts] })),
    variants,
    variantById: new Map(variants.map((v) => [v.id, v])),
    athletes,
    athleteById: new Map(athletes.map((a) => [a.id, a])),
  };
}

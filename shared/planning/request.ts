// The one place stored planning data becomes the engine's PlanRequest: the server's plan services and the
// board's live checks both build their requests here, so a cell gets the same answer in browser and server.
// Dated restrictions become ISO week ranges, archived and meet-phase variants keep their flags, rest weeks
// and risk ceilings pass through, and each athlete's rule overrides sit on top of the team's rules.
import type { AthleteInput, PlanEntry, PlanRequest, Restriction, Rules, SlotDef, Variant } from '../engine/types';
import { weekOfDate } from '../engine/weeks';
import type { BoardAthlete, BoardRestriction, BoardSlot, BoardVariant } from '../schemas/plans';
import type { AthleteRuleOverrides, TeamRules } from '../schemas/rules';

/** A stored plan cell, as the server reads it and the board snapshot carries it. */
export interface StoredEntry {
  athleteId: number;
  week: string;
  slotId: string;
  /** null: a cleared cell, which holds nothing for the engine. */
  variantId: number | null;
  pinned: boolean;
}

/** The team's planning facts, as stored (and as the board snapshot carries them). */
export interface PlanningFacts {
  rules: TeamRules;
  seed: string;
  slots: BoardSlot[];
  variants: BoardVariant[];
  athletes: BoardAthlete[];
}

/** Athletes that share effective rules share one request: the engine takes one set of rules per request. */
export interface RulesGroup {
  rules: Rules;
  athleteIds: number[];
  request: PlanRequest;
}

export function engineVariant(v: BoardVariant): Variant {
  return {
    id: String(v.id),
    name: v.name,
    lift: v.lift,
    family: v.family,
    risk: v.risk,
    specificity: v.specificity,
    stress: v.stress,
    equipment: v.equipment,
    emphasis: v.emphasis,
    bar: v.bar,
    // Archived variants stay in the library so past picks still count toward windows and budgets.
    ...(v.archived ? { archived: true } : {}),
    ...(v.meetPhaseWeeks !== null && v.meetPhaseWeeks !== undefined ? { meetPhaseWeeks: v.meetPhaseWeeks } : {}),
  };
}

export function engineEntry(e: StoredEntry & { variantId: number }): PlanEntry {
  return {
    athleteId: String(e.athleteId),
    week: e.week,
    slotId: e.slotId,
    variantId: String(e.variantId),
    pinned: e.pinned,
  };
}

export const dayWeek = (day: string): string => weekOfDate(new Date(`${day}T00:00:00Z`));

/** A stored restriction covers the ISO weeks its first and last day fall in. */
export function engineRestriction(r: BoardRestriction): Restriction {
  const out: Restriction = { fromWeek: dayWeek(r.fromDate) };
  if (r.toDate !== null) out.toWeek = dayWeek(r.toDate);
  if (r.joint !== null && r.maxStress !== null) {
    out.joint = r.joint;
    out.maxStress = r.maxStress;
  }
  if (r.emphasis.length) out.emphasis = [...r.emphasis];
  if (r.families.length) out.families = [...r.families];
  return out;
}

/**
 * The engine's rules for one athlete: team rules with the athlete's overrides on top (joint budgets merge
 * per joint), and the team's plan seed.
 */
export function engineRules(team: TeamRules, seed: string, overrides: AthleteRuleOverrides = {}): Rules {
  return {
    repeatWindowWeeks: overrides.repeatWindowWeeks ?? team.repeatWindowWeeks,
    familyWindowWeeks: overrides.familyWindowWeeks ?? team.familyWindowWeeks,
    jointWindowWeeks: overrides.jointWindowWeeks ?? team.jointWindowWeeks,
    jointBudget: { ...team.jointBudget, ...(overrides.jointBudget ?? {}) },
    taper: team.taper.map((t) => ({ ...t })),
    seed,
    comfortRatio: team.comfortRatio,
    liftBalanceWeeks: team.liftBalanceWeeks,
  };
}

export function engineSlots(slots: readonly { id: string; lifts: readonly BoardSlot['lifts'][number][] }[]): SlotDef[] {
  return slots.map((s) => ({ id: s.id, lifts: [...s.lifts] }));
}

/**
 * One athlete as the engine sees them. Every restriction goes in with its own weeks: the engine applies
 * each only to the weeks it covers, so no caller's choice of weeks can change what a cell may hold.
 */
export function athleteInput(a: BoardAthlete, history: PlanEntry[]): AthleteInput {
  return {
    id: String(a.id),
    equipment: [...a.equipment],
    restrictions: a.restrictions.map(engineRestriction),
    ...(a.meet ? { meetWeek: a.meet.week } : {}),
    ...(a.maxRisk !== null ? { maxRisk: a.maxRisk } : {}),
    ...(a.restWeeks.length ? { restWeeks: [...a.restWeeks] } : {}),
    history,
  };
}

export interface BuildOptions {
  /** Consecutive ISO weeks to plan or check, oldest first. */
  weeks: string[];
  /**
   * The stored entries of these athletes. Those before the first week are history; the rest are on the
   * board (`planned`). Leave out what the caller wants re-picked or is about to change.
   */
  entries: readonly StoredEntry[];
  /** Only these athletes (default: every athlete in the facts). */
  athleteIds?: readonly number[];
}

/** The requests for a set of athletes: one per group of athletes with the same effective rules. */
export function buildPlanRequests(facts: PlanningFacts, opts: BuildOptions): RulesGroup[] {
  const first = opts.weeks[0];
  const wanted = opts.athleteIds ? new Set(opts.athleteIds) : null;
  const athletes = wanted ? facts.athletes.filter((a) => wanted.has(a.id)) : facts.athletes;
  const variants = facts.variants.map(engineVariant);
  const slots = engineSlots(facts.slots);

  const historyOf = new Map<number, PlanEntry[]>();
  const plannedOf = new Map<number, PlanEntry[]>();
  for (const e of opts.entries) {
    if (e.variantId === null) continue;
    const into = first !== undefined && e.week < first ? historyOf : plannedOf;
    const list = into.get(e.athleteId);
    const entry = engineEntry({ ...e, variantId: e.variantId });
    if (list) list.push(entry);
    else into.set(e.athleteId, [entry]);
  }

  const byRules = new Map<string, { rules: Rules; athletes: BoardAthlete[] }>();
  for (const a of athletes) {
    const rules = engineRules(facts.rules, facts.seed, a.ruleOverrides);
    const key = JSON.stringify(rules);
    const group = byRules.get(key);
    if (group) group.athletes.push(a);
    else byRules.set(key, { rules, athletes: [a] });
  }

  return [...byRules.values()].map((g) => ({
    rules: g.rules,
    athleteIds: g.athletes.map((a) => a.id),
    request: {
      variants,
      slots,
      athletes: g.athletes.map((a) => athleteInput(a, historyOf.get(a.id) ?? [])),
      rules: g.rules,
      weeks: [...opts.weeks],
      planned: g.athletes.flatMap((a) => plannedOf.get(a.id) ?? []),
    },
  }));
}

/** The request that holds one athlete (their rules group), or undefined when the athlete is not in the facts. */
export function buildAthleteRequest(
  facts: PlanningFacts,
  athleteId: number,
  opts: Omit<BuildOptions, 'athleteIds'>,
): PlanRequest | undefined {
  return buildPlanRequests(facts, { ...opts, athleteIds: [athleteId] })[0]?.request;
}

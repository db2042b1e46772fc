// The board's data in the engine's terms, built once per snapshot: athletes grouped by their effective
// rules (the engine takes one set of rules per request), rule warnings per cell, joint loads per athlete,
// and the live checks a drag uses, so every drop is judged in the browser with no round-trip.
import {
  checkPlan,
  jointLoadSeries,
  prepareCandidateChecks,
  type AthleteInput,
  type CandidateChecks,
  type JointLoadPoint,
  type PlanEntry,
  type Rules,
} from '../../../../shared/engine';
import { buildPlanRequests, type RulesGroup, type StoredEntry } from '../../../../shared/planning';
import {
  type BoardAthlete,
  type BoardData,
  type BoardSlot,
  type BoardVariant,
  type PlanEntryDto,
} from '../../../../shared/schemas';

export type CellKey = string;
export interface CellRef {
  athleteId: number;
  week: string;
  slotId: string;
}

export const cellKey = (athleteId: number, week: string, slotId: string): CellKey => `${athleteId}|${week}|${slotId}`;
export const keyOf = (c: CellRef): CellKey => cellKey(c.athleteId, c.week, c.slotId);

export function parseCellKey(key: CellKey): CellRef {
  const [athleteId, week, slotId] = key.split('|');
  return { athleteId: Number(athleteId), week: week!, slotId: slotId! };
}

export type { RulesGroup };

export interface AthleteView {
  athlete: BoardAthlete;
  /** Per visible week: the joint loads of the span ending that week (ratio = load ÷ budget). */
  loads: JointLoadPoint[][];
  /** The highest ratio on the board's weeks, and where. */
  peak: JointLoadPoint | null;
}

export interface BoardModel {
  data: BoardData;
  weeks: string[];
  /** First week that can still be planned (this week). */
  editableFrom: string;
  slots: BoardSlot[];
  /** The board's rows, in order. */
  athletes: BoardAthlete[];
  athleteById: Map<number, BoardAthlete>;
  variantById: Map<number, BoardVariant>;
  entryAt: Map<CellKey, PlanEntryDto>;
  /** An athlete's joint loads and peak (worked out on first use). */
  view(athleteId: number): AthleteView;
  /** What checkPlan reports for the cell's current pick, in plain words (worked out per athlete on first use). */
  warnings(key: CellKey): string[] | undefined;
  groups: RulesGroup[];
  groupOf: Map<number, RulesGroup>;
  /** Cells a drop may target: editable weeks × athletes × slots, in board order. */
  targets: CellRef[];
  /** Per athlete: warnings, loads and what they were worked out from, to reuse them when unchanged. */
  factsOf(athleteId: number): AthleteFacts | undefined;
  /** The athletes' facts worked out so far. */
  facts: ReadonlyMap<number, AthleteFacts>;
}

/** Every stored entry the snapshot carries: the board's weeks and the context around them. */
function storedEntries(data: BoardData): StoredEntry[] {
  return [...data.context, ...data.entries];
}

/**
 * Builds the model of a snapshot. Given the previous model, lists and cells whose content did not change
 * keep their identity, so memoised cells skip redrawing after a save.
 */
export function buildBoardModel(data: BoardData, prev?: BoardModel): BoardModel {
  const variantById = new Map(data.variants.map((v) => [v.id, v]));
  // One request per rules group over the board's weeks, through the same builder the server uses.
  const groups = buildPlanRequests(data, { weeks: data.weeks, entries: storedEntries(data) });
  const groupOf = new Map<number, RulesGroup>();
  for (const g of groups) for (const id of g.athleteIds) groupOf.set(id, g);
  const planned = groups.flatMap((g) => g.request.planned ?? []);

  const entryAt = new Map<CellKey, PlanEntryDto>();
  for (const e of data.entries) entryAt.set(cellKey(e.athleteId, e.week, e.slotId), e);

  // Rule warnings and joint loads are worked out per athlete when a row first needs them (rows off
  // screen are not drawn), and an athlete whose board and rules did not change since the previous model
  // keeps what was worked out then.
  const plannedOf = new Map<string, PlanEntry[]>();
  for (const e of planned) {
    const list = plannedOf.get(e.athleteId);
    if (list) list.push(e);
    else plannedOf.set(e.athleteId, [e]);
  }
  const athleteById = new Map(data.athletes.map((a) => [a.id, a]));
  const facts = new Map<number, AthleteFacts>();
  // Only what the previous model already worked out is carried over, so models do not chain up.
  const inherited = new Map(prev?.facts);
  const factsOf = (id: number): AthleteFacts | undefined => {
    const hit = facts.get(id);
    if (hit) return hit;
    const g = groupOf.get(id);
    const athlete = athleteById.get(id);
    const input = g?.request.athletes.find((a) => a.id === String(id));
    if (!g || !athlete || !input) return undefined;
    const own = plannedOf.get(input.id) ?? [];
    const sig = signature(g.rules, input, own, data.weeks);
    const old = inherited.get(id);
    let made: AthleteFacts;
    if (old && old.sig === sig && old.view.athlete === athlete) made = old;
    else {
      const warnings = new Map<CellKey, string[]>();
      for (const v of checkPlan(g.request, own)) {
        const key = cellKey(id, v.week, v.slotId);
        warnings.set(key, [...(warnings.get(key) ?? []), v.message]);
      }
      made = {
        sig,
        warnings,
        view: athleteView(athlete, data.weeks, jointLoadSeries(g.request, input.id, data.weeks, own)),
      };
    }
    facts.set(id, made);
    return made;
  };

  const editableWeeks = data.weeks.filter((w) => w >= data.currentWeek);
  let targets: CellRef[] = [];
  for (const a of data.athletes) {
    for (const week of editableWeeks) for (const s of data.slots) targets.push({ athleteId: a.id, week, slotId: s.id });
  }
  if (prev && prev.targets.length === targets.length && prev.targets.every((t, i) => keyOf(t) === keyOf(targets[i]!))) {
    targets = prev.targets;
  }

  return {
    data,
    weeks: data.weeks,
    editableFrom: data.currentWeek,
    slots: data.slots,
    athletes: data.athletes,
    athleteById,
    variantById,
    entryAt,
    groups,
    groupOf,
    targets,
    facts,
    factsOf,
    view: (id) => factsOf(id)?.view ?? athleteView(athleteById.get(id)!, data.weeks, []),
    warnings: (key) => factsOf(parseCellKey(key).athleteId)?.warnings.get(key),
  };
}

function athleteView(athlete: BoardAthlete, weeks: string[], points: JointLoadPoint[]): AthleteView {
  const byWeek = new Map<string, JointLoadPoint[]>();
  let peak: JointLoadPoint | null = null;
  for (const p of points) {
    const list = byWeek.get(p.week) ?? [];
    list.push(p);
    byWeek.set(p.week, list);
    if (!peak || p.ratio > peak.ratio) peak = p;
  }
  return { athlete, loads: weeks.map((w) => byWeek.get(w) ?? []), peak };
}

interface AthleteFacts {
  sig: string;
  warnings: Map<CellKey, string[]>;
  view: AthleteView;
}

/** Everything an athlete's warnings and loads depend on, as one string. */
function signature(rules: Rules, input: AthleteInput, own: PlanEntry[], weeks: string[]): string {
  const entries = (list: PlanEntry[]) =>
    list.map((e) => `${e.week}${e.slotId}${e.variantId}${e.pinned ? 'p' : ''}`).join(',');
  return [
    JSON.stringify(rules),
    input.equipment.join(','),
    JSON.stringify(input.restrictions),
    input.meetWeek ?? '',
    input.maxRisk ?? '',
    (input.restWeeks ?? []).join(','),
    weeks[0],
    weeks.length,
    entries(input.history),
    entries(own),
  ].join('|');
}

// ---- live checks while dragging ----

export type DropStatus = 'clean' | 'warning' | 'break' | 'wrongLift' | 'source';

export interface DropRating {
  status: DropStatus;
  /** The rules the drop would break, in plain words. */
  breaks: string[];
  /** Softer things worth a look (a joint near its budget, a window only just kept). */
  warnings: string[];
}

/** What is being dragged: a library variant, or the pick of one cell (to move or swap it). */
export type DragSource =
  { kind: 'library'; variantId: number } | { kind: 'cell'; cell: CellRef; variantId: number; entry: PlanEntryDto };

const CLEAN: DropRating = { status: 'clean', breaks: [], warnings: [] };
const SOURCE: DropRating = { status: 'source', breaks: [], warnings: [] };

/** Drop ratings of one drag, worked out per cell when first asked for and kept for the rest of the drag. */
export interface Ratings {
  readonly source: DragSource;
  /** undefined for a cell that is not a target (a past week, an unknown athlete). */
  get(key: CellKey): DropRating | undefined;
}

/**
 * Prepares the engine for this drag (once per rules group, on first need) and rates cells on demand, so
 * a drag start pays only for the cells on screen. A dragged cell's own pick is taken off the board
 * first, since it leaves its cell when dropped.
 */
export function prepareRatings(model: BoardModel, source: DragSource): Ratings {
  const variant = model.variantById.get(source.variantId);
  const cache = new Map<CellKey, DropRating | undefined>();
  const checksOf = new Map<RulesGroup, CandidateChecks>();
  const checks = (g: RulesGroup) => {
    let c = checksOf.get(g);
    if (!c) {
      let req = g.request;
      if (source.kind === 'cell' && g.athleteIds.includes(source.cell.athleteId)) {
        const skip = keyOf(source.cell);
        req = {
          ...req,
          planned: (req.planned ?? []).filter((e) => cellKey(Number(e.athleteId), e.week, e.slotId) !== skip),
        };
      }
      c = prepareCandidateChecks(req);
      checksOf.set(g, c);
    }
    return c;
  };
  const slotLifts = new Map(model.slots.map((s) => [s.id, s.lifts]));
  const sourceKey = source.kind === 'cell' ? keyOf(source.cell) : null;

  const rate = (key: CellKey): DropRating | undefined => {
    if (!variant) return undefined;
    const t = parseCellKey(key);
    if (t.week < model.editableFrom || !model.weeks.includes(t.week)) return undefined;
    if (key === sourceKey) return SOURCE;
    const lifts = slotLifts.get(t.slotId);
    const group = model.groupOf.get(t.athleteId);
    if (!lifts || !group) return undefined;
    if (!lifts.includes(variant.lift)) {
      return { status: 'wrongLift', breaks: [`${variant.name} is a ${variant.lift} variant`], warnings: [] };
    }
    const r = checks(group).rate(String(t.athleteId), t.week, t.slotId, String(variant.id));
    if (r.status === 'clean') return CLEAN;
    return {
      status: r.status,
      breaks: r.violations.map((v) => v.message),
      warnings: r.warnings,
    };
  };

  return {
    source,
    get(key) {
      if (cache.has(key)) return cache.get(key);
      const r = rate(key);
      cache.set(key, r);
      return r;
    },
  };
}

/** Every target cell's rating for a drag, at once. */
export function rateTargets(model: BoardModel, source: DragSource): Map<CellKey, DropRating> {
  const ratings = prepareRatings(model, source);
  const out = new Map<CellKey, DropRating>();
  for (const t of model.targets) {
    const r = ratings.get(keyOf(t));
    if (r) out.set(keyOf(t), r);
  }
  return out;
}

/** Rule breaks the board would have after these picks, judged by the engine, per changed cell. */
export function breaksAfter(
  model: BoardModel,
  picks: { cell: CellRef; variantId: number | null }[],
): Map<CellKey, string[]> {
  const out = new Map<CellKey, string[]>();
  const changed = new Map(picks.map((p) => [keyOf(p.cell), p]));
  const groups = new Set(picks.map((p) => model.groupOf.get(p.cell.athleteId)).filter((g) => !!g));
  for (const g of groups) {
    const ids = new Set(g!.athleteIds.map(String));
    const entries: PlanEntry[] = (g!.request.planned ?? []).filter(
      (e) => ids.has(e.athleteId) && !changed.has(cellKey(Number(e.athleteId), e.week, e.slotId)),
    );
    for (const p of picks) {
      if (p.variantId === null || !g!.athleteIds.includes(p.cell.athleteId)) continue;
      entries.push({
        athleteId: String(p.cell.athleteId),
        week: p.cell.week,
        slotId: p.cell.slotId,
        variantId: String(p.variantId),
      });
    }
    for (const v of checkPlan(g!.request, entries)) {
      const key = cellKey(Number(v.athleteId), v.week, v.slotId);
      if (!changed.has(key)) continue;
      const list = out.get(key) ?? [];
      list.push(v.message);
      out.set(key, list);
    }
  }
  return out;
}

/** "<athlete> · <ISO week> · <slot>", as the cell's drop target is named. */
export function cellLabel(model: BoardModel, c: CellRef): string {
  const athlete = model.athleteById.get(c.athleteId)?.name ?? `Athlete ${c.athleteId}`;
  const slot = model.slots.find((s) => s.id === c.slotId)?.label ?? c.slotId;
  return `${athlete} · ${c.week} · ${slot}`;
}

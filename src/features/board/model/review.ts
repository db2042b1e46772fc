// Reviewing the board with the engine: each pick's status where it stands (clean, worth a look, breaks a
// rule) for the card badges and the "Needs a look" list, and a cell's ranked alternatives ("What fits
// here") from the same ranking the server answers with.
import {
  NEAR_BUDGET,
  addWeeks,
  jointLoadLabel,
  prepareCandidateChecks,
  rankAlternatives,
  summariseAlternatives,
  type AlternativesSummary,
  type CandidateChecks,
} from '../../../../shared/engine';
import type { AlternativeItem } from '../../../../shared/schemas';
import { cellKey, parseCellKey, type BoardModel, type CellKey, type CellRef, type RulesGroup } from './board-model';

export type PickStatus = 'clean' | 'warning' | 'break';

export interface CellReview {
  key: CellKey;
  cell: CellRef;
  variantId: number;
  status: PickStatus;
  /** Rule breaks first, then cautions, in plain words. */
  reasons: string[];
  /** The coach's reason for keeping a pick that breaks a rule. */
  explained: string | null;
}

interface ModelCache {
  checks: Map<RulesGroup, CandidateChecks>;
  byAthlete: Map<number, Map<CellKey, CellReview>>;
}
const caches = new WeakMap<BoardModel, ModelCache>();

function cacheOf(model: BoardModel): ModelCache {
  let c = caches.get(model);
  if (!c) {
    c = { checks: new Map(), byAthlete: new Map() };
    caches.set(model, c);
  }
  return c;
}

function checksFor(model: BoardModel, group: RulesGroup): CandidateChecks {
  const cache = cacheOf(model);
  let checks = cache.checks.get(group);
  if (!checks) {
    checks = prepareCandidateChecks(group.request);
    cache.checks.set(group, checks);
  }
  return checks;
}

const pct = (r: number) => `${Math.round(r * 100)}%`;

/**
 * Every pick of one athlete in the board's editable weeks, rated where it stands (worked out once per
 * model). A pick needs a look when it breaks a rule, or when a joint it loads is near its budget in a span
 * that holds it; the softer drag hints (a window only just kept, the same emphasis twice) stay off the
 * cards and the list.
 */
export function athleteReviews(model: BoardModel, athleteId: number): Map<CellKey, CellReview> {
  const cache = cacheOf(model);
  const hit = cache.byAthlete.get(athleteId);
  if (hit) return hit;
  const out = new Map<CellKey, CellReview>();
  const group = model.groupOf.get(athleteId);
  if (group) {
    const checks = checksFor(model, group);
    const loads = model.view(athleteId).loads;
    const span = Math.max(1, group.rules.jointWindowWeeks);
    for (const [wi, week] of model.weeks.entries()) {
      if (week < model.editableFrom) continue;
      for (const slot of model.slots) {
        const key = cellKey(athleteId, week, slot.id);
        const entry = model.entryAt.get(key);
        if (entry?.variantId == null) continue;
        const rating = checks.rate(String(athleteId), week, slot.id, String(entry.variantId));
        const variant = model.variantById.get(entry.variantId);
        const near: string[] = [];
        const last = addWeeks(week, span - 1);
        for (let i = wi; i < model.weeks.length && model.weeks[i]! <= last; i++) {
          for (const p of loads[i] ?? []) {
            if (!variant?.stress[p.joint] || p.ratio < NEAR_BUDGET || p.ratio > 1) continue;
            const line = `${jointLoadLabel(p.joint)} at ${pct(p.ratio)} of its budget in the ${span} weeks to ${p.week}`;
            if (!near.some((n) => n.startsWith(jointLoadLabel(p.joint)))) near.push(line);
          }
        }
        const breaks = rating.violations.map((v) => v.message);
        out.set(key, {
          key,
          cell: { athleteId, week, slotId: slot.id },
          variantId: entry.variantId,
          status: breaks.length ? 'break' : near.length ? 'warning' : 'clean',
          reasons: [...breaks, ...near],
          explained: entry.reason,
        });
      }
    }
  }
  cache.byAthlete.set(athleteId, out);
  return out;
}

/** The pick's status in a cell of an editable week; undefined for an empty or past cell. */
export function reviewOf(model: BoardModel, key: CellKey): CellReview | undefined {
  return athleteReviews(model, parseCellKey(key).athleteId).get(key);
}

/**
 * Cells that need a look in these weeks: every pick with a warning or a break, in board order (athletes as
 * listed, then week, then slot). `extra` cells (e.g. those a save changed) join the list whatever the week.
 */
export function needsALook(model: BoardModel, weeks: readonly string[], extra: Iterable<CellKey> = []): CellReview[] {
  const wanted = new Set(weeks);
  const extraKeys = new Set(extra);
  const out: CellReview[] = [];
  for (const a of model.athletes) {
    for (const r of athleteReviews(model, a.id).values()) {
      if (r.status === 'clean') continue;
      if (wanted.has(r.cell.week) || extraKeys.has(r.key)) out.push(r);
    }
  }
  return out;
}

export interface CellAlternatives {
  items: AlternativeItem[];
  summary: AlternativesSummary;
}

/** The library ranked for one cell: clean, then worth a look, then breaks a rule, with the reasons. */
export function alternativesOf(model: BoardModel, cell: CellRef): CellAlternatives {
  const group = model.groupOf.get(cell.athleteId);
  if (!group) return { items: [], summary: summariseAlternatives([]) };
  const current = model.entryAt.get(cellKey(cell.athleteId, cell.week, cell.slotId))?.variantId ?? null;
  const ranked = rankAlternatives(
    group.request,
    String(cell.athleteId),
    cell.week,
    cell.slotId,
    checksFor(model, group),
  ).filter((a) => !model.variantById.get(Number(a.variantId))?.archived);
  return {
    summary: summariseAlternatives(ranked),
    items: ranked.map((a) => ({
      variantId: Number(a.variantId),
      name: a.name,
      status: a.status,
      reasons: a.reasons,
      rules: [...new Set(a.violations.map((v) => v.rule))],
      current: current === Number(a.variantId),
    })),
  };
}

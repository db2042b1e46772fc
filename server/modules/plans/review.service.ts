// Reviewing a plan with the engine: the status of every pick (clean, warning, break) and how a save
// changed them, the library ranked for one cell ("What fits here"), and a week's picks for publishing.
import {
  prepareCandidateChecks,
  rankAlternatives,
  summariseAlternatives,
  weekRange,
  type AlternativesSummary,
  type PlanRequest,
} from '../../../shared/engine';
import { buildAthleteRequest } from '../../../shared/planning';
import type { AlternativesResponse, CellStatusChange, PlanCell } from '../../../shared/schemas';
import type { Db, Queryable } from '../../db/client';
import { NotFoundError } from '../../lib/errors';
import { loadPlanning, today, type Planning } from './plans.context';
import { entriesOfAthletes, listAthletes, type EntryRow } from './plans.repository';

export type CellStatus = 'clean' | 'warning' | 'break';
export interface RatedCell {
  athleteId: number;
  week: string;
  slotId: string;
  variantId: number;
  reason: string | null;
  status: CellStatus;
  /** Rule breaks first, then cautions, in plain words. */
  reasons: string[];
}

export { today };

const keyOf = (c: { athleteId: number; week: string; slotId: string }) => `${c.athleteId}|${c.week}|${c.slotId}`;

/**
 * One athlete's engine request over their whole stored plan (every entry counts toward the windows), built
 * by the shared request builder as the board builds it.
 */
function requestFor(planning: Planning, athleteId: number, rows: EntryRow[]): PlanRequest | undefined {
  const own = rows.filter((r) => r.athleteId === athleteId);
  const weeks = own.map((r) => r.week).sort();
  return buildAthleteRequest(planning, athleteId, {
    weeks: weeks.length ? weekRange(weeks[0]!, weeks[weeks.length - 1]!) : [today().week],
    entries: own,
  });
}

/** Every pick of these athletes (in `weeks` when given), rated where it stands. */
export function rateCells(planning: Planning, rows: EntryRow[], athleteIds: number[], weeks?: Set<string>) {
  const out: RatedCell[] = [];
  for (const id of athleteIds) {
    const req = requestFor(planning, id, rows);
    if (!req) continue;
    const checks = prepareCandidateChecks(req);
    for (const r of rows) {
      if (r.athleteId !== id || r.variantId === null || (weeks && !weeks.has(r.week))) continue;
      const rating = checks.rate(String(id), r.week, r.slotId, String(r.variantId));
      out.push({
        athleteId: id,
        week: r.week,
        slotId: r.slotId,
        variantId: r.variantId,
        reason: r.reason,
        status: rating.status,
        reasons: [...rating.violations.map((v) => v.message), ...rating.warnings],
      });
    }
  }
  return out;
}

/**
 * Cells other than the changed ones that started or stopped breaking a rule between two states of the
 * board, e.g. an override in one week that makes last week's engine pick repeat too soon.
 */
export function statusChanges(
  planning: Planning,
  before: EntryRow[],
  after: EntryRow[],
  athleteIds: number[],
  changed: Set<string>,
): CellStatusChange[] {
  const was = new Map(rateCells(planning, before, athleteIds).map((c) => [keyOf(c), c]));
  const out: CellStatusChange[] = [];
  for (const now of rateCells(planning, after, athleteIds)) {
    const key = keyOf(now);
    if (changed.has(key)) continue;
    const old = was.get(key);
    // Only a pick that starts or stops breaking a rule is news; softer hints come and go with every change.
    if (!old || old.variantId !== now.variantId || (old.status === 'break') === (now.status === 'break')) continue;
    out.push({
      athleteId: now.athleteId,
      week: now.week,
      slotId: now.slotId,
      variantId: now.variantId,
      from: old.status,
      to: now.status,
      reasons: now.reasons,
    });
  }
  return out;
}

/** The library ranked for one cell; another team's athlete, or an unknown slot, is not found. */
export async function alternativesFor(db: Db, teamId: number, cell: PlanCell): Promise<AlternativesResponse> {
  const [row] = await listAthletes(db, teamId, [cell.athleteId]);
  if (!row) throw new NotFoundError('That athlete');
  const planning = await loadPlanning(db, teamId, { athletes: [row], today: today() });
  if (!planning.slots.some((s) => s.id === cell.slotId)) throw new NotFoundError('That slot');
  const rows = await entriesOfAthletes(db, teamId, [row.id]);
  const req = requestFor(planning, row.id, rows)!;
  const ranked = rankAlternatives(req, String(row.id), cell.week, cell.slotId).filter(
    (a) => !planning.variantById.get(Number(a.variantId))?.archived,
  );
  const summary: AlternativesSummary = summariseAlternatives(ranked);
  const current = rows.find((r) => keyOf(r) === keyOf(cell))?.variantId ?? null;
  return {
    items: ranked.map((a) => ({
      variantId: Number(a.variantId),
      name: a.name,
      status: a.status,
      reasons: a.reasons,
      rules: [...new Set(a.violations.map((v) => v.rule))],
      current: current === Number(a.variantId),
    })),
    summary,
  };
}

/** What publishing a week needs: each athlete of the team with their picks of that week, rated. */
export async function weekForPublishing(db: Queryable, teamId: number, week: string) {
  const athletes = await listAthletes(db, teamId);
  const planning = await loadPlanning(db, teamId, { athletes, today: today() });
  const ids = athletes.map((a) => a.id);
  const rows = await entriesOfAthletes(db, teamId, ids);
  return {
    slots: planning.slots,
    athletes: athletes.map((a) => ({ id: a.id, name: a.name })),
    cells: rateCells(planning, rows, ids, new Set([week])),
    variantName: (id: number) => planning.variantById.get(id)?.name ?? `variant ${id}`,
  };
}

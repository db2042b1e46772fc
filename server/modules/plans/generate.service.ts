// Fill next week, Plan to meet and Reshuffle: gathers the team's planning facts and every athlete's
// history, runs the engine, and writes what changed, with history rows, in one transaction.
import { inTransaction } from '../../db/transaction';
import { randomBytes } from 'node:crypto';
import { generatePlan, weekRange, type PlanResult } from '../../../shared/engine';
import { buildPlanRequests } from '../../../shared/planning';
import {
  MAX_GENERATE_WEEKS,
  type BoardAthlete,
  type GenerateChange,
  type GenerateResult,
  type generateBody,
} from '../../../shared/schemas';
import type { z } from 'zod';
import type { Db } from '../../db/client';
import type { AuthContext } from '../../middleware/auth';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import { publishChange } from '../events/events.service';
import { loadPlanning, today } from './plans.context';
import { entryDtos } from './plans.dto';
import {
  appendHistory,
  entriesByIds,
  entriesOfAthletes,
  insertEntry,
  listAthletes,
  readRulesRow,
  setSeed,
  updateEntry,
  type EntryRow,
  type EntryWrite,
  type HistoryInsert,
} from './plans.repository';

type Body = z.output<typeof generateBody>;

const key = (athleteId: number | string, week: string, slotId: string) => `${athleteId}|${week}|${slotId}`;

interface Job {
  athlete: BoardAthlete;
  weeks: string[];
}

/** The weeks each athlete gets filled, or why they are left out. */
function weeksFor(
  body: Body,
  athlete: BoardAthlete,
  rows: EntryRow[],
  next: string,
): { weeks: string[] } | { skip: string } {
  const cap = (last: string) => weekRange(next, last).slice(0, MAX_GENERATE_WEEKS);
  if (body.weeks === 'next') return { weeks: [next] };
  if (body.weeks === 'toMeet') {
    const meet = athlete.meet;
    if (!meet) return { skip: 'no meet ahead' };
    if (meet.week < next) return { skip: 'the meet is this week' };
    return { weeks: cap(meet.week) };
  }
  if (body.weeks === 'ahead') {
    let last = next;
    for (const r of rows) if (r.variantId !== null && r.week > last) last = r.week;
    return { weeks: cap(last) };
  }
  return { weeks: weekRange(body.weeks.from, body.weeks.to) };
}

export async function generate(db: Db, auth: AuthContext, body: Body): Promise<GenerateResult> {
  const t = today();
  if (typeof body.weeks === 'object' && body.weeks.from < t.week) {
    throw new ValidationError('Some fields need attention.', {
      'weeks.from': [`Past weeks are history; plan ${t.week} or later`],
    });
  }
  const teamId = auth.teamId;

  return inTransaction(db, async (tx) => {
    const athletes = await listAthletes(tx, teamId, body.athleteIds);
    if (body.athleteIds && athletes.length !== new Set(body.athleteIds).size) throw new NotFoundError('That athlete');
    let seed: string | undefined;
    if (body.reshuffle) {
      // Locks the rules row so two reshuffles take turns.
      const rulesRow = await readRulesRow(tx, teamId, true);
      do seed = randomBytes(6).toString('hex');
      while (seed === rulesRow?.seed);
      await setSeed(tx, teamId, seed, auth.userId);
    }
    const ids = athletes.map((a) => a.id);
    const rows = await entriesOfAthletes(tx, teamId, ids, true);
    const planning = await loadPlanning(tx, teamId, { athletes, today: t, ...(seed ? { seed } : {}) });

    const rowsOf = new Map<number, EntryRow[]>();
    for (const r of rows) {
      const list = rowsOf.get(r.athleteId) ?? [];
      list.push(r);
      rowsOf.set(r.athleteId, list);
    }
    const jobs: Job[] = [];
    const skipped: GenerateResult['skipped'] = [];
    for (const athlete of planning.athletes) {
      const w = weeksFor(body, athlete, rowsOf.get(athlete.id) ?? [], t.next);
      if ('skip' in w) skipped.push({ athleteId: athlete.id, reason: w.skip });
      else jobs.push({ athlete, weeks: w.weeks });
    }

    // Athletes filled over the same weeks share requests (one per set of effective rules).
    const byWeeks = new Map<string, Job[]>();
    for (const j of jobs) {
      const k = j.weeks.join(',');
      byWeeks.set(k, [...(byWeeks.get(k) ?? []), j]);
    }
    const results: PlanResult[] = [];
    for (const group of byWeeks.values()) {
      const weeks = group[0]!.weeks;
      const inFill = new Set(weeks);
      const athleteIds = group.map((j) => j.athlete.id);
      // A reshuffle re-picks every unpinned engine pick in the weeks it fills.
      const entries = athleteIds
        .flatMap((id) => rowsOf.get(id) ?? [])
        .filter((r) => !(body.reshuffle && inFill.has(r.week) && r.source === 'engine' && !r.pinned));
      for (const g of buildPlanRequests(planning, { weeks, entries, athleteIds }))
        results.push(generatePlan(g.request));
    }

    const rowAt = new Map(rows.map((r) => [key(r.athleteId, r.week, r.slotId), r]));
    const history: HistoryInsert[] = [];
    const written: { id: number; previous: GenerateChange['previous']; swap: GenerateChange['swap'] }[] = [];
    let kept = 0;
    const write = async (athleteId: number, week: string, slotId: string, w: EntryWrite) => {
      const row = rowAt.get(key(athleteId, week, slotId));
      const cell = { athleteId, week, slotId };
      let id: number;
      let version = 1;
      if (row) {
        if (!(await updateEntry(tx, row.id, row.version, w))) throw new ConflictError('The board changed meanwhile.');
        id = row.id;
        version = row.version + 1;
      } else {
        id = await insertEntry(tx, teamId, cell, w);
      }
      history.push({
        teamId,
        planEntryId: id,
        ...cell,
        oldVariantId: row?.variantId ?? null,
        newVariantId: w.variantId ?? null,
        source: w.source,
        pinned: false,
        reason: null,
        version,
        changedBy: auth.userId,
      });
      const previous = row
        ? { variantId: row.variantId, source: row.source, pinned: row.pinned, reason: row.reason, reasons: row.reasons }
        : null;
      return { id, previous };
    };

    const unfilled: GenerateResult['unfilled'] = [];
    for (const result of results) {
      const swapAt = new Map(result.swaps.map((s) => [key(s.athleteId, s.week, s.slotId), s]));
      for (const e of result.entries) {
        const row = rowAt.get(key(e.athleteId, e.week, e.slotId));
        if (e.pinned || (row && row.variantId === Number(e.variantId))) {
          kept++;
          continue;
        }
        const athleteId = Number(e.athleteId);
        const done = await write(athleteId, e.week, e.slotId, {
          variantId: Number(e.variantId),
          source: 'engine',
          pinned: false,
          reason: null,
          reasons: e.reasons,
          updatedBy: auth.userId,
        });
        const swap = swapAt.get(key(e.athleteId, e.week, e.slotId));
        written.push({ ...done, swap: swap ? { from: Number(swap.from), rule: swap.rule } : null });
      }
      for (const u of result.unfilled) {
        const athleteId = Number(u.athleteId);
        const row = rowAt.get(key(athleteId, u.week, u.slotId));
        let dropped: GenerateResult['unfilled'][number]['dropped'] = null;
        if (u.dropped) {
          dropped = { variantId: Number(u.dropped.variantId), rule: u.dropped.rule, message: u.dropped.message };
        }
        if (dropped && row && row.variantId !== null) {
          // Nothing valid could replace it: the cell is emptied rather than left breaking a rule.
          const done = await write(athleteId, u.week, u.slotId, {
            variantId: null,
            source: 'engine',
            pinned: false,
            reason: null,
            reasons: [`cleared: ${dropped.message}`],
            updatedBy: auth.userId,
          });
          written.push({ ...done, swap: null });
        }
        unfilled.push({ athleteId, week: u.week, slotId: u.slotId, blockedBy: u.blockedBy, dropped });
      }
      // A rest week holds no max-effort pick: what the engine took out of one is emptied here.
      for (const c of result.cleared ?? []) {
        const row = rowAt.get(key(c.athleteId, c.week, c.slotId));
        if (!row || row.variantId === null || row.pinned) continue;
        const done = await write(Number(c.athleteId), c.week, c.slotId, {
          variantId: null,
          source: 'engine',
          pinned: false,
          reason: null,
          reasons: ['cleared: rest week'],
          updatedBy: auth.userId,
        });
        written.push({ ...done, swap: null });
      }
    }
    await appendHistory(tx, history);

    const saved = await entriesByIds(
      tx,
      teamId,
      written.map((w) => w.id),
    );
    // Open boards (and, once published, athletes' pages) hear which athletes and weeks the run changed.
    const changedWeeks = new Map<number, Set<string>>();
    for (const r of saved) changedWeeks.set(r.athleteId, (changedWeeks.get(r.athleteId) ?? new Set()).add(r.week));
    for (const [athleteId, weeksChanged] of changedWeeks) {
      await publishChange(tx, { teamId, athleteId, topic: 'plan', weeks: [...weeksChanged] });
    }
    const dtos = new Map((await entryDtos(tx, saved)).map((d) => [d.id, d]));
    const weeks = [...new Set(jobs.flatMap((j) => j.weeks))].sort();
    return {
      weeks,
      seed: planning.seed,
      changes: written.map((w) => ({ entry: dtos.get(w.id)!, previous: w.previous, swap: w.swap })),
      kept,
      unfilled,
      skipped,
    };
  });
}

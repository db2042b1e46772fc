// The coach's board in one answer: athletes with their planning facts, the library, rules and slots, the
// entries of the visible weeks, and every other entry as engine input, so the browser can check drops itself.
import { weekRange } from '../../../shared/engine';
import type { BoardData, BoardQuery } from '../../../shared/schemas';
import type { Db } from '../../db/client';
import { entriesOfAthletes, entryDtos, loadPlanning, today } from '../plans/plans.service';

export async function loadBoard(db: Db, teamId: number, q: BoardQuery): Promise<BoardData> {
  const t = today();
  const planning = await loadPlanning(db, teamId, { today: t });
  const rows = await entriesOfAthletes(
    db,
    teamId,
    planning.athletes.map((a) => a.id),
  );
  const visible = rows.filter((r) => r.week >= q.from && r.week <= q.to);
  const context: BoardData['context'] = [];
  for (const r of rows) {
    if ((r.week >= q.from && r.week <= q.to) || r.variantId === null) continue;
    context.push({ athleteId: r.athleteId, week: r.week, slotId: r.slotId, variantId: r.variantId, pinned: r.pinned });
  }
  return {
    currentWeek: t.week,
    from: q.from,
    to: q.to,
    weeks: weekRange(q.from, q.to),
    rules: planning.rules,
    seed: planning.seed,
    rulesVersion: planning.rulesVersion,
    slots: planning.slots,
    variants: planning.variants,
    athletes: planning.athletes,
    entries: await entryDtos(db, visible),
    context,
  };
}

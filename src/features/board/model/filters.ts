// Which athletes' rows the board shows: by name, by meet (any, or within so many weeks), by restriction,
// and only those with a pick that needs a look. Pure, so it is tested without a browser.
import { addWeeks } from '../../../../shared/engine/weeks';
import { restrictionTag } from '../../../../shared/planning/words';
import type { BoardAthlete } from '../../../../shared/schemas';
import type { BoardModel, CellKey } from './board-model';
import { athleteReviews } from './review';

export interface BoardFilter {
  /** Part of the athlete's name, any case. */
  name: string;
  /** 'any'; 'meet': has a meet ahead; a number: the meet is within that many weeks from this week. */
  meet: 'any' | 'meet' | number;
  /** '' any; '*' any restriction; otherwise one restriction's tag. */
  restriction: string;
  needsALook: boolean;
}

export const NO_FILTER: BoardFilter = { name: '', meet: 'any', restriction: '', needsALook: false };

export function isFiltering(f: BoardFilter): boolean {
  return f.name.trim() !== '' || f.meet !== 'any' || f.restriction !== '' || f.needsALook;
}

/** The restriction tags on the board, for the filter's choices. */
export function restrictionTags(athletes: readonly BoardAthlete[]): string[] {
  return [...new Set(athletes.flatMap((a) => a.restrictions.map(restrictionTag)))].sort();
}

/** Does any pick of the athlete in the weeks still to plan need a look (or did the last save change one)? */
function needsALook(model: BoardModel, athleteId: number, flagged: ReadonlySet<CellKey>): boolean {
  for (const r of athleteReviews(model, athleteId).values()) if (r.status !== 'clean') return true;
  for (const k of flagged) if (k.startsWith(`${athleteId}|`)) return true;
  return false;
}

export function filterAthletes(model: BoardModel, f: BoardFilter, flagged: ReadonlySet<CellKey>): BoardAthlete[] {
  if (!isFiltering(f)) return model.athletes;
  const name = f.name.trim().toLowerCase();
  const current = model.data.currentWeek;
  return model.athletes.filter((a) => {
    if (name && !a.name.toLowerCase().includes(name)) return false;
    if (f.meet !== 'any') {
      if (!a.meet || a.meet.week < current) return false;
      if (typeof f.meet === 'number' && a.meet.week > addWeeks(current, f.meet)) return false;
    }
    if (f.restriction === '*' && a.restrictions.length === 0) return false;
    if (f.restriction && f.restriction !== '*' && !a.restrictions.some((r) => restrictionTag(r) === f.restriction))
      return false;
    if (f.needsALook && !needsALook(model, a.id, flagged)) return false;
    return true;
  });
}

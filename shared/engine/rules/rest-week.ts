// restWeek: a deload or rest week of the athlete holds no max-effort pick at all.

import { maskOf, weekStr } from '../core';
import type { CellRule } from './rule';

export const restWeek: CellRule = {
  kind: 'cell',
  id: 'restWeek',
  blockedIn: (ctx, ath, w) => (ath.restWeeks.has(w) ? maskOf(ctx, () => true) : null),
  describe: (_ctx, _ath, w) => [`${weekStr(w)} is a rest week for this athlete: no max-effort pick`],
};

/** Whether week w is one of the athlete's rest weeks (its cells are neither filled nor left unfilled). */
export function isRestWeek(ath: { restWeeks: Set<number> }, w: number): boolean {
  return ath.restWeeks.has(w);
}

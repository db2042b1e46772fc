// meetPhase: a meet-phase variant (meet rehearsals, opener singles) only when 0 <= weeks to the athlete's
// meet <= its meetPhaseWeeks; without a meet, never.

import { maskOf, type Ath, type Ctx } from '../core';
import * as W from '../words';
import type { CellRule } from './rule';

function inPhase(ctx: Ctx, ath: Ath, w: number, v: number): boolean {
  const phase = ctx.meetPhaseWeeks[v]!;
  if (phase < 0) return true;
  if (ath.meet === undefined) return false;
  const d = ath.meet - w;
  return d >= 0 && d <= phase;
}

/** "the last 3 weeks before a meet", "the meet week" */
function window(phase: number): string {
  return phase === 0 ? 'the meet week' : `the last ${W.weeks(phase)} before a meet`;
}

export const meetPhase: CellRule = {
  kind: 'cell',
  id: 'meetPhase',
  blockedIn: (ctx, ath, w) => (ctx.anyMeetPhase ? maskOf(ctx, (v) => !inPhase(ctx, ath, w, v)) : null),
  describe: (ctx, ath, w, _slot, v) => {
    const x = ctx.variants[v]!;
    const phase = ctx.meetPhaseWeeks[v]!;
    let now: string;
    if (ath.meet === undefined) now = 'this athlete has no meet planned';
    else if (ath.meet < w) now = `the meet was ${W.weeks(w - ath.meet)} ago`;
    else now = `the meet is ${W.weeks(ath.meet - w)} away`;
    return [`${x.name} is for ${window(phase)}; ${now}`];
  },
  reason: (ctx, ath, w, v) => {
    const phase = ctx.meetPhaseWeeks[v]!;
    if (phase < 0 || ath.meet === undefined) return null;
    return `meet-phase pick: ${W.meetDistance(ath.meet - w)} (allowed within ${W.weeks(phase)})`;
  },
};

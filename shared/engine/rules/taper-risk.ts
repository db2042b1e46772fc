// taperRisk: from a taper rule's weeksOut through the meet week, no variant above its risk limit.

import { maskOf, taperAt } from '../core';
import * as W from '../words';
import type { CellRule } from './rule';

export const taperRisk: CellRule = {
  kind: 'cell',
  id: 'taperRisk',
  blockedIn: (ctx, ath, w) => {
    const taper = taperAt(ctx, ath, w);
    if (!taper || !Number.isFinite(taper.maxRisk)) return null;
    return maskOf(ctx, (v) => ctx.risk[v]! > taper.maxRisk);
  },
  describe: (ctx, ath, w, _slot, v) => {
    const taper = taperAt(ctx, ath, w)!;
    const x = ctx.variants[v]!;
    return [`${x.name} has risk ${x.risk}, above the limit of ${taper.maxRisk} ${W.meetWhen(taper.weeksToMeet)}`];
  },
};

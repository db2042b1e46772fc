// riskCeiling: no variant above the athlete's own risk ceiling (e.g. 2 for a newer lifter).

import { maskOf } from '../core';
import type { CellRule } from './rule';

export const riskCeiling: CellRule = {
  kind: 'cell',
  id: 'riskCeiling',
  blockedIn: (ctx, ath) => (Number.isFinite(ath.maxRisk) ? maskOf(ctx, (v) => ctx.risk[v]! > ath.maxRisk) : null),
  describe: (ctx, ath, _w, _slot, v) => {
    const x = ctx.variants[v]!;
    return [`${x.name} has risk ${x.risk}, above this athlete's ceiling of ${ath.maxRisk}`];
  },
};

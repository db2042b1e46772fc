// taperSpecificity: from a taper rule's weeksOut through the meet week, no variant below its minimum
// specificity (when the rule sets one). Its reason line also reports the taper's risk limit.

import { EPS, maskOf, specText, taperAt } from '../core';
import * as W from '../words';
import type { CellRule } from './rule';

export const taperSpecificity: CellRule = {
  kind: 'cell',
  id: 'taperSpecificity',
  blockedIn: (ctx, ath, w) => {
    const taper = taperAt(ctx, ath, w);
    if (!taper || !Number.isFinite(taper.minSpecificity)) return null;
    return maskOf(ctx, (v) => ctx.specificity[v]! < taper.minSpecificity - EPS);
  },
  describe: (ctx, ath, w, _slot, v) => {
    const taper = taperAt(ctx, ath, w)!;
    const x = ctx.variants[v]!;
    return [
      `${x.name} has specificity ${specText(x.specificity)}, below the minimum of ${specText(taper.minSpecificity)} ${W.meetWhen(taper.weeksToMeet)}`,
    ];
  },
  reason: (ctx, ath, w, v) => {
    const taper = taperAt(ctx, ath, w);
    if (!taper) return null;
    const x = ctx.variants[v]!;
    const min = Number.isFinite(taper.minSpecificity) ? ` (at least ${specText(taper.minSpecificity)})` : '';
    const max = Number.isFinite(taper.maxRisk) ? ` (at most ${taper.maxRisk})` : '';
    return `${W.meetDistance(taper.weeksToMeet)}: specificity ${specText(x.specificity)}${min}, risk ${x.risk}${max}`;
  },
};

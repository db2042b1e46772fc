// repeat: any span of repeatWindowWeeks consecutive weeks holds a variant at most once (never twice in a week).

import { nearest, weekStr } from '../core';
import * as W from '../words';
import type { WindowRule } from './rule';

export const repeat: WindowRule = {
  kind: 'window',
  id: 'repeat',
  window: (ctx) => ctx.repeatWindow,
  itemCount: (ctx) => ctx.variants.length,
  items: (ctx) => ctx.variantItems,
  uses: (board, v) => board.variantUses[v],
  describe: (ctx, v, w, other) => {
    const x = ctx.variants[v]!;
    return other === w
      ? `${x.name} is already in ${weekStr(w)}; a variant may appear only once a week`
      : `${x.name} is already in ${weekStr(other)}, ${W.weeks(Math.abs(other - w))} away; the repeat window is ${W.weeks(ctx.repeatWindow)}`;
  },
  warning: (ctx, v, w, board) => {
    if (ctx.repeatWindow <= 1) return null;
    const u = nearest(board.variantUses[v], w, ctx.repeatWindow + 2);
    if (u === undefined || Math.abs(u - w) < ctx.repeatWindow) return null;
    return `${ctx.variants[v]!.name} is also in ${weekStr(u)}, just outside the ${ctx.repeatWindow}-week repeat window`;
  },
  reason: (ctx, v, gap) => {
    const x = ctx.variants[v]!;
    return gap === undefined ? `${x.name} not done before` : `${x.name} last done ${W.weeks(gap)} ago`;
  },
};

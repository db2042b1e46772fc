// family: any span of familyWindowWeeks consecutive weeks holds a family at most once.

import { nearest, weekStr } from '../core';
import * as W from '../words';
import type { WindowRule } from './rule';

export const family: WindowRule = {
  kind: 'window',
  id: 'family',
  window: (ctx) => ctx.familyWindow,
  itemCount: (ctx) => ctx.familyNames.length,
  items: (ctx) => ctx.family,
  uses: (board, f) => board.familyUses[f],
  describe: (ctx, v, w, other) => {
    const away = other === w ? '' : `, ${W.weeks(Math.abs(other - w))} away`;
    return `the ${ctx.variants[v]!.family} family is already in ${weekStr(other)}${away}; the family window is ${W.weeks(ctx.familyWindow)}`;
  },
  warning: (ctx, v, w, board) => {
    if (ctx.familyWindow <= 0) return null;
    const u = nearest(board.familyUses[ctx.family[v]!], w, ctx.familyWindow + 2);
    if (u === undefined || Math.abs(u - w) < ctx.familyWindow) return null;
    return `the ${ctx.variants[v]!.family} family is also in ${weekStr(u)}, just outside its ${ctx.familyWindow}-week window`;
  },
  reason: (ctx, v, gap, leastRecent) => {
    const ago = gap === undefined ? 'not used before' : `${W.weeks(gap)} ago`;
    const name = ctx.variants[v]!.family;
    return leastRecent ? `least recently used ${name} family (${ago})` : `${name} family last used ${ago}`;
  },
};

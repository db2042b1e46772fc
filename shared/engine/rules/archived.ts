// archived: a variant the coach retired from the library is never picked; one still on the board is
// swapped out, a pinned one is kept and reported.

import type { CellRule } from './rule';

export const archived: CellRule = {
  kind: 'cell',
  id: 'archived',
  blockedIn: (ctx) => (ctx.anyArchived ? ctx.archived : null),
  describe: (ctx, _ath, _w, _slot, v) => [`${ctx.variants[v]!.name} is archived in the library`],
};

// equipment: every piece of equipment a variant needs must be available to the athlete.

import type { CellRule } from './rule';

export const equipment: CellRule = {
  kind: 'cell',
  id: 'equipment',
  blockedIn: (_ctx, ath) => ath.missingEquipment,
  describe: (ctx, ath, _w, _slot, v) => {
    const x = ctx.variants[v]!;
    const missing = x.equipment.filter((e) => !ath.equipment.has(e));
    return [`${x.name} needs ${missing.join(', ')}, which this athlete does not have`];
  },
};

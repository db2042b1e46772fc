// liftMismatch: the variant's lift is not one the slot takes (or there is no such slot).

import type { Ctx } from '../core';
import type { CellRule } from './rule';

/** Whether variant v's lift fits slot index `slot` (−1: no such slot). */
export function fitsSlot(ctx: Ctx, v: number, slot: number): boolean {
  return slot >= 0 && slot < ctx.slotMasks.length && (ctx.liftBit[v]! & ctx.slotMasks[slot]!) !== 0;
}

export const liftMismatch: CellRule = {
  kind: 'cell',
  id: 'liftMismatch',
  blockedIn: () => null,
  fitsSlot,
  describe: (ctx, _ath, _w, slot, v, slotId) => {
    if (slot < 0) return [`there is no "${slotId}" slot`];
    const x = ctx.variants[v]!;
    const lifts = ctx.slotList[slot]!.lifts;
    const takes = lifts.length ? lifts.join(' or ') : 'no lift';
    return [`${x.name} is a ${x.lift} variant; the ${slotId} slot takes ${takes}`];
  },
};

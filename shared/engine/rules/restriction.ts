// restriction: the athlete's restrictions in force that week, each a joint's stress cap, a list of
// emphases to avoid or a list of families to avoid, with optional first and last weeks.

import { EPS, JOINT_COUNT, restrictedIn, restrictionsIn, weekStr, type DatedRestriction } from '../core';
import { JOINTS, type Restriction } from '../types';
import * as W from '../words';
import type { CellRule } from './rule';

/** " (2027-W05…2027-W08)", " (from 2027-W05)", " (until 2027-W08)", or "" for an open-ended one. */
function dates(r: DatedRestriction): string {
  const from = Number.isFinite(r.from) ? weekStr(r.from) : undefined;
  const to = Number.isFinite(r.to) ? weekStr(r.to) : undefined;
  if (from && to) return ` (${W.span(from, to)})`;
  if (from) return ` (from ${from})`;
  if (to) return ` (until ${to})`;
  return '';
}

/** One line per part of the restriction that rules the variant out. */
function partsBroken(ctx: Parameters<CellRule['describe']>[0], r: Restriction, v: number): string[] {
  const x = ctx.variants[v]!;
  const out: string[] = [];
  if (r.joint !== undefined && typeof r.maxStress === 'number') {
    const s = ctx.stress[v * JOINT_COUNT + JOINTS.indexOf(r.joint)]!;
    if (s > r.maxStress + EPS)
      out.push(
        `${x.name} puts ${W.jointName(r.joint)} stress ${W.num(s)} over this athlete's limit of ${W.num(r.maxStress)}`,
      );
  }
  if (r.emphasis && x.emphasis && r.emphasis.includes(x.emphasis))
    out.push(`${x.name} overloads the ${W.emphasisName(x.emphasis)}, which this athlete is to avoid`);
  if (r.families && r.families.includes(x.family)) out.push(`the ${x.family} family is off for this athlete`);
  return out;
}

export const restriction: CellRule = {
  kind: 'cell',
  id: 'restriction',
  blockedIn: (_ctx, ath, w) => restrictedIn(ath, w),
  describe: (ctx, ath, w, _slot, v) =>
    restrictionsIn(ath, w).flatMap((r) => (r.blocks[v] ? partsBroken(ctx, r.source, v).map((m) => m + dates(r)) : [])),
};

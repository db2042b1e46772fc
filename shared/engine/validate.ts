// Input checks every engine entry point runs first: a request the rules cannot read is refused with a
// RangeError that says what is wrong, rather than planned as if the odd part were not there.

import { isIsoWeek, weekNumber } from './weeks';
import { JOINTS, type PlanRequest, type Restriction } from './types';

/** Every field a rules object may hold; anything else is a mistake (a typo would silently do nothing). */
const RULE_FIELDS = new Set([
  'repeatWindowWeeks',
  'familyWindowWeeks',
  'jointWindowWeeks',
  'jointBudget',
  'taper',
  'seed',
  'comfortRatio',
  'liftBalanceWeeks',
]);

export function validateRequest(req: PlanRequest): void {
  const rules = req.rules as unknown as Record<string, unknown>;
  const unknown = Object.keys(rules).filter((k) => !RULE_FIELDS.has(k));
  if (unknown.length) {
    throw new RangeError(
      `unknown rule field${unknown.length > 1 ? 's' : ''} ${unknown.map((k) => `"${k}"`).join(', ')}; the rules take ${[...RULE_FIELDS].join(', ')}`,
    );
  }
  const comfort = req.rules.comfortRatio;
  if (comfort !== undefined && !(typeof comfort === 'number' && comfort > 0 && comfort <= 1)) {
    throw new RangeError(`comfortRatio must be a share of the budget above 0 and at most 1 (got ${String(comfort)})`);
  }
  const balance = req.rules.liftBalanceWeeks;
  if (balance !== undefined && !(Number.isInteger(balance) && balance >= 1)) {
    throw new RangeError(`liftBalanceWeeks must be a whole number of weeks, at least 1 (got ${String(balance)})`);
  }
  for (const a of req.athletes) {
    a.restrictions.forEach((r, i) => checkRestriction(r, `athlete "${a.id}", restriction ${i + 1}`));
    for (const w of a.restWeeks ?? []) {
      if (!isIsoWeek(w)) throw new RangeError(`athlete "${a.id}": rest week "${w}" is not an ISO week like 2027-W05`);
    }
    if (a.maxRisk !== undefined && ![1, 2, 3].includes(a.maxRisk)) {
      throw new RangeError(`athlete "${a.id}": maxRisk must be 1, 2 or 3 (got ${String(a.maxRisk)})`);
    }
  }
}

function checkRestriction(r: Restriction, where: string): void {
  const hasJoint = r.joint !== undefined || r.maxStress !== undefined;
  if (hasJoint) {
    if (r.joint === undefined || !JOINTS.includes(r.joint))
      throw new RangeError(`${where}: a stress cap needs a joint (one of ${JOINTS.join(', ')})`);
    if (typeof r.maxStress !== 'number' || !Number.isFinite(r.maxStress))
      throw new RangeError(`${where}: the ${r.joint} cap needs a maxStress number`);
  }
  const hasEmphasis = (r.emphasis?.length ?? 0) > 0;
  const hasFamilies = (r.families?.length ?? 0) > 0;
  if (!hasJoint && !hasEmphasis && !hasFamilies) {
    throw new RangeError(`${where}: give a joint with maxStress, an emphasis list or a family list`);
  }
  for (const [name, week] of [
    ['fromWeek', r.fromWeek],
    ['toWeek', r.toWeek],
  ] as const) {
    if (week !== undefined && !isIsoWeek(week))
      throw new RangeError(`${where}: ${name} "${week}" is not an ISO week like 2027-W05`);
  }
  if (r.fromWeek && r.toWeek && weekNumber(r.toWeek) < weekNumber(r.fromWeek)) {
    throw new RangeError(`${where}: toWeek ${r.toWeek} is before fromWeek ${r.fromWeek}`);
  }
}

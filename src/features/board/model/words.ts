// What the board says about rules, drop checks, sources and weeks, in our own words.
import { mondayOf, type Joint, type RuleId } from '../../../../shared/engine';
import { jointName } from '../../../../shared/engine';
import type { DropStatus } from './board-model';

export const RULE_WORDS: Record<RuleId, string> = {
  repeat: 'same variant too soon',
  family: 'same family too soon',
  jointBudget: 'joint budget',
  taperRisk: 'too risky this close to the meet',
  taperSpecificity: 'not close enough to the competition lift for the taper',
  restriction: 'athlete restriction',
  equipment: 'equipment the athlete lacks',
  liftMismatch: 'wrong lift for the slot',
  unknownVariant: 'not in the library',
  meetPhase: 'only for the weeks just before a meet',
  archived: 'archived in the library',
  riskCeiling: "above the athlete's risk ceiling",
  restWeek: 'rest week',
};

export const STATUS_WORDS: Record<DropStatus, string> = {
  clean: 'Clean',
  warning: 'Warning',
  break: 'Breaks a rule',
  wrongLift: 'Wrong lift',
  source: 'Moving',
};

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "W50" */
export function shortWeek(week: string): string {
  return `W${week.slice(6)}`;
}

/** "7 Dec" — the Monday of the week. */
export function weekStart(week: string): string {
  const d = mondayOf(week);
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}`;
}

export function jointWords(joint: Joint): string {
  return jointName(joint);
}

/** The joint's short name, printed under its bar in the joint-load strip. */
const JOINT_SHORT: Record<Joint, string> = {
  shoulder: 'Shd',
  elbow: 'Elb',
  wrist: 'Wst',
  lowerBack: 'Back',
  hip: 'Hip',
  knee: 'Knee',
};
export function jointShort(joint: Joint): string {
  return JOINT_SHORT[joint];
}

export function percent(ratio: number): string {
  return Number.isFinite(ratio) ? `${Math.round(ratio * 100)}%` : 'over budget';
}

/** "Lower max effort" → "Lower": the cell shows the short form, the label keeps the full one. */
export function shortSlot(label: string): string {
  return label.replace(/\s+max effort$/i, '');
}

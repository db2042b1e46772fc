// Plain-language pieces shared by rule messages, pick reasons and drag warnings, so every text a coach
// reads names joints, numbers and spans the same way.

import type { Emphasis, Joint } from './types';

const JOINT_WORDS: Record<Joint, string> = {
  shoulder: 'shoulder',
  elbow: 'elbow',
  wrist: 'wrist',
  lowerBack: 'lower back',
  hip: 'hip',
  knee: 'knee',
};

/** "lower back" */
export function jointName(joint: Joint): string {
  return JOINT_WORDS[joint];
}

/** "lower-back load" */
export function jointLoad(joint: Joint): string {
  return `${JOINT_WORDS[joint].replace(' ', '-')} load`;
}

const EMPHASIS_WORDS: Record<Emphasis, string> = { bottom: 'bottom', midRange: 'mid-range', lockout: 'lockout' };

export function emphasisName(e: Emphasis): string {
  return EMPHASIS_WORDS[e];
}

/** Stress sums are usually whole numbers; show at most one decimal when they are not. */
export function num(n: number): string {
  const r = Math.round(n * 10) / 10;
  return Number.isInteger(r) ? String(r) : r.toFixed(1);
}

export function pct(ratio: number): string {
  return `${Math.round(ratio * 100)}%`;
}

export function weeks(n: number): string {
  return n === 1 ? '1 week' : `${n} weeks`;
}

/** "2027-W03…2027-W06", or the single week for a one-week span. */
export function span(first: string, last: string): string {
  return first === last ? first : `${first}…${last}`;
}

/** Distance to the meet as a coach says it: "in the meet week", "2 weeks out from the meet". */
export function meetDistance(d: number): string {
  return d === 0 ? 'in the meet week' : `${weeks(d)} out from the meet`;
}

/** The same, to end a sentence: "in the meet week", "at 2 weeks out from the meet". */
export function meetWhen(d: number): string {
  return d === 0 ? meetDistance(d) : `at ${meetDistance(d)}`;
}

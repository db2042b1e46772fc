// How a restriction reads on screen, the same on the Athlete page and on the board.
import type { Emphasis, Joint } from '../engine/types';
import { emphasisName, jointName } from '../engine/words';

export interface RestrictionWords {
  joint: Joint | null;
  maxStress: number | null;
  emphasis: readonly Emphasis[];
  families: readonly string[];
}

const CAP_WORDS = ['no load', 'light load only', 'up to moderate load', 'any load'];
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** "Elbow: light load only (≤ 1); no lockout work; no good morning". */
export function restrictionText(r: RestrictionWords): string {
  const parts: string[] = [];
  if (r.joint !== null && r.maxStress !== null) {
    const what = CAP_WORDS[r.maxStress] ?? `at most ${r.maxStress}`;
    parts.push(`${jointName(r.joint)}: ${what} (≤ ${r.maxStress})`);
  }
  if (r.emphasis.length) parts.push(`no ${r.emphasis.map(emphasisName).join(' or ')} work`);
  if (r.families.length) parts.push(`no ${r.families.join(' or ')}`);
  return capital(parts.join('; '));
}

/** "elbow ≤ 1 · no lockout · no good morning": the short form for a board row. */
export function restrictionTag(r: RestrictionWords): string {
  const parts: string[] = [];
  if (r.joint !== null && r.maxStress !== null) parts.push(`${jointName(r.joint)} ≤ ${r.maxStress}`);
  if (r.emphasis.length) parts.push(`no ${r.emphasis.map(emphasisName).join('/')}`);
  if (r.families.length) parts.push(`no ${r.families.join('/')}`);
  return parts.join(' · ');
}

/** What the restriction is named by in buttons ("Edit elbow restriction"). */
export function restrictionName(r: RestrictionWords): string {
  if (r.joint !== null) return jointName(r.joint);
  if (r.emphasis.length) return r.emphasis.map(emphasisName).join(' and ');
  return r.families.join(' and ');
}

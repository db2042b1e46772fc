// Per-variant records and the e1RM of a logged set: pure, so the rules are tested on their own.
import { setE1rm } from '../../../shared/calc';
import type { TopSet } from '../../../shared/schemas';

/**
 * e1RM stored with a top set, rounded to 0.01 kg like the column: Epley on the reps done plus the reps in
 * reserve the logged RPE says were left (a single at RPE 8 is not a max), plain Epley without an RPE. The
 * seeded history is made the same way, so a record means the same thing from week to week.
 */
export function topSetE1rmKg(weightKg: number, reps: number, rpe: number | null = null): number {
  return setE1rm(weightKg, reps, rpe);
}

type Mark = Pick<TopSet, 'weightKg' | 'reps' | 'e1rmKg'>;

/** Heavier weight wins; at the same weight, more reps. */
export function heavierThan(a: Mark, b: Mark): boolean {
  return a.weightKg > b.weightKg || (a.weightKg === b.weightKg && a.reps > b.reps);
}

/** Best e1RM and heaviest weight × reps; of equal sets, the first in the list counts. */
export function recordOf<T extends Mark>(sets: readonly T[]): { bestE1rm: T | null; heaviest: T | null } {
  let bestE1rm: T | null = null;
  let heaviest: T | null = null;
  for (const s of sets) {
    if (!bestE1rm || s.e1rmKg > bestE1rm.e1rmKg) bestE1rm = s;
    if (!heaviest || heavierThan(s, heaviest)) heaviest = s;
  }
  return { bestE1rm, heaviest };
}

/** How a new set compares with every earlier set on the same variant. */
export function compareWithRecord(set: Mark, earlier: { bestE1rm: Mark | null; heaviest: Mark | null }) {
  return {
    firstOnVariant: earlier.bestE1rm === null,
    newRecord: earlier.bestE1rm === null || set.e1rmKg > earlier.bestE1rm.e1rmKg,
    newHeaviest: earlier.heaviest === null || heavierThan(set, earlier.heaviest),
  };
}

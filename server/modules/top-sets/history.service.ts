// An athlete's history: records per variant, e1RM series per competition lift and the bodyweight series.
import type { E1rmPoint, Series, TopSet, VariantHistory } from '../../../shared/schemas';
import type { Queryable } from '../../db/client';
import { allBodyweights } from '../bodyweights/bodyweights.service';
import { recordOf } from './records';
import { allTopSets } from './top-sets.repository';

type WithSpecificity = TopSet & { specificity: number };

/** Per variant, most recently trained first. */
export function variantHistoriesOf(sets: readonly WithSpecificity[]): VariantHistory[] {
  const byVariant = new Map<number, WithSpecificity[]>();
  for (const s of sets) byVariant.set(s.variantId, [...(byVariant.get(s.variantId) ?? []), s]);
  return [...byVariant.values()]
    .map((list) => {
      const first = list[0]!;
      const lastOn = list.reduce((m, s) => (s.performedOn > m ? s.performedOn : m), first.performedOn);
      return {
        variantId: first.variantId,
        variantName: first.variantName,
        lift: first.lift,
        specificity: first.specificity,
        count: list.length,
        lastOn,
        record: recordOf(list),
      };
    })
    .sort((a, b) => b.lastOn.localeCompare(a.lastOn) || a.variantName.localeCompare(b.variantName));
}

/** Every top set as a point of its competition lift's e1RM series, oldest first. */
export function e1rmSeriesOf(sets: readonly WithSpecificity[]): Series['e1rm'] {
  const out: Series['e1rm'] = { squat: [], bench: [], deadlift: [] };
  const sorted = [...sets].sort((a, b) => a.performedOn.localeCompare(b.performedOn) || a.id - b.id);
  for (const s of sorted) {
    const point: E1rmPoint = {
      topSetId: s.id,
      week: s.week,
      performedOn: s.performedOn,
      e1rmKg: s.e1rmKg,
      weightKg: s.weightKg,
      reps: s.reps,
      variantId: s.variantId,
      variantName: s.variantName,
      specificity: s.specificity,
    };
    out[s.lift].push(point);
  }
  return out;
}

export async function historyOf(db: Queryable, teamId: number, athleteId: number) {
  const [sets, bodyweight] = await Promise.all([
    allTopSets(db, teamId, athleteId),
    allBodyweights(db, teamId, athleteId),
  ]);
  return {
    variants: variantHistoriesOf(sets),
    series: { e1rm: e1rmSeriesOf(sets), bodyweight } satisfies Series,
  };
}

// SQL for the athlete's week: the max-effort picks on the board for that week, with their variants
// (the connective-tissue work reads their joint stress from here too).
import { and, asc, eq, isNotNull } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athleteWeekPublications, planEntries, variants } from '../../db/schema';

export async function weekPicks(db: Queryable, teamId: number, athleteId: number, week: string) {
  return db
    .select({
      planEntryId: planEntries.id,
      slotId: planEntries.slotId,
      variant: {
        id: variants.id,
        name: variants.name,
        lift: variants.lift,
        family: variants.family,
        bar: variants.bar,
        specificity: variants.specificity,
        scheme: variants.scheme,
        notes: variants.notes,
        stress: variants.stress,
      },
    })
    .from(planEntries)
    .innerJoin(variants, and(eq(variants.id, planEntries.variantId), eq(variants.teamId, teamId)))
    .where(
      and(
        eq(planEntries.teamId, teamId),
        eq(planEntries.athleteId, athleteId),
        eq(planEntries.week, week),
        isNotNull(planEntries.variantId),
      ),
    )
    .orderBy(asc(planEntries.slotId));
}

/** Whether the coach has published this athlete's week (without it the week is a draft). */
export async function isWeekPublished(db: Queryable, teamId: number, athleteId: number, week: string) {
  const [row] = await db
    .select({ id: athleteWeekPublications.id })
    .from(athleteWeekPublications)
    .where(
      and(
        eq(athleteWeekPublications.teamId, teamId),
        eq(athleteWeekPublications.athleteId, athleteId),
        eq(athleteWeekPublications.week, week),
      ),
    )
    .limit(1);
  return !!row;
}

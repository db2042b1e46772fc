// The demo's past meet: two club athletes weighed in, nine judged attempts each, and the results already
// written into their histories, so the result sheet and the records have something to show.
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import { MEET_LIFTS, standingOf, weightClass, type MeetLift } from '../../../shared/calc';
import { suggestAttempts } from '../../../shared/schemas/meets';
import type { Tx } from '../client';
import { meetAttempts, meetEntries, meets, topSets } from '../schema';
import { DEMO_ATHLETES, PAST_MEET } from './demo-people';
import type { HistoryContext } from './demo-history';

const COMPETITION_VARIANT: Record<MeetLift, string> = {
  squat: 'Competition squat, top single',
  bench: 'Competition bench press, top single',
  deadlift: 'Competition deadlift, top single',
};
// How each lifter's day went: true = good, false = missed (invented).
const OUTCOMES: Record<MeetLift, boolean[]> = {
  squat: [true, true, false],
  bench: [true, false, true],
  deadlift: [true, true, true],
};

function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/** The club's past meet: a Saturday some weeks before this one. */
export function pastMeetDay(today: Date): { week: string; date: string } {
  const week = addWeeks(weekOfDate(today), -PAST_MEET.weeksAgo);
  return { week, date: isoDay(new Date(mondayOf(week).getTime() + 5 * 86_400_000)) };
}

export async function seedDemoPastMeet(tx: Tx, ctx: HistoryContext): Promise<void> {
  const { week, date } = pastMeetDay(ctx.today);
  const [meet] = await tx
    .insert(meets)
    .values({
      teamId: ctx.teamId,
      name: PAST_MEET.name,
      date,
      location: PAST_MEET.location,
      federation: PAST_MEET.federation,
      equipment: 'classic',
      resultsSavedAt: new Date(`${date}T20:00:00Z`),
    })
    .$returningId();
  let lot = 1;
  for (const key of PAST_MEET.athletes) {
    const a = DEMO_ATHLETES.find((x) => x.key === key)!;
    const athleteId = ctx.athleteIds.get(key)!;
    // A little lighter than today: the athlete made weight and has eaten since.
    const weighInKg = Math.round((a.bodyweight - 0.6) * 10) / 10;
    const plan = Object.fromEntries(MEET_LIFTS.map((l) => [l, suggestAttempts(a.maxes[l] * 0.97)])) as Record<
      MeetLift,
      [number, number, number]
    >;
    const [entry] = await tx
      .insert(meetEntries)
      .values({
        teamId: ctx.teamId,
        meetId: meet!.id,
        athleteId,
        weightClass: weightClass(weighInKg, a.sex, { division: a.division }),
        division: a.division,
        attempts: plan,
        weighInKg,
        flight: 'A',
        lot: lot++,
      })
      .$returningId();
    const judged: Record<MeetLift, { kg: number; good: boolean }[]> = { squat: [], bench: [], deadlift: [] };
    for (const lift of MEET_LIFTS) {
      for (let i = 0; i < 3; i++) {
        const prev = judged[lift][i - 1];
        // After a miss the same weight is taken again (never lower), as the rules allow.
        const kg = prev && !prev.good ? prev.kg : plan[lift][i]!;
        const good = OUTCOMES[lift][i]!;
        judged[lift].push({ kg, good });
        await tx.insert(meetAttempts).values({
          teamId: ctx.teamId,
          meetId: meet!.id,
          entryId: entry!.id,
          lift,
          attemptNo: i + 1,
          weightKg: kg,
          result: good ? 'good' : 'missed',
          idempotencyKey: `demo-${entry!.id}-${lift}-${i + 1}`,
          markedBy: ctx.coachId,
        });
      }
    }
    const { best } = standingOf(judged, weighInKg, a.sex);
    for (const lift of MEET_LIFTS) {
      const kg = best[lift];
      if (kg === null) continue;
      await tx.insert(topSets).values({
        teamId: ctx.teamId,
        athleteId,
        variantId: ctx.variantIds.get(COMPETITION_VARIANT[lift])!,
        week,
        performedOn: date,
        weightKg: kg,
        reps: 1,
        e1rmKg: kg,
        note: `Best ${lift === 'bench' ? 'bench press' : lift} at ${PAST_MEET.name}`,
        createdBy: ctx.coachId,
      });
    }
  }
}

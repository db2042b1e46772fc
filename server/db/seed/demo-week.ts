// The invented demo club's training week beyond max effort: accessories for every session of this week
// and the next two (speed work follows the default wave), and a deload week where an athlete rests.
import { addWeeks } from '../../../shared/engine/weeks';
import type { AccessoryWork, SessionWork } from '../../../shared/schemas';
import type { athleteWeeks } from '../schema';

const acc = (
  name: string,
  category: AccessoryWork['category'],
  sets: number,
  reps: number,
  target: { rpe?: number; loadKg?: number } = {},
): AccessoryWork => ({ name, category, sets, reps, loadKg: target.loadKg ?? null, rpe: target.rpe ?? null });

/** Two invented accessory blocks, alternated between athletes and weeks (speed work: null keeps the default wave). */
const BLOCKS: Record<string, AccessoryWork[]>[] = [
  {
    'lower-me': [acc('Reverse hyper', 'hamstrings', 4, 12, { rpe: 7 }), acc('Hanging knee raise', 'abdominals', 3, 15)],
    'upper-me': [
      acc('Chest-supported row', 'upperBack', 4, 10, { rpe: 8 }),
      acc('Rolling dumbbell extension', 'triceps', 4, 12, { rpe: 8 }),
    ],
    'lower-speed': [
      acc('Glute-ham raise', 'hamstrings', 4, 8, { rpe: 8 }),
      acc('Farmer carry', 'grip', 3, 1, { loadKg: 40 }),
    ],
    'upper-speed': [acc('Lat pulldown', 'lats', 4, 12, { rpe: 8 }), acc('Band pushdown', 'triceps', 3, 25)],
  },
  {
    'lower-me': [
      acc('Romanian deadlift', 'hamstrings', 3, 8, { rpe: 7 }),
      acc('Ab wheel rollout', 'abdominals', 3, 10),
    ],
    'upper-me': [acc('Seal row', 'upperBack', 4, 10, { rpe: 8 }), acc('JM press', 'triceps', 4, 8, { rpe: 8 })],
    'lower-speed': [
      acc('Kettlebell swing', 'glutes', 4, 15, { loadKg: 24 }),
      acc('Plate pinch', 'grip', 3, 1, { loadKg: 15 }),
    ],
    'upper-speed': [acc('Chin-up', 'lats', 4, 8, { rpe: 8 }), acc('Face pull', 'shoulders', 3, 20)],
  },
];

function workOf(block: Record<string, AccessoryWork[]>): Record<string, SessionWork> {
  return Object.fromEntries(Object.entries(block).map(([id, accessories]) => [id, { speed: null, accessories }]));
}

/** Rows for this week and the next two; a week the athlete rests is a deload. */
export function demoWeekRows(
  teamId: number,
  athleteId: number,
  index: number,
  thisWeek: string,
  restInWeeks: readonly number[],
  updatedBy: number | null,
): (typeof athleteWeeks.$inferInsert)[] {
  return [0, 1, 2].map((n) => {
    const work = workOf(BLOCKS[(index + n) % 2]!);
    return {
      teamId,
      athleteId,
      week: addWeeks(thisWeek, n),
      deload: restInWeeks.includes(n),
      trainingMaxPct: 90,
      work,
      updatedBy,
    };
  });
}

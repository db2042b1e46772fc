// The invented demo club's training week beyond max effort: its accessory library, accessories from it for
// every session of this week and the next two (speed work follows the default wave), and a deload week where an athlete rests.
import { eq } from 'drizzle-orm';
import { addWeeks } from '../../../shared/engine/weeks';
import type { AccessoryCategory, AccessoryWork, SessionWork } from '../../../shared/schemas';
import type { Tx } from '../client';
import { accessories, type StressMap, type athleteWeeks } from '../schema';

interface DemoAccessory {
  name: string;
  category: AccessoryCategory;
  stress: StressMap;
  sets: number;
  reps: number;
  loadKg?: number;
  rpe?: number;
}

/** The demo club's accessory library: common gym exercises with the club's own defaults (invented). */
export const DEMO_ACCESSORIES: DemoAccessory[] = [
  { name: 'Reverse hyper', category: 'hamstrings', stress: { lowerBack: 1 }, sets: 4, reps: 12, rpe: 7 },
  { name: 'Glute-ham raise', category: 'hamstrings', stress: { knee: 1 }, sets: 4, reps: 8, rpe: 8 },
  { name: 'Romanian deadlift', category: 'hamstrings', stress: { lowerBack: 2, hip: 1 }, sets: 3, reps: 8, rpe: 7 },
  { name: 'Hanging knee raise', category: 'abdominals', stress: {}, sets: 3, reps: 15 },
  { name: 'Ab wheel rollout', category: 'abdominals', stress: { shoulder: 1 }, sets: 3, reps: 10 },
  { name: 'Weighted plank', category: 'abdominals', stress: {}, sets: 3, reps: 1, loadKg: 20 },
  { name: 'Chest-supported row', category: 'upperBack', stress: {}, sets: 4, reps: 10, rpe: 8 },
  { name: 'Seal row', category: 'upperBack', stress: {}, sets: 4, reps: 10, rpe: 8 },
  { name: 'Rear-delt raise', category: 'upperBack', stress: { shoulder: 1 }, sets: 3, reps: 20 },
  { name: 'Rolling dumbbell extension', category: 'triceps', stress: { elbow: 1 }, sets: 4, reps: 12, rpe: 8 },
  { name: 'JM press', category: 'triceps', stress: { elbow: 2 }, sets: 4, reps: 8, rpe: 8 },
  { name: 'Band pushdown', category: 'triceps', stress: {}, sets: 3, reps: 25 },
  { name: 'Lat pulldown', category: 'lats', stress: {}, sets: 4, reps: 12, rpe: 8 },
  { name: 'Chin-up', category: 'lats', stress: { elbow: 1 }, sets: 4, reps: 8, rpe: 8 },
  { name: 'Farmer carry', category: 'grip', stress: {}, sets: 3, reps: 1, loadKg: 40 },
  { name: 'Plate pinch', category: 'grip', stress: { wrist: 1 }, sets: 3, reps: 1, loadKg: 15 },
  { name: 'Kettlebell swing', category: 'glutes', stress: { lowerBack: 1 }, sets: 4, reps: 15, loadKg: 24 },
  { name: 'Face pull', category: 'shoulders', stress: {}, sets: 3, reps: 20 },
];

/** The demo library in the team; its ids by name. */
export async function insertDemoAccessories(tx: Tx, teamId: number): Promise<Map<string, number>> {
  await tx
    .insert(accessories)
    .values(DEMO_ACCESSORIES.map((a) => ({ ...a, teamId, loadKg: a.loadKg ?? null, rpe: a.rpe ?? null, notes: null })));
  const rows = await tx
    .select({ id: accessories.id, name: accessories.name })
    .from(accessories)
    .where(eq(accessories.teamId, teamId));
  return new Map(rows.map((r) => [r.name, r.id]));
}

const acc = (name: string): Omit<AccessoryWork, 'accessoryId'> => {
  const a = DEMO_ACCESSORIES.find((x) => x.name === name)!;
  return { name, category: a.category, sets: a.sets, reps: a.reps, loadKg: a.loadKg ?? null, rpe: a.rpe ?? null };
};

/** Two accessory blocks from the library, alternated between athletes and weeks (speed work: null keeps the default wave). */
const BLOCKS: Record<string, Omit<AccessoryWork, 'accessoryId'>[]>[] = [
  {
    'lower-me': [acc('Reverse hyper'), acc('Hanging knee raise')],
    'upper-me': [acc('Chest-supported row'), acc('Rolling dumbbell extension')],
    'lower-speed': [acc('Glute-ham raise'), acc('Farmer carry')],
    'upper-speed': [acc('Lat pulldown'), acc('Band pushdown')],
  },
  {
    'lower-me': [acc('Romanian deadlift'), acc('Ab wheel rollout')],
    'upper-me': [acc('Seal row'), acc('JM press')],
    'lower-speed': [acc('Kettlebell swing'), acc('Plate pinch')],
    'upper-speed': [acc('Chin-up'), acc('Face pull')],
  },
];

function workOf(
  block: Record<string, Omit<AccessoryWork, 'accessoryId'>[]>,
  idOf: ReadonlyMap<string, number>,
): Record<string, SessionWork> {
  return Object.fromEntries(
    Object.entries(block).map(([id, list]) => [
      id,
      { speed: null, accessories: list.map((a) => ({ ...a, accessoryId: idOf.get(a.name) ?? null })) },
    ]),
  );
}

/** Rows for this week and the next two; a week the athlete rests is a deload. */
export function demoWeekRows(
  teamId: number,
  athleteId: number,
  index: number,
  thisWeek: string,
  restInWeeks: readonly number[],
  updatedBy: number | null,
  idOf: ReadonlyMap<string, number>,
): (typeof athleteWeeks.$inferInsert)[] {
  return [0, 1, 2].map((n) => {
    const work = workOf(BLOCKS[(index + n) % 2]!, idOf);
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

// Test data factories: each test builds its own team, so test files can run in parallel on one database.
import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { Db } from '../../server/db/client';
import { athleteBilling, feePlans } from '../../server/db/schema';
import {
  athleteWeekPublications,
  athletes,
  memberships,
  planEntries,
  teamRules,
  teams,
  topSets,
  users,
  variants,
} from '../../server/db/schema';
import { bodyweights, meetAttempts, meetEntries, meets, restrictions } from '../../server/db/schema';
import { DEFAULT_TEAM_RULES } from '../../shared/schemas/rules';
import { TEST_PASSWORD } from './app';

// bcrypt is slow on purpose; one hash serves every test user.
const passwordHash = bcrypt.hashSync(TEST_PASSWORD, 4);

export const uniq = () => randomUUID().slice(0, 8);

export async function createUser(db: Db, teamId: number, role: 'head_coach' | 'coach' | 'athlete', name?: string) {
  const tag = uniq();
  const email = `${role.replace('_', '-')}-${tag}@example.test`;
  const [u] = await db
    .insert(users)
    .values({ email, name: name ?? `Test ${role} ${tag}`, passwordHash })
    .$returningId();
  await db.insert(memberships).values({ teamId, userId: u!.id, role });
  return { id: u!.id, email };
}

export async function createAthlete(db: Db, teamId: number, overrides: Partial<typeof athletes.$inferInsert> = {}) {
  const [a] = await db
    .insert(athletes)
    .values({
      teamId,
      name: `Athlete ${uniq()}`,
      sex: 'F',
      equipment: ['box', 'bands', 'rack pins', 'boards'],
      ruleOverrides: {},
      ...overrides,
    })
    .$returningId();
  return a!.id;
}

export interface VariantOverrides extends Partial<typeof variants.$inferInsert> {}

export async function createVariant(db: Db, teamId: number, overrides: VariantOverrides = {}) {
  const [v] = await db
    .insert(variants)
    .values({
      teamId,
      name: `Variant ${uniq()}`,
      lift: 'squat',
      family: 'box squat',
      bar: 'straight',
      equipment: [],
      emphasis: 'bottom',
      stress: { lowerBack: 1, hip: 1 },
      risk: 1,
      specificity: 0.5,
      scheme: 'single',
      ...overrides,
    })
    .$returningId();
  return v!.id;
}

/** A team with a head coach, a coach, and an athlete whose account is linked to a roster entry. */
export async function createTeam(db: Db, name = `Team ${uniq()}`) {
  const [t] = await db.insert(teams).values({ name }).$returningId();
  const teamId = t!.id;
  await db.insert(teamRules).values({
    teamId,
    rules: DEFAULT_TEAM_RULES as unknown as Record<string, unknown>,
    equipment: ['box', 'bands', 'rack pins', 'boards'],
    seed: 'test-seed',
  });
  const headCoach = await createUser(db, teamId, 'head_coach');
  const coach = await createUser(db, teamId, 'coach');
  const athleteUser = await createUser(db, teamId, 'athlete');
  const athleteId = await createAthlete(db, teamId, { userId: athleteUser.id, name: 'Linked Athlete' });
  return { teamId, name, headCoach, coach, athleteUser, athleteId };
}
export type TestTeam = Awaited<ReturnType<typeof createTeam>>;

/** Marks an athlete's week as published (what the coach does with Publish week), so My week shows it. */
export async function publishAthleteWeek(db: Db, teamId: number, athleteId: number, week: string) {
  await db.insert(athleteWeekPublications).values({ teamId, athleteId, week, picks: [] });
}

/** A plan entry (one athlete × week × slot) holding a variant. */
export async function createPlanEntry(
  db: Db,
  teamId: number,
  athleteId: number,
  variantId: number,
  overrides: Partial<typeof planEntries.$inferInsert> = {},
) {
  const [p] = await db
    .insert(planEntries)
    .values({
      teamId,
      athleteId,
      variantId,
      week: '2026-W10',
      slotId: 'lower',
      source: 'engine',
      reasons: [],
      ...overrides,
    })
    .$returningId();
  return p!.id;
}

/** A logged top set; the e1RM is Epley's on the reps done unless given. */
export async function createTopSet(
  db: Db,
  teamId: number,
  athleteId: number,
  variantId: number,
  overrides: Partial<typeof topSets.$inferInsert> = {},
) {
  const weightKg = overrides.weightKg ?? 100;
  const reps = overrides.reps ?? 1;
  const [s] = await db
    .insert(topSets)
    .values({
      teamId,
      athleteId,
      variantId,
      week: '2026-W10',
      performedOn: '2026-03-04',
      weightKg,
      reps,
      e1rmKg: Math.round(weightKg * (reps === 1 ? 1 : 1 + reps / 30) * 100) / 100,
      ...overrides,
    })
    .$returningId();
  return s!.id;
}

/** A restriction on one joint, in force from the given day (a past Monday by default) with no end. */
export async function createRestriction(
  db: Db,
  teamId: number,
  athleteId: number,
  overrides: Partial<typeof restrictions.$inferInsert> = {},
) {
  const [r] = await db
    .insert(restrictions)
    .values({ teamId, athleteId, joint: 'elbow', maxStress: 1, fromDate: '2026-01-05', ...overrides })
    .$returningId();
  return r!.id;
}

/** A meet on the given day (a day in 2030 by default, so it counts as upcoming). */
export async function createMeet(db: Db, teamId: number, overrides: Partial<typeof meets.$inferInsert> = {}) {
  const [m] = await db
    .insert(meets)
    .values({ teamId, name: `Meet ${uniq()}`, date: '2030-06-01', ...overrides })
    .$returningId();
  return m!.id;
}

export async function createMeetEntry(
  db: Db,
  teamId: number,
  meetId: number,
  athleteId: number,
  overrides: Partial<typeof meetEntries.$inferInsert> = {},
) {
  const [e] = await db
    .insert(meetEntries)
    .values({ teamId, meetId, athleteId, attempts: {}, ...overrides })
    .$returningId();
  return e!.id;
}

/** A judged attempt on meet day (the first squat, good, at 100 kg unless told otherwise). */
export async function createMeetAttempt(
  db: Db,
  teamId: number,
  meetId: number,
  entryId: number,
  overrides: Partial<typeof meetAttempts.$inferInsert> = {},
) {
  const [a] = await db
    .insert(meetAttempts)
    .values({
      teamId,
      meetId,
      entryId,
      lift: 'squat',
      attemptNo: 1,
      weightKg: 100,
      result: 'good',
      idempotencyKey: `factory-${uniq()}`,
      ...overrides,
    })
    .$returningId();
  return a!.id;
}

export async function createBodyweight(
  db: Db,
  teamId: number,
  athleteId: number,
  measuredOn: string,
  weightKg: number,
) {
  await db.insert(bodyweights).values({ teamId, athleteId, measuredOn, weightKg });
}

/**
 * A library the planner can fill many weeks from: `perLift` variants each of squat, deadlift and bench,
 * each in its own family, with light joint stress and no equipment.
 */
export async function createPlanLibrary(db: Db, teamId: number, perLift = 6) {
  const make = async (lift: 'squat' | 'deadlift' | 'bench', i: number) =>
    createVariant(db, teamId, {
      name: `${lift} variant ${i} ${uniq()}`,
      lift,
      family: `${lift} family ${i}`,
      emphasis: (['bottom', 'midRange', 'lockout'] as const)[i % 3],
      stress: lift === 'bench' ? { shoulder: 1, elbow: 1 } : { lowerBack: 1, hip: 1, knee: 1 },
      specificity: 0.9,
      equipment: [],
    });
  const out = { squat: [] as number[], deadlift: [] as number[], bench: [] as number[] };
  for (let i = 0; i < perLift; i++) {
    out.squat.push(await make('squat', i));
    out.deadlift.push(await make('deadlift', i));
    out.bench.push(await make('bench', i));
  }
  return out;
}

/** A fee plan of the team (EUR by default), optionally already tied to a provider price. */
export async function createFeePlan(db: Db, teamId: number, overrides: Partial<typeof feePlans.$inferInsert> = {}) {
  const [p] = await db
    .insert(feePlans)
    .values({ teamId, name: `Plan ${uniq()}`, priceMinor: 4500, currency: 'EUR', ...overrides })
    .$returningId();
  return p!.id;
}

/** An athlete's fee state, as the provider's events would have left it. */
export async function setAthleteBilling(
  db: Db,
  teamId: number,
  athleteId: number,
  values: Partial<typeof athleteBilling.$inferInsert> = {},
) {
  await db
    .insert(athleteBilling)
    .values({ athleteId, teamId, status: 'active', ...values })
    .onDuplicateKeyUpdate({ set: { status: values.status ?? 'active', ...values } });
}

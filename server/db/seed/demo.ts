// Seeds the invented demo scenario into an empty database (never twice). Dates are relative to the
// day of seeding: the history ends last week and the current week is already planned.
import { inTransaction } from '../transaction';
import { sql } from 'drizzle-orm';
import { addWeeks, mondayOf, weekOfDate } from '../../../shared/engine/weeks';
import { demoWeekRows, insertDemoAccessories } from './demo-week';
import { weightClass } from '../../../shared/calc';
import { DEFAULT_TEAM_RULES } from '../../../shared/schemas/rules';
import { suggestAttempts } from '../../../shared/schemas/meets';
import type { Db, Queryable, Tx } from '../client';
import { hashPassword } from '../../lib/passwords';
import {
  athletes,
  meetEntries,
  meets,
  memberships,
  restWeeks,
  athleteWeeks,
  restrictions,
  teamRules,
  teams,
  users,
  variants,
} from '../schema';
import { DEMO_EQUIPMENT, DEMO_LIBRARY, OTHER_TEAM_LIBRARY, type DemoVariant } from './demo-library';
import { DEMO_ATHLETES, DEMO_COACHES, DEMO_MEETS, DEMO_PASSWORD, DEMO_TEAM, OTHER_TEAM } from './demo-people';
import { seedDemoHistory } from './demo-history';
import { seedDemoTissue } from './demo-tissue';
import { seedDemoPastMeet } from './demo-meet-day';
import { seedDemoFees } from './demo-fees';

export async function seedDemoIfEmpty(db: Db, today = new Date()): Promise<boolean> {
  // A lock so two processes starting at once cannot both seed.
  await db.execute(sql`SELECT GET_LOCK('rackturn_seed', 30)`);
  try {
    const [row] = await db.select({ n: sql<number>`count(*)` }).from(teams);
    if (Number(row?.n ?? 0) > 0) return false;
    await seedDemo(db, today);
    return true;
  } finally {
    await db.execute(sql`SELECT RELEASE_LOCK('rackturn_seed')`);
  }
}

export function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}

function saturdayOf(week: string): string {
  return isoDay(new Date(mondayOf(week).getTime() + 5 * 86_400_000));
}

export async function insertLibrary(
  tx: Queryable,
  teamId: number,
  library: DemoVariant[],
): Promise<Map<string, number>> {
  await tx
    .insert(variants)
    .values(library.map((v) => ({ teamId, ...v, notes: v.notes ?? null, meetPhaseWeeks: v.meetPhaseWeeks ?? null })));
  const rows = await tx
    .select({ id: variants.id, name: variants.name })
    .from(variants)
    .where(sql`${variants.teamId} = ${teamId}`);
  return new Map(rows.map((r) => [r.name, r.id]));
}

async function insertUser(tx: Tx, email: string, name: string, passwordHash: string, unit: 'kg' | 'lb' = 'kg') {
  const [res] = await tx.insert(users).values({ email, name, passwordHash, unit }).$returningId();
  return res!.id;
}

export async function seedDemo(db: Db, today = new Date()): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const thisWeek = weekOfDate(today);

  await inTransaction(db, async (tx) => {
    // The demo club.
    const [team] = await tx.insert(teams).values(DEMO_TEAM).$returningId();
    const teamId = team!.id;
    const staffIds: number[] = [];
    for (const c of DEMO_COACHES) {
      const userId = await insertUser(tx, c.email, c.name, passwordHash);
      await tx.insert(memberships).values({ teamId, userId, role: c.role });
      staffIds.push(userId);
    }
    await tx.insert(teamRules).values({
      teamId,
      rules: DEFAULT_TEAM_RULES as unknown as Record<string, unknown>,
      equipment: DEMO_EQUIPMENT,
      seed: 'copperkettle-1',
      updatedBy: staffIds[0] ?? null,
    });
    const variantIds = await insertLibrary(tx, teamId, DEMO_LIBRARY);
    const accessoryIds = await insertDemoAccessories(tx, teamId);

    const athleteIds = new Map<string, number>();
    for (const a of DEMO_ATHLETES) {
      let userId: number | null = null;
      if (a.email) {
        userId = await insertUser(tx, a.email, a.name, passwordHash, a.unit ?? 'kg');
        await tx.insert(memberships).values({ teamId, userId, role: 'athlete' });
      }
      const [row] = await tx
        .insert(athletes)
        .values({
          teamId,
          userId,
          name: a.name,
          sex: a.sex,
          birthYear: a.birthYear,
          division: a.division,
          maxRisk: a.maxRisk ?? null,
          equipment: DEMO_EQUIPMENT.filter((e) => !a.lacks?.includes(e)),
          ruleOverrides: {},
        })
        .$returningId();
      athleteIds.set(a.key, row!.id);
      for (const r of a.restrictions ?? []) {
        await tx.insert(restrictions).values({
          teamId,
          athleteId: row!.id,
          joint: r.joint ?? null,
          maxStress: r.maxStress ?? null,
          emphasis: r.emphasis ?? [],
          families: r.families ?? [],
          fromDate: isoDay(mondayOf(addWeeks(thisWeek, r.fromInWeeks))),
          toDate:
            r.toInWeeks === undefined
              ? null
              : isoDay(new Date(mondayOf(addWeeks(thisWeek, r.toInWeeks)).getTime() + 6 * 86_400_000)),
          note: r.note,
          createdBy: staffIds[0] ?? null,
        });
      }
      for (const w of a.restInWeeks ?? []) {
        await tx
          .insert(restWeeks)
          .values({ teamId, athleteId: row!.id, week: addWeeks(thisWeek, w), createdBy: staffIds[0] ?? null });
      }
      await tx
        .insert(athleteWeeks)
        .values(
          demoWeekRows(
            teamId,
            row!.id,
            athleteIds.size,
            thisWeek,
            a.restInWeeks ?? [],
            staffIds[0] ?? null,
            accessoryIds,
          ),
        );
    }

    for (const m of DEMO_MEETS) {
      const [meet] = await tx
        .insert(meets)
        .values({
          teamId,
          name: m.name,
          date: saturdayOf(addWeeks(thisWeek, m.inWeeks)),
          location: m.location,
          federation: m.federation,
        })
        .$returningId();
      for (const a of DEMO_ATHLETES.filter((x) => x.meetInWeeks === m.inWeeks)) {
        await tx.insert(meetEntries).values({
          teamId,
          meetId: meet!.id,
          athleteId: athleteIds.get(a.key)!,
          weightClass: weightClass(a.bodyweight, a.sex, { division: a.division }),
          division: a.division,
          // Planned from the athlete's invented maxes, the way the Meets page plans them.
          attempts: {
            squat: suggestAttempts(a.maxes.squat),
            bench: suggestAttempts(a.maxes.bench),
            deadlift: suggestAttempts(a.maxes.deadlift),
          },
        });
      }
    }

    await seedDemoHistory(tx, { teamId, today, athleteIds, variantIds, coachId: staffIds[0] ?? null });
    await seedDemoPastMeet(tx, { teamId, today, athleteIds, variantIds, coachId: staffIds[0] ?? null });
    await seedDemoTissue(tx, { teamId, today, athleteIds });
    await seedDemoFees(tx, { teamId, currency: DEMO_TEAM.currency, today, athleteIds });

    // A second, small team, so that isolation between teams can be seen.
    const [other] = await tx
      .insert(teams)
      .values({ name: OTHER_TEAM.name, unit: 'kg', currency: 'EUR' })
      .$returningId();
    const otherId = other!.id;
    const otherCoach = await insertUser(tx, OTHER_TEAM.headCoach.email, OTHER_TEAM.headCoach.name, passwordHash);
    await tx.insert(memberships).values({ teamId: otherId, userId: otherCoach, role: 'head_coach' });
    await tx.insert(teamRules).values({
      teamId: otherId,
      rules: DEFAULT_TEAM_RULES as unknown as Record<string, unknown>,
      equipment: ['box', 'rack pins', 'blocks', 'boards'],
      seed: 'quillmoor-1',
    });
    await insertLibrary(tx, otherId, OTHER_TEAM_LIBRARY);
    for (const a of OTHER_TEAM.athletes) {
      await tx.insert(athletes).values({
        teamId: otherId,
        name: a.name,
        sex: a.sex,
        division: 'open',
        equipment: ['box', 'rack pins', 'blocks', 'boards'],
        ruleOverrides: {},
      });
    }
  });
}

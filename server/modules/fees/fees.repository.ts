// SQL for fee plans and the athletes' fee status table. Every function takes the caller's teamId.
import { and, asc, desc, eq, isNull, isNotNull, ne, sql, type SQL } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athleteBilling, athletes, feePlans, teams } from '../../db/schema';
import type { z } from 'zod';
import type { PaymentStatus, feeAthleteListQuery, feePlanListQuery } from '../../../shared/schemas';

export type PlanRow = typeof feePlans.$inferSelect & { subscribers: number; inUse: boolean };
export type PlanFilters = z.output<typeof feePlanListQuery>;
export type AthleteFilters = z.output<typeof feeAthleteListQuery>;

const RUNNING = sql`('active', 'past_due', 'pending')`;

// A plan someone has checked out with (a provider price exists) or that an athlete's fee names is
// archived rather than deleted, so the fee history keeps its name.
const subscribers = sql<number>`(select count(*) from athlete_billing ab
  where ab.fee_plan_id = ${feePlans.id} and ab.status in ${RUNNING})`;
const inUse = sql<number>`(${feePlans.providerPriceId} is not null
  or exists(select 1 from athlete_billing ab where ab.fee_plan_id = ${feePlans.id}))`;

const planColumns = () => ({
  id: feePlans.id,
  teamId: feePlans.teamId,
  name: feePlans.name,
  priceMinor: feePlans.priceMinor,
  currency: feePlans.currency,
  description: feePlans.description,
  providerProductId: feePlans.providerProductId,
  providerPriceId: feePlans.providerPriceId,
  archivedAt: feePlans.archivedAt,
  version: feePlans.version,
  createdAt: feePlans.createdAt,
  updatedAt: feePlans.updatedAt,
  subscribers,
  inUse,
});

const toPlan = (r: Omit<PlanRow, 'subscribers' | 'inUse'> & { subscribers: unknown; inUse: unknown }): PlanRow => ({
  ...r,
  subscribers: Number(r.subscribers),
  inUse: Number(r.inUse) > 0,
});

const PLAN_SORT = { name: feePlans.name, price: feePlans.priceMinor, created: feePlans.createdAt } as const;

function sortOf<K extends string>(sort: string): { key: K; down: boolean } {
  return sort.startsWith('-') ? { key: sort.slice(1) as K, down: true } : { key: sort as K, down: false };
}

export async function listPlans(db: Queryable, teamId: number, f: PlanFilters) {
  const where = and(
    eq(feePlans.teamId, teamId),
    f.status === 'active'
      ? isNull(feePlans.archivedAt)
      : f.status === 'archived'
        ? isNotNull(feePlans.archivedAt)
        : undefined,
  );
  const { key, down } = sortOf<keyof typeof PLAN_SORT>(f.sort);
  const col = PLAN_SORT[key];
  const [rows, [count]] = await Promise.all([
    db
      .select(planColumns())
      .from(feePlans)
      .where(where)
      .orderBy(down ? desc(col) : asc(col), asc(feePlans.name), asc(feePlans.id))
      .limit(f.limit)
      .offset(f.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(feePlans)
      .where(where),
  ]);
  return { rows: rows.map(toPlan), total: Number(count?.n ?? 0) };
}

export async function findPlan(db: Queryable, teamId: number, id: number, opts: { lock?: boolean } = {}) {
  const q = db
    .select(planColumns())
    .from(feePlans)
    .where(and(eq(feePlans.teamId, teamId), eq(feePlans.id, id)))
    .limit(1);
  const [row] = opts.lock ? await q.for('update') : await q;
  return row ? toPlan(row) : null;
}

/** Another plan of the team, not archived, already has this name. */
export async function planNameTaken(db: Queryable, teamId: number, name: string, exceptId?: number) {
  const [row] = await db
    .select({ id: feePlans.id })
    .from(feePlans)
    .where(
      and(
        eq(feePlans.teamId, teamId),
        eq(feePlans.name, name),
        isNull(feePlans.archivedAt),
        exceptId ? ne(feePlans.id, exceptId) : undefined,
      ),
    )
    .limit(1);
  return Boolean(row);
}

export async function teamCurrency(db: Queryable, teamId: number): Promise<{ currency: string; name: string }> {
  const [row] = await db.select({ currency: teams.currency, name: teams.name }).from(teams).where(eq(teams.id, teamId));
  return row ?? { currency: 'EUR', name: '' };
}

export async function insertPlan(
  db: Queryable,
  teamId: number,
  v: { name: string; priceMinor: number; currency: string; description: string | null },
) {
  const [res] = await db
    .insert(feePlans)
    .values({ teamId, ...v })
    .$returningId();
  return res!.id;
}

/**
 * Writes the plan if it still has the version the head coach read; true when it did. A new name or
 * price drops the provider's product and price, so the next checkout creates ones that match.
 */
export async function updatePlan(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  set: Partial<{ name: string; priceMinor: number; description: string | null; archivedAt: Date | null }>,
  opts: { dropProviderPrice?: boolean } = {},
): Promise<boolean> {
  const [res] = await db
    .update(feePlans)
    .set({
      ...set,
      ...(opts.dropProviderPrice ? { providerProductId: null, providerPriceId: null } : {}),
      version: sql`${feePlans.version} + 1`,
    })
    .where(and(eq(feePlans.teamId, teamId), eq(feePlans.id, id), eq(feePlans.version, version)));
  return res.affectedRows === 1;
}

export async function deletePlan(db: Queryable, teamId: number, id: number, version: number): Promise<boolean> {
  const [res] = await db
    .delete(feePlans)
    .where(and(eq(feePlans.teamId, teamId), eq(feePlans.id, id), eq(feePlans.version, version), sql`not ${inUse}`));
  return res.affectedRows === 1;
}

/**
 * Stores the provider's product and price made for this version of the plan. A system write: the
 * version stays, so a head coach editing at the same moment is not refused for it; a plan edited in
 * the meantime keeps its cleared ids.
 */
export async function setPlanProviderIds(
  db: Queryable,
  teamId: number,
  id: number,
  version: number,
  ids: { productId: string; priceId: string },
) {
  await db
    .update(feePlans)
    .set({ providerProductId: ids.productId, providerPriceId: ids.priceId })
    .where(
      and(
        eq(feePlans.teamId, teamId),
        eq(feePlans.id, id),
        eq(feePlans.version, version),
        isNull(feePlans.providerPriceId),
      ),
    );
}

// ---- the athletes' fee table -------------------------------------------------------------------

const statusOf = sql<PaymentStatus>`coalesce(${athleteBilling.status}, 'none')`;
// Most urgent first: a failed renewal, then fees waiting for payment, then running, ended and none.
const statusRank = sql`field(${statusOf}, 'past_due', 'pending', 'active', 'cancelled', 'none')`;

const ATHLETE_SORT: Record<string, SQL[]> = {
  name: [sql`${athletes.name}`],
  status: [statusRank],
  renewal: [sql`${athleteBilling.currentPeriodEnd} is null`, sql`${athleteBilling.currentPeriodEnd}`],
  lastPayment: [sql`${athleteBilling.lastPaymentAt} is null`, sql`${athleteBilling.lastPaymentAt}`],
};

export interface AthleteFeeRow {
  athleteId: number;
  name: string;
  status: PaymentStatus;
  currentPeriodEnd: Date | null;
  lastPaymentAt: Date | null;
  planId: number | null;
  planName: string | null;
  planPriceMinor: number | null;
  planCurrency: string | null;
  planArchivedAt: Date | null;
}

function athleteFeeQuery(db: Queryable, where: SQL | undefined) {
  return db
    .select({
      athleteId: athletes.id,
      name: athletes.name,
      status: statusOf,
      currentPeriodEnd: athleteBilling.currentPeriodEnd,
      lastPaymentAt: athleteBilling.lastPaymentAt,
      planId: feePlans.id,
      planName: feePlans.name,
      planPriceMinor: feePlans.priceMinor,
      planCurrency: feePlans.currency,
      planArchivedAt: feePlans.archivedAt,
    })
    .from(athletes)
    .leftJoin(
      athleteBilling,
      and(eq(athleteBilling.athleteId, athletes.id), eq(athleteBilling.teamId, athletes.teamId)),
    )
    .leftJoin(feePlans, and(eq(feePlans.id, athleteBilling.feePlanId), eq(feePlans.teamId, athletes.teamId)))
    .where(where);
}

export async function listAthleteFees(db: Queryable, teamId: number, f: AthleteFilters) {
  const where = and(
    eq(athletes.teamId, teamId),
    isNull(athletes.archivedAt),
    f.status ? sql`${statusOf} = ${f.status}` : undefined,
  );
  const { key, down } = sortOf<string>(f.sort);
  // The leading "is null" term of a date sort keeps empty dates last in both directions.
  const nullsLast = key === 'renewal' || key === 'lastPayment';
  const order = (ATHLETE_SORT[key] ?? ATHLETE_SORT.name!).map((c, i) =>
    down && !(nullsLast && i === 0) ? desc(c) : asc(c),
  );
  const [rows, [count]] = await Promise.all([
    athleteFeeQuery(db, where)
      .orderBy(...order, asc(athletes.name), asc(athletes.id))
      .limit(f.limit)
      .offset(f.offset),
    db
      .select({ n: sql<number>`count(*)` })
      .from(athletes)
      .leftJoin(
        athleteBilling,
        and(eq(athleteBilling.athleteId, athletes.id), eq(athleteBilling.teamId, athletes.teamId)),
      )
      .where(where),
  ]);
  return { rows: rows as AthleteFeeRow[], total: Number(count?.n ?? 0) };
}

export async function findAthleteFee(db: Queryable, teamId: number, athleteId: number): Promise<AthleteFeeRow | null> {
  const [row] = await athleteFeeQuery(
    db,
    and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId), isNull(athletes.archivedAt)),
  ).limit(1);
  return (row as AthleteFeeRow | undefined) ?? null;
}

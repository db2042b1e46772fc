// SQL for each athlete's fee state with the provider (customer, subscription, status, period, last
// payment). Team-scoped for requests; the webhook path finds the row by the provider's customer id.
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { athleteBilling, athletes, users } from '../../db/schema';
import type { PaymentStatus } from '../../../shared/schemas';

export type BillingRow = typeof athleteBilling.$inferSelect;

/** The athlete a fee is for, with the e-mail of their account if they have one. */
export async function findPayer(db: Queryable, teamId: number, athleteId: number) {
  const [row] = await db
    .select({ id: athletes.id, name: athletes.name, createdAt: athletes.createdAt, email: users.email })
    .from(athletes)
    .leftJoin(users, eq(users.id, athletes.userId))
    .where(and(eq(athletes.teamId, teamId), eq(athletes.id, athleteId), isNull(athletes.archivedAt)))
    .limit(1);
  return row ?? null;
}

export async function findBilling(db: Queryable, teamId: number, athleteId: number, opts: { lock?: boolean } = {}) {
  const q = db
    .select()
    .from(athleteBilling)
    .where(and(eq(athleteBilling.teamId, teamId), eq(athleteBilling.athleteId, athleteId)))
    .limit(1);
  const [row] = opts.lock ? await q.for('update') : await q;
  return row ?? null;
}

/** Only the provider's events use this: the customer id is what they carry. */
export async function lockBillingByCustomer(db: Queryable, customerId: string) {
  const [row] = await db
    .select()
    .from(athleteBilling)
    .where(eq(athleteBilling.providerCustomerId, customerId))
    .limit(1)
    .for('update');
  return row ?? null;
}

/**
 * Records the athlete's provider customer, creating the billing row if needed. The first customer
 * stored wins, so two checkouts started at once still share one customer.
 */
export async function rememberCustomer(db: Queryable, teamId: number, athleteId: number, customerId: string) {
  await db
    .insert(athleteBilling)
    .values({ athleteId, teamId, providerCustomerId: customerId, status: 'none' })
    .onDuplicateKeyUpdate({
      set: { providerCustomerId: sql`coalesce(${athleteBilling.providerCustomerId}, values(provider_customer_id))` },
    });
  const row = await findBilling(db, teamId, athleteId);
  return row!.providerCustomerId!;
}

export interface BillingChange {
  status?: PaymentStatus;
  feePlanId?: number | null;
  providerSubscriptionId?: string | null;
  currentPeriodEnd?: Date | null;
  lastPaymentAt?: Date | null;
}

export async function updateBilling(db: Queryable, athleteId: number, change: BillingChange) {
  await db
    .update(athleteBilling)
    .set({ ...change, version: sql`${athleteBilling.version} + 1` })
    .where(eq(athleteBilling.athleteId, athleteId));
}

// Coaching fees: the team's monthly plans, each athlete's subscription state, and webhook events seen.
import { char, datetime, index, int, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { paymentStatusSchema } from '../../../shared/schemas/fees';
import { createdAt, enumValues, id, ref, updatedAt, version } from './columns';
import { teamRef } from './auth';
import { athletes } from './roster';

export const feePlans = mysqlTable(
  'fee_plans',
  {
    id: id(),
    teamId: teamRef(),
    name: varchar('name', { length: 120 }).notNull(),
    priceMinor: int('price_minor', { unsigned: true }).notNull(),
    currency: char('currency', { length: 3 }).notNull(),
    description: text('description'),
    providerProductId: varchar('provider_product_id', { length: 120 }),
    providerPriceId: varchar('provider_price_id', { length: 120 }),
    archivedAt: datetime('archived_at', { mode: 'date', fsp: 3 }),
    version: version(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('fee_plans_team_idx').on(t.teamId)],
);

export const athleteBilling = mysqlTable(
  'athlete_billing',
  {
    athleteId: ref('athlete_id')
      .primaryKey()
      .references(() => athletes.id, { onDelete: 'cascade' }),
    teamId: teamRef(),
    feePlanId: ref('fee_plan_id').references(() => feePlans.id, { onDelete: 'set null' }),
    providerCustomerId: varchar('provider_customer_id', { length: 120 }),
    providerSubscriptionId: varchar('provider_subscription_id', { length: 120 }),
    status: mysqlEnum('status', enumValues(paymentStatusSchema.options)).notNull().default('none'),
    currentPeriodEnd: datetime('current_period_end', { mode: 'date', fsp: 3 }),
    lastPaymentAt: datetime('last_payment_at', { mode: 'date', fsp: 3 }),
    version: version(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('athlete_billing_team_idx').on(t.teamId),
    index('athlete_billing_customer_idx').on(t.providerCustomerId),
  ],
);

export const paymentEvents = mysqlTable(
  'payment_events',
  {
    id: id(),
    eventId: varchar('event_id', { length: 120 }).notNull(),
    type: varchar('type', { length: 80 }).notNull(),
    receivedAt: createdAt(),
  },
  (t) => [uniqueIndex('payment_events_event_uq').on(t.eventId)],
);

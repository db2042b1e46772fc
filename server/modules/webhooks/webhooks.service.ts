// Turns the provider's (already verified) events into each athlete's fee status. Every event is
// handled once: its id is stored in the same transaction as the change it causes, so a replay, or
// two copies arriving together, change nothing the second time.
import { inTransaction } from '../../db/transaction';
import type Stripe from 'stripe';
import type { AppContext } from '../../context';
import type { Tx } from '../../db/client';
import { findPlan } from '../fees/fees.service';
import {
  lockBillingByCustomer,
  updateBilling,
  type BillingChange,
  type BillingRow,
} from '../payments/payments.service';
import {
  checkoutSessionObject,
  invoiceObject,
  invoicePeriodEnd,
  invoiceSubscription,
  subscriptionObject,
  type InvoiceObject,
} from './events';
import { receiptMail } from './receipt';
import * as repo from './webhooks.repository';

export type Outcome = 'processed' | 'ignored' | 'duplicate';

/** What one event means for an athlete's fee, worked out before the transaction (it may call the SDK). */
type Change =
  | {
      kind: 'checkout';
      customer: string;
      subscription: string;
      planId: number | null;
      paid: boolean;
      periodEnd: Date | null;
    }
  | { kind: 'paid'; customer: string; subscription: string | null; invoice: InvoiceObject }
  | { kind: 'failed'; customer: string; subscription: string | null }
  | { kind: 'ended'; customer: string; subscription: string };

async function interpret(ctx: AppContext, event: Stripe.Event): Promise<Change | null> {
  const object: unknown = event.data.object;
  switch (event.type) {
    case 'checkout.session.completed': {
      const s = checkoutSessionObject.parse(object);
      if (s.mode !== 'subscription' || !s.customer || !s.subscription) return null;
      // The session does not say when the first period ends; the subscription does.
      const sub = subscriptionObject.parse(await ctx.services.payments.retrieveSubscription(s.subscription));
      const planId = Number(s.metadata.planId);
      return {
        kind: 'checkout',
        customer: s.customer,
        subscription: s.subscription,
        planId: Number.isSafeInteger(planId) && planId > 0 ? planId : null,
        paid: s.payment_status === 'paid',
        periodEnd: sub.items.data[0]?.current_period_end ?? null,
      };
    }
    case 'invoice.paid': {
      const invoice = invoiceObject.parse(object);
      return invoice.customer
        ? { kind: 'paid', customer: invoice.customer, subscription: invoiceSubscription(invoice), invoice }
        : null;
    }
    case 'invoice.payment_failed': {
      const invoice = invoiceObject.parse(object);
      return invoice.customer
        ? { kind: 'failed', customer: invoice.customer, subscription: invoiceSubscription(invoice) }
        : null;
    }
    case 'customer.subscription.deleted': {
      const sub = subscriptionObject.parse(object);
      return sub.customer ? { kind: 'ended', customer: sub.customer, subscription: sub.id } : null;
    }
    default:
      return null;
  }
}

const sameSubscription = (row: BillingRow, id: string | null) => id !== null && row.providerSubscriptionId === id;

/** The new state of the row, or null when the event is about a subscription the athlete no longer has. */
async function changeFor(tx: Tx, row: BillingRow, c: Change): Promise<BillingChange | null> {
  switch (c.kind) {
    case 'checkout': {
      const plan = c.planId ? await findPlan(tx, row.teamId, c.planId) : null;
      return {
        providerSubscriptionId: c.subscription,
        feePlanId: plan?.id ?? row.feePlanId,
        // An "unpaid" completed session waits for a payment method that settles later.
        status: c.paid ? 'active' : 'pending',
        currentPeriodEnd: c.periodEnd,
      };
    }
    case 'paid': {
      // The first invoice may arrive before the checkout event: adopt a new subscription then, but
      // never let a late invoice of an ended one revive the fee.
      const adopt =
        !sameSubscription(row, c.subscription) &&
        (row.status === 'none' || row.status === 'cancelled') &&
        c.invoice.billing_reason === 'subscription_create';
      if (!sameSubscription(row, c.subscription) && !adopt) return null;
      const paidAt = c.invoice.status_transitions?.paid_at ?? new Date();
      return {
        providerSubscriptionId: c.subscription,
        status: row.status === 'cancelled' && !adopt ? 'cancelled' : 'active',
        lastPaymentAt: paidAt,
        currentPeriodEnd: invoicePeriodEnd(c.invoice) ?? row.currentPeriodEnd,
      };
    }
    case 'failed':
      return sameSubscription(row, c.subscription) && row.status !== 'cancelled' ? { status: 'past_due' } : null;
    case 'ended':
      return sameSubscription(row, c.subscription) ? { status: 'cancelled' } : null;
  }
}

async function queueReceipt(ctx: AppContext, tx: Tx, row: BillingRow, invoice: InvoiceObject) {
  const who = await repo.receiptDetails(tx, row.teamId, row.athleteId);
  if (!who?.email || invoice.amount_paid <= 0) return false;
  const plan = row.feePlanId ? await findPlan(tx, row.teamId, row.feePlanId) : null;
  return ctx.services.mail.enqueue(
    tx,
    receiptMail({
      invoiceId: invoice.id,
      invoiceNumber: invoice.number ?? null,
      teamId: row.teamId,
      teamName: who.teamName,
      athleteName: who.athleteName,
      to: who.email,
      planName: plan?.name ?? null,
      amountMinor: invoice.amount_paid,
      currency: invoice.currency,
      paidAt: invoice.status_transitions?.paid_at ?? new Date(),
      periodEnd: invoicePeriodEnd(invoice),
      appOrigin: new URL(ctx.env.APP_ORIGIN).origin,
    }),
  );
}

export async function handlePaymentEvent(ctx: AppContext, event: Stripe.Event): Promise<Outcome> {
  const db = ctx.database.db;
  if (await repo.eventSeen(db, event.id)) return 'duplicate';
  const change = await interpret(ctx, event);
  let queued = false;
  try {
    const outcome = await inTransaction(db, async (tx): Promise<Outcome> => {
      await repo.recordEvent(tx, event.id, event.type);
      if (!change) return 'ignored';
      const row = await lockBillingByCustomer(tx, change.customer);
      if (!row) return 'ignored';
      const next = await changeFor(tx, row, change);
      if (!next) return 'ignored';
      await updateBilling(tx, row.athleteId, next);
      if (change.kind === 'paid') {
        queued = await queueReceipt(ctx, tx, { ...row, ...next } as BillingRow, change.invoice);
      }
      return 'processed';
    });
    if (queued) ctx.services.mail.kick();
    return outcome;
  } catch (err) {
    if (repo.isDuplicateKey(err)) return 'duplicate';
    throw err;
  }
}

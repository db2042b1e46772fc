// Paying a fee: a provider customer per athlete, a provider price per plan version, and a hosted
// checkout session in subscription mode; and cancelling, which ends the subscription at once. What
// the athlete's status becomes after paying is decided by the provider's webhook events, not here.
import { inTransaction } from '../../db/transaction';
import type { AthleteFee, CheckoutStart } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { AppError, NotFoundError, ValidationError } from '../../lib/errors';
import { findAthleteFee, findPlan, setPlanProviderIds, teamCurrency, toAthleteFee } from '../fees/fees.service';
import * as repo from './payments.repository';

/** Where the provider sends the payer back: the athlete's own page, or the head coach's Fees page. */
export type ReturnTo = 'athlete' | 'coach';

export async function athleteFee(ctx: AppContext, teamId: number, athleteId: number): Promise<AthleteFee> {
  const row = await findAthleteFee(ctx.database.db, teamId, athleteId);
  if (!row) throw new NotFoundError('That athlete');
  return toAthleteFee(row);
}

async function priceFor(ctx: AppContext, teamId: number, planId: number) {
  const db = ctx.database.db;
  const plan = await findPlan(db, teamId, planId);
  if (!plan) throw new ValidationError('Some fields need attention.', { planId: ['Choose one of the plans on offer'] });
  if (plan.archivedAt) {
    throw new ValidationError('Some fields need attention.', { planId: ['This plan is no longer offered'] });
  }
  if (plan.providerPriceId) return { plan, priceId: plan.providerPriceId };
  const team = await teamCurrency(db, teamId);
  const meta = { teamId: String(teamId), planId: String(plan.id), planVersion: String(plan.version) };
  const ids = await ctx.services.payments.createPlanPrice({
    productName: `${team.name} — ${plan.name}`,
    unitAmount: plan.priceMinor,
    currency: plan.currency,
    metadata: meta,
  });
  await setPlanProviderIds(db, teamId, plan.id, plan.version, ids);
  return { plan, priceId: ids.priceId };
}

export async function startCheckout(
  ctx: AppContext,
  teamId: number,
  athleteId: number,
  planId: number,
  returnTo: ReturnTo,
): Promise<CheckoutStart> {
  const db = ctx.database.db;
  const payer = await repo.findPayer(db, teamId, athleteId);
  if (!payer) throw new NotFoundError('That athlete');
  const billing = await repo.findBilling(db, teamId, athleteId);
  if (billing && (billing.status === 'active' || billing.status === 'past_due')) {
    throw new AppError(
      409,
      'fee_running',
      'This athlete already has a running fee. Cancel it before choosing another plan.',
    );
  }
  const { plan, priceId } = await priceFor(ctx, teamId, planId);
  const customerId =
    billing?.providerCustomerId ??
    (await repo.rememberCustomer(
      db,
      teamId,
      athleteId,
      await ctx.services.payments.createCustomer({
        name: payer.name,
        email: payer.email,
        metadata: { teamId: String(teamId), athleteId: String(athleteId) },
      }),
    ));

  const origin = new URL(ctx.env.APP_ORIGIN).origin;
  const back =
    returnTo === 'athlete'
      ? { success: `${origin}/my-fee?checkout=success`, cancel: `${origin}/my-fee?checkout=cancelled` }
      : {
          success: `${origin}/fees?checkout=success&athlete=${athleteId}`,
          cancel: `${origin}/fees?checkout=cancelled&athlete=${athleteId}`,
        };
  const session = await ctx.services.payments.createCheckout({
    customerId,
    priceId,
    successUrl: `${back.success}&session_id={CHECKOUT_SESSION_ID}`,
    cancelUrl: back.cancel,
    clientReferenceId: String(athleteId),
    metadata: { teamId: String(teamId), athleteId: String(athleteId), planId: String(plan.id) },
  });
  return { url: session.url, sessionId: session.id };
}

/**
 * Ends the athlete's fee now (no further charges; the current period is not refunded). The provider
 * also sends `customer.subscription.deleted`; both paths set the same status, so either may come first.
 */
export async function cancelFee(ctx: AppContext, teamId: number, athleteId: number): Promise<AthleteFee> {
  const db = ctx.database.db;
  if (!(await repo.findPayer(db, teamId, athleteId))) throw new NotFoundError('That athlete');
  const billing = await repo.findBilling(db, teamId, athleteId);
  if (!billing || !['active', 'past_due', 'pending'].includes(billing.status)) {
    throw new AppError(409, 'no_running_fee', 'There is no running fee to cancel.');
  }
  if (billing.providerSubscriptionId) {
    await ctx.services.payments.cancelSubscription(billing.providerSubscriptionId);
  }
  await inTransaction(db, async (tx) => {
    const row = await repo.findBilling(tx, teamId, athleteId, { lock: true });
    if (row && row.status !== 'cancelled' && row.providerSubscriptionId === billing.providerSubscriptionId) {
      await repo.updateBilling(tx, athleteId, { status: 'cancelled' });
    }
  });
  return athleteFee(ctx, teamId, athleteId);
}

// Offered to webhooks: the billing row a provider event changes, through this module's service.
export { lockBillingByCustomer, updateBilling, type BillingChange, type BillingRow } from './payments.repository';

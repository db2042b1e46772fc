// The payment provider through its official SDK: customers, plan prices, hosted checkout, subscription
// cancel, and webhook signature checks. PAYMENTS_HOST/PORT/PROTOCOL point the SDK at the local fake.
import Stripe from 'stripe';
import type { Env } from '../config/env';
import { AppError } from '../lib/errors';
import type { Logger } from '../lib/logger';

type PaymentsEnv = Pick<
  Env,
  'PAYMENTS_HOST' | 'PAYMENTS_PORT' | 'PAYMENTS_PROTOCOL' | 'PAYMENTS_SECRET_KEY' | 'PAYMENTS_WEBHOOK_SECRET'
>;

/** Raised for a webhook whose signature or timestamp does not check out. */
export class WebhookSignatureError extends AppError {
  constructor() {
    super(400, 'invalid_signature', 'The webhook signature could not be verified.');
  }
}

/** The provider could not be reached or refused the call: the user can try again later. */
export class PaymentProviderError extends AppError {
  constructor() {
    super(502, 'payment_provider_error', 'The payment provider did not answer as expected. Try again in a moment.');
  }
}

export interface CheckoutRequest {
  customerId: string;
  priceId: string;
  successUrl: string;
  cancelUrl: string;
  metadata: Record<string, string>;
  clientReferenceId: string;
}

export class Payments {
  readonly sdk: Stripe;
  private readonly webhookSecret: string;

  constructor(
    env: PaymentsEnv,
    private readonly logger?: Logger,
  ) {
    this.webhookSecret = env.PAYMENTS_WEBHOOK_SECRET;
    this.sdk = new Stripe(env.PAYMENTS_SECRET_KEY, {
      ...(env.PAYMENTS_HOST
        ? { host: env.PAYMENTS_HOST, port: env.PAYMENTS_PORT, protocol: env.PAYMENTS_PROTOCOL }
        : { protocol: env.PAYMENTS_PROTOCOL }),
      maxNetworkRetries: 1,
      timeout: 10_000,
      telemetry: false,
      appInfo: { name: 'Rackturn' },
    });
  }

  async createCustomer(input: { name: string; email: string | null; metadata: Record<string, string> }) {
    const customer = await this.call(() =>
      this.sdk.customers.create({
        name: input.name,
        ...(input.email ? { email: input.email } : {}),
        metadata: input.metadata,
      }),
    );
    return customer.id;
  }

  /** A product and a monthly recurring price for one version of a fee plan. */
  async createPlanPrice(input: {
    productName: string;
    unitAmount: number;
    currency: string;
    metadata: Record<string, string>;
  }) {
    const product = await this.call(() =>
      this.sdk.products.create({ name: input.productName, metadata: input.metadata }),
    );
    const price = await this.call(() =>
      this.sdk.prices.create({
        product: product.id,
        unit_amount: input.unitAmount,
        currency: input.currency.toLowerCase(),
        recurring: { interval: 'month', interval_count: 1 },
        metadata: input.metadata,
      }),
    );
    return { productId: product.id, priceId: price.id };
  }

  async createCheckout(req: CheckoutRequest) {
    const session = await this.call(() =>
      this.sdk.checkout.sessions.create({
        mode: 'subscription',
        customer: req.customerId,
        line_items: [{ price: req.priceId, quantity: 1 }],
        success_url: req.successUrl,
        cancel_url: req.cancelUrl,
        client_reference_id: req.clientReferenceId,
        metadata: req.metadata,
        subscription_data: { metadata: req.metadata },
      }),
    );
    if (!session.url) throw new PaymentProviderError();
    return { id: session.id, url: session.url };
  }

  async retrieveSubscription(id: string) {
    return this.call(() => this.sdk.subscriptions.retrieve(id));
  }

  /**
   * Ends a subscription now. A subscription the provider no longer knows is already over, so that
   * answers null rather than an error.
   */
  async cancelSubscription(id: string): Promise<Stripe.Subscription | null> {
    try {
      return await this.sdk.subscriptions.cancel(id);
    } catch (err) {
      if (err instanceof Stripe.errors.StripeInvalidRequestError && err.code === 'resource_missing') return null;
      throw this.providerError(err);
    }
  }

  /** Verifies the signature (and its age, 5 minutes at most) over the exact bytes received. */
  verifyEvent(payload: Uint8Array, signature: string | undefined): Stripe.Event {
    if (!signature) throw new WebhookSignatureError();
    try {
      return this.sdk.webhooks.constructEvent(Buffer.from(payload), signature, this.webhookSecret);
    } catch {
      throw new WebhookSignatureError();
    }
  }

  /** SDK failures become one typed error for the client; the provider's own message goes to the log. */
  private providerError(err: unknown): unknown {
    if (!(err instanceof Stripe.errors.StripeError)) return err;
    this.logger?.warn(
      { type: err.type, code: err.code, status: err.statusCode, msg: err.message },
      'payment provider call failed',
    );
    return new PaymentProviderError();
  }

  private async call<T>(fn: () => Promise<T>): Promise<T> {
    try {
      return await fn();
    } catch (err) {
      throw this.providerError(err);
    }
  }
}

export function createPayments(env: PaymentsEnv, logger?: Logger): Payments {
  return new Payments(env, logger);
}

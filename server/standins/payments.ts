// Local fake of the payment provider for development, the demo and tests: the few REST endpoints the
// app's SDK calls (form-encoded in, provider-shaped JSON out), a hosted test checkout page, signed
// webhook events sent to the app, and a control endpoint that fires a renewal on demand.
import express, { type NextFunction, type Request, type Response } from 'express';
import type { Server } from 'node:http';
import { join } from 'node:path';
import Stripe from 'stripe';
import { checkCard, type CardBehaviour } from './payments/cards';
import { checkoutPage, messagePage } from './payments/page';
import {
  API_VERSION,
  Store,
  addMonth,
  customerObject,
  newId,
  nowSeconds,
  priceObject,
  productObject,
  sessionObject,
  type DeliveryRecord,
  type FakeInvoice,
  type FakePrice,
  type FakeSession,
  type FakeSubscription,
} from './payments/store';

export const DEFAULT_SECRET_KEY = 'sk_test_rackturn_local_fake';
export const DEFAULT_WEBHOOK_SECRET = 'whsec_rackturn_local_fake';

export interface PaymentsFakeOptions {
  port: number;
  host?: string;
  secretKey?: string;
  webhookSecret?: string;
  /** Where events go. Without it, each checkout's events go to `/api/webhooks/payments` on its success URL's origin. */
  webhookUrl?: string;
  /** Keeps the state in `<dataDir>/payments.json` across restarts. */
  dataDir?: string;
  /** Delays before re-sending an event the app did not acknowledge. */
  retryDelaysMs?: number[];
}

export interface PaymentsFake {
  name: string;
  port: number;
  url: string;
  store: Store;
  /** Fires the next monthly renewal of a subscription now; answers the invoice and its event. */
  renew(subscriptionId: string): Promise<{ invoice: FakeInvoice; eventId: string; delivery: DeliveryRecord }>;
  /** Sends an already-sent event again, exactly as before but freshly signed. */
  resend(eventId: string): Promise<DeliveryRecord>;
  /** Changes where events go (tests start the app after the fake). */
  setWebhookUrl(url: string | undefined): void;
  stop(): Promise<void>;
}

type Params = Record<string, unknown>;

class ApiFailure extends Error {
  constructor(
    readonly status: number,
    readonly type: string,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
}

const missing = (what: string, id: string, param?: string) =>
  new ApiFailure(404, 'invalid_request_error', `No such ${what}: '${id}'`, 'resource_missing', param);
const required = (param: string) =>
  new ApiFailure(400, 'invalid_request_error', `Missing required param: ${param}.`, 'parameter_missing', param);

const str = (v: unknown): string | undefined => (typeof v === 'string' && v !== '' ? v : undefined);
const metadataOf = (v: unknown): Record<string, string> =>
  v && typeof v === 'object'
    ? Object.fromEntries(Object.entries(v as Params).filter((e): e is [string, string] => typeof e[1] === 'string'))
    : {};

export async function startPaymentsFake(opts: PaymentsFakeOptions): Promise<PaymentsFake> {
  const host = opts.host ?? '127.0.0.1';
  const secretKey = opts.secretKey ?? DEFAULT_SECRET_KEY;
  const webhookSecret = opts.webhookSecret ?? DEFAULT_WEBHOOK_SECRET;
  const retryDelays = opts.retryDelaysMs ?? [1_000, 5_000, 20_000];
  let webhookUrl = opts.webhookUrl;
  const store = new Store(opts.dataDir ? join(opts.dataDir, 'payments.json') : null);
  const timers = new Set<NodeJS.Timeout>();
  let base = '';
  const s = () => store.state;

  // ---- events -------------------------------------------------------------------------------------

  async function post(record: DeliveryRecord): Promise<void> {
    const event = s().events[record.eventId];
    const payload = JSON.stringify(event, null, 2);
    const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
    record.attempts += 1;
    try {
      const res = await fetch(record.url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signature,
          'user-agent': 'RackturnLocalPayments/1.0',
        },
        body: payload,
        signal: AbortSignal.timeout(5_000),
      });
      await res.arrayBuffer().catch(() => undefined);
      record.lastStatus = res.status;
      record.delivered = res.status >= 200 && res.status < 300;
    } catch {
      record.lastStatus = 0;
      record.delivered = false;
    }
    store.save();
  }

  /** Sends now and waits for the answer; an unacknowledged event is retried a few times later. */
  async function deliver(record: DeliveryRecord): Promise<DeliveryRecord> {
    await post(record);
    const retry = (i: number) => {
      if (record.delivered || i >= retryDelays.length) return;
      const timer = setTimeout(async () => {
        timers.delete(timer);
        await post(record);
        retry(i + 1);
      }, retryDelays[i]);
      timers.add(timer);
    };
    retry(0);
    return record;
  }

  function targetFor(objectId: string): string | null {
    return webhookUrl ?? s().internal.webhookUrl[objectId] ?? null;
  }

  async function emit(type: string, object: object, targetOf: string): Promise<DeliveryRecord> {
    const event = {
      id: newId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: nowSeconds(),
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    s().events[event.id] = event;
    const url = targetFor(targetOf);
    const record: DeliveryRecord = {
      eventId: event.id,
      type,
      url: url ?? '',
      attempts: 0,
      lastStatus: 0,
      delivered: false,
    };
    s().deliveries.push(record);
    store.save();
    return url ? deliver(record) : record;
  }

  // ---- billing ------------------------------------------------------------------------------------

  function invoiceFor(sub: FakeSubscription, price: FakePrice, reason: string, paid: boolean): FakeInvoice {
    const item = sub.items.data[0]!;
    const now = nowSeconds();
    const amount = price.unit_amount * Number(item.quantity ?? 1);
    const invoice: FakeInvoice = {
      id: newId('in'),
      object: 'invoice',
      customer: sub.customer,
      status: paid ? 'paid' : 'open',
      billing_reason: reason,
      collection_method: 'charge_automatically',
      currency: price.currency,
      amount_due: amount,
      amount_paid: paid ? amount : 0,
      amount_remaining: paid ? 0 : amount,
      attempt_count: 1,
      attempted: true,
      created: now,
      number: store.nextInvoiceNumber(sub.customer),
      hosted_invoice_url: null,
      livemode: false,
      period_start: now,
      period_end: now,
      parent: {
        type: 'subscription_details',
        quote_details: null,
        subscription_details: { subscription: sub.id, metadata: sub.metadata },
      },
      lines: {
        object: 'list',
        has_more: false,
        url: '/v1/invoices/lines',
        data: [
          {
            id: newId('il'),
            object: 'line_item',
            amount,
            currency: price.currency,
            description: `${item.quantity ?? 1} × ${String(s().products[price.product]?.name ?? 'Fee')}`,
            quantity: item.quantity ?? 1,
            period: { start: item.current_period_start, end: item.current_period_end },
            pricing: { type: 'price_details', price_details: { price: price.id, product: price.product } },
          },
        ],
      },
      status_transitions: {
        finalized_at: now,
        paid_at: paid ? now : null,
        marked_uncollectible_at: null,
        voided_at: null,
      },
    };
    s().invoices[invoice.id] = invoice;
    sub.latest_invoice = invoice.id;
    return invoice;
  }

  async function completeCheckout(session: FakeSession, card: { behaviour: CardBehaviour; last4: string }) {
    const line = s().internal.lineItems[session.id]![0]!;
    const price = s().prices[line.price]!;
    const start = nowSeconds();
    const end = addMonth(start);
    const sub: FakeSubscription = {
      id: newId('sub'),
      object: 'subscription',
      customer: session.customer,
      status: 'active',
      billing_cycle_anchor: start,
      cancel_at_period_end: false,
      canceled_at: null,
      ended_at: null,
      collection_method: 'charge_automatically',
      created: start,
      currency: price.currency,
      default_payment_method: newId('pm'),
      latest_invoice: null,
      livemode: false,
      metadata: s().internal.subscriptionData[session.id] ?? {},
      start_date: start,
      items: {
        object: 'list',
        has_more: false,
        url: '/v1/subscription_items',
        data: [
          {
            id: newId('si', 14),
            object: 'subscription_item',
            price: structuredClone(price),
            quantity: line.quantity,
            current_period_start: start,
            current_period_end: end,
            created: start,
            metadata: {},
          },
        ],
      },
    };
    s().subscriptions[sub.id] = sub;
    s().internal.card[sub.id] = card;
    const hook = s().internal.webhookUrl[session.id];
    if (hook) s().internal.webhookUrl[sub.id] = hook;
    const invoice = invoiceFor(sub, price, 'subscription_create', true);
    Object.assign(session, { status: 'complete', payment_status: 'paid', subscription: sub.id, invoice: invoice.id });
    session.url = null;
    store.save();
    await emit('checkout.session.completed', session, session.id);
    await emit('invoice.paid', invoice, sub.id);
  }

  async function renew(subscriptionId: string) {
    const sub = s().subscriptions[subscriptionId];
    if (!sub) throw missing('subscription', subscriptionId);
    if (sub.status === 'canceled') {
      throw new ApiFailure(
        400,
        'invalid_request_error',
        'A cancelled subscription does not renew.',
        'subscription_canceled',
      );
    }
    const item = sub.items.data[0]!;
    const price = s().prices[(item.price as FakePrice).id]!;
    const start = Number(item.current_period_end);
    Object.assign(item, {
      current_period_start: start,
      current_period_end: addMonth(start, new Date(sub.billing_cycle_anchor * 1000).getUTCDate()),
    });
    const fails = s().internal.card[sub.id]?.behaviour === 'fails_at_renewal';
    const invoice = invoiceFor(sub, price, 'subscription_cycle', !fails);
    sub.status = fails ? 'past_due' : 'active';
    store.save();
    const delivery = await emit(fails ? 'invoice.payment_failed' : 'invoice.paid', invoice, sub.id);
    return { invoice, eventId: delivery.eventId, delivery };
  }

  async function cancel(subscriptionId: string) {
    const sub = s().subscriptions[subscriptionId];
    if (!sub) throw missing('subscription', subscriptionId);
    if (sub.status !== 'canceled') {
      const now = nowSeconds();
      Object.assign(sub, { status: 'canceled', canceled_at: now, ended_at: now });
      store.save();
      await emit('customer.subscription.deleted', sub, sub.id);
    }
    return sub;
  }

  // ---- the REST API ------------------------------------------------------------------------------

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true, limit: '100kb' }));

  const requireKey = (req: Request, _res: Response, next: NextFunction) => {
    const auth = req.get('authorization') ?? '';
    if (auth !== `Bearer ${secretKey}`) {
      next(new ApiFailure(401, 'invalid_request_error', 'Invalid API Key provided.', 'api_key_invalid'));
      return;
    }
    next();
  };

  /** A POST repeated with the same Idempotency-Key answers exactly what the first one did. */
  const idempotent = (req: Request, res: Response, next: NextFunction) => {
    const key = req.get('idempotency-key');
    if (req.method !== 'POST' || !key) return next();
    const cacheKey = `${req.path} ${key}`;
    const seen = s().idempotency[cacheKey];
    if (seen) {
      res.setHeader('Idempotent-Replayed', 'true');
      res.status(seen.status).json(seen.body);
      return;
    }
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      s().idempotency[cacheKey] = { status: res.statusCode, body };
      store.save();
      return json(body);
    };
    next();
  };

  const v1 = express.Router();
  v1.use(requireKey, idempotent, (_req, res, next) => {
    res.setHeader('Stripe-Version', API_VERSION);
    res.setHeader('Request-Id', newId('req', 14));
    next();
  });

  v1.post('/customers', (req, res) => {
    const p = req.body as Params;
    const customer = customerObject({ name: str(p.name), email: str(p.email), metadata: metadataOf(p.metadata) });
    s().customers[customer.id] = customer;
    store.save();
    res.json(customer);
  });
  v1.get('/customers/:id', (req, res) => {
    const c = s().customers[req.params.id!];
    if (!c) throw missing('customer', req.params.id!);
    res.json(c);
  });

  v1.post('/products', (req, res) => {
    const p = req.body as Params;
    const name = str(p.name);
    if (!name) throw required('name');
    const product = productObject({ name, metadata: metadataOf(p.metadata) });
    s().products[product.id as string] = product;
    store.save();
    res.json(product);
  });

  v1.post('/prices', (req, res) => {
    const p = req.body as Params;
    const product = str(p.product);
    if (!product) throw required('product');
    if (!s().products[product]) throw missing('product', product, 'product');
    const unitAmount = Number(p.unit_amount);
    if (!Number.isInteger(unitAmount) || unitAmount < 0) throw required('unit_amount');
    const currency = str(p.currency)?.toLowerCase();
    if (!currency || !/^[a-z]{3}$/.test(currency)) throw required('currency');
    const r = p.recurring as Params | undefined;
    const interval = str(r?.interval);
    if (r && !['day', 'week', 'month', 'year'].includes(interval ?? '')) throw required('recurring[interval]');
    const price = priceObject({
      product,
      unitAmount,
      currency,
      recurring: r ? { interval: interval!, interval_count: Number(r.interval_count ?? 1) } : null,
      metadata: metadataOf(p.metadata),
    });
    s().prices[price.id] = price;
    store.save();
    res.json(price);
  });
  v1.get('/prices/:id', (req, res) => {
    const price = s().prices[req.params.id!];
    if (!price) throw missing('price', req.params.id!);
    res.json(price);
  });

  v1.post('/checkout/sessions', (req, res) => {
    const p = req.body as Params;
    if (str(p.mode) !== 'subscription') {
      throw new ApiFailure(
        400,
        'invalid_request_error',
        'This local fake supports mode=subscription only.',
        undefined,
        'mode',
      );
    }
    const customer = str(p.customer);
    if (!customer) throw required('customer');
    if (!s().customers[customer]) throw missing('customer', customer, 'customer');
    const lines = Array.isArray(p.line_items) ? (p.line_items as Params[]) : [];
    const first = lines[0];
    const priceId = str(first?.price);
    if (!priceId) throw required('line_items[0][price]');
    const price = s().prices[priceId];
    if (!price) throw missing('price', priceId, 'line_items[0][price]');
    if (!price.recurring) {
      throw new ApiFailure(
        400,
        'invalid_request_error',
        'Subscription mode needs a recurring price.',
        undefined,
        'line_items',
      );
    }
    const successUrl = str(p.success_url);
    const cancelUrl = str(p.cancel_url);
    if (!successUrl) throw required('success_url');
    if (!cancelUrl) throw required('cancel_url');
    const quantity = Number(first?.quantity ?? 1) || 1;
    const session = sessionObject({
      base,
      customer,
      price,
      quantity,
      successUrl,
      cancelUrl,
      metadata: metadataOf(p.metadata),
      clientReferenceId: str(p.client_reference_id) ?? null,
    });
    s().sessions[session.id] = session;
    s().internal.lineItems[session.id] = [{ price: price.id, quantity }];
    s().internal.subscriptionData[session.id] = metadataOf((p.subscription_data as Params | undefined)?.metadata);
    s().internal.webhookUrl[session.id] = new URL('/api/webhooks/payments', successUrl).href;
    store.save();
    res.json(session);
  });
  v1.get('/checkout/sessions/:id', (req, res) => {
    const session = s().sessions[req.params.id!];
    if (!session) throw missing('checkout.session', req.params.id!);
    res.json(session);
  });

  v1.get('/subscriptions/:id', (req, res) => {
    const sub = s().subscriptions[req.params.id!];
    if (!sub) throw missing('subscription', req.params.id!);
    res.json(sub);
  });
  v1.delete('/subscriptions/:id', async (req, res) => {
    res.json(await cancel(req.params.id!));
  });

  v1.use((req) => {
    throw new ApiFailure(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.originalUrl}).`);
  });
  app.use('/v1', v1);

  // ---- control endpoints for tests and developers -------------------------------------------------

  const control = express.Router();
  control.use(requireKey);
  control.post('/subscriptions/:id/renew', async (req, res) => {
    res.json(await renew(req.params.id!));
  });
  control.post('/events/:id/resend', async (req, res) => {
    res.json(await resendEvent(req.params.id!));
  });
  control.get('/deliveries', (_req, res) => {
    res.json({ object: 'list', data: s().deliveries.slice(-100).reverse() });
  });
  app.use('/control', control);

  async function resendEvent(eventId: string) {
    if (!s().events[eventId]) throw missing('event', eventId);
    const first = s().deliveries.find((d) => d.eventId === eventId);
    const record: DeliveryRecord = {
      eventId,
      type: String(s().events[eventId]!.type),
      url: webhookUrl ?? first?.url ?? '',
      attempts: 0,
      lastStatus: 0,
      delivered: false,
    };
    s().deliveries.push(record);
    if (record.url) await post(record);
    return record;
  }

  // ---- the hosted test checkout page --------------------------------------------------------------

  const page = (res: Response, status: number, html: string) => {
    res
      .status(status)
      .setHeader(
        'Content-Security-Policy',
        "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'",
      )
      .setHeader('Cache-Control', 'no-store')
      .setHeader('Referrer-Policy', 'no-referrer')
      .type('html')
      .send(html);
  };
  const viewOf = (session: FakeSession) => {
    const price = s().prices[s().internal.lineItems[session.id]![0]!.price]!;
    const product = s().products[price.product];
    return {
      sessionId: session.id,
      productName: String(product?.name ?? 'Fee'),
      unitAmount: price.unit_amount,
      currency: price.currency,
      cancelUrl: session.cancel_url,
    };
  };
  const openSession = (res: Response, id: string): FakeSession | null => {
    const session = s().sessions[id];
    if (!session) {
      page(res, 404, messagePage('Checkout not found', 'There is no test checkout at this address.'));
      return null;
    }
    if (session.status === 'complete') {
      const back = session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id);
      page(
        res,
        200,
        messagePage('Already paid', 'This checkout is complete.', { href: back, label: 'Back to the app' }),
      );
      return null;
    }
    if (session.expires_at < nowSeconds()) {
      page(
        res,
        410,
        messagePage('Checkout expired', 'This checkout has expired. Start again from the app.', {
          href: session.cancel_url,
          label: 'Back to the app',
        }),
      );
      return null;
    }
    return session;
  };

  app.get('/test-checkout/:id', (req, res) => {
    const session = openSession(res, req.params.id!);
    if (session) page(res, 200, checkoutPage(viewOf(session)));
  });

  app.post('/test-checkout/:id', async (req, res) => {
    const session = openSession(res, req.params.id!);
    if (!session) return;
    const form = req.body as Record<string, string | undefined>;
    const values = { name: form.name ?? '', expiry: form.expiry ?? '' };
    const card = checkCard(form);
    if (!card.ok) {
      page(res, 422, checkoutPage({ ...viewOf(session), values, error: { field: card.field, message: card.message } }));
      return;
    }
    if (card.behaviour === 'declined') {
      // A declined card changes nothing and sends nothing: the payer stays here and can try again.
      page(res, 402, checkoutPage({ ...viewOf(session), values, declined: true }));
      return;
    }
    await completeCheckout(session, { behaviour: card.behaviour, last4: card.last4 });
    res.redirect(303, session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id));
  });

  app.get('/', (_req, res) => {
    page(
      res,
      200,
      messagePage(
        'Local payments stand-in',
        'The app talks to this fake provider through its SDK. Checkouts open at /test-checkout/<session id>.',
      ),
    );
  });

  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    const e =
      err instanceof ApiFailure
        ? err
        : new ApiFailure(500, 'api_error', 'The local payments fake failed; see its log.');
    if (!(err instanceof ApiFailure)) console.error('[payments fake]', err);
    res.status(e.status).json({
      error: {
        type: e.type,
        message: e.message,
        ...(e.code ? { code: e.code } : {}),
        ...(e.param ? { param: e.param } : {}),
      },
    });
  });

  const server: Server = await new Promise((resolve, reject) => {
    const srv = app.listen(opts.port, host, () => resolve(srv));
    srv.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;
  base = `http://${host}:${port}`;

  return {
    name: `payments fake on ${base}`,
    port,
    url: base,
    store,
    renew,
    resend: resendEvent,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    async stop() {
      for (const t of timers) clearTimeout(t);
      timers.clear();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/** The stand-in as `npm start` and `npm test` run it, configured from their environment. */
export function startPaymentsStandIn(env: NodeJS.ProcessEnv) {
  return startPaymentsFake({
    port: Number(env.PAYMENTS_PORT ?? 4403),
    host: env.PAYMENTS_HOST || '127.0.0.1',
    secretKey: env.PAYMENTS_SECRET_KEY || DEFAULT_SECRET_KEY,
    webhookSecret: env.PAYMENTS_WEBHOOK_SECRET || DEFAULT_WEBHOOK_SECRET,
    webhookUrl: env.PAYMENTS_WEBHOOK_URL || undefined,
    dataDir: env.STANDIN_DATA_DIR || undefined,
  });
}

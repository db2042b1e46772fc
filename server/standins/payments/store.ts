// The local payments fake's state: provider-shaped objects (customers, prices, checkout sessions,
// subscriptions, invoices, events) in memory, optionally kept in a JSON file between restarts.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import type { CardBehaviour } from './cards';

// The provider's API version the pinned SDK sends; the fake answers in the shapes of that version.
export const API_VERSION = '2026-10-28.endive';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** Ids shaped like the provider's: a type prefix and random base-62 characters. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

/** The same day of the next month (clamped to its last day), in UTC, as the provider bills monthly. */
export function addMonth(seconds: number, anchorDay?: number): number {
  const d = new Date(seconds * 1000);
  const day = anchorDay ?? d.getUTCDate();
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth() + 1;
  const last = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  return Date.UTC(y, m, Math.min(day, last), d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds()) / 1000;
}

type Json = Record<string, unknown>;
type Metadata = Record<string, string>;

export interface FakeCustomer extends Json {
  id: string;
  object: 'customer';
  name: string | null;
  email: string | null;
  metadata: Metadata;
}
export interface FakePrice extends Json {
  id: string;
  object: 'price';
  product: string;
  unit_amount: number;
  currency: string;
  recurring: { interval: string; interval_count: number; [more: string]: unknown } | null;
}
export interface FakeSession extends Json {
  id: string;
  object: 'checkout.session';
  customer: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  subscription: string | null;
  invoice: string | null;
  success_url: string;
  cancel_url: string;
  url: string | null;
  amount_total: number;
  currency: string;
  expires_at: number;
  metadata: Metadata;
}
export interface FakeSubscription extends Json {
  id: string;
  object: 'subscription';
  customer: string;
  status: 'active' | 'past_due' | 'canceled';
  items: { object: 'list'; data: Json[]; has_more: false; url: string };
  metadata: Metadata;
  latest_invoice: string | null;
  billing_cycle_anchor: number;
  canceled_at: number | null;
  ended_at: number | null;
}
export interface FakeInvoice extends Json {
  id: string;
  object: 'invoice';
  customer: string;
  status: 'paid' | 'open';
}

/** What the fake knows beyond the provider's objects: where to send events, how the card behaves. */
interface Internal {
  webhookUrl: Record<string, string>;
  card: Record<string, { behaviour: CardBehaviour; last4: string }>;
  lineItems: Record<string, { price: string; quantity: number }[]>;
  subscriptionData: Record<string, Metadata>;
  invoiceCount: number;
}

export interface DeliveryRecord {
  eventId: string;
  type: string;
  url: string;
  attempts: number;
  /** HTTP status of the last attempt; 0 when the app could not be reached. */
  lastStatus: number;
  delivered: boolean;
}

export interface State {
  customers: Record<string, FakeCustomer>;
  products: Record<string, Json>;
  prices: Record<string, FakePrice>;
  sessions: Record<string, FakeSession>;
  subscriptions: Record<string, FakeSubscription>;
  invoices: Record<string, FakeInvoice>;
  events: Record<string, Json>;
  deliveries: DeliveryRecord[];
  idempotency: Record<string, { status: number; body: unknown }>;
  internal: Internal;
}

const empty = (): State => ({
  customers: {},
  products: {},
  prices: {},
  sessions: {},
  subscriptions: {},
  invoices: {},
  events: {},
  deliveries: [],
  idempotency: {},
  internal: { webhookUrl: {}, card: {}, lineItems: {}, subscriptionData: {}, invoiceCount: 0 },
});

/** Older events and replay keys are dropped so a long-running demo does not grow without end. */
const KEEP_EVENTS = 500;

export class Store {
  state: State;

  constructor(private readonly file: string | null) {
    this.state = empty();
    if (file && existsSync(file)) {
      try {
        this.state = { ...empty(), ...(JSON.parse(readFileSync(file, 'utf8')) as Partial<State>) };
      } catch {
        this.state = empty();
      }
    }
  }

  /** Writes the state atomically (temp file + rename) when a data folder was given. */
  save(): void {
    const s = this.state;
    if (s.deliveries.length > KEEP_EVENTS) s.deliveries = s.deliveries.slice(-KEEP_EVENTS);
    const eventIds = Object.keys(s.events);
    for (const id of eventIds.slice(0, Math.max(0, eventIds.length - KEEP_EVENTS))) delete s.events[id];
    const keys = Object.keys(s.idempotency);
    for (const k of keys.slice(0, Math.max(0, keys.length - KEEP_EVENTS))) delete s.idempotency[k];
    if (!this.file) return;
    mkdirSync(dirname(this.file), { recursive: true });
    const tmp = `${this.file}.tmp`;
    writeFileSync(tmp, JSON.stringify(s));
    renameSync(tmp, this.file);
  }

  nextInvoiceNumber(customer: string): string {
    this.state.internal.invoiceCount += 1;
    return `${customer.slice(-6).toUpperCase()}-${String(this.state.internal.invoiceCount).padStart(4, '0')}`;
  }
}

export function customerObject(input: { name?: string; email?: string; metadata?: Metadata }): FakeCustomer {
  return {
    id: newId('cus', 14),
    object: 'customer',
    name: input.name ?? null,
    email: input.email ?? null,
    metadata: input.metadata ?? {},
    created: nowSeconds(),
    currency: null,
    default_source: null,
    delinquent: false,
    description: null,
    invoice_settings: { default_payment_method: null, custom_fields: null, footer: null },
    livemode: false,
  };
}

export function productObject(input: { name: string; metadata?: Metadata }): Json {
  return {
    id: newId('prod', 14),
    object: 'product',
    active: true,
    name: input.name,
    description: null,
    metadata: input.metadata ?? {},
    created: nowSeconds(),
    updated: nowSeconds(),
    livemode: false,
    type: 'service',
  };
}

export function priceObject(input: {
  product: string;
  unitAmount: number;
  currency: string;
  recurring: { interval: string; interval_count: number } | null;
  metadata?: Metadata;
}): FakePrice {
  return {
    id: newId('price'),
    object: 'price',
    active: true,
    billing_scheme: 'per_unit',
    currency: input.currency,
    product: input.product,
    unit_amount: input.unitAmount,
    unit_amount_decimal: String(input.unitAmount),
    recurring: input.recurring
      ? { ...input.recurring, usage_type: 'licensed', meter: null, trial_period_days: null }
      : null,
    type: input.recurring ? 'recurring' : 'one_time',
    metadata: input.metadata ?? {},
    created: nowSeconds(),
    livemode: false,
    lookup_key: null,
    nickname: null,
    tax_behavior: 'unspecified',
  };
}

export function sessionObject(input: {
  base: string;
  customer: string;
  price: FakePrice;
  quantity: number;
  successUrl: string;
  cancelUrl: string;
  metadata: Metadata;
  clientReferenceId: string | null;
}): FakeSession {
  const id = newId('cs_test', 58);
  const created = nowSeconds();
  return {
    id,
    object: 'checkout.session',
    mode: 'subscription',
    status: 'open',
    payment_status: 'unpaid',
    customer: input.customer,
    client_reference_id: input.clientReferenceId,
    subscription: null,
    invoice: null,
    success_url: input.successUrl,
    cancel_url: input.cancelUrl,
    url: `${input.base}/test-checkout/${id}`,
    amount_subtotal: input.price.unit_amount * input.quantity,
    amount_total: input.price.unit_amount * input.quantity,
    currency: input.price.currency,
    created,
    expires_at: created + 24 * 3600,
    metadata: input.metadata,
    livemode: false,
    payment_method_types: ['card'],
    ui_mode: 'hosted',
  };
}

// The parts of the provider's event payloads the fee handling reads, checked with zod after the
// signature is verified. Ids may arrive expanded into objects, so both shapes are accepted.
import { z } from 'zod';

const ref = z
  .union([z.string(), z.object({ id: z.string() }).transform((o) => o.id)])
  .nullable()
  .optional()
  .transform((v) => v ?? null);
const metadata = z
  .record(z.string(), z.string())
  .nullable()
  .optional()
  .transform((m) => m ?? {});
const epoch = z
  .number()
  .int()
  .nullable()
  .optional()
  .transform((s) => (typeof s === 'number' ? new Date(s * 1000) : null));

export const checkoutSessionObject = z.object({
  id: z.string(),
  mode: z.string(),
  customer: ref,
  subscription: ref,
  payment_status: z.string(),
  metadata,
});

export const invoiceObject = z.object({
  id: z.string(),
  customer: ref,
  number: z.string().nullable().optional(),
  billing_reason: z.string().nullable().optional(),
  amount_paid: z.number().int(),
  currency: z.string(),
  parent: z
    .object({ subscription_details: z.object({ subscription: ref }).nullable().optional() })
    .nullable()
    .optional(),
  lines: z.object({ data: z.array(z.object({ period: z.object({ start: epoch, end: epoch }) })) }),
  status_transitions: z.object({ paid_at: epoch }).partial().nullable().optional(),
});

export const subscriptionObject = z.object({
  id: z.string(),
  customer: ref,
  status: z.string(),
  items: z.object({ data: z.array(z.object({ current_period_end: epoch })) }),
});

export type CheckoutSessionObject = z.output<typeof checkoutSessionObject>;
export type InvoiceObject = z.output<typeof invoiceObject>;
export type SubscriptionObject = z.output<typeof subscriptionObject>;

/** The subscription an invoice bills, wherever this API version puts it. */
export function invoiceSubscription(inv: InvoiceObject): string | null {
  return inv.parent?.subscription_details?.subscription ?? null;
}

/** The end of the period an invoice paid for: its latest line's period end. */
export function invoicePeriodEnd(inv: InvoiceObject): Date | null {
  const ends = inv.lines.data.map((l) => l.period.end).filter((d): d is Date => d !== null);
  return ends.length ? new Date(Math.max(...ends.map((d) => d.getTime()))) : null;
}

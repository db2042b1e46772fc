// Coaching fees: plan contracts, the athletes' payment status, checkout, and money in minor units.
import { z } from 'zod';
import { idParam, listQuery, versionField } from './common';

export const paymentStatusSchema = z.enum(['none', 'pending', 'active', 'past_due', 'cancelled']);
export type PaymentStatus = z.infer<typeof paymentStatusSchema>;

/** How many decimals a currency's minor unit has (EUR 2, JPY 0), from the runtime's ISO 4217 data. */
export function currencyDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/**
 * "49.5" → 4950 for EUR. Works on the digits, never through floating point, so 0.29 stays 29.
 * Null when the amount has more decimals than the currency allows.
 */
export function toMinorUnits(amount: string, currency: string): number | null {
  const m = /^(\d+)(?:\.(\d+))?$/.exec(amount.trim());
  if (!m) return null;
  const digits = currencyDigits(currency);
  const fraction = m[2] ?? '';
  if (fraction.length > digits) return null;
  return Number(m[1]) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}

/** 4950 → "49.50" for EUR: the plain decimal a price field is filled with. */
export function fromMinorUnits(minor: number, currency: string): string {
  const digits = currencyDigits(currency);
  if (digits === 0) return String(minor);
  const s = String(Math.abs(minor)).padStart(digits + 1, '0');
  return `${minor < 0 ? '-' : ''}${s.slice(0, -digits)}.${s.slice(-digits)}`;
}

/** 4950 → "€49.50" (in the reader's locale). */
export function formatMoney(minor: number, currency: string, locale?: string): string {
  const digits = currencyDigits(currency);
  return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 10 ** digits);
}

export const feePlanNameField = z
  .string({ message: 'Give the plan a name' })
  .trim()
  .min(1, 'Give the plan a name')
  .max(120, 'Use at most 120 characters');

/** A monthly price typed as a decimal ("49", "49.50" or "49,50"); the server turns it into minor units. */
export const feePriceField = z
  .string({ message: 'Enter the monthly price' })
  .trim()
  .min(1, 'Enter the monthly price')
  .transform((s) => s.replace(',', '.'))
  .pipe(
    z
      .string()
      .regex(/^\d{1,6}(\.\d{1,2})?$/, 'Enter an amount like 45 or 45.50')
      .refine((s) => Number(s) > 0, 'The price must be more than zero'),
  );

export const feePlanDescriptionField = z
  .string()
  .trim()
  .max(1000, 'Use at most 1000 characters')
  .nullish()
  .transform((s) => (s ? s : null));

export const feePlanBody = z.object({
  name: feePlanNameField,
  price: feePriceField,
  description: feePlanDescriptionField,
});
export type FeePlanBody = z.input<typeof feePlanBody>;
export type FeePlanValues = z.output<typeof feePlanBody>;

export const feePlanUpdateBody = feePlanBody.extend({ version: versionField });
export type FeePlanUpdateBody = z.input<typeof feePlanUpdateBody>;

/** Archive, restore and delete name the version the head coach saw. */
export const planVersionBody = z.object({ version: versionField });
export const planVersionQuery = z.object({ version: z.coerce.number().int().positive() });

export const feePlanListQuery = listQuery.extend({
  status: z.enum(['active', 'archived', 'all']).default('active'),
  sort: z.enum(['name', '-name', 'price', '-price', 'created', '-created']).default('price'),
});
export type FeePlanListQuery = z.input<typeof feePlanListQuery>;

export const feeAthleteListQuery = listQuery.extend({
  status: paymentStatusSchema.optional(),
  sort: z
    .enum(['name', '-name', 'status', '-status', 'renewal', '-renewal', 'lastPayment', '-lastPayment'])
    .default('name'),
});
export type FeeAthleteListQuery = z.input<typeof feeAthleteListQuery>;

export const athleteIdParams = z.object({ athleteId: idParam });

export const checkoutBody = z.object({
  planId: z.number({ message: 'Choose a plan' }).int().positive('Choose a plan'),
});
export type CheckoutBody = z.infer<typeof checkoutBody>;

/** The webhook's body must reach the handler as the exact bytes that were signed. */
export const rawBody = z.instanceof(Uint8Array, { message: 'Expected the raw request body' });

export interface FeePlan {
  id: number;
  name: string;
  priceMinor: number;
  currency: string;
  description: string | null;
  archived: boolean;
  /** Athletes whose fee currently runs on this plan. */
  subscribers: number;
  /** Someone has checked out with it: it can be archived but no longer deleted. */
  inUse: boolean;
  version: number;
  createdAt: string;
}

/** The plan list also names the team's currency, which new plans are priced in. */
export interface FeePlanList {
  items: FeePlan[];
  total: number;
  currency: string;
}

export interface AthleteFee {
  athleteId: number;
  name: string;
  status: PaymentStatus;
  plan: { id: number; name: string; priceMinor: number; currency: string; archived: boolean } | null;
  currentPeriodEnd: string | null;
  lastPaymentAt: string | null;
}

export interface CheckoutStart {
  url: string;
  sessionId: string;
}

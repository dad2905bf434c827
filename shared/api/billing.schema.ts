import { z } from 'zod';

/**
 * Seats and billing. Amounts are in the currency's minor unit (cents), as the payment provider
 * sends them; dates are ISO strings. Only staff seats are paid for: client reviewers are free.
 */

export const MAX_SEATS = 500;

/**
 * Test payment methods the local payment provider understands (the same ids its hosted
 * counterpart accepts in test mode). In production a card form would hand over its own `pm_…`.
 */
export const TEST_PAYMENT_METHODS = [
  { id: 'pm_card_visa', label: 'Visa ending 4242 — payments succeed' },
  { id: 'pm_card_mastercard', label: 'Mastercard ending 4444 — payments succeed' },
  { id: 'pm_card_chargeCustomerFail', label: 'Visa ending 0341 — saved, but every charge fails' },
  { id: 'pm_card_chargeDeclined', label: 'Visa ending 0002 — declined straight away' },
] as const;

export const seatQuantitySchema = z
  .number({ error: 'Enter a number of seats.' })
  .int('Seats come in whole numbers.')
  .min(1, 'A subscription needs at least one seat.')
  .max(MAX_SEATS, `At most ${MAX_SEATS} seats can be bought here; write to us for more.`);

export const paymentMethodIdSchema = z
  .string({ error: 'Choose a card.' })
  .trim()
  .regex(/^pm_[A-Za-z0-9_]{3,120}$/, 'Choose a card.');

/** `POST /api/billing/subscription` (admin). */
export const startSubscriptionSchema = z.object({ quantity: seatQuantitySchema, paymentMethod: paymentMethodIdSchema });
export type StartSubscriptionInput = z.infer<typeof startSubscriptionSchema>;

/** `PATCH /api/billing/seats` (admin). */
export const changeSeatsSchema = z.object({ quantity: seatQuantitySchema });
export type ChangeSeatsInput = z.infer<typeof changeSeatsSchema>;

/** `POST /api/billing/payment-method` (admin): replaces the card and retries an unpaid invoice. */
export const updatePaymentMethodSchema = z.object({ paymentMethod: paymentMethodIdSchema });
export type UpdatePaymentMethodInput = z.infer<typeof updatePaymentMethodSchema>;

export const invoiceLineSchema = z.object({
  description: z.string(),
  amount: z.number(),
  quantity: z.number().nullable(),
  /** A charge or credit for part of a period, from a seat change. */
  proration: z.boolean(),
});
export type InvoiceLine = z.infer<typeof invoiceLineSchema>;

export const invoiceSchema = z.object({
  id: z.string(),
  number: z.string().nullable(),
  status: z.enum(['draft', 'open', 'paid', 'uncollectible', 'void']),
  currency: z.string(),
  total: z.number(),
  amountDue: z.number(),
  amountPaid: z.number(),
  created: z.string(),
  periodStart: z.string(),
  periodEnd: z.string(),
  lines: z.array(invoiceLineSchema),
});
export type Invoice = z.infer<typeof invoiceSchema>;

export const upcomingInvoiceSchema = z.object({
  currency: z.string(),
  total: z.number(),
  amountDue: z.number(),
  /** When the provider will try to charge it (the end of the current period). */
  date: z.string().nullable(),
  lines: z.array(invoiceLineSchema),
});
export type UpcomingInvoice = z.infer<typeof upcomingInvoiceSchema>;

export const invoiceListSchema = z.object({ invoices: z.array(invoiceSchema) });
export type InvoiceList = z.infer<typeof invoiceListSchema>;

/**
 * What the Billing page shows. `state`:
 * - `none`: no subscription yet, the studio uses its included seats;
 * - `active`: paid up;
 * - `grace`: a payment failed, nothing is blocked until `graceUntil`;
 * - `blocked`: the grace period is over (or the subscription ended): no new staff can join,
 *   everyone keeps access to existing work.
 */
export const billingStateSchema = z.enum(['none', 'active', 'grace', 'blocked']);
export type BillingState = z.infer<typeof billingStateSchema>;

export const billingOverviewSchema = z.object({
  state: billingStateSchema,
  plan: z
    .object({ name: z.string(), unitAmount: z.number(), currency: z.string(), interval: z.string() })
    .nullable(),
  seats: z.object({ used: z.number(), paid: z.number() }),
  subscription: z
    .object({
      status: z.enum(['incomplete', 'active', 'past_due', 'canceled']),
      quantity: z.number(),
      currentPeriodEnd: z.string().nullable(),
      graceUntil: z.string().nullable(),
    })
    .nullable(),
  card: z.object({ brand: z.string(), last4: z.string() }).nullable(),
  upcoming: upcomingInvoiceSchema.nullable(),
  invoices: z.array(invoiceSchema),
  /** Set when the payment provider could not be reached; the rest is what Warpmeter last knew. */
  providerProblem: z.string().nullable(),
});
export type BillingOverview = z.infer<typeof billingOverviewSchema>;

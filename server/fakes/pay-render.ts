import type { CatalogPrice } from './pay-catalog.js';
import type {
  CustomerRec, InvoiceRec, LineRec, PayStore, PaymentMethodRec, SubscriptionRec,
} from './pay-store.js';

/**
 * Renders the fake's records as the provider's API objects (the subset of fields the SDK's
 * types describe that a seat subscription needs), so server code reads them exactly as it
 * would read the hosted service's answers.
 */
type Obj = Record<string, unknown>;

export const list = (data: unknown[], url: string, hasMore = false) => ({ object: 'list', data, has_more: hasMore, url });

export function renderPrice(p: CatalogPrice): Obj {
  return {
    id: p.id,
    object: 'price',
    active: true,
    currency: p.currency,
    unit_amount: p.unitAmount,
    unit_amount_decimal: String(p.unitAmount),
    lookup_key: p.lookupKey,
    nickname: null,
    product: p.productId,
    recurring: { interval: p.interval, interval_count: 1, usage_type: 'licensed' },
    type: 'recurring',
    billing_scheme: 'per_unit',
    livemode: false,
    metadata: {},
  };
}

export const renderProduct = (p: CatalogPrice): Obj => ({
  id: p.productId,
  object: 'product',
  name: p.productName,
  active: true,
  livemode: false,
  metadata: {},
});

export function renderCustomer(c: CustomerRec): Obj {
  return {
    id: c.id,
    object: 'customer',
    email: c.email,
    name: c.name,
    metadata: c.metadata,
    created: c.created,
    balance: 0,
    currency: 'eur',
    delinquent: false,
    invoice_settings: { default_payment_method: c.defaultPaymentMethod, custom_fields: null, footer: null },
    livemode: false,
  };
}

export function renderPaymentMethod(pm: PaymentMethodRec): Obj {
  return {
    id: pm.id,
    object: 'payment_method',
    type: 'card',
    customer: pm.customer,
    created: pm.created,
    livemode: false,
    metadata: {},
    billing_details: { address: null, email: null, name: null, phone: null },
    card: {
      brand: pm.card.brand,
      last4: pm.card.last4,
      exp_month: pm.card.expMonth,
      exp_year: pm.card.expYear,
      funding: 'credit',
      country: 'US',
    },
  };
}

export function renderSubscription(store: PayStore, s: SubscriptionRec): Obj {
  const price = store.prices.get(s.priceId)!;
  const item = {
    id: s.itemId,
    object: 'subscription_item',
    created: s.created,
    price: renderPrice(price),
    quantity: s.quantity,
    subscription: s.id,
    current_period_start: s.periodStart,
    current_period_end: s.periodEnd,
    metadata: {},
  };
  return {
    id: s.id,
    object: 'subscription',
    customer: s.customer,
    status: s.status,
    currency: price.currency,
    collection_method: 'charge_automatically',
    billing_cycle_anchor: s.created,
    cancel_at_period_end: false,
    canceled_at: s.canceledAt,
    ended_at: s.canceledAt,
    created: s.created,
    start_date: s.created,
    default_payment_method: s.defaultPaymentMethod,
    latest_invoice: s.latestInvoice,
    items: list([item], `/v1/subscription_items?subscription=${s.id}`),
    metadata: s.metadata,
    livemode: false,
  };
}

function renderLine(l: LineRec, currency: string, invoiceId: string | null, subscription: string): Obj {
  return {
    id: l.id,
    object: 'line_item',
    amount: l.amount,
    subtotal: l.amount,
    currency,
    description: l.description,
    quantity: l.quantity,
    invoice: invoiceId,
    subscription,
    period: { start: l.periodStart, end: l.periodEnd },
    pricing: { type: 'price_details', price_details: { price: l.priceId }, unit_amount_decimal: null },
    parent: l.invoiceItem
      ? {
          type: 'invoice_item_details',
          invoice_item_details: { invoice_item: l.invoiceItem, proration: l.proration, subscription },
          subscription_item_details: null,
        }
      : {
          type: 'subscription_item_details',
          invoice_item_details: null,
          subscription_item_details: { proration: l.proration, subscription },
        },
    discountable: true,
    discounts: [],
    livemode: false,
    metadata: {},
  };
}

export const invoiceTotal = (lines: LineRec[]) => lines.reduce((sum, l) => sum + l.amount, 0);

export function renderInvoice(store: PayStore, inv: InvoiceRec): Obj {
  const sub = store.subscriptions.get(inv.subscription);
  const currency = store.prices.get(sub?.priceId ?? '')?.currency ?? 'eur';
  const total = invoiceTotal(inv.lines);
  const amountDue = Math.max(0, total);
  return {
    id: inv.id,
    object: 'invoice',
    number: inv.number,
    customer: inv.customer,
    status: inv.status,
    billing_reason: inv.billingReason,
    collection_method: 'charge_automatically',
    currency,
    subtotal: total,
    total,
    amount_due: amountDue,
    amount_paid: inv.amountPaid,
    amount_remaining: inv.status === 'paid' ? 0 : amountDue - inv.amountPaid,
    attempt_count: inv.attemptCount,
    attempted: inv.attemptCount > 0,
    created: inv.created,
    period_start: inv.periodStart,
    period_end: inv.periodEnd,
    next_payment_attempt: null,
    status_transitions: { finalized_at: inv.created, paid_at: inv.paidAt, voided_at: null, marked_uncollectible_at: null },
    parent: { type: 'subscription_details', quote_details: null, subscription_details: { subscription: inv.subscription, metadata: sub?.metadata ?? {} } },
    lines: list(
      inv.lines.map((l) => renderLine(l, currency, inv.id, inv.subscription)),
      `/v1/invoices/${inv.id}/lines`,
    ),
    livemode: false,
    metadata: {},
  };
}

/** A not-yet-created invoice (`POST /v1/invoices/create_preview`): same shape, no id of its own. */
export function renderPreview(store: PayStore, sub: SubscriptionRec, lines: LineRec[], date: number): Obj {
  const currency = store.prices.get(sub.priceId)!.currency;
  const total = invoiceTotal(lines);
  return {
    id: `upcoming_${sub.id}`,
    object: 'invoice',
    number: null,
    customer: sub.customer,
    status: 'draft',
    billing_reason: 'upcoming',
    currency,
    subtotal: total,
    total,
    amount_due: Math.max(0, total),
    amount_paid: 0,
    amount_remaining: Math.max(0, total),
    attempt_count: 0,
    attempted: false,
    created: date,
    period_start: sub.periodStart,
    period_end: sub.periodEnd,
    next_payment_attempt: date,
    parent: { type: 'subscription_details', quote_details: null, subscription_details: { subscription: sub.id, metadata: sub.metadata } },
    lines: list(lines.map((l) => renderLine(l, currency, null, sub.id)), '/v1/invoices/upcoming/lines'),
    livemode: false,
    metadata: {},
  };
}

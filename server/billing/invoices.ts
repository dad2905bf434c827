import type Stripe from 'stripe';
import type { Invoice, InvoiceLine, UpcomingInvoice } from '../../shared/api/billing.schema.js';

const iso = (sec: number | null | undefined) => (sec ? new Date(sec * 1000).toISOString() : null);

function toLine(l: Stripe.InvoiceLineItem): InvoiceLine {
  const proration = Boolean(l.parent?.invoice_item_details?.proration ?? l.parent?.subscription_item_details?.proration);
  return { description: l.description ?? '', amount: l.amount, quantity: l.quantity ?? null, proration };
}

/** The subscription an invoice belongs to (current API: under `parent`). */
export function invoiceSubscriptionId(inv: Stripe.Invoice): string | null {
  const sub = inv.parent?.subscription_details?.subscription;
  return typeof sub === 'string' ? sub : (sub?.id ?? null);
}

const STATUSES: readonly Invoice['status'][] = ['draft', 'open', 'paid', 'uncollectible', 'void'];
const statusOf = (s: string | null): Invoice['status'] => (STATUSES as readonly string[]).includes(s ?? '') ? (s as Invoice['status']) : 'draft';

export function toInvoice(inv: Stripe.Invoice): Invoice {
  return {
    id: inv.id,
    number: inv.number,
    status: statusOf(inv.status),
    currency: inv.currency,
    total: inv.total,
    amountDue: inv.amount_due,
    amountPaid: inv.amount_paid,
    created: iso(inv.created)!,
    periodStart: iso(inv.period_start)!,
    periodEnd: iso(inv.period_end)!,
    lines: inv.lines.data.map(toLine),
  };
}

export function toUpcoming(inv: Stripe.Invoice): UpcomingInvoice {
  return {
    currency: inv.currency,
    total: inv.total,
    amountDue: inv.amount_due,
    date: iso(inv.next_payment_attempt ?? inv.period_end),
    lines: inv.lines.data.map(toLine),
  };
}

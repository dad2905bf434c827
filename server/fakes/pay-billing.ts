import { cardDeclined, invalid, missing } from './pay-errors.js';
import { TEST_CARDS } from './pay-catalog.js';
import { renderCustomer, renderInvoice, renderPaymentMethod, renderSubscription } from './pay-render.js';
import {
  addInterval, newId, type CustomerRec, type InvoiceRec, type LineRec, type PayStore, type PaymentMethodRec,
  type SubscriptionRec,
} from './pay-store.js';

export type Emit = (type: string, object: Record<string, unknown>, previous?: Record<string, unknown>) => void;

const fmtDate = (sec: number) =>
  new Date(sec * 1000).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
const fmtMoney = (minor: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency }).format(minor / 100);

/**
 * The provider's behaviour for a per-seat subscription: customers and cards, a subscription
 * invoiced up front each period, quantity changes prorated onto the next invoice, renewals and
 * charge failures. Every state change emits the event the hosted service would send.
 */
export class PayBilling {
  constructor(
    readonly store: PayStore,
    private readonly emit: Emit,
  ) {}

  customer(id: string): CustomerRec {
    const c = this.store.customers.get(id);
    if (!c) throw missing('customer', id, 'customer');
    return c;
  }

  subscription(id: string): SubscriptionRec {
    const s = this.store.subscriptions.get(id);
    if (!s) throw missing('subscription', id);
    return s;
  }

  invoice(id: string): InvoiceRec {
    const i = this.store.invoices.get(id);
    if (!i) throw missing('invoice', id);
    return i;
  }

  createCustomer(p: { email?: string; name?: string; metadata?: Record<string, string> }): CustomerRec {
    const c: CustomerRec = {
      id: newId('cus'),
      email: p.email ?? null,
      name: p.name ?? null,
      metadata: p.metadata ?? {},
      created: this.store.now(),
      defaultPaymentMethod: null,
    };
    this.store.customers.set(c.id, c);
    this.emit('customer.created', renderCustomer(c));
    return c;
  }

  updateCustomer(id: string, p: { email?: string; name?: string; defaultPaymentMethod?: string; metadata?: Record<string, string> }) {
    const c = this.customer(id);
    if (p.defaultPaymentMethod !== undefined) {
      const pm = this.store.paymentMethods.get(p.defaultPaymentMethod);
      if (!pm || pm.customer !== c.id) {
        throw invalid(`The customer does not have a payment method with the ID ${p.defaultPaymentMethod}.`, 'invoice_settings[default_payment_method]');
      }
      c.defaultPaymentMethod = pm.id;
    }
    if (p.email !== undefined) c.email = p.email;
    if (p.name !== undefined) c.name = p.name;
    if (p.metadata) c.metadata = { ...c.metadata, ...p.metadata };
    this.emit('customer.updated', renderCustomer(c));
    return c;
  }

  /** Test-mode card ids (`pm_card_visa`) attach as a fresh payment method, as on the hosted service. */
  attachPaymentMethod(pmId: string, customerId: string): PaymentMethodRec {
    const customer = this.customer(customerId);
    const template = TEST_CARDS[pmId];
    let pm = this.store.paymentMethods.get(pmId);
    if (template) {
      if (template.attachFails) throw cardDeclined();
      pm = { id: newId('pm'), customer: null, card: template, created: this.store.now() };
      this.store.paymentMethods.set(pm.id, pm);
    }
    if (!pm) throw missing('PaymentMethod', pmId, 'payment_method');
    if (pm.customer && pm.customer !== customer.id) throw invalid('This PaymentMethod is already attached to another customer.');
    pm.customer = customer.id;
    this.emit('payment_method.attached', renderPaymentMethod(pm));
    return pm;
  }

  paymentMethod(id: string): PaymentMethodRec {
    const pm = this.store.paymentMethods.get(id);
    if (pm) return pm;
    const template = TEST_CARDS[id];
    if (template) return { id, customer: null, card: template, created: this.store.now() };
    throw missing('PaymentMethod', id);
  }

  private seatLine(sub: SubscriptionRec, start: number, end: number): LineRec {
    const price = this.store.prices.get(sub.priceId)!;
    return {
      id: newId('il'),
      amount: price.unitAmount * sub.quantity,
      description: `${sub.quantity} × ${price.productName} (at ${fmtMoney(price.unitAmount, price.currency)} / ${price.interval})`,
      quantity: sub.quantity,
      periodStart: start,
      periodEnd: end,
      proration: false,
      priceId: price.id,
      invoiceItem: null,
    };
  }

  private pendingItems(sub: SubscriptionRec) {
    return [...this.store.invoiceItems.values()].filter((i) => i.subscription === sub.id && i.invoice === null);
  }

  /** True when the card pays; totals of zero or less need no charge. */
  private charge(inv: InvoiceRec, sub: SubscriptionRec): boolean {
    const total = inv.lines.reduce((s, l) => s + l.amount, 0);
    inv.attemptCount += 1;
    if (total > 0) {
      const pmId = sub.defaultPaymentMethod ?? this.customer(sub.customer).defaultPaymentMethod;
      const pm = pmId ? this.store.paymentMethods.get(pmId) : undefined;
      if (!pm || pm.card.chargeFails) return false;
    }
    inv.status = 'paid';
    inv.amountPaid = Math.max(0, total);
    inv.paidAt = this.store.now();
    return true;
  }

  private newInvoice(sub: SubscriptionRec, reason: InvoiceRec['billingReason'], lines: LineRec[], start: number, end: number): InvoiceRec {
    const { number, seq } = this.store.nextInvoiceNumber(sub.customer);
    const inv: InvoiceRec = {
      id: newId('in'), number, customer: sub.customer, subscription: sub.id, status: 'open', billingReason: reason,
      lines, created: this.store.now(), periodStart: start, periodEnd: end, amountPaid: 0, attemptCount: 0, paidAt: null, seq,
    };
    for (const l of lines) if (l.invoiceItem) this.store.invoiceItems.get(l.invoiceItem)!.invoice = inv.id;
    this.store.invoices.set(inv.id, inv);
    sub.latestInvoice = inv.id;
    return inv;
  }

  createSubscription(p: {
    customer: string; priceId: string; quantity: number; defaultPaymentMethod?: string;
    paymentBehavior?: string; metadata?: Record<string, string>;
  }): SubscriptionRec {
    const customer = this.customer(p.customer);
    const price = this.store.prices.get(p.priceId);
    if (!price) throw missing('price', p.priceId, 'items[0][price]');
    if (!Number.isInteger(p.quantity) || p.quantity < 1) throw invalid('Invalid quantity: must be a positive integer.', 'items[0][quantity]');
    const pmId = p.defaultPaymentMethod ?? customer.defaultPaymentMethod;
    if (!pmId || this.store.paymentMethods.get(pmId)?.customer !== customer.id) {
      throw invalid('This customer has no attached payment source or default payment method.');
    }
    const now = this.store.now();
    const sub: SubscriptionRec = {
      id: newId('sub'), customer: customer.id, status: 'incomplete', itemId: newId('si'), priceId: price.id,
      quantity: p.quantity, periodStart: now, periodEnd: addInterval(now, price.interval),
      defaultPaymentMethod: p.defaultPaymentMethod ?? null, latestInvoice: null, metadata: p.metadata ?? {}, created: now, canceledAt: null,
    };
    const inv = this.newInvoice(sub, 'subscription_create', [this.seatLine(sub, sub.periodStart, sub.periodEnd)], sub.periodStart, sub.periodEnd);
    const paid = this.charge(inv, sub);
    if (!paid && p.paymentBehavior === 'error_if_incomplete') {
      // The hosted service creates nothing when the first payment fails in this mode.
      this.store.invoices.delete(inv.id);
      throw cardDeclined();
    }
    this.store.subscriptions.set(sub.id, sub);
    if (paid) sub.status = 'active';
    this.emit('customer.subscription.created', renderSubscription(this.store, sub));
    this.emit(paid ? 'invoice.paid' : 'invoice.payment_failed', renderInvoice(this.store, inv));
    return sub;
  }

  /**
   * A quantity change prorated for the rest of the period: a credit for the unused time on the
   * old quantity and a charge for the remaining time on the new one, both added to the next invoice.
   */
  updateSubscription(id: string, p: { itemId?: string; quantity?: number; prorate: boolean; defaultPaymentMethod?: string; metadata?: Record<string, string> }) {
    const sub = this.subscription(id);
    if (sub.status === 'canceled') throw invalid('A canceled subscription cannot be updated.');
    const previous: Record<string, unknown> = {};
    if (p.quantity !== undefined && p.quantity !== sub.quantity) {
      if (p.itemId && p.itemId !== sub.itemId) throw missing('subscription item', p.itemId, 'items[0][id]');
      if (!Number.isInteger(p.quantity) || p.quantity < 1) throw invalid('Invalid quantity: must be a positive integer.', 'items[0][quantity]');
      const before = renderSubscription(this.store, sub);
      if (p.prorate) this.addProration(sub, sub.quantity, p.quantity);
      sub.quantity = p.quantity;
      previous.items = before.items;
    }
    if (p.defaultPaymentMethod !== undefined) {
      const pm = this.store.paymentMethods.get(p.defaultPaymentMethod);
      if (!pm || pm.customer !== sub.customer) throw invalid(`No such PaymentMethod: '${p.defaultPaymentMethod}' on this customer.`, 'default_payment_method');
      previous.default_payment_method = sub.defaultPaymentMethod;
      sub.defaultPaymentMethod = pm.id;
    }
    if (p.metadata) {
      previous.metadata = sub.metadata;
      sub.metadata = { ...sub.metadata, ...p.metadata };
    }
    if (Object.keys(previous).length) this.emit('customer.subscription.updated', renderSubscription(this.store, sub), previous);
    return sub;
  }

  private addProration(sub: SubscriptionRec, oldQty: number, newQty: number) {
    const price = this.store.prices.get(sub.priceId)!;
    const now = Math.min(Math.max(this.store.now(), sub.periodStart), sub.periodEnd);
    const fraction = (sub.periodEnd - now) / (sub.periodEnd - sub.periodStart);
    const after = fmtDate(now);
    const make = (qty: number, sign: 1 | -1, what: string) => {
      const item = {
        id: newId('ii'), customer: sub.customer, subscription: sub.id, invoice: null, created: this.store.now(),
        amount: sign * Math.round(price.unitAmount * qty * fraction),
        description: `${what} on ${qty} × ${price.productName} after ${after}`,
        quantity: qty, periodStart: now, periodEnd: sub.periodEnd, proration: true, priceId: price.id, invoiceItem: null as string | null,
      };
      item.invoiceItem = item.id;
      this.store.invoiceItems.set(item.id, item);
    };
    make(oldQty, -1, 'Unused time');
    make(newQty, 1, 'Remaining time');
  }

  /** What the next invoice will hold: pending prorations plus the next period at today's quantity. */
  previewLines(sub: SubscriptionRec): LineRec[] {
    const price = this.store.prices.get(sub.priceId)!;
    return [
      ...this.pendingItems(sub).map((i) => ({ ...i })),
      this.seatLine(sub, sub.periodEnd, addInterval(sub.periodEnd, price.interval)),
    ];
  }

  /** Moves the clock to the end of the period and bills the next one (a renewal). */
  renew(id: string): InvoiceRec {
    const sub = this.subscription(id);
    if (sub.status === 'canceled' || sub.status === 'incomplete') throw invalid(`A ${sub.status} subscription does not renew.`);
    const price = this.store.prices.get(sub.priceId)!;
    this.store.clockOffsetSec += Math.max(0, sub.periodEnd - this.store.now());
    sub.periodStart = sub.periodEnd;
    sub.periodEnd = addInterval(sub.periodStart, price.interval);
    const lines = [...this.pendingItems(sub), this.seatLine(sub, sub.periodStart, sub.periodEnd)];
    const inv = this.newInvoice(sub, 'subscription_cycle', lines, sub.periodStart, sub.periodEnd);
    this.settle(sub, inv, this.charge(inv, sub));
    return inv;
  }

  /** Retries an open invoice with the current card (`POST /v1/invoices/:id/pay`). */
  payInvoice(id: string): InvoiceRec {
    const inv = this.invoice(id);
    if (inv.status === 'paid') throw invalid('Invoice is already paid.');
    if (inv.status !== 'open') throw invalid(`You can only pay an open invoice; this one is ${inv.status}.`);
    const sub = this.subscription(inv.subscription);
    const paid = this.charge(inv, sub);
    this.settle(sub, inv, paid);
    if (!paid) throw cardDeclined();
    return inv;
  }

  /** Events and the subscription's status after a charge attempt on an existing subscription. */
  private settle(sub: SubscriptionRec, inv: InvoiceRec, paid: boolean) {
    const before = sub.status;
    if (paid) {
      const stillOpen = [...this.store.invoices.values()].some((i) => i.subscription === sub.id && i.status === 'open');
      if (!stillOpen && sub.status === 'past_due') sub.status = 'active';
      this.emit('invoice.paid', renderInvoice(this.store, inv));
    } else {
      if (sub.status === 'active') sub.status = 'past_due';
      this.emit('invoice.payment_failed', renderInvoice(this.store, inv));
    }
    if (sub.status !== before) this.emit('customer.subscription.updated', renderSubscription(this.store, sub), { status: before });
  }

  cancelSubscription(id: string): SubscriptionRec {
    const sub = this.subscription(id);
    if (sub.status === 'canceled') return sub;
    sub.status = 'canceled';
    sub.canceledAt = this.store.now();
    this.emit('customer.subscription.deleted', renderSubscription(this.store, sub));
    return sub;
  }
}

import { randomBytes } from 'node:crypto';
import { DEFAULT_PRICES, type CatalogPrice, type TestCard } from './pay-catalog.js';

/** In-memory records of the local payment provider; rendered to API objects in pay-render.ts. */
export interface CustomerRec {
  id: string;
  email: string | null;
  name: string | null;
  metadata: Record<string, string>;
  created: number;
  defaultPaymentMethod: string | null;
}

export interface PaymentMethodRec {
  id: string;
  customer: string | null;
  card: TestCard;
  created: number;
}

export type SubStatus = 'incomplete' | 'active' | 'past_due' | 'canceled';

export interface SubscriptionRec {
  id: string;
  customer: string;
  status: SubStatus;
  itemId: string;
  priceId: string;
  quantity: number;
  periodStart: number;
  periodEnd: number;
  defaultPaymentMethod: string | null;
  latestInvoice: string | null;
  metadata: Record<string, string>;
  created: number;
  canceledAt: number | null;
}

export interface LineRec {
  id: string;
  amount: number;
  description: string;
  quantity: number | null;
  periodStart: number;
  periodEnd: number;
  proration: boolean;
  priceId: string;
  /** Set for lines that came from a pending invoice item (prorations). */
  invoiceItem: string | null;
}

/** A pending charge or credit waiting for the subscription's next invoice. */
export interface InvoiceItemRec extends LineRec {
  customer: string;
  subscription: string;
  invoice: string | null;
  created: number;
}

export type InvoiceStatus = 'draft' | 'open' | 'paid' | 'uncollectible' | 'void';

export interface InvoiceRec {
  id: string;
  number: string;
  customer: string;
  subscription: string;
  status: InvoiceStatus;
  billingReason: 'subscription_create' | 'subscription_cycle' | 'subscription_update';
  lines: LineRec[];
  created: number;
  periodStart: number;
  periodEnd: number;
  amountPaid: number;
  attemptCount: number;
  paidAt: number | null;
  /** Creation order, to sort invoices made in the same second. */
  seq: number;
}

export interface EventRec {
  id: string;
  type: string;
  created: number;
  object: Record<string, unknown>;
  previousAttributes?: Record<string, unknown>;
}

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Ids shaped like the provider's: a type prefix and 14 random base-62 characters. */
export function newId(prefix: string): string {
  const bytes = randomBytes(14);
  return `${prefix}_${Array.from(bytes, (b) => ALPHABET[b % 62]).join('')}`;
}

/** Adds one calendar month in UTC (the provider bills monthly on the same day of the month). */
export function addInterval(sec: number, interval: 'month' | 'year'): number {
  const d = new Date(sec * 1000);
  if (interval === 'year') d.setUTCFullYear(d.getUTCFullYear() + 1);
  else d.setUTCMonth(d.getUTCMonth() + 1);
  return Math.floor(d.getTime() / 1000);
}

export class PayStore {
  customers = new Map<string, CustomerRec>();
  paymentMethods = new Map<string, PaymentMethodRec>();
  subscriptions = new Map<string, SubscriptionRec>();
  invoices = new Map<string, InvoiceRec>();
  invoiceItems = new Map<string, InvoiceItemRec>();
  events: EventRec[] = [];
  prices: Map<string, CatalogPrice>;
  /** Seconds added to the wall clock, like the provider's test clocks. */
  clockOffsetSec = 0;
  private invoiceSeq = 0;

  constructor(prices: CatalogPrice[] = DEFAULT_PRICES) {
    this.prices = new Map(prices.map((p) => [p.id, p]));
  }

  now(): number {
    return Math.floor(Date.now() / 1000) + this.clockOffsetSec;
  }

  nextInvoiceNumber(customer: string): { number: string; seq: number } {
    this.invoiceSeq += 1;
    const prefix = customer.slice(4, 12).toUpperCase();
    const count = [...this.invoices.values()].filter((i) => i.customer === customer).length + 1;
    return { number: `${prefix}-${String(count).padStart(4, '0')}`, seq: this.invoiceSeq };
  }

  /** Finds any stored object by id, for `expand[]`. */
  lookup(id: string): { kind: string; rec: unknown } | null {
    const maps: [string, Map<string, unknown>][] = [
      ['customer', this.customers],
      ['payment_method', this.paymentMethods],
      ['subscription', this.subscriptions],
      ['invoice', this.invoices],
      ['price', this.prices],
    ];
    for (const [kind, map] of maps) if (map.has(id)) return { kind, rec: map.get(id) };
    return null;
  }
}

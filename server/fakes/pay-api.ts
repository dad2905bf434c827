import { asInt, asList, asString, type FormObject, type FormValue } from './pay-form.js';
import type { PayBilling } from './pay-billing.js';
import { invalid, missing, PayError } from './pay-errors.js';
import {
  list, renderCustomer, renderInvoice, renderPaymentMethod, renderPreview, renderPrice, renderProduct, renderSubscription,
} from './pay-render.js';
import type { EventRec } from './pay-store.js';
import { eventBody } from './pay-webhooks.js';

type Obj = Record<string, unknown>;
type Handler = (p: FormObject, id: string) => Obj;

/**
 * The REST surface of the local payment provider under `/v1`, for the endpoints a per-seat
 * subscription uses. Bodies are form-encoded, answers are JSON objects or
 * `{ object: 'list', data, has_more }`, and `expand[]` replaces ids with the objects they name.
 */
export function apiRoutes(billing: PayBilling): { method: string; pattern: RegExp; handler: Handler }[] {
  const store = billing.store;
  const metadata = (v: FormValue | undefined) =>
    v && typeof v === 'object' && !Array.isArray(v) ? (Object.fromEntries(Object.entries(v).map(([k, x]) => [k, String(x)])) as Record<string, string>) : undefined;
  const pageOf = <T>(items: T[], p: FormObject, url: string, idOf: (x: T) => string, render: (x: T) => unknown) => {
    const limit = Math.min(Math.max(asInt(p.limit) ?? 10, 1), 100);
    const after = asString(p.starting_after);
    const start = after ? items.findIndex((x) => idOf(x) === after) + 1 : 0;
    const page = items.slice(start, start + limit);
    return list(page.map(render), url, start + limit < items.length);
  };
  const routes: { method: string; path: string; handler: Handler }[] = [
    {
      method: 'GET', path: '/v1/prices', handler: (p) => {
        const keys = asList(p.lookup_keys).map(String);
        const prices = [...store.prices.values()].filter((x) => !keys.length || keys.includes(x.lookupKey));
        return list(prices.map(renderPrice), '/v1/prices');
      },
    },
    { method: 'GET', path: '/v1/prices/:id', handler: (_p, id) => renderPrice(store.prices.get(id) ?? throwing(missing('price', id))) },
    {
      method: 'POST', path: '/v1/customers', handler: (p) => {
        const c = billing.createCustomer({ email: asString(p.email), name: asString(p.name), metadata: metadata(p.metadata) });
        const pm = asString(p.payment_method);
        if (pm) billing.attachPaymentMethod(pm, c.id);
        const dflt = asString((p.invoice_settings as FormObject | undefined)?.default_payment_method);
        if (dflt) billing.updateCustomer(c.id, { defaultPaymentMethod: dflt });
        return renderCustomer(c);
      },
    },
    { method: 'GET', path: '/v1/customers/:id', handler: (_p, id) => renderCustomer(billing.customer(id)) },
    {
      method: 'POST', path: '/v1/customers/:id', handler: (p, id) =>
        renderCustomer(
          billing.updateCustomer(id, {
            email: asString(p.email), name: asString(p.name), metadata: metadata(p.metadata),
            defaultPaymentMethod: asString((p.invoice_settings as FormObject | undefined)?.default_payment_method),
          }),
        ),
    },
    {
      method: 'POST', path: '/v1/payment_methods/:id/attach', handler: (p, id) => {
        const customer = asString(p.customer);
        if (!customer) throw invalid('Missing required param: customer.', 'customer');
        return renderPaymentMethod(billing.attachPaymentMethod(id, customer));
      },
    },
    { method: 'GET', path: '/v1/payment_methods/:id', handler: (_p, id) => renderPaymentMethod(billing.paymentMethod(id)) },
    {
      method: 'POST', path: '/v1/subscriptions', handler: (p) => {
        const items = asList(p.items) as FormObject[];
        if (items.length !== 1) throw invalid('Exactly one subscription item is supported here.', 'items');
        const customer = asString(p.customer);
        if (!customer) throw invalid('Missing required param: customer.', 'customer');
        const sub = billing.createSubscription({
          customer,
          priceId: asString(items[0].price) ?? '',
          quantity: asInt(items[0].quantity) ?? 1,
          defaultPaymentMethod: asString(p.default_payment_method),
          paymentBehavior: asString(p.payment_behavior),
          metadata: metadata(p.metadata),
        });
        return renderSubscription(store, sub);
      },
    },
    { method: 'GET', path: '/v1/subscriptions/:id', handler: (_p, id) => renderSubscription(store, billing.subscription(id)) },
    {
      method: 'POST', path: '/v1/subscriptions/:id', handler: (p, id) => {
        const item = (asList(p.items) as FormObject[])[0];
        const behaviour = asString(p.proration_behavior) ?? 'create_prorations';
        if (!['create_prorations', 'none'].includes(behaviour)) throw invalid(`proration_behavior '${behaviour}' is not supported here.`, 'proration_behavior');
        const sub = billing.updateSubscription(id, {
          itemId: item ? asString(item.id) : undefined,
          quantity: item ? asInt(item.quantity) : undefined,
          prorate: behaviour === 'create_prorations',
          defaultPaymentMethod: asString(p.default_payment_method),
          metadata: metadata(p.metadata),
        });
        return renderSubscription(store, sub);
      },
    },
    { method: 'DELETE', path: '/v1/subscriptions/:id', handler: (_p, id) => renderSubscription(store, billing.cancelSubscription(id)) },
    {
      method: 'GET', path: '/v1/invoices', handler: (p) => {
        const customer = asString(p.customer);
        const subscription = asString(p.subscription);
        const status = asString(p.status);
        const invoices = [...store.invoices.values()]
          .filter((i) => (!customer || i.customer === customer) && (!subscription || i.subscription === subscription) && (!status || i.status === status))
          .sort((a, b) => b.created - a.created || b.seq - a.seq);
        return pageOf(invoices, p, '/v1/invoices', (i) => i.id, (i) => renderInvoice(store, i));
      },
    },
    {
      method: 'POST', path: '/v1/invoices/create_preview', handler: (p) => {
        const id = asString(p.subscription);
        if (!id) throw invalid('Missing required param: subscription.', 'subscription');
        const sub = billing.subscription(id);
        const customer = asString(p.customer);
        if (customer && customer !== sub.customer) throw invalid('The subscription does not belong to this customer.', 'subscription');
        if (sub.status === 'canceled') throw invalid('No upcoming invoices for a canceled subscription.', 'subscription');
        return renderPreview(store, sub, billing.previewLines(sub), sub.periodEnd);
      },
    },
    { method: 'GET', path: '/v1/invoices/:id', handler: (_p, id) => renderInvoice(store, billing.invoice(id)) },
    { method: 'POST', path: '/v1/invoices/:id/pay', handler: (_p, id) => renderInvoice(store, billing.payInvoice(id)) },
    { method: 'GET', path: '/v1/events/:id', handler: (_p, id) => JSON.parse(eventBody(findEvent(store.events, id))) },
  ];
  return routes.map((r) => ({
    method: r.method,
    pattern: new RegExp(`^${r.path.replace(':id', '([A-Za-z0-9_]+)')}$`),
    handler: r.handler,
  }));
}

function throwing(err: Error): never {
  throw err;
}

function findEvent(events: EventRec[], id: string): EventRec {
  return events.find((e) => e.id === id) ?? throwing(missing('event', id));
}

/** Replaces ids with objects along each `expand[]` path (`latest_invoice`, `data.product`). */
export function expand(billing: PayBilling, obj: unknown, path: string[]): unknown {
  if (!obj || typeof obj !== 'object' || !path.length) return obj;
  const o = obj as Obj;
  const [head, ...rest] = path;
  if (head === 'data' && o.object === 'list' && Array.isArray(o.data)) {
    o.data = o.data.map((x) => expand(billing, x, rest));
    return o;
  }
  let v = o[head];
  if (typeof v === 'string') v = renderById(billing, v) ?? v;
  o[head] = expand(billing, v, rest);
  return o;
}

function renderById(billing: PayBilling, id: string): unknown {
  const store = billing.store;
  if (id.startsWith('prod_')) {
    const p = [...store.prices.values()].find((x) => x.productId === id);
    return p ? renderProduct(p) : undefined;
  }
  const found = store.lookup(id);
  if (!found) return undefined;
  switch (found.kind) {
    case 'customer': return renderCustomer(billing.customer(id));
    case 'payment_method': return renderPaymentMethod(billing.paymentMethod(id));
    case 'subscription': return renderSubscription(store, billing.subscription(id));
    case 'invoice': return renderInvoice(store, billing.invoice(id));
    case 'price': return renderPrice(store.prices.get(id)!);
    default: return undefined;
  }
}

export { PayError };

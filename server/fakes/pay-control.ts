import type { PayBilling } from './pay-billing.js';
import { renderInvoice } from './pay-render.js';
import type { WebhookSender } from './pay-webhooks.js';

type Body = Record<string, unknown>;

/**
 * The fake's own control surface, apart from the provider's API (no API key, JSON bodies):
 *   GET  /_fake/state                        counts, clock, webhook settings
 *   POST /_fake/config {webhookUrl?, autoDeliver?}
 *   POST /_fake/clock {advanceSeconds}       moves the provider's clock forward
 *   POST /_fake/subscriptions/:id/advance    ends the period and bills the next one
 *   GET  /_fake/events                       every event with its delivery record
 *   POST /_fake/events/:id/deliver           delivers one event now (again, if it was before)
 *   POST /_fake/drain                        waits until queued deliveries are done
 */
export function controlRoutes(billing: PayBilling, webhooks: WebhookSender) {
  const store = billing.store;
  const routes: { method: string; path: string; handler: (body: Body, id: string) => unknown }[] = [
    {
      method: 'GET', path: '/_fake/state', handler: () => ({
        now: store.now(),
        clockOffsetSec: store.clockOffsetSec,
        webhookUrl: webhooks.url,
        autoDeliver: webhooks.auto,
        customers: store.customers.size,
        subscriptions: store.subscriptions.size,
        invoices: store.invoices.size,
        events: store.events.length,
      }),
    },
    {
      method: 'POST', path: '/_fake/config', handler: (b) => {
        if (typeof b.webhookUrl === 'string' || b.webhookUrl === null) webhooks.url = b.webhookUrl as string | null;
        if (typeof b.autoDeliver === 'boolean') webhooks.auto = b.autoDeliver;
        return { webhookUrl: webhooks.url, autoDeliver: webhooks.auto };
      },
    },
    {
      method: 'POST', path: '/_fake/clock', handler: (b) => {
        const sec = Number(b.advanceSeconds);
        if (!Number.isFinite(sec) || sec < 0) throw new Error('advanceSeconds must be a number ≥ 0');
        store.clockOffsetSec += Math.round(sec);
        return { now: store.now() };
      },
    },
    {
      method: 'POST', path: '/_fake/subscriptions/:id/advance', handler: (_b, id) => ({ invoice: renderInvoice(store, billing.renew(id)) }),
    },
    {
      method: 'GET', path: '/_fake/events', handler: () => ({
        events: store.events.map((e) => ({ id: e.id, type: e.type, created: e.created, delivery: webhooks.deliveries.get(e.id) ?? null })),
      }),
    },
    {
      method: 'POST', path: '/_fake/events/:id/deliver', handler: async (_b, id) => {
        const e = store.events.find((x) => x.id === id);
        if (!e) throw new Error(`no event ${id}`);
        return webhooks.deliver(e);
      },
    },
    { method: 'POST', path: '/_fake/drain', handler: async () => (await webhooks.drain(), { drained: true }) },
  ];
  return routes.map((r) => ({ ...r, pattern: new RegExp(`^${r.path.replace(':id', '([A-Za-z0-9_]+)')}$`) }));
}

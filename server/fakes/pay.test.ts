import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakePay, type FakePay } from './pay.js';
import { parseForm } from './pay-form.js';

const SECRET = 'whsec_unit_fake';
let fake: FakePay;
let sdk: Stripe;
let hook: http.Server;
const received: { header: string; body: string }[] = [];

beforeAll(async () => {
  hook = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      received.push({ header: String(req.headers['stripe-signature']), body });
      res.writeHead(200).end('{}');
    });
  });
  await new Promise<void>((r) => hook.listen(0, '127.0.0.1', r));
  fake = await startFakePay({ webhookSecret: SECRET, webhookUrl: `http://127.0.0.1:${(hook.address() as AddressInfo).port}/` });
  sdk = new Stripe('sk_test_unit', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
});

afterAll(async () => {
  await fake.close();
  await new Promise<void>((r) => hook.close(() => r()));
});

async function customerWith(card: string) {
  const c = await sdk.customers.create({ email: 'owner@example.test', metadata: { studioId: '1' } });
  const pm = await sdk.paymentMethods.attach(card, { customer: c.id });
  await sdk.customers.update(c.id, { invoice_settings: { default_payment_method: pm.id } });
  return { customer: c, pm };
}

async function seatPrice() {
  const prices = await sdk.prices.list({ lookup_keys: ['warpmeter_staff_seat_monthly'], expand: ['data.product'] });
  return prices.data[0];
}

describe('form decoding', () => {
  it('reads bracketed keys into objects and arrays', () => {
    expect(parseForm('items[0][price]=p&items[0][quantity]=3&expand[0]=a&expand[]=b&metadata[k]=v%20w')).toEqual({
      items: [{ price: 'p', quantity: '3' }],
      expand: ['a', 'b'],
      metadata: { k: 'v w' },
    });
  });
});

describe('local payment provider through the SDK', () => {
  it('sells the seat price with its product expanded', async () => {
    const price = await seatPrice();
    expect(price.unit_amount).toBeGreaterThan(0);
    expect((price.product as Stripe.Product).name).toMatch(/seat/i);
  });

  it('refuses keys that are not test-mode secret keys', async () => {
    const live = new Stripe('rk_live_nope', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(live.customers.create({})).rejects.toMatchObject({ type: 'StripeAuthenticationError' });
  });

  it('subscribes, prorates a quantity change onto the next invoice and signs its events', async () => {
    const price = await seatPrice();
    const { customer, pm } = await customerWith('pm_card_visa');
    expect(pm.id).not.toBe('pm_card_visa');
    expect(pm.card?.last4).toBe('4242');
    const sub = await sdk.subscriptions.create({
      customer: customer.id,
      items: [{ price: price.id, quantity: 3 }],
      payment_behavior: 'error_if_incomplete',
      expand: ['latest_invoice'],
    });
    expect(sub.status).toBe('active');
    const first = sub.latest_invoice as Stripe.Invoice;
    expect(first.status).toBe('paid');
    expect(first.amount_paid).toBe(3 * price.unit_amount!);

    const item = sub.items.data[0];
    const updated = await sdk.subscriptions.update(sub.id, { items: [{ id: item.id, quantity: 5 }], proration_behavior: 'create_prorations' });
    expect(updated.items.data[0].quantity).toBe(5);
    const preview = await sdk.invoices.createPreview({ customer: customer.id, subscription: sub.id });
    const prorations = preview.lines.data.filter((l) => l.parent?.invoice_item_details?.proration);
    expect(prorations).toHaveLength(2);
    // Unused time on 3 seats comes back as a credit, remaining time on 5 is charged: the net is
    // 2 seats for the rest of the period, at most two full seats' price.
    const net = prorations.reduce((s, l) => s + l.amount, 0);
    expect(net).toBeGreaterThan(0);
    expect(net).toBeLessThanOrEqual(2 * price.unit_amount!);
    expect(preview.total).toBe(net + 5 * price.unit_amount!);

    await fetch(`${fake.url}/_fake/drain`, { method: 'POST' });
    const types = received.map((r) => JSON.parse(r.body).type);
    expect(types).toEqual(expect.arrayContaining(['customer.subscription.created', 'invoice.paid', 'customer.subscription.updated']));
    for (const r of received) expect(sdk.webhooks.constructEvent(r.body, r.header, SECRET).id).toMatch(/^evt_/);
    expect(() => sdk.webhooks.constructEvent(received[0].body, received[0].header, 'whsec_other')).toThrow();
  });

  it('declines a failing card at once when the first payment must succeed', async () => {
    const price = await seatPrice();
    await expect(sdk.paymentMethods.attach('pm_card_chargeDeclined', { customer: (await sdk.customers.create({})).id })).rejects.toMatchObject({
      type: 'StripeCardError',
      code: 'card_declined',
    });
    const { customer } = await customerWith('pm_card_chargeCustomerFail');
    await expect(
      sdk.subscriptions.create({ customer: customer.id, items: [{ price: price.id, quantity: 1 }], payment_behavior: 'error_if_incomplete' }),
    ).rejects.toMatchObject({ type: 'StripeCardError' });
    expect((await sdk.invoices.list({ customer: customer.id })).data).toHaveLength(0);
  });

  it('turns past_due when a renewal fails and active again once the invoice is paid', async () => {
    const price = await seatPrice();
    const { customer } = await customerWith('pm_card_visa');
    const sub = await sdk.subscriptions.create({ customer: customer.id, items: [{ price: price.id, quantity: 2 }] });
    const failing = await sdk.paymentMethods.attach('pm_card_chargeCustomerFail', { customer: customer.id });
    await sdk.customers.update(customer.id, { invoice_settings: { default_payment_method: failing.id } });
    const advanced = await fetch(`${fake.url}/_fake/subscriptions/${sub.id}/advance`, { method: 'POST' }).then((r) => r.json());
    expect(advanced.invoice.status).toBe('open');
    expect((await sdk.subscriptions.retrieve(sub.id)).status).toBe('past_due');
    await expect(sdk.invoices.pay(advanced.invoice.id)).rejects.toMatchObject({ type: 'StripeCardError' });

    const good = await sdk.paymentMethods.attach('pm_card_visa', { customer: customer.id });
    await sdk.customers.update(customer.id, { invoice_settings: { default_payment_method: good.id } });
    const paid = await sdk.invoices.pay(advanced.invoice.id);
    expect(paid.status).toBe('paid');
    const after = await sdk.subscriptions.retrieve(sub.id);
    expect(after.status).toBe('active');
    expect(after.items.data[0].current_period_start).toBe(sub.items.data[0].current_period_end);
    const invoices = await sdk.invoices.list({ customer: customer.id });
    expect(invoices.data.map((i) => i.status)).toEqual(['paid', 'paid']);
  });

  it('answers unknown objects with the provider’s 404', async () => {
    await expect(sdk.subscriptions.retrieve('sub_doesnotexist')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });
});

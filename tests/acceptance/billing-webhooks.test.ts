import { createHmac } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PaymentEvent, SeatSubscription } from '../../server/entities/index.js';
import { control, startBillingHarness, type BillingHarness } from '../support/billing-harness.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { caughtMail } from '../support/test-app.js';

/**
 * The provider's signed webhooks: signatures checked with the SDK, every event stored once by
 * its id, replays without effect, and events arriving out of order not undoing newer state.
 */
let h: BillingHarness;
beforeAll(async () => {
  h = await startBillingHarness();
});
afterAll(() => h?.close());

type FakeEvent = { id: string; type: string; created: number };
const events = async () => (await control<{ events: FakeEvent[] }>(h.fake, 'events')).events;
const deliver = (id: string) => control<{ status: number; body: string }>(h.fake, `events/${id}/deliver`, {});
const stored = () => h.deps.dataSource.getRepository(PaymentEvent);
const rowOf = (s: StudioFixture) => h.deps.dataSource.getRepository(SeatSubscription).findOneByOrFail({ studioId: s.studioId });
const mailCount = async (to: string, subject: RegExp) => (await caughtMail()).filter((m) => m.to.includes(to) && subject.test(m.subject)).length;

/** Signed exactly as the provider signs (HMAC-SHA256 over "<t>.<body>"), with any secret. */
const sign = (body: string, secret: string, t = Math.floor(Date.now() / 1000)) =>
  `t=${t},v1=${createHmac('sha256', secret).update(`${t}.${body}`).digest('hex')}`;

async function subscribedStudio(): Promise<StudioFixture> {
  const s = await createStudioWithRoles(h);
  const res = await s.admin.post('/api/billing/subscription', { quantity: 3, paymentMethod: 'pm_card_visa' });
  expect(res.status).toBe(201);
  await h.drain();
  return s;
}

describe('webhook signatures', () => {
  it('refuses a bad, missing, stale or tampered signature with 400, logs it and stores nothing', async () => {
    const body = JSON.stringify({ id: 'evt_forged000001', object: 'event', type: 'invoice.paid', created: 1, data: { object: { customer: 'cus_x' } } });
    const secret = h.deps.config.pay.webhookSecret;
    const attempts = [
      { name: 'wrong secret', header: sign(body, 'whsec_not_ours'), body },
      { name: 'no header', header: undefined, body },
      { name: 'an hour old', header: sign(body, secret, Math.floor(Date.now() / 1000) - 3600), body },
      { name: 'body changed after signing', header: sign(body, secret), body: body.replace('cus_x', 'cus_y') },
    ];
    const before = h.logs().length;
    for (const a of attempts) {
      let req = request(h.app).post('/api/billing/webhook').set('content-type', 'application/json');
      if (a.header) req = req.set('stripe-signature', a.header);
      const res = await req.send(a.body);
      expect(res.status, a.name).toBe(400);
      expect(res.body.error.message).toMatch(/signature could not be verified/);
    }
    const refusals = h.logs().slice(before).filter((l) => l.msg === 'payment webhook refused: bad signature');
    expect(refusals).toHaveLength(attempts.length);
    expect(await stored().countBy({ eventId: 'evt_forged000001' })).toBe(0);
  });

  it('accepts an event signed with the configured secret and stores it, even for an unknown customer', async () => {
    const body = JSON.stringify({
      id: 'evt_unknowncustomer1', object: 'event', type: 'invoice.paid', created: Math.floor(Date.now() / 1000),
      data: { object: { object: 'invoice', customer: 'cus_nobodyhere' } },
    });
    const res = await request(h.app).post('/api/billing/webhook').set('content-type', 'application/json')
      .set('stripe-signature', sign(body, h.deps.config.pay.webhookSecret)).send(body);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ received: true, duplicate: false, outcome: 'unmatched' });
    expect(await stored().findOneByOrFail({ eventId: 'evt_unknowncustomer1' })).toMatchObject({ studioId: null, outcome: 'unmatched', type: 'invoice.paid' });
  });
});

describe('replays', () => {
  it('stores each event once; a replayed receipt event changes nothing and mails nobody', async () => {
    const s = await subscribedStudio();
    const row = await rowOf(s);
    const paid = (await events()).filter((e) => e.type === 'invoice.paid').at(-1)!;
    const first = await stored().findOneByOrFail({ eventId: paid.id });
    expect(first).toMatchObject({ studioId: s.studioId, outcome: 'applied' });
    expect((first.payload as { id: string }).id).toBe(paid.id);
    const receipts = await mailCount(s.users.admin.email, /^Receipt /);
    expect(receipts).toBe(1);

    for (let i = 0; i < 3; i++) {
      const replay = await deliver(paid.id);
      expect(replay.status).toBe(200);
      expect(JSON.parse(replay.body)).toMatchObject({ received: true, duplicate: true });
    }
    await new Promise((r) => setTimeout(r, 300));
    expect(await stored().countBy({ eventId: paid.id })).toBe(1);
    expect(await mailCount(s.users.admin.email, /^Receipt /)).toBe(receipts);
    expect(await rowOf(s)).toMatchObject({ status: 'active', quantity: 3, lastEventCreated: row.lastEventCreated });

    // Events the product does not act on are still kept, with the studio they concern.
    const other = await stored().findOneByOrFail({ studioId: s.studioId, type: 'customer.updated' });
    expect(other.outcome).toBe('ignored');
    expect((other.payload as { data: { object: { id: string } } }).data.object.id).toBe(row.customerId);
  });
});

describe('events out of order', () => {
  it('ignores an older payment failure that arrives after the recovery', async () => {
    const s = await subscribedStudio();
    const row = await rowOf(s);
    expect((await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_chargeCustomerFail' })).status).toBe(200);
    await h.drain();
    await control(h.fake, 'config', { autoDeliver: false });
    try {
      const mark = (await events()).length;
      await control(h.fake, `subscriptions/${row.subscriptionId}/advance`, {});
      const failure = (await events()).slice(mark);
      expect(failure.map((e) => e.type)).toEqual(['invoice.payment_failed', 'customer.subscription.updated']);

      await control(h.fake, 'clock', { advanceSeconds: 120 });
      // The admin fixes the card before any webhook arrived; the app applies the answer itself.
      const fixed = await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_visa' });
      expect(fixed.status).toBe(200);
      const recovery = (await events()).slice(mark + failure.length).filter((e) => e.type.startsWith('invoice.') || e.type.startsWith('customer.subscription.'));
      expect(recovery.map((e) => e.type)).toEqual(['invoice.paid', 'customer.subscription.updated']);
      expect(recovery[0].created).toBeGreaterThan(failure[0].created);

      // Newest first, then the older failure.
      for (const e of [...recovery, ...failure]) expect((await deliver(e.id)).status).toBe(200);
      const outcomes = Object.fromEntries(
        (await stored().findBy({ studioId: s.studioId })).map((e) => [e.eventId, e.outcome]),
      );
      for (const e of recovery) expect(outcomes[e.id], e.type).toBe('applied');
      for (const e of failure) expect(outcomes[e.id], e.type).toBe('stale');
      expect(await rowOf(s)).toMatchObject({ status: 'active', graceUntil: null });
      expect(await mailCount(s.users.admin.email, /^Payment failed/)).toBe(0);
      expect((await s.admin.get('/api/billing')).body.state).toBe('active');
    } finally {
      await control(h.fake, 'config', { autoDeliver: true });
    }
  });

  it('applies the provider’s current quantity, whatever order the updates come in', async () => {
    const s = await subscribedStudio();
    const row = await rowOf(s);
    await control(h.fake, 'config', { autoDeliver: false });
    try {
      // Seats changed at the provider directly (as from its dashboard), twice, a minute apart.
      const mark = (await events()).length;
      await h.sdk.subscriptions.update(row.subscriptionId!, { items: [{ id: row.subscriptionItemId!, quantity: 7 }] });
      await control(h.fake, 'clock', { advanceSeconds: 60 });
      await h.sdk.subscriptions.update(row.subscriptionId!, { items: [{ id: row.subscriptionItemId!, quantity: 5 }] });
      const [older, newer] = (await events()).slice(mark).filter((e) => e.type === 'customer.subscription.updated');
      expect(newer.created).toBeGreaterThan(older.created);

      expect((await deliver(newer.id)).status).toBe(200);
      expect(await rowOf(s)).toMatchObject({ quantity: 5, lastEventCreated: newer.created });
      expect((await deliver(older.id)).status).toBe(200);
      expect((await rowOf(s)).quantity).toBe(5);
      expect((await stored().findOneByOrFail({ eventId: older.id })).outcome).toBe('stale');
      expect((await s.admin.get('/api/billing')).body.seats.paid).toBe(5);
    } finally {
      await control(h.fake, 'config', { autoDeliver: true });
    }
  });
});

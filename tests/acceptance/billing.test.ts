import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BillingOverview } from '../../shared/api/billing.schema.js';
import { PaymentEvent, SeatSubscription, Studio } from '../../server/entities/index.js';
import { control, startBillingHarness, type BillingHarness } from '../support/billing-harness.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { caughtMail } from '../support/test-app.js';

/**
 * Seat purchase, increase, decrease, payment failure and recovery, end to end: the API calls the
 * provider through the SDK, the provider (the local fake) bills and sends signed webhooks back.
 */
let h: BillingHarness;
beforeAll(async () => {
  h = await startBillingHarness();
});
afterAll(() => h?.close());

async function mailsTo(address: string, subject: RegExp, atLeast = 1, timeoutMs = 5000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = (await caughtMail()).filter((m) => m.to.includes(address) && subject.test(m.subject));
    if (found.length >= atLeast || Date.now() > until) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
}

const overview = async (s: StudioFixture) => {
  const res = await s.admin.get('/api/billing');
  expect(res.status).toBe(200);
  return res.body as BillingOverview;
};

const rowOf = (s: StudioFixture) => h.deps.dataSource.getRepository(SeatSubscription).findOneByOrFail({ studioId: s.studioId });

describe('buying and changing seats', () => {
  let s: StudioFixture;
  let unit: number;
  beforeAll(async () => {
    s = await createStudioWithRoles(h);
  });

  it('shows the plan and the included seats before anything is bought', async () => {
    const o = await overview(s);
    expect(o.state).toBe('none');
    expect(o.subscription).toBeNull();
    expect(o.seats).toEqual({ used: 3, paid: 3 });
    expect(o.plan).toMatchObject({ currency: 'eur', interval: 'month' });
    expect(o.plan!.unitAmount).toBeGreaterThan(0);
    expect(o.invoices).toEqual([]);
    unit = o.plan!.unitAmount;
  });

  it('explains bad input with 422 and stores nothing', async () => {
    for (const body of [{ quantity: 0, paymentMethod: 'pm_card_visa' }, { quantity: 2.5, paymentMethod: 'pm_card_visa' }, { quantity: 4, paymentMethod: 'visa' }, {}]) {
      const res = await s.admin.post('/api/billing/subscription', body);
      expect(res.status).toBe(422);
      expect(Object.keys(res.body.error.fields).length).toBeGreaterThan(0);
    }
    expect(await h.deps.dataSource.getRepository(SeatSubscription).countBy({ studioId: s.studioId })).toBe(0);
  });

  it('refuses to buy fewer seats than are in use', async () => {
    const res = await s.admin.post('/api/billing/subscription', { quantity: 2, paymentMethod: 'pm_card_visa' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/3 staff seats are in use/);
    expect(await h.deps.dataSource.getRepository(SeatSubscription).countBy({ studioId: s.studioId })).toBe(0);
  });

  it('buys four seats: paid first invoice, masked card, seat count follows, receipt mailed', async () => {
    const res = await s.admin.post('/api/billing/subscription', { quantity: 4, paymentMethod: 'pm_card_visa' });
    expect(res.status).toBe(201);
    const o = res.body as BillingOverview;
    expect(o.state).toBe('active');
    expect(o.seats).toEqual({ used: 3, paid: 4 });
    expect(o.subscription).toMatchObject({ status: 'active', quantity: 4, graceUntil: null });
    expect(o.card).toEqual({ brand: 'visa', last4: '4242' });
    expect(o.invoices).toHaveLength(1);
    expect(o.invoices[0]).toMatchObject({ status: 'paid', amountPaid: 4 * unit, currency: 'eur' });
    expect((await h.deps.dataSource.getRepository(Studio).findOneByOrFail({ id: s.studioId })).seatCount).toBe(4);

    // The provider holds the same subscription.
    const row = await rowOf(s);
    const sub = await h.sdk.subscriptions.retrieve(row.subscriptionId!);
    expect(sub.items.data[0].quantity).toBe(4);
    expect(sub.customer).toBe(row.customerId);

    await h.drain();
    const receipts = await mailsTo(s.users.admin.email, /^Receipt /);
    expect(receipts).toHaveLength(1);
    expect(receipts[0].text).toContain(`€${((4 * unit) / 100).toFixed(2)}`);
  });

  it('refuses a second subscription', async () => {
    const res = await s.admin.post('/api/billing/subscription', { quantity: 5, paymentMethod: 'pm_card_visa' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already has a seat subscription/);
  });

  it('adds two seats: the upcoming invoice carries the proration lines', async () => {
    const res = await s.admin.patch('/api/billing/seats', { quantity: 6 });
    expect(res.status).toBe(200);
    const o = res.body as BillingOverview;
    expect(o.seats.paid).toBe(6);
    expect(o.subscription!.quantity).toBe(6);
    const prorations = o.upcoming!.lines.filter((l) => l.proration);
    expect(prorations.map((l) => l.description)).toEqual([
      expect.stringMatching(/^Unused time on 4 × /),
      expect.stringMatching(/^Remaining time on 6 × /),
    ]);
    // Changed seconds after the period began, so the credit and the charge are (to the cent)
    // the whole period's price of 4 and 6 seats.
    expect(Math.abs(prorations[0].amount + 4 * unit)).toBeLessThanOrEqual(1);
    expect(Math.abs(prorations[1].amount - 6 * unit)).toBeLessThanOrEqual(1);
    const nextPeriod = o.upcoming!.lines.find((l) => !l.proration)!;
    expect(nextPeriod).toMatchObject({ quantity: 6, amount: 6 * unit });
    expect(o.upcoming!.total).toBe(prorations[0].amount + prorations[1].amount + 6 * unit);
    const row = await rowOf(s);
    expect((await h.sdk.subscriptions.retrieve(row.subscriptionId!)).items.data[0].quantity).toBe(6);
  });

  it('removes seats, but never below the seats in use (pending staff invitations count)', async () => {
    const invite = await s.admin.post('/api/people/invitations', { email: `pending.${randomBytes(3).toString('hex')}@billing.warpmeter.test`, role: 'cartographer' });
    expect(invite.status).toBe(201);
    const below = await s.admin.patch('/api/billing/seats', { quantity: 3 });
    expect(below.status).toBe(409);
    expect(below.body.error.message).toMatch(/4 staff seats are in use/);
    const row = await rowOf(s);
    expect((await h.sdk.subscriptions.retrieve(row.subscriptionId!)).items.data[0].quantity).toBe(6);

    const ok = await s.admin.patch('/api/billing/seats', { quantity: 4 });
    expect(ok.status).toBe(200);
    expect(ok.body.seats).toEqual({ used: 4, paid: 4 });
    expect((await h.sdk.subscriptions.retrieve(row.subscriptionId!)).items.data[0].quantity).toBe(4);
    expect((await s.admin.delete(`/api/people/invitations/${invite.body.id}`)).status).toBe(204);
  });

  it('lists the invoices on their own route too', async () => {
    const res = await s.admin.get('/api/billing/invoices');
    expect(res.status).toBe(200);
    expect(res.body.invoices).toHaveLength(1);
    expect(res.body.invoices[0].lines[0]).toMatchObject({ quantity: 4, proration: false });
  });

  it('fails a renewal, keeps working through the grace period, pauses new staff after it, recovers with a new card', async () => {
    // The card now on file will be declined.
    const swap = await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_chargeCustomerFail' });
    expect(swap.status).toBe(200);
    expect(swap.body.card).toEqual({ brand: 'visa', last4: '0341' });
    expect(swap.body.state).toBe('active');

    const row = await rowOf(s);
    const { invoice } = await control<{ invoice: { id: string; status: string } }>(h.fake, `subscriptions/${row.subscriptionId}/advance`, {});
    expect(invoice.status).toBe('open');
    await h.drain();

    const grace = await overview(s);
    expect(grace.state).toBe('grace');
    expect(grace.subscription!.status).toBe('past_due');
    const graceDays = (Date.parse(grace.subscription!.graceUntil!) - Date.now()) / 86_400_000;
    expect(graceDays).toBeGreaterThan(6.9);
    expect(graceDays).toBeLessThanOrEqual(7);
    expect(grace.invoices.map((i) => i.status)).toEqual(['open', 'paid']);
    const notices = await mailsTo(s.users.admin.email, /^Payment failed/);
    expect(notices).toHaveLength(1);
    expect(notices[0].text).toMatch(/Nobody loses access/);

    // During the grace period nothing is blocked.
    const duringGrace = await s.admin.post('/api/people/invitations', { email: `grace.${randomBytes(3).toString('hex')}@billing.warpmeter.test`, role: 'editor' });
    expect(duringGrace.status).toBe(201);
    expect((await s.admin.delete(`/api/people/invitations/${duringGrace.body.id}`)).status).toBe(204);
    // Adding seats waits for a working card; removing would not.
    const more = await s.admin.patch('/api/billing/seats', { quantity: 5 });
    expect(more.status).toBe(402);

    // The grace period runs out (moved into the past here rather than waiting a week).
    await h.deps.dataSource.getRepository(SeatSubscription).update(row.id, { graceUntil: new Date(Date.now() - 1000) });
    expect((await overview(s)).state).toBe('blocked');
    const blocked = await s.admin.post('/api/people/invitations', { email: `late.${randomBytes(3).toString('hex')}@billing.warpmeter.test`, role: 'editor' });
    expect(blocked.status).toBe(402);
    expect(blocked.body.error.code).toBe('billing_hold');
    expect(blocked.body.error.message).toMatch(/update the card/i);
    // Nobody is locked out of existing work.
    expect((await s.cartographer.get('/api/projects')).status).toBe(200);
    expect((await s.editor.get('/api/projects')).status).toBe(200);
    expect((await s.admin.get('/api/people')).status).toBe(200);

    // A declined replacement keeps the studio where it is.
    const stillFailing = await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_chargeDeclined' });
    expect(stillFailing.status).toBe(402);
    expect((await overview(s)).state).toBe('blocked');

    const fixed = await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_mastercard' });
    expect(fixed.status).toBe(200);
    expect(fixed.body.state).toBe('active');
    expect(fixed.body.subscription.graceUntil).toBeNull();
    expect(fixed.body.card).toEqual({ brand: 'mastercard', last4: '4444' });
    expect(fixed.body.invoices.map((i: { status: string }) => i.status)).toEqual(['paid', 'paid']);
    await h.drain();
    expect(await mailsTo(s.users.admin.email, /^Receipt /, 2)).toHaveLength(2);
    expect((await overview(s)).state).toBe('active');

    const again = await s.admin.post('/api/people/invitations', { email: `back.${randomBytes(3).toString('hex')}@billing.warpmeter.test`, role: 'editor' });
    expect(again.status).toBe(201);
    const stored = await h.deps.dataSource.getRepository(PaymentEvent).findBy({ studioId: s.studioId });
    expect(stored.map((e) => e.type)).toEqual(expect.arrayContaining(['invoice.payment_failed', 'invoice.paid', 'customer.subscription.updated']));
  });
});

describe('cards that fail at the start', () => {
  it('stores no subscription when the card is declined at once, or saved but then not charged', async () => {
    const s = await createStudioWithRoles(h);
    for (const paymentMethod of ['pm_card_chargeDeclined', 'pm_card_chargeCustomerFail']) {
      const res = await s.admin.post('/api/billing/subscription', { quantity: 3, paymentMethod });
      expect(res.status).toBe(402);
      expect(res.body.error.code).toBe('card_declined');
      expect(res.body.error.message).toMatch(/declined/);
    }
    const o = await overview(s);
    expect(o).toMatchObject({ state: 'none', subscription: null, card: null, invoices: [] });
    expect(o.seats.paid).toBe(3);
    const row = await rowOf(s);
    expect(row.subscriptionId).toBeNull();
    expect([...h.fake.store.subscriptions.values()].filter((x) => x.customer === row.customerId)).toEqual([]);

    // The same customer is reused once a good card comes along.
    const ok = await s.admin.post('/api/billing/subscription', { quantity: 3, paymentMethod: 'pm_card_visa' });
    expect(ok.status).toBe(201);
    expect((await rowOf(s)).customerId).toBe(row.customerId);
  });
});

describe('who may see and change billing', () => {
  it('denies every billing route to non-admins and to the signed-out, and keeps studios apart', async () => {
    const a = await createStudioWithRoles(h);
    const b = await createStudioWithRoles(h);
    expect((await a.admin.post('/api/billing/subscription', { quantity: 3, paymentMethod: 'pm_card_visa' })).status).toBe(201);
    const calls = [
      (c: StudioFixture['admin']) => c.get('/api/billing'),
      (c: StudioFixture['admin']) => c.get('/api/billing/invoices'),
      (c: StudioFixture['admin']) => c.post('/api/billing/subscription', { quantity: 9, paymentMethod: 'pm_card_visa' }),
      (c: StudioFixture['admin']) => c.patch('/api/billing/seats', { quantity: 9 }),
      (c: StudioFixture['admin']) => c.post('/api/billing/payment-method', { paymentMethod: 'pm_card_visa' }),
    ];
    const anonymous = await a.anonymous();
    for (const call of calls) {
      for (const role of ['cartographer', 'editor', 'client'] as const) {
        const res = await call(a[role]);
        expect(res.status, `${role}`).toBe(403);
      }
      expect((await call(anonymous)).status).toBe(401);
    }
    expect((await overview(a)).seats.paid).toBe(3);
    const seenByB = await overview(b);
    expect(seenByB).toMatchObject({ state: 'none', subscription: null, invoices: [], card: null });
  });
});

describe('when the provider cannot be reached', () => {
  it('still shows what Warpmeter knows and refuses changes with a clear 503', async () => {
    const s = await createStudioWithRoles(h);
    const saved = { ...h.deps.config.pay };
    delete h.deps.services.pay;
    h.deps.config.pay = { ...saved, port: 9 }; // the discard port: nothing listens there
    try {
      const o = await overview(s);
      expect(o.seats).toEqual({ used: 3, paid: 3 });
      expect(o.providerProblem).toMatch(/cannot be reached/);
      const res = await s.admin.post('/api/billing/subscription', { quantity: 3, paymentMethod: 'pm_card_visa' });
      expect(res.status).toBe(503);
      expect(res.body.error.message).toMatch(/cannot be reached/);
      expect(await h.deps.dataSource.getRepository(SeatSubscription).countBy({ studioId: s.studioId })).toBe(0);
    } finally {
      h.deps.config.pay = saved;
      delete h.deps.services.pay;
    }
  });
});

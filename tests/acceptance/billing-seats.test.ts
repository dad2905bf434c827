import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/api/roles.js';
import { SeatSubscription } from '../../server/entities/index.js';
import { control, startBillingHarness, type BillingHarness } from '../support/billing-harness.js';
import { anonymousClient, createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { mailTo } from '../support/test-app.js';

/**
 * Paid seats are enforced wherever a staff seat is taken — invitation, acceptance, a client made
 * staff, a reactivation — and a billing hold (grace period over) refuses exactly those, while
 * client reviewers never need a seat and nobody loses access.
 */
let h: BillingHarness;
beforeAll(async () => {
  h = await startBillingHarness();
});
afterAll(() => h?.close());

const address = (what: string) => `${what}.${randomBytes(4).toString('hex')}@seats.warpmeter.test`;

async function invite(s: StudioFixture, role: Role) {
  const email = address(role);
  const res = await s.admin.post('/api/people/invitations', { email, role });
  return { email, res };
}

/** Accepts the invitation mailed to `email` as a new person. */
async function accept(email: string) {
  const mail = await mailTo(email);
  const token = decodeURIComponent(mail.text.match(/token=([^\s&)]+)/)![1]);
  const c = await anonymousClient(h.app);
  return c.post('/api/invitations/accept', { token, name: 'New Person', password: `pw-${randomBytes(6).toString('hex')}-long` });
}

async function subscribed(quantity: number): Promise<StudioFixture> {
  const s = await createStudioWithRoles(h);
  const res = await s.admin.post('/api/billing/subscription', { quantity, paymentMethod: 'pm_card_visa' });
  expect(res.status).toBe(201);
  await h.drain();
  return s;
}

const rowOf = (s: StudioFixture) => h.deps.dataSource.getRepository(SeatSubscription).findOneByOrFail({ studioId: s.studioId });
const setMember = (s: StudioFixture, role: Role, change: object) => s.admin.patch(`/api/people/${s.users[role].membershipId}`, change);
const seats = async (s: StudioFixture) => (await s.admin.get('/api/billing')).body.seats as { used: number; paid: number };

describe('the paid quantity limits every way in', () => {
  it('refuses staff beyond the paid seats on invite, client → staff, reactivation and acceptance', async () => {
    const s = await subscribed(3);
    expect(await seats(s)).toEqual({ used: 3, paid: 3 });

    const staff = await invite(s, 'editor');
    expect(staff.res.status).toBe(409);
    expect(staff.res.body.error.code).toBe('seats_full');
    const client = await invite(s, 'client');
    expect(client.res.status).toBe(201);
    expect(await seats(s)).toEqual({ used: 3, paid: 3 });

    const promote = await setMember(s, 'client', { role: 'editor' });
    expect(promote.status).toBe(409);
    expect(promote.body.error.code).toBe('seats_full');

    expect((await setMember(s, 'editor', { status: 'deactivated' })).status).toBe(200);
    const pending = await invite(s, 'cartographer');
    expect(pending.res.status).toBe(201);
    const reactivate = await setMember(s, 'editor', { status: 'active' });
    expect(reactivate.status).toBe(409);
    expect(reactivate.body.error.code).toBe('seats_full');

    // Seats lowered at the provider itself (its dashboard): the webhook brings the count down to 2
    // while 3 are in use, so the pending invitation can no longer be accepted.
    const row = await rowOf(s);
    await h.sdk.subscriptions.update(row.subscriptionId!, { items: [{ id: row.subscriptionItemId!, quantity: 2 }] });
    await h.drain();
    expect(await seats(s)).toEqual({ used: 3, paid: 2 });
    const refused = await accept(pending.email);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('seats_full');

    // Client reviewers never take a seat, even when every seat is gone.
    expect((await accept(client.email)).status).toBe(200);

    expect((await s.admin.patch('/api/billing/seats', { quantity: 3 })).status).toBe(200);
    expect((await accept(pending.email)).status).toBe(200);
    expect(await seats(s)).toEqual({ used: 3, paid: 3 });
  });
});

describe('a billing hold', () => {
  it('refuses only what adds staff once the grace period is over, and lifts when the card is fixed', async () => {
    const s = await subscribed(5);
    const pendingStaff = await invite(s, 'editor');
    const pendingClient = await invite(s, 'client');
    expect([pendingStaff.res.status, pendingClient.res.status]).toEqual([201, 201]);
    expect((await setMember(s, 'editor', { status: 'deactivated' })).status).toBe(200);

    expect((await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_chargeCustomerFail' })).status).toBe(200);
    const row = await rowOf(s);
    await control(h.fake, `subscriptions/${row.subscriptionId}/advance`, {});
    await h.drain();
    expect((await rowOf(s)).status).toBe('past_due');
    await h.deps.dataSource.getRepository(SeatSubscription).update(row.id, { graceUntil: new Date(Date.now() - 60_000) });

    const held = (res: { status: number; body: { error?: { code: string } } }, what: string) => {
      expect(res.status, what).toBe(402);
      expect(res.body.error?.code, what).toBe('billing_hold');
    };
    held((await invite(s, 'cartographer')).res, 'invite staff');
    held(await accept(pendingStaff.email), 'accept staff invitation');
    held(await setMember(s, 'client', { role: 'cartographer' }), 'client made staff');
    held(await setMember(s, 'editor', { status: 'active' }), 'reactivation');

    // Client reviewers, taking no seat, are not held; nor is anything that frees a seat.
    expect((await invite(s, 'client')).res.status).toBe(201);
    expect((await accept(pendingClient.email)).status).toBe(200);
    expect((await setMember(s, 'cartographer', { role: 'editor' })).status).toBe(200);
    // Everyone keeps working.
    expect((await s.cartographer.get('/api/projects')).status).toBe(200);
    expect((await s.client.get('/api/projects')).status).toBe(200);

    expect((await s.admin.post('/api/billing/payment-method', { paymentMethod: 'pm_card_visa' })).status).toBe(200);
    expect((await setMember(s, 'editor', { status: 'active' })).status).toBe(200);
    expect((await accept(pendingStaff.email)).status).toBe(200);
  });
});

import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import type { StartSubscriptionInput } from '../../shared/api/billing.schema.js';
import type { AppDeps } from '../deps.js';
import { SeatSubscription } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, HttpError } from '../http/errors.js';
import { countStaffSeatsUsed, lockStudio } from '../services/seats.service.js';
import { payClient } from './pay-client.js';
import { seatPlan } from './plan.js';
import { providerError, viaProvider } from './provider-errors.js';
import { applyCard, applySubscription } from './subscription-sync.js';

/*
 * Every change runs inside a transaction holding the studio row's lock (the same lock the seat
 * checks take), across the provider calls: an invitation cannot slip in between counting seats
 * and lowering them, and a webhook about the change waits until the change is stored.
 */

const belowUse = (used: number) =>
  conflict(
    `${used} staff seat${used === 1 ? ' is' : 's are'} in use (active staff plus pending staff invitations), so the studio needs at least ${used}. Deactivate someone or withdraw an invitation first.`,
  );

const rows = (m: EntityManager) => m.getRepository(SeatSubscription);

/** Refuses a start when the studio already pays, or when fewer seats than are in use are asked for. */
async function checkStart(m: EntityManager, studioId: number, quantity: number): Promise<SeatSubscription | null> {
  const row = await rows(m).findOneBy({ studioId });
  if (row && (row.status === 'active' || row.status === 'past_due')) {
    throw conflict('This studio already has a seat subscription. Change the number of seats instead.');
  }
  const used = await countStaffSeatsUsed(m, studioId);
  if (quantity < used) throw belowUse(used);
  return row;
}

/** Attaches a card to the customer and makes it the one invoices are charged to. */
async function attachDefaultCard(pay: Stripe, row: SeatSubscription, paymentMethod: string): Promise<Stripe.PaymentMethod> {
  const pm = await viaProvider(() => pay.paymentMethods.attach(paymentMethod, { customer: row.customerId }));
  await viaProvider(() => pay.customers.update(row.customerId, { invoice_settings: { default_payment_method: pm.id } }));
  return pm;
}

/**
 * `POST /api/billing/subscription`: buys `quantity` staff seats, paid now for the first period.
 * The studio's customer at the provider is created and stored first, on its own, so a declined
 * card leaves a customer to reuse rather than one Warpmeter forgot.
 */
export async function startSubscription(deps: AppDeps, actor: Actor, input: StartSubscriptionInput): Promise<void> {
  const pay = payClient(deps);
  const plan = await viaProvider(() => seatPlan(pay));
  await deps.dataSource.transaction(async (m) => {
    const studio = await lockStudio(m, actor.studioId);
    if (await checkStart(m, studio.id, input.quantity)) return;
    const customer = await viaProvider(() =>
      pay.customers.create({ email: actor.email, name: studio.name, metadata: { studioId: String(studio.id) } }),
    );
    await rows(m).insert({ studioId: studio.id, customerId: customer.id, status: 'none', quantity: 0, lastEventCreated: 0 });
  });
  await deps.dataSource.transaction(async (m) => {
    await lockStudio(m, actor.studioId);
    const row = (await checkStart(m, actor.studioId, input.quantity))!;
    const pm = await attachDefaultCard(pay, row, input.paymentMethod);
    // error_if_incomplete: when the first payment fails the provider creates nothing, so no
    // half-started subscription exists anywhere.
    const sub = await viaProvider(() =>
      pay.subscriptions.create({
        customer: row.customerId,
        items: [{ price: plan.priceId, quantity: input.quantity }],
        payment_behavior: 'error_if_incomplete',
        metadata: { studioId: String(actor.studioId) },
      }),
    );
    applyCard(row, pm);
    await applySubscription(m, row, sub);
  });
}

/** `PATCH /api/billing/seats`: more or fewer seats, prorated onto the next invoice. */
export async function changeSeats(deps: AppDeps, actor: Actor, quantity: number): Promise<void> {
  const pay = payClient(deps);
  await deps.dataSource.transaction(async (m) => {
    await lockStudio(m, actor.studioId);
    const row = await rows(m).findOneBy({ studioId: actor.studioId });
    if (!row?.subscriptionId || !row.subscriptionItemId || (row.status !== 'active' && row.status !== 'past_due')) {
      throw conflict('There is no seat subscription yet. Start one first.');
    }
    const used = await countStaffSeatsUsed(m, actor.studioId);
    if (quantity < used) throw belowUse(used);
    if (quantity > row.quantity && row.status === 'past_due') {
      throw new HttpError(402, 'payment_failed', 'A payment failed. Update the card before adding seats; removing seats still works.');
    }
    if (quantity === row.quantity) return;
    const sub = await viaProvider(() =>
      pay.subscriptions.update(row.subscriptionId!, {
        items: [{ id: row.subscriptionItemId!, quantity }],
        proration_behavior: 'create_prorations',
      }),
    );
    await applySubscription(m, row, sub);
  });
}

/**
 * `POST /api/billing/payment-method`: replaces the card, then retries any unpaid invoice so a
 * studio in its grace period (or past it) recovers at once.
 */
export async function updatePaymentMethod(deps: AppDeps, actor: Actor, paymentMethod: string): Promise<void> {
  const pay = payClient(deps);
  const row = await deps.dataSource.transaction(async (m) => {
    await lockStudio(m, actor.studioId);
    const r = await rows(m).findOneBy({ studioId: actor.studioId });
    if (!r?.subscriptionId) throw conflict('There is no seat subscription yet. Choose the card when you start one.');
    applyCard(r, await attachDefaultCard(pay, r, paymentMethod));
    return rows(m).save(r);
  });
  // Asks the provider rather than the local status: a failure's webhook may not have arrived yet.
  const open = await viaProvider(() => pay.invoices.list({ customer: row.customerId, subscription: row.subscriptionId!, status: 'open' }));
  if (!open.data.length) return;
  let declined = 0;
  for (const inv of open.data) {
    try {
      await pay.invoices.pay(inv.id);
    } catch (err) {
      if ((err as { type?: string }).type !== 'StripeCardError') throw providerError(err);
      declined += 1;
    }
  }
  await deps.dataSource.transaction(async (m) => {
    await lockStudio(m, actor.studioId);
    const fresh = (await rows(m).findOneBy({ studioId: actor.studioId }))!;
    await applySubscription(m, fresh, await viaProvider(() => pay.subscriptions.retrieve(fresh.subscriptionId!)));
  });
  if (declined) {
    throw new HttpError(402, 'card_declined', 'The new card was saved, but it was declined for the unpaid invoice. Choose another card and try again.');
  }
}

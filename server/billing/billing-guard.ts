import type { EntityManager } from 'typeorm';
import { SeatSubscription } from '../entities/index.js';
import { HttpError } from '../http/errors.js';
import { billingState } from './billing-state.js';

const day = (d: Date) => d.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/**
 * Refuses (402 `billing_hold`) to let new staff take a seat once a failed payment's grace period
 * is over, or after the subscription ended. Existing members keep every bit of their access;
 * only new staff seats (invite, accept, client → staff, reactivation) wait for the card.
 */
export async function assertBillingAllowsNewStaff(manager: EntityManager, studioId: number, now = new Date()): Promise<void> {
  const row = await manager.getRepository(SeatSubscription).findOneBy({ studioId });
  if (billingState(row, now) !== 'blocked') return;
  const message =
    row!.status === 'canceled'
      ? 'The seat subscription has ended, so no new staff can join until an admin starts it again on the Billing page. Everyone keeps access to existing work.'
      : `A payment failed and the grace period ended on ${day(row!.graceUntil ?? now)}. An admin needs to update the card on the Billing page before new staff can join. Everyone keeps access to existing work.`;
  throw new HttpError(402, 'billing_hold', message);
}

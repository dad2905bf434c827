import type { BillingState } from '../../shared/api/billing.schema.js';
import type { SeatSubscription, SeatSubscriptionStatus } from '../entities/seat-subscription.entity.js';

/** Days between a failed payment and the pause on new staff. Nobody ever loses existing access. */
export const GRACE_PERIOD_DAYS = 7;
export const GRACE_PERIOD_MS = GRACE_PERIOD_DAYS * 24 * 60 * 60 * 1000;

/** The provider's subscription statuses folded into the four Warpmeter acts on. */
export function localStatus(providerStatus: string): Exclude<SeatSubscriptionStatus, 'none'> {
  switch (providerStatus) {
    case 'active':
    case 'trialing':
      return 'active';
    case 'past_due':
    case 'unpaid':
    case 'paused':
      return 'past_due';
    case 'incomplete':
      return 'incomplete';
    default:
      return 'canceled';
  }
}

/** What the Billing page and the seat checks make of a studio's subscription row at `now`. */
export function billingState(row: Pick<SeatSubscription, 'status' | 'graceUntil'> | null, now = new Date()): BillingState {
  if (!row || row.status === 'none' || row.status === 'incomplete') return 'none';
  if (row.status === 'active') return 'active';
  if (row.status === 'past_due' && row.graceUntil && row.graceUntil.getTime() > now.getTime()) return 'grace';
  return 'blocked';
}

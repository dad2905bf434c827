import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import { SeatSubscription, Studio } from '../entities/index.js';
import { GRACE_PERIOD_MS, localStatus } from './billing-state.js';

/**
 * Copies the provider's view of a subscription onto the studio's row: quantity, status, period
 * end and the grace period (started by the first failed payment, cleared once paid up). The
 * studio's seat count follows the paid quantity. Call inside the caller's transaction.
 */
export async function applySubscription(m: EntityManager, row: SeatSubscription, sub: Stripe.Subscription, now = new Date()) {
  const item = sub.items.data[0];
  const status = localStatus(sub.status);
  row.subscriptionId = sub.id;
  row.subscriptionItemId = item?.id ?? null;
  row.quantity = item?.quantity ?? 0;
  row.currentPeriodEnd = item ? new Date(item.current_period_end * 1000) : null;
  if (status === 'past_due') row.graceUntil ??= new Date(now.getTime() + GRACE_PERIOD_MS);
  else row.graceUntil = null;
  row.status = status;
  await m.getRepository(SeatSubscription).save(row);
  if ((status === 'active' || status === 'past_due') && row.quantity > 0) {
    await m.getRepository(Studio).update(row.studioId, { seatCount: row.quantity });
  }
}

/** Keeps the masked card on file (brand and last four digits only). */
export function applyCard(row: SeatSubscription, pm: Stripe.PaymentMethod) {
  row.cardBrand = pm.card?.brand ?? pm.type;
  row.cardLast4 = pm.card?.last4 ?? null;
}

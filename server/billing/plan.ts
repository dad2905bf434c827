import type Stripe from 'stripe';
import { HttpError } from '../http/errors.js';

/** The price Warpmeter sells, found by its lookup key so no price id needs configuring. */
export const SEAT_PRICE_LOOKUP_KEY = 'warpmeter_staff_seat_monthly';

export interface SeatPlan {
  priceId: string;
  name: string;
  /** Minor units per seat per interval. */
  unitAmount: number;
  currency: string;
  interval: string;
}

const CACHE_MS = 10 * 60 * 1000;
const cache = new WeakMap<Stripe, { at: number; plan: SeatPlan }>();

/** The per-seat price from the provider, cached for a few minutes per client. */
export async function seatPlan(pay: Stripe): Promise<SeatPlan> {
  const hit = cache.get(pay);
  if (hit && Date.now() - hit.at < CACHE_MS) return hit.plan;
  const prices = await pay.prices.list({ lookup_keys: [SEAT_PRICE_LOOKUP_KEY], active: true, expand: ['data.product'] });
  const price = prices.data[0];
  if (!price || price.unit_amount === null || !price.recurring) {
    throw new HttpError(503, 'plan_missing', `The payment provider has no recurring price with the lookup key "${SEAT_PRICE_LOOKUP_KEY}". Set it up there first.`);
  }
  const product = price.product as Stripe.Product | string;
  const plan: SeatPlan = {
    priceId: price.id,
    name: typeof product === 'string' ? 'Staff seat' : product.name,
    unitAmount: price.unit_amount,
    currency: price.currency,
    interval: price.recurring.interval,
  };
  cache.set(pay, { at: Date.now(), plan });
  return plan;
}

import Stripe from 'stripe';
import { HttpError } from '../http/errors.js';

/**
 * Turns an SDK error into an answer a person can act on: a refused card is the customer's to fix
 * (402), an unreachable or misconfigured provider is ours (503), anything else is a 502.
 */
export function providerError(err: unknown): HttpError {
  if (err instanceof HttpError) return err;
  if (err instanceof Stripe.errors.StripeCardError) {
    return new HttpError(402, 'card_declined', `The card was declined (${err.message.replace(/\.$/, '')}). Choose another card and try again.`);
  }
  if (err instanceof Stripe.errors.StripeConnectionError) {
    return new HttpError(503, 'provider_unreachable', 'The payment provider cannot be reached right now. Nothing was changed; please try again in a moment.');
  }
  if (err instanceof Stripe.errors.StripeAuthenticationError || err instanceof Stripe.errors.StripePermissionError) {
    return new HttpError(503, 'provider_config', 'The payment provider refused our credentials. An administrator of this Warpmeter installation needs to check its payment settings.');
  }
  if (err instanceof Stripe.errors.StripeError) {
    return new HttpError(502, 'provider_error', `The payment provider refused the request: ${err.message}`);
  }
  throw err;
}

/** Runs a provider call, rethrowing its failure as an HttpError. */
export async function viaProvider<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    throw providerError(err);
  }
}

import Stripe from 'stripe';
import type { Config } from '../config.js';
import type { AppDeps } from '../deps.js';

/** The placeholder key of a local checkout: it only ever talks to the local provider. */
export const LOCAL_PAY_KEY_PREFIX = 'sk_test_warpmeter';

/**
 * SDK options for the configured provider. The local fake (the placeholder key, or an explicit
 * WARPMETER_PAY_HOST) gets host, port and protocol and no network retries; real credentials
 * with no host override get the SDK's defaults untouched, so they reach the hosted service.
 */
export function payClientOptions(pay: Config['pay'], env: NodeJS.ProcessEnv = process.env): Stripe.StripeConfig {
  const local = pay.apiKey.startsWith(LOCAL_PAY_KEY_PREFIX) || Boolean(env.WARPMETER_PAY_HOST);
  if (!local) return { appInfo: { name: 'Warpmeter' } };
  return { host: pay.host, port: pay.port, protocol: pay.protocol, maxNetworkRetries: 0, timeout: 15_000, appInfo: { name: 'Warpmeter' } };
}

export function createPayClient(pay: Config['pay'], env: NodeJS.ProcessEnv = process.env): Stripe {
  return new Stripe(pay.apiKey, payClientOptions(pay, env));
}

/** The app's one payment client, made on first use and kept in `deps.services.pay`. */
export function payClient(deps: AppDeps): Stripe {
  if (!deps.services.pay) deps.services.pay = createPayClient(deps.config.pay);
  return deps.services.pay as Stripe;
}

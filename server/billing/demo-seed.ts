import pino from 'pino';
import Stripe from 'stripe';
import { loadConfig } from '../config.js';
import type { AppDeps } from '../deps.js';
import { SeatSubscription } from '../entities/index.js';
import { DEMO_SEAT_COUNT } from '../seed/demo-studio.js';
import type { DemoContext } from '../seed/index.js';
import { payClient, payClientOptions } from './pay-client.js';
import { startSubscription } from './subscription.service.js';

/**
 * Demo seeder: gives the demo studio a paid subscription for its seats on the local payment
 * provider, with the test Visa card. Skipped (with a note) when the provider is not reachable or
 * is not the local one. The local provider keeps its state in memory, so after it restarted the
 * studio's old subscription is gone there: the local record of it is dropped and a new one made.
 */
export async function seedDemoSubscription(ctx: DemoContext): Promise<void> {
  const config = loadConfig();
  if (!payClientOptions(config.pay).host) return; // never buy anything from a real provider here
  const log = pino({ level: process.env.LOG_LEVEL ?? 'info' });
  const deps: AppDeps = { config, dataSource: ctx.ds, logger: log, mailer: { send: async () => {} }, services: {} };
  const rows = ctx.ds.getRepository(SeatSubscription);
  const row = await rows.findOneBy({ studioId: ctx.studioId });
  try {
    if (row?.subscriptionId && (row.status === 'active' || row.status === 'past_due')) {
      const known = await payClient(deps).subscriptions.retrieve(row.subscriptionId).then(() => true, (err) => {
        if (err instanceof Stripe.errors.StripeInvalidRequestError && err.statusCode === 404) return false;
        throw err;
      });
      if (known) return;
      await rows.delete({ id: row.id });
    } else if (row && !(await payClient(deps).customers.retrieve(row.customerId).then(() => true, () => false))) {
      await rows.delete({ id: row.id });
    }
    const admin = ctx.people.admin;
    await startSubscription(
      deps,
      { userId: admin.userId, studioId: ctx.studioId, membershipId: admin.membershipId, role: 'admin', email: admin.email, name: admin.name },
      { quantity: DEMO_SEAT_COUNT, paymentMethod: 'pm_card_visa' },
    );
    console.log(`Demo studio subscribed to ${DEMO_SEAT_COUNT} staff seats on the local payment provider.`);
  } catch (err) {
    console.log(`Demo subscription skipped: ${(err as Error).message}`);
  }
}

import type { BillingOverview, Invoice } from '../../shared/api/billing.schema.js';
import type { AppDeps } from '../deps.js';
import { SeatSubscription, Studio } from '../entities/index.js';
import { notFound } from '../http/errors.js';
import { countStaffSeatsUsed } from '../services/seats.service.js';
import { billingState } from './billing-state.js';
import { toInvoice, toUpcoming } from './invoices.js';
import { payClient } from './pay-client.js';
import { seatPlan } from './plan.js';
import { providerError, viaProvider } from './provider-errors.js';

const INVOICE_LIMIT = 24;

/** The studio's invoices at the provider, newest first (none before a customer exists). */
export async function listInvoices(deps: AppDeps, studioId: number): Promise<Invoice[]> {
  const row = await deps.dataSource.getRepository(SeatSubscription).findOneBy({ studioId });
  if (!row) return [];
  const pay = payClient(deps);
  const list = await viaProvider(() => pay.invoices.list({ customer: row.customerId, limit: INVOICE_LIMIT }));
  return list.data.map(toInvoice);
}

/**
 * Everything the Billing page shows. Local facts (seats, status, grace, card) always come back;
 * what only the provider knows (price, invoices, the upcoming invoice) is left empty with a
 * plain note when the provider cannot be reached.
 */
export async function getOverview(deps: AppDeps, studioId: number, now = new Date()): Promise<BillingOverview> {
  const ds = deps.dataSource;
  const studio = await ds.getRepository(Studio).findOneBy({ id: studioId });
  if (!studio) throw notFound('That studio');
  const row = await ds.getRepository(SeatSubscription).findOneBy({ studioId });
  const used = await countStaffSeatsUsed(ds.manager, studioId);
  const pay = payClient(deps);
  const hasSubscription = Boolean(row?.subscriptionId) && row!.status !== 'canceled';

  let providerProblem: string | null = null;
  const [plan, invoices, upcoming] = await Promise.all([
    seatPlan(pay).catch((err) => ((providerProblem = providerError(err).message), null)),
    listInvoices(deps, studioId).catch((err) => ((providerProblem = providerError(err).message), [] as Invoice[])),
    hasSubscription
      ? pay.invoices
          .createPreview({ customer: row!.customerId, subscription: row!.subscriptionId! })
          .then(toUpcoming)
          .catch((err) => ((providerProblem = providerError(err).message), null))
      : Promise.resolve(null),
  ]);
  if (providerProblem) deps.logger.warn({ studioId, providerProblem }, 'billing overview without provider data');

  return {
    state: billingState(row, now),
    plan: plan && { name: plan.name, unitAmount: plan.unitAmount, currency: plan.currency, interval: plan.interval },
    seats: { used, paid: studio.seatCount },
    subscription:
      row && row.subscriptionId && row.status !== 'none'
        ? {
            status: row.status,
            quantity: row.quantity,
            currentPeriodEnd: row.currentPeriodEnd?.toISOString() ?? null,
            graceUntil: row.graceUntil?.toISOString() ?? null,
          }
        : null,
    card: row?.cardLast4 ? { brand: row.cardBrand ?? 'card', last4: row.cardLast4 } : null,
    upcoming,
    invoices,
    providerProblem,
  };
}

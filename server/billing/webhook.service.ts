import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import type { AppDeps } from '../deps.js';
import { PaymentEvent, SeatSubscription, Studio } from '../entities/index.js';
import type { PaymentEventOutcome } from '../entities/payment-event.entity.js';
import { badRequest } from '../http/errors.js';
import { lockStudio } from '../services/seats.service.js';
import { adminAddresses, mailAdmins, paymentFailedMail, receiptMail } from './billing-mail.js';
import { invoiceSubscriptionId } from './invoices.js';
import { payClient } from './pay-client.js';
import { viaProvider } from './provider-errors.js';
import { applySubscription } from './subscription-sync.js';

const SUBSCRIPTION_EVENTS = new Set(['customer.subscription.created', 'customer.subscription.updated', 'customer.subscription.deleted']);
const INVOICE_EVENTS = new Set(['invoice.paid', 'invoice.payment_failed']);

export interface WebhookResult {
  received: true;
  duplicate: boolean;
  outcome: PaymentEventOutcome | null;
}

type PendingMail = { studioId: number; to: string[]; mail: Parameters<typeof mailAdmins>[3] };

/** Verifies the signature with the SDK's own check; a bad one is logged and answered with 400. */
function verify(deps: AppDeps, raw: Buffer, signature: string | undefined): Stripe.Event {
  try {
    return payClient(deps).webhooks.constructEvent(raw, signature ?? '', deps.config.pay.webhookSecret);
  } catch (err) {
    deps.logger.warn({ reason: (err as Error).message, signaturePresent: Boolean(signature), bytes: raw.length }, 'payment webhook refused: bad signature');
    throw badRequest('The webhook signature could not be verified.');
  }
}

/** The provider customer an event is about (customer events carry the customer itself). */
function customerOf(obj: { object?: string; id?: string; customer?: string | { id: string } | null }): string | null {
  if (obj.object === 'customer') return obj.id ?? null;
  return typeof obj.customer === 'string' ? obj.customer : (obj.customer?.id ?? null);
}

/**
 * `POST /api/billing/webhook`. Each verified event is stored once, by its id, in the same
 * transaction as its effect, so a replay changes nothing. Events are not guaranteed to arrive in
 * order: one older than the newest applied for the studio is stored as `stale` and not applied,
 * and a newer one applies the subscription as the provider holds it now (fetched), not the
 * possibly outdated copy in the event. Mail goes out after the commit.
 */
export async function handleWebhook(deps: AppDeps, raw: Buffer, signature: string | undefined): Promise<WebhookResult> {
  const event = verify(deps, raw, signature);
  const repo = deps.dataSource.getRepository(PaymentEvent);
  if (await repo.existsBy({ eventId: event.id })) return { received: true, duplicate: true, outcome: null };
  const customerId = customerOf(event.data.object as { customer?: string });
  const mails: PendingMail[] = [];
  try {
    const outcome = await deps.dataSource.transaction(async (m) => {
      const found = customerId ? await m.getRepository(SeatSubscription).findOneBy({ customerId }) : null;
      let outcome: PaymentEventOutcome = 'unmatched';
      if (found) {
        await lockStudio(m, found.studioId);
        const row = (await m.getRepository(SeatSubscription).findOneBy({ id: found.id }))!;
        outcome = await applyEvent(deps, m, row, event, mails);
      }
      await m.getRepository(PaymentEvent).insert({
        eventId: event.id, type: event.type, studioId: found?.studioId ?? null, eventCreated: event.created, outcome, payload: event,
      });
      return outcome;
    });
    for (const p of mails) await mailAdmins(deps, p.studioId, p.to, p.mail);
    deps.logger.info({ eventId: event.id, type: event.type, outcome }, 'payment webhook processed');
    return { received: true, duplicate: false, outcome };
  } catch (err) {
    // Two deliveries of one event at the same moment: the second meets the unique id.
    if ((err as { code?: string }).code === 'ER_DUP_ENTRY') return { received: true, duplicate: true, outcome: null };
    throw err;
  }
}

async function applyEvent(deps: AppDeps, m: EntityManager, row: SeatSubscription, event: Stripe.Event, mails: PendingMail[]): Promise<PaymentEventOutcome> {
  const isSub = SUBSCRIPTION_EVENTS.has(event.type);
  const isInvoice = INVOICE_EVENTS.has(event.type);
  if (!isSub && !isInvoice) return 'ignored';
  if (event.created < row.lastEventCreated) return 'stale';
  const obj = event.data.object as Stripe.Subscription | Stripe.Invoice;
  const subscriptionId = isSub ? obj.id : invoiceSubscriptionId(obj as Stripe.Invoice);
  // A subscription other than the studio's own (made elsewhere at the provider) is recorded only.
  if (!subscriptionId || (row.subscriptionId && row.subscriptionId !== subscriptionId)) return 'ignored';

  const pay = payClient(deps);
  const sub = await viaProvider(() => pay.subscriptions.retrieve(subscriptionId));
  await applySubscription(m, row, sub);
  row.lastEventCreated = event.created;
  await m.getRepository(SeatSubscription).update(row.id, { lastEventCreated: event.created });

  if (isInvoice) {
    const invoice = obj as Stripe.Invoice;
    const studio = (await m.getRepository(Studio).findOneBy({ id: row.studioId }))!;
    const billingUrl = `${deps.config.publicUrl}/studio/billing`;
    const to = await adminAddresses(m, row.studioId);
    if (event.type === 'invoice.paid' && invoice.amount_paid > 0) {
      mails.push({ studioId: row.studioId, to, mail: receiptMail({ studioName: studio.name, invoice, billingUrl }) });
    }
    if (event.type === 'invoice.payment_failed') {
      mails.push({ studioId: row.studioId, to, mail: paymentFailedMail({ studioName: studio.name, invoice, graceUntil: row.graceUntil, billingUrl }) });
    }
  }
  return 'applied';
}

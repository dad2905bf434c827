import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import type { AppDeps } from '../deps.js';
import { Membership } from '../entities/index.js';
import type { OutgoingMail } from '../mail/mailer.js';

type Mail = Pick<OutgoingMail, 'subject' | 'text' | 'template'>;

const money = (minor: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
const day = (d: Date) => d.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

const lineList = (inv: Stripe.Invoice) =>
  inv.lines.data.map((l) => `  ${l.description ?? 'Item'}: ${money(l.amount, inv.currency)}`).join('\n');

/** A receipt for a paid invoice. */
export function receiptMail(p: { studioName: string; invoice: Stripe.Invoice; billingUrl: string }): Mail {
  const inv = p.invoice;
  const paidAt = new Date((inv.status_transitions?.paid_at ?? inv.created) * 1000);
  return {
    template: 'billing-receipt',
    // Amounts stay out of the subject: currency signs there need MIME encoding some readers garble.
    subject: `Receipt for invoice ${inv.number ?? inv.id} (${p.studioName})`,
    text: [
      `Thank you. We received ${money(inv.amount_paid, inv.currency)} for ${p.studioName}'s staff seats on ${day(paidAt)}.`,
      '',
      `Invoice ${inv.number ?? inv.id}`,
      lineList(inv),
      `  Total: ${money(inv.total, inv.currency)}`,
      '',
      `Invoices and seats: ${p.billingUrl}`,
    ].join('\n'),
  };
}

/** A payment failed: what happens when, and what to do. */
export function paymentFailedMail(p: { studioName: string; invoice: Stripe.Invoice; graceUntil: Date | null; billingUrl: string }): Mail {
  const inv = p.invoice;
  const until = p.graceUntil ? day(p.graceUntil) : 'the end of the grace period';
  return {
    template: 'billing-payment-failed',
    subject: `Payment failed for ${p.studioName}: please update the card by ${until}`,
    text: [
      `We could not charge the card on file for invoice ${inv.number ?? inv.id} (${money(inv.amount_due, inv.currency)}).`,
      '',
      `Until ${until} nothing changes. After that date no new staff can be invited or added until the card is updated.`,
      'Nobody loses access to existing projects, audits or sign-offs at any point.',
      '',
      `Update the card: ${p.billingUrl}`,
    ].join('\n'),
  };
}

/** E-mail addresses of the studio's active admins. */
export async function adminAddresses(m: EntityManager, studioId: number): Promise<string[]> {
  const admins = await m.getRepository(Membership).find({ where: { studioId, role: 'admin', status: 'active' }, relations: { user: true } });
  return admins.map((a) => a.user.email);
}

/** Sends one message to each admin; a failed send is logged (and kept in the mail log), not thrown. */
export async function mailAdmins(deps: AppDeps, studioId: number, to: string[], mail: Mail): Promise<void> {
  for (const address of to) {
    try {
      await deps.mailer.send({ ...mail, to: address, studioId });
    } catch (err) {
      deps.logger.error({ err, studioId, template: mail.template }, 'billing mail not sent');
    }
  }
}

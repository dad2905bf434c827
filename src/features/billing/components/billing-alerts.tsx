import type { BillingOverview } from '@shared/api/billing.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { formatDate } from '@/lib/format.js';

/** What needs the admin's attention: a failed payment (in or past its grace period), an unreachable provider. */
export function BillingAlerts({ billing }: { billing: BillingOverview }) {
  const graceUntil = billing.subscription?.graceUntil;
  return (
    <>
      {billing.state === 'grace' && (
        <Alert tone="warning" title="A payment failed">
          Nothing is blocked until {graceUntil ? formatDate(graceUntil) : 'the end of the grace period'}. Update the card
          below before then, or new staff cannot be invited or added after that date. Nobody loses access to existing work.
        </Alert>
      )}
      {billing.state === 'blocked' && (
        <Alert tone="error" title={billing.subscription?.status === 'canceled' ? 'The subscription has ended' : 'New staff are paused'}>
          {billing.subscription?.status === 'canceled'
            ? 'No new staff can join until a subscription is started again.'
            : 'The grace period after the failed payment is over. Update the card below to invite or add staff again.'}{' '}
          Everyone keeps access to their projects, audits and sign-offs.
        </Alert>
      )}
      {billing.providerProblem && (
        <Alert tone="info" title="Some billing details are missing">
          {billing.providerProblem} Seats and status below are what Warpmeter last knew.
        </Alert>
      )}
    </>
  );
}

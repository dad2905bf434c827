import { useSuspenseQuery } from '@tanstack/react-query';
import { PageHeader } from '@/components/layouts/page-header.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { billingQueryOptions } from '@/features/billing/api/get-billing.js';
import { BillingAlerts } from '@/features/billing/components/billing-alerts.js';
import { CardOnFile } from '@/features/billing/components/card-on-file.js';
import { InvoicesTable } from '@/features/billing/components/invoices-table.js';
import { PlanSummary } from '@/features/billing/components/plan-summary.js';
import { SeatsForm } from '@/features/billing/components/seats-form.js';
import { StartSubscriptionForm } from '@/features/billing/components/start-subscription-form.js';
import { UpcomingInvoice } from '@/features/billing/components/upcoming-invoice.js';
import type { MemberPage } from '../../route-types.js';

/** Seats and payment (admins): plan, seats used and paid, the card, the next invoice and past ones. */
function BillingPage() {
  const { data: billing } = useSuspenseQuery(billingQueryOptions());
  const subscribed = billing.subscription !== null && billing.subscription.status !== 'canceled';
  return (
    <>
      <PageHeader title="Billing" description="Staff seats and payment for your studio. Client reviewers are always free." />
      <div className="flex flex-col gap-6">
        <BillingAlerts billing={billing} />
        <Card aria-labelledby="plan-heading">
          <CardHeader id="plan-heading" title="Plan and seats" />
          <CardBody className="flex flex-col gap-6">
            <PlanSummary billing={billing} />
            {subscribed ? (
              <SeatsForm
                key={billing.seats.paid}
                paid={billing.seats.paid}
                used={billing.seats.used}
                plan={billing.plan}
                paymentFailed={billing.state === 'grace' || billing.state === 'blocked'}
              />
            ) : (
              <StartSubscriptionForm seatsUsed={billing.seats.used} plan={billing.plan} />
            )}
          </CardBody>
        </Card>
        {subscribed && (
          <Card aria-labelledby="card-heading">
            <CardHeader id="card-heading" title="Card on file" description="Invoices are charged to this card." />
            <CardBody>
              <CardOnFile billing={billing} />
            </CardBody>
          </Card>
        )}
        {billing.upcoming && (
          <Card aria-labelledby="upcoming-heading">
            <CardHeader id="upcoming-heading" title="Next invoice" description="Seat changes during a period show up here, prorated." />
            <CardBody>
              <UpcomingInvoice upcoming={billing.upcoming} />
            </CardBody>
          </Card>
        )}
        <Card aria-labelledby="invoices-heading">
          <CardHeader id="invoices-heading" title="Invoices" />
          <InvoicesTable invoices={billing.invoices} />
        </Card>
      </div>
    </>
  );
}

export const billingPage: MemberPage = {
  path: 'studio/billing',
  Component: BillingPage,
  roles: ['admin'],
  load: ({ queryClient }) => queryClient.ensureQueryData(billingQueryOptions()),
};

import { PageHeader } from '@/components/layouts/page-header.js';
import { Card } from '@/components/ui/card.js';
import { EmptyState } from '@/components/ui/empty-state.js';
import type { MemberPage } from '../../route-types.js';

/** Seats and payment. A placeholder until the billing feature fills it. */
function BillingPage() {
  return (
    <>
      <PageHeader title="Billing" description="Staff seats and payment for your studio." />
      <Card>
        <EmptyState title="Billing is not available yet" description="Seat purchases and invoices will appear here." />
      </Card>
    </>
  );
}

export const billingPage: MemberPage = { path: 'studio/billing', Component: BillingPage, roles: ['admin'] };

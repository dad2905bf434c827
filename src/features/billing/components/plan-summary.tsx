import type { BillingOverview, BillingState } from '@shared/api/billing.schema.js';
import { Badge, type BadgeTone } from '@/components/ui/badge.js';
import { formatDate } from '@/lib/format.js';
import { formatSeatPrice } from '../format-money.js';

const STATE: Record<BillingState, { label: string; tone: BadgeTone }> = {
  none: { label: 'No subscription', tone: 'neutral' },
  active: { label: 'Paid up', tone: 'success' },
  grace: { label: 'Payment failed', tone: 'warning' },
  blocked: { label: 'New staff paused', tone: 'danger' },
};

/** Plan, price, seats used against seats paid, and where the subscription stands. */
export function PlanSummary({ billing }: { billing: BillingOverview }) {
  const { plan, seats, subscription } = billing;
  const state = STATE[billing.state];
  return (
    <dl className="grid gap-4 sm:grid-cols-3">
      <div>
        <dt className="text-xs font-medium tracking-wide text-ink-600 uppercase">Plan</dt>
        <dd className="mt-1 text-sm text-ink-950">
          {plan ? (
            <>
              <span className="font-medium">{plan.name}</span>
              <span className="block text-ink-600">{formatSeatPrice(plan.unitAmount, plan.currency, plan.interval)}</span>
            </>
          ) : (
            'Price not available right now'
          )}
        </dd>
      </div>
      <div>
        <dt className="text-xs font-medium tracking-wide text-ink-600 uppercase">Staff seats</dt>
        <dd className="mt-1 text-sm text-ink-950">
          <span className="text-lg font-semibold tabular" data-testid="billing-seats">
            {seats.used} used / {seats.paid} paid
          </span>
          <span className="block text-ink-600">Client reviewers take no seat.</span>
        </dd>
      </div>
      <div>
        <dt className="text-xs font-medium tracking-wide text-ink-600 uppercase">Status</dt>
        <dd className="mt-1 text-sm text-ink-950">
          <Badge tone={state.tone}>{state.label}</Badge>
          {subscription?.currentPeriodEnd && billing.state !== 'blocked' && (
            <span className="mt-1 block text-ink-600">Renews on {formatDate(subscription.currentPeriodEnd)}</span>
          )}
          {!subscription && <span className="mt-1 block text-ink-600">{seats.paid} seats included until you subscribe</span>}
        </dd>
      </div>
    </dl>
  );
}

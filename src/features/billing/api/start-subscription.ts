import { billingOverviewSchema, type StartSubscriptionInput } from '@shared/api/billing.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { useBillingChange } from './use-billing-change.js';

/** `POST /api/billing/subscription` (admin): buys seats; the first period is charged at once. */
export const startSubscription = (input: StartSubscriptionInput) =>
  apiRequest('/billing/subscription', { method: 'POST', body: input, schema: billingOverviewSchema });

export const useStartSubscription = () => useBillingChange(startSubscription);

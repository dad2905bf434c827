import { billingOverviewSchema, type UpdatePaymentMethodInput } from '@shared/api/billing.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { useBillingChange } from './use-billing-change.js';

/** `POST /api/billing/payment-method` (admin): replaces the card and retries an unpaid invoice. */
export const updatePaymentMethod = (input: UpdatePaymentMethodInput) =>
  apiRequest('/billing/payment-method', { method: 'POST', body: input, schema: billingOverviewSchema });

export const useUpdatePaymentMethod = () => useBillingChange(updatePaymentMethod);

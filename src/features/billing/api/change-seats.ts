import { billingOverviewSchema, type ChangeSeatsInput } from '@shared/api/billing.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { useBillingChange } from './use-billing-change.js';

/** `PATCH /api/billing/seats` (admin): the difference is prorated onto the next invoice. */
export const changeSeats = (input: ChangeSeatsInput) =>
  apiRequest('/billing/seats', { method: 'PATCH', body: input, schema: billingOverviewSchema });

export const useChangeSeats = () => useBillingChange(changeSeats);

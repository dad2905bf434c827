import { queryOptions } from '@tanstack/react-query';
import { billingOverviewSchema } from '@shared/api/billing.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/billing` (admin): plan, seats, subscription state, card, upcoming and past invoices. */
export const getBilling = (signal?: AbortSignal) => apiRequest('/billing', { schema: billingOverviewSchema, signal });

export const billingQueryOptions = () =>
  queryOptions({ queryKey: ['billing'] as const, queryFn: ({ signal }) => getBilling(signal) });

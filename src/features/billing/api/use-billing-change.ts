import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BillingOverview } from '@shared/api/billing.schema.js';
import { peopleQueryOptions } from '@/features/people/api/get-people.js';
import { billingQueryOptions } from './get-billing.js';

/**
 * A billing write whose answer is the new overview: it replaces the cached one at once, and the
 * people page's seat count is refetched. A refusal refetches too, since a card update can be
 * saved even when its payment is declined.
 */
export function useBillingChange<In>(send: (input: In) => Promise<BillingOverview>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: (overview) => queryClient.setQueryData(billingQueryOptions().queryKey, overview),
    onError: () => queryClient.invalidateQueries({ queryKey: billingQueryOptions().queryKey }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}

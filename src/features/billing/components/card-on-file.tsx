import { useState } from 'react';
import type { BillingOverview } from '@shared/api/billing.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { SelectField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { useUpdatePaymentMethod } from '../api/update-payment-method.js';
import { TEST_CARD_OPTIONS } from '../test-cards.js';

const BRANDS: Record<string, string> = { visa: 'Visa', mastercard: 'Mastercard', amex: 'American Express' };

/** The card invoices are charged to, masked, and a way to replace it (which also pays what is owed). */
export function CardOnFile({ billing }: { billing: BillingOverview }) {
  const [paymentMethod, setPaymentMethod] = useState('pm_card_visa');
  const [error, setError] = useState<string | null>(null);
  const update = useUpdatePaymentMethod();
  const { notify } = useToast();
  const owing = billing.state === 'grace' || billing.state === 'blocked';
  const card = billing.card;
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-950" data-testid="card-on-file">
        {card ? (
          <>
            <span className="font-medium">{BRANDS[card.brand] ?? card.brand}</span>{' '}
            <span className="tabular" aria-label={`ending in ${card.last4}`}>•••• •••• •••• {card.last4}</span>
          </>
        ) : (
          'No card on file.'
        )}
      </p>
      {error && <Alert tone="error" title="The card was not accepted">{error}</Alert>}
      <form
        aria-label="Replace the card"
        className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_auto] sm:items-start"
        onSubmit={async (e) => {
          e.preventDefault();
          setError(null);
          try {
            const next = await update.mutateAsync({ paymentMethod });
            notify(next.state === 'active' && owing ? 'Card replaced and the open invoice paid.' : 'Card replaced.');
          } catch (err) {
            setError(isApiError(err) ? err.message : 'The card was not replaced. Please try again.');
          }
        }}
      >
        <SelectField label="New card" options={TEST_CARD_OPTIONS} value={paymentMethod} onChange={(e) => setPaymentMethod(e.target.value)} />
        <Button type="submit" variant={owing ? 'primary' : 'secondary'} loading={update.isPending} className="sm:mt-[1.625rem]">
          {owing ? 'Replace card and pay' : 'Replace card'}
        </Button>
      </form>
    </div>
  );
}

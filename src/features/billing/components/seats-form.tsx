import { useState } from 'react';
import { MAX_SEATS } from '@shared/api/billing.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { Input } from '@/components/ui/input.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { plural } from '@/lib/format.js';
import { useChangeSeats } from '../api/change-seats.js';
import { formatMoney } from '../format-money.js';

interface Props {
  paid: number;
  used: number;
  plan: { unitAmount: number; currency: string; interval: string } | null;
  /** A payment is outstanding: seats can only go down until the card is fixed. */
  paymentFailed: boolean;
}

/** More or fewer seats; never below the seats in use. The difference is prorated onto the next invoice. */
export function SeatsForm({ paid, used, plan, paymentFailed }: Props) {
  const [quantity, setQuantity] = useState(paid);
  const [error, setError] = useState<string | null>(null);
  const change = useChangeSeats();
  const { notify } = useToast();
  const diff = quantity - paid;
  const floor = Math.max(1, used);
  const tooLow = quantity < floor;
  const blockedUp = paymentFailed && diff > 0;
  const set = (n: number) => {
    setError(null);
    setQuantity(Number.isFinite(n) ? Math.min(MAX_SEATS, Math.max(0, Math.round(n))) : paid);
  };
  const submit = async () => {
    setError(null);
    try {
      await change.mutateAsync({ quantity });
      notify(diff > 0 ? `${plural(diff, 'seat', 'seats')} added.` : `${plural(-diff, 'seat', 'seats')} removed.`);
    } catch (err) {
      setError(isApiError(err) ? err.message : 'The seats were not changed. Please try again.');
    }
  };
  return (
    <form
      aria-label="Change seats"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      {error && <Alert tone="error" title="The seats were not changed">{error}</Alert>}
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1.5">
          <label htmlFor="seat-quantity" className="text-sm font-medium text-ink-950">
            Staff seats
          </label>
          <div className="flex items-center gap-2">
            <Button variant="secondary" aria-label="One seat fewer" disabled={quantity <= floor} onClick={() => set(quantity - 1)}>
              −
            </Button>
            <Input
              id="seat-quantity"
              type="number"
              inputMode="numeric"
              min={floor}
              max={MAX_SEATS}
              className="w-24 text-center tabular"
              value={quantity}
              aria-describedby="seat-quantity-hint"
              onChange={(e) => set(e.target.valueAsNumber)}
            />
            <Button variant="secondary" aria-label="One seat more" disabled={quantity >= MAX_SEATS} onClick={() => set(quantity + 1)}>
              +
            </Button>
          </div>
        </div>
        <Button type="submit" loading={change.isPending} disabled={diff === 0 || tooLow || blockedUp}>
          {diff > 0 ? `Add ${plural(diff, 'seat', 'seats')}` : diff < 0 ? `Remove ${plural(-diff, 'seat', 'seats')}` : 'No change'}
        </Button>
      </div>
      <p id="seat-quantity-hint" className="text-sm text-ink-600">
        {tooLow
          ? `${plural(used, 'seat is', 'seats are')} in use (staff and pending staff invitations): deactivate someone or withdraw an invitation to go lower.`
          : blockedUp
            ? 'A payment failed: update the card before adding seats. Removing seats still works.'
            : plan && diff !== 0
              ? `From the next period ${formatMoney(plan.unitAmount * quantity, plan.currency)} per ${plan.interval}; the part of this period is settled on the next invoice.`
              : `${plural(used, 'seat is', 'seats are')} in use.`}
      </p>
    </form>
  );
}

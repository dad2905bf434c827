import { z } from 'zod';
import { paymentMethodIdSchema, seatQuantitySchema } from '@shared/api/billing.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { SelectField, TextField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { plural } from '@/lib/format.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useStartSubscription } from '../api/start-subscription.js';
import { formatMoney } from '../format-money.js';
import { TEST_CARD_OPTIONS } from '../test-cards.js';

// The form holds text; the same seat rules as the server apply once it is read as a number.
const formSchema = z.object({
  quantity: z.coerce.number({ error: 'Enter a number of seats.' }).pipe(seatQuantitySchema),
  paymentMethod: paymentMethodIdSchema,
});

interface Props {
  seatsUsed: number;
  plan: { unitAmount: number; currency: string; interval: string } | null;
}

/** Buys the first seats; the first period is charged to the card straight away. */
export function StartSubscriptionForm({ seatsUsed, plan }: Props) {
  const start = useStartSubscription();
  const { notify } = useToast();
  const form = useZodForm(formSchema, { quantity: String(Math.max(1, seatsUsed)), paymentMethod: 'pm_card_visa' });
  const quantity = Number(form.values.quantity);
  return (
    <form
      noValidate
      aria-label="Start the subscription"
      className="flex flex-col gap-4"
      onSubmit={form.handleSubmit(async (input) => {
        await start.mutateAsync(input);
        notify(`Subscribed with ${plural(input.quantity, 'staff seat', 'staff seats')}.`);
      })}
    >
      {form.formError && <Alert tone="error" title="The subscription was not started">{form.formError}</Alert>}
      <div className="grid gap-4 sm:grid-cols-[10rem_minmax(0,1fr)_auto] sm:items-start">
        <TextField
          label="Staff seats"
          type="number"
          inputMode="numeric"
          min={Math.max(1, seatsUsed)}
          hint={`At least ${seatsUsed}, the seats in use`}
          {...form.field('quantity')}
        />
        <SelectField label="Card" options={TEST_CARD_OPTIONS} hint="Test cards of the local payment provider" {...form.field('paymentMethod')} />
        <Button type="submit" loading={form.submitting} className="sm:mt-[1.625rem]">
          Subscribe
        </Button>
      </div>
      {plan && Number.isInteger(quantity) && quantity > 0 && (
        <p className="text-sm text-ink-600 tabular">
          {formatMoney(plan.unitAmount * quantity, plan.currency)} now, then every {plan.interval}.
        </p>
      )}
    </form>
  );
}

import type { UpcomingInvoice as Upcoming } from '@shared/api/billing.schema.js';
import { formatDate } from '@/lib/format.js';
import { formatMoney } from '../format-money.js';
import { InvoiceLines } from './invoice-lines.js';

/** What the next invoice will hold, seat changes included, and when it will be charged. */
export function UpcomingInvoice({ upcoming }: { upcoming: Upcoming }) {
  return (
    <div className="flex flex-col gap-2">
      <InvoiceLines lines={upcoming.lines} currency={upcoming.currency} label="Lines of the next invoice" />
      <p className="flex justify-between border-t border-rule-strong pt-2 text-sm font-semibold text-ink-950">
        <span>Total{upcoming.date ? `, charged on ${formatDate(upcoming.date)}` : ''}</span>
        <span className="tabular" data-testid="upcoming-total">{formatMoney(upcoming.total, upcoming.currency)}</span>
      </p>
    </div>
  );
}

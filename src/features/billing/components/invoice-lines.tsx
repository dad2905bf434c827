import type { InvoiceLine } from '@shared/api/billing.schema.js';
import { Badge } from '@/components/ui/badge.js';
import { formatMoney } from '../format-money.js';

/** An invoice's lines; prorations (part-period charges and credits from seat changes) are marked. */
export function InvoiceLines({ lines, currency, label }: { lines: readonly InvoiceLine[]; currency: string; label: string }) {
  return (
    <ul className="divide-y divide-rule" aria-label={label}>
      {lines.map((l, i) => (
        <li key={i} className="flex items-start justify-between gap-4 py-2 text-sm">
          <span className="text-ink-950">
            {l.description}
            {l.proration && (
              <Badge tone="highlight" className="ml-2">
                prorated
              </Badge>
            )}
          </span>
          <span className="shrink-0 tabular text-ink-950">{formatMoney(l.amount, currency)}</span>
        </li>
      ))}
    </ul>
  );
}

import type { AuditDetail } from '@shared/api/audits.schema.js';
import { rankForPurpose } from '@shared/api/audit-metrics.js';
import { metricText } from '@shared/review/metric-display.js';
import { Badge } from '@/components/ui/badge.js';
import { cn } from '@/lib/cn.js';

interface ShortlistPickerProps {
  audit: AuditDetail;
  picked: number[];
  onChange: (ids: number[]) => void;
  max: number;
  error?: string;
}

/** Check boxes over the audit's scorecards, best for the purpose first; at most `max` may be ticked. */
export function ShortlistPicker({ audit, picked, onChange, max, error }: ShortlistPickerProps) {
  const { column, order } = rankForPurpose(audit.purpose, audit.scorecards);
  const cards = order.map((id) => audit.scorecards.find((c) => c.candidateId === id)!);
  const full = picked.length >= max;
  const toggle = (id: number) => onChange(picked.includes(id) ? picked.filter((x) => x !== id) : [...picked, id]);
  return (
    <fieldset aria-describedby={error ? 'shortlist-error' : undefined}>
      <legend className="text-sm font-medium text-ink-950">Shortlist</legend>
      <p className="mt-0.5 text-xs text-ink-600">
        Pick 1 to {max}, in the order you want the client to see them. Ranked by {column.label.toLowerCase()} ({column.units}) for this map’s purpose.
      </p>
      <ul className="mt-2 divide-y divide-rule rounded-md border border-rule">
        {cards.map((c, rank) => {
          const on = picked.includes(c.candidateId);
          return (
            <li key={c.candidateId}>
              <label className={cn('flex cursor-pointer items-center gap-3 px-3 py-2 text-sm', on && 'bg-mulberry-50')}>
                <input
                  type="checkbox"
                  checked={on}
                  disabled={!on && full}
                  onChange={() => toggle(c.candidateId)}
                  className="size-4 accent-mulberry-700"
                />
                <span className="flex-1">
                  <span className="font-medium">{c.label}</span>{' '}
                  <span className="text-ink-600">({c.family})</span>
                </span>
                {rank === 0 && <Badge tone="highlight">Best fit</Badge>}
                <span className="w-28 text-right tabular-nums text-ink-800">
                  {metricText(column, c.metrics)}
                </span>
                {on && <span className="w-6 text-right text-xs text-mulberry-700">#{picked.indexOf(c.candidateId) + 1}</span>}
              </label>
            </li>
          );
        })}
      </ul>
      {error && (
        <p id="shortlist-error" className="mt-1.5 text-sm text-vermilion-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}

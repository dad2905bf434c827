import type { ScorecardView } from '@shared/api/audits.schema.js';
import { PURPOSE_METRIC, SCORECARD_COLUMNS, displayValue, rankForPurpose } from '@shared/api/audit-metrics.js';
import { Badge } from '@/components/ui/badge.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { cn } from '@/lib/cn.js';

const PURPOSE_WORDS: Record<string, string> = {
  'equal-area': 'an equal-area map',
  conformal: 'a conformal map',
  reference: 'a general reference map',
  equidistant: 'distances from a centre',
};

const fmt = (v: number | null, digits: number) => (v === null ? '—' : Number(v.toPrecision(digits)).toLocaleString(undefined, { maximumSignificantDigits: digits }));

/**
 * Every candidate of an audit in one sortable table: the main metrics with their units, each
 * header explained in plain words on hover and focus, the column that decides the ranking for
 * the project's purpose tinted, and the best candidate for that purpose marked.
 */
export function ScorecardTable({ cards, purpose }: { cards: ScorecardView[]; purpose: string }) {
  const ranking = rankForPurpose(purpose, cards);
  const rank = new Map(ranking.order.map((id, i) => [id, i + 1]));
  const best = ranking.order[0];
  const decisive = PURPOSE_METRIC[purpose] ?? ranking.column.key;
  const columns: Column<ScorecardView>[] = [
    {
      key: 'label',
      header: 'Candidate',
      rowHeader: true,
      className: 'min-w-52',
      sortValue: (c) => c.label,
      cell: (c) => (
        <div className="flex flex-col gap-0.5">
          <span>{c.label}</span>
          <span className="text-xs font-normal text-ink-600">{c.family}</span>
        </div>
      ),
    },
    {
      key: 'rank',
      header: 'Rank',
      align: 'right',
      sortValue: (c) => rank.get(c.candidateId),
      description: `Order for ${PURPOSE_WORDS[purpose] ?? 'this map'}: by ${ranking.column.label.toLowerCase()}, then by overall distortion.`,
      cell: (c) =>
        c.candidateId === best ? (
          <Badge tone="highlight">1 · best fit</Badge>
        ) : (
          <span className="tabular">{rank.get(c.candidateId)}</span>
        ),
    },
    ...SCORECARD_COLUMNS.map<Column<ScorecardView>>((m) => ({
      key: m.key,
      header: (
        <span className="flex flex-col items-end leading-tight">
          <span>{m.label}</span>
          <span className="text-xs font-normal text-ink-500">{m.units}</span>
        </span>
      ),
      align: 'right',
      description: m.explanation,
      sortValue: (c) => displayValue(m, c.metrics),
      cell: (c) => <span className="tabular">{fmt(displayValue(m, c.metrics), m.digits)}</span>,
      className: cn(m.key === decisive && 'bg-saffron-100/60'),
    })),
  ];
  return (
    <DataTable
      caption={`Scorecards, ranked for ${PURPOSE_WORDS[purpose] ?? 'this map'} (tinted column decides)`}
      rows={cards}
      columns={columns}
      rowKey={(c) => c.candidateId}
      initialSort={{ key: 'rank', direction: 'ascending' }}
      rowClassName={(c) => (c.candidateId === best ? 'bg-saffron-100/30' : undefined)}
    />
  );
}

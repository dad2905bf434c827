import type { ScorecardView } from '@shared/api/audits.schema.js';
import { SCORECARD_COLUMNS, rankForPurpose } from '@shared/api/audit-metrics.js';
import { metricShown, metricText } from '@shared/review/metric-display.js';
import { Badge } from '@/components/ui/badge.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';

/** The audit table's columns, in its order (the reviewer sees the same measures as the studio). */
const COLUMNS = SCORECARD_COLUMNS;

interface ShortlistTableProps {
  cards: ScorecardView[];
  purpose: string;
  /** Marks the approved candidate. */
  chosenId?: number | null;
  caption: string;
}

/** The shortlisted scorecards side by side; the best for the project's purpose is marked. */
export function ShortlistTable({ cards, purpose, chosenId, caption }: ShortlistTableProps) {
  const { column: rankColumn, order } = rankForPurpose(purpose, cards);
  const columns: Column<ScorecardView>[] = [
    {
      key: 'label',
      header: 'Candidate',
      rowHeader: true,
      sortValue: (c) => c.label,
      cell: (c) => (
        <span className="flex flex-wrap items-center gap-2">
          <span className="font-medium">{c.label}</span>
          {c.candidateId === order[0] && cards.length > 1 && <Badge tone="highlight">Best {rankColumn.label.toLowerCase()}</Badge>}
          {c.candidateId === chosenId && <Badge tone="success">Approved</Badge>}
        </span>
      ),
    },
    ...COLUMNS.map((col): Column<ScorecardView> => {
      return {
        key: col.key,
        header: (
          <span title={col.explanation}>
            {col.label} <span className="font-normal text-ink-600">({col.units})</span>
          </span>
        ),
        align: 'right',
        sortValue: (c) => metricShown(col, c.metrics),
        cell: (c) => <span className="tabular-nums">{metricText(col, c.metrics, false)}</span>,
      };
    }),
  ];
  return <DataTable rows={cards} columns={columns} rowKey={(c) => c.candidateId} caption={caption} />;
}

import type { Invoice } from '@shared/api/billing.schema.js';
import { Badge, type BadgeTone } from '@/components/ui/badge.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { EmptyState } from '@/components/ui/empty-state.js';
import { formatDate } from '@/lib/format.js';
import { formatMoney } from '../format-money.js';
import { InvoiceLines } from './invoice-lines.js';

const STATUS: Record<Invoice['status'], { label: string; tone: BadgeTone }> = {
  paid: { label: 'Paid', tone: 'success' },
  open: { label: 'Unpaid', tone: 'danger' },
  draft: { label: 'Draft', tone: 'neutral' },
  void: { label: 'Void', tone: 'neutral' },
  uncollectible: { label: 'Uncollectible', tone: 'danger' },
};

const columns: Column<Invoice>[] = [
  { key: 'number', header: 'Invoice', rowHeader: true, cell: (i) => i.number ?? i.id, sortValue: (i) => i.number },
  { key: 'created', header: 'Date', cell: (i) => formatDate(i.created), sortValue: (i) => new Date(i.created) },
  { key: 'period', header: 'Period', cell: (i) => `${formatDate(i.periodStart)} – ${formatDate(i.periodEnd)}` },
  {
    key: 'lines',
    header: 'Lines',
    cell: (i) => (
      <details>
        <summary className="cursor-pointer text-mulberry-700">{i.lines.length === 1 ? '1 line' : `${i.lines.length} lines`}</summary>
        <InvoiceLines lines={i.lines} currency={i.currency} label={`Lines of invoice ${i.number ?? i.id}`} />
      </details>
    ),
  },
  { key: 'total', header: 'Amount', align: 'right', cell: (i) => <span className="tabular">{formatMoney(i.total, i.currency)}</span>, sortValue: (i) => i.total },
  { key: 'status', header: 'Status', cell: (i) => <Badge tone={STATUS[i.status].tone}>{STATUS[i.status].label}</Badge>, sortValue: (i) => i.status },
];

/** Past invoices with their amounts and whether they were paid. */
export function InvoicesTable({ invoices }: { invoices: readonly Invoice[] }) {
  return (
    <DataTable
      rows={invoices}
      columns={columns}
      rowKey={(i) => i.id}
      caption="Invoices, newest first"
      captionHidden
      empty={<EmptyState title="No invoices yet" description="The first one is made when the subscription starts." />}
    />
  );
}

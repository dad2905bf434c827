import { useId, useMemo, useState, type ReactNode } from 'react';
import { cn } from '@/lib/cn.js';

export type SortDirection = 'ascending' | 'descending';
export type SortValue = string | number | Date | null | undefined;

export interface Column<Row> {
  key: string;
  header: ReactNode;
  cell: (row: Row) => ReactNode;
  /** Makes the column sortable by this value; nulls sort last either way. */
  sortValue?: (row: Row) => SortValue;
  align?: 'left' | 'right';
  /** Row header cell (`<th scope="row">`), for the column that names the row. */
  rowHeader?: boolean;
  className?: string;
  /** Plain-words explanation of the column, shown as a tooltip on hover and keyboard focus of its header. */
  description?: ReactNode;
}

interface DataTableProps<Row> {
  rows: readonly Row[];
  columns: readonly Column<Row>[];
  rowKey: (row: Row) => string | number;
  /** Names the table for assistive technology; shown unless captionHidden. */
  caption: ReactNode;
  captionHidden?: boolean;
  initialSort?: { key: string; direction: SortDirection };
  empty?: ReactNode;
  className?: string;
  /** Extra classes for a row (e.g. to highlight one). */
  rowClassName?: (row: Row) => string | undefined;
}

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });

const isMissing = (v: SortValue): v is null | undefined =>
  v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v));

/** Orders two present values: numbers and dates by size, text in natural order ("P2" < "P10"). */
export function compareSortValues(a: SortValue, b: SortValue): number {
  const na = isMissing(a);
  const nb = isMissing(b);
  if (na || nb) return na === nb ? 0 : na ? 1 : -1;
  if (a instanceof Date && b instanceof Date) return a.getTime() - b.getTime();
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return collator.compare(String(a), String(b));
}

/** Sorts a copy; nulls stay at the end in both directions, ties keep their input order. */
export function sortRows<Row>(rows: readonly Row[], value: (row: Row) => SortValue, direction: SortDirection): Row[] {
  const sign = direction === 'ascending' ? 1 : -1;
  return rows
    .map((row, index) => ({ row, index, v: value(row) }))
    .sort((x, y) => {
      const xNull = isMissing(x.v);
      const yNull = isMissing(y.v);
      if (xNull || yNull) return xNull === yNull ? x.index - y.index : xNull ? 1 : -1;
      return sign * compareSortValues(x.v, y.v) || x.index - y.index;
    })
    .map((e) => e.row);
}

/**
 * A table whose sortable column headers are buttons (reachable by Tab, pressed with Enter or
 * Space) and whose header cells carry aria-sort, so the current order is announced.
 */
export function DataTable<Row>({ rows, columns, rowKey, caption, captionHidden, initialSort, empty, className, rowClassName }: DataTableProps<Row>) {
  const [sort, setSort] = useState(initialSort);
  const tipBase = useId();
  const sorted = useMemo(() => {
    const col = sort && columns.find((c) => c.key === sort.key);
    return col?.sortValue && sort ? sortRows(rows, col.sortValue, sort.direction) : rows;
  }, [rows, columns, sort]);

  const toggle = (key: string) =>
    setSort((s) => (s?.key === key ? { key, direction: s.direction === 'ascending' ? 'descending' : 'ascending' } : { key, direction: 'ascending' }));

  return (
    // `relative`: visually hidden (absolutely placed) labels inside must scroll with the table,
    // not widen the page on narrow screens.
    <div className={cn('relative overflow-x-auto', className)}>
      <table className="w-full border-collapse text-left text-sm">
        <caption className={cn('px-4 py-2 text-left text-sm text-ink-600', captionHidden && 'sr-only')}>{caption}</caption>
        <thead>
          <tr className="border-b border-rule bg-paper/60">
            {columns.map((col) => {
              const active = sort?.key === col.key;
              const tipId = col.description ? `${tipBase}-${col.key}` : undefined;
              return (
                <th
                  key={col.key}
                  scope="col"
                  aria-sort={col.sortValue ? (active ? sort.direction : 'none') : undefined}
                  className={cn('px-4 py-2 font-medium whitespace-nowrap text-ink-600', col.align === 'right' && 'text-right', tipId && 'group relative', col.className)}
                >
                  {col.sortValue ? (
                    <button
                      type="button"
                      aria-describedby={tipId}
                      onClick={() => toggle(col.key)}
                      className={cn(
                        '-mx-1.5 inline-flex items-center gap-1 rounded px-1.5 py-0.5 hover:bg-mulberry-50 hover:text-ink-950',
                        active && 'text-ink-950',
                        col.align === 'right' && 'flex-row-reverse',
                      )}
                    >
                      {col.header}
                      <SortIcon direction={active ? sort.direction : undefined} />
                    </button>
                  ) : tipId ? (
                    <span tabIndex={0} aria-describedby={tipId} className="rounded">
                      {col.header}
                    </span>
                  ) : (
                    col.header
                  )}
                  {tipId && (
                    <span
                      role="tooltip"
                      id={tipId}
                      className={cn(
                        'invisible absolute top-full z-20 mt-1 w-64 rounded-md bg-ink-950 px-3 py-2 text-left text-xs font-normal whitespace-normal text-white shadow-lg',
                        'group-hover:visible group-focus-within:visible',
                        col.align === 'right' ? 'right-2' : 'left-2',
                      )}
                    >
                      {col.description}
                    </span>
                  )}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {sorted.length === 0 && empty ? (
            <tr>
              <td colSpan={columns.length} className="px-4 py-8 text-center text-ink-600">
                {empty}
              </td>
            </tr>
          ) : (
            sorted.map((row) => (
              <tr key={rowKey(row)} className={cn('border-b border-rule last:border-b-0 hover:bg-paper/50', rowClassName?.(row))}>
                {columns.map((col) => {
                  const Cell = col.rowHeader ? 'th' : 'td';
                  return (
                    <Cell
                      key={col.key}
                      scope={col.rowHeader ? 'row' : undefined}
                      className={cn('px-4 py-2.5 align-middle', col.rowHeader && 'font-medium text-ink-950', col.align === 'right' && 'text-right tabular', col.className)}
                    >
                      {col.cell(row)}
                    </Cell>
                  );
                })}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}

function SortIcon({ direction }: { direction?: SortDirection }) {
  return (
    <svg className="size-3.5 shrink-0" viewBox="0 0 16 16" aria-hidden="true">
      <path d="M5 6.5L8 3.5l3 3" fill="none" stroke="currentColor" strokeWidth="1.5" strokeOpacity={direction === 'ascending' ? 1 : 0.35} />
      <path d="M5 9.5l3 3 3-3" fill="none" stroke="currentColor" strokeWidth="1.5" strokeOpacity={direction === 'descending' ? 1 : 0.35} />
    </svg>
  );
}

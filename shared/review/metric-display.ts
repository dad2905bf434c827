import { SCORECARD_COLUMNS, metricValue, type MetricColumn } from '../api/audit-metrics.js';

/**
 * A scorecard metric as review screens, the sign-off sheet and e-mails print it, following the
 * audit table's own column description (a 0–1 share shown as a percentage, a logarithmic error as
 * a percentage error 100·(eˣ − 1), anything else as stored).
 */
type ColumnLike = MetricColumn & { display?: 'plain' | 'share' | 'ln-as-pct'; share?: boolean };

export function metricShown(column: MetricColumn, metrics: Record<string, unknown>): number | null {
  const c = column as ColumnLike;
  const v = metricValue(metrics, c.key);
  if (v === null) return null;
  const mode = c.display ?? (c.share ? 'share' : 'plain');
  if (mode === 'share') return v * 100;
  if (mode === 'ln-as-pct') return (Math.exp(v) - 1) * 100;
  return v;
}

/** The shown value as text with the column's units ("0.412 °", "1.0034 max/min"); "–" when absent. */
export function metricText(column: MetricColumn, metrics: Record<string, unknown>, withUnits = true): string {
  const v = metricShown(column, metrics);
  if (v === null) return '–';
  const digits = Math.max(3, column.digits);
  // Below 1e-9 a value is floating-point noise around zero (a conformal map's ω, say): show 0.
  const text = Math.abs(v) < 1e-9 ? '0' : Math.abs(v) >= 1e-3 ? Number(v.toPrecision(digits)).toString() : v.toExponential(2);
  return withUnits ? `${text} ${column.units}` : text;
}

export const columnByKey = (key: string) => SCORECARD_COLUMNS.find((c) => c.key === key);

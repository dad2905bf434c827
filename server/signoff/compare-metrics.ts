/** One leaf that differs between the stored and the re-computed scorecard. */
export interface MetricDifference {
  metric: string;
  stored: unknown;
  recomputed: unknown;
}

function leaves(value: unknown, at: string, out: Map<string, unknown>) {
  if (value !== null && typeof value === 'object') {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    if (!entries.length) out.set(at, Array.isArray(value) ? [] : {});
    for (const [k, v] of entries) leaves(v, at ? `${at}.${k}` : k, out);
  } else {
    out.set(at, value);
  }
}

/**
 * Every metric path whose value is not identical (numbers compared bit for bit, after both went
 * through JSON as stored). A reproducible audit gives an empty list.
 *
 * diffMetrics({ s: { max: 1.02 } }, { s: { max: 1.03 } }) → [{ metric: 's.max', stored: 1.02, recomputed: 1.03 }]
 */
export function diffMetrics(stored: unknown, recomputed: unknown): MetricDifference[] {
  const a = new Map<string, unknown>();
  const b = new Map<string, unknown>();
  leaves(stored, '', a);
  leaves(recomputed, '', b);
  const keys = [...new Set([...a.keys(), ...b.keys()])].sort();
  const differences: MetricDifference[] = [];
  for (const k of keys) {
    const x = a.has(k) ? a.get(k) : undefined;
    const y = b.has(k) ? b.get(k) : undefined;
    const same = Array.isArray(x) || Array.isArray(y) ? JSON.stringify(x) === JSON.stringify(y) : Object.is(x, y);
    if (!same) differences.push({ metric: k || '(whole scorecard)', stored: x ?? null, recomputed: y ?? null });
  }
  return differences;
}

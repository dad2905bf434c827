/**
 * The scorecard's main metrics as the table, the exports and the ranking show them: where each
 * sits in the metrics object, its units, which way is better, and a plain-words explanation.
 */
export interface MetricColumn {
  /** Dotted path into a scorecard's metrics. */
  key: string;
  label: string;
  units: string;
  better: 'lower' | 'higher';
  /** Shown on hover and focus of the column header. */
  explanation: string;
  /** Significant digits in the table. */
  digits: number;
  /**
   * How the stored value is shown: as is; as a percentage of the region (a 0–1 share); or as a
   * percentage error from a logarithmic one (100·(eˣ − 1), the engine keeps |ln| ratios).
   */
  display: 'plain' | 'share' | 'ln-as-pct';
}

export const SCORECARD_COLUMNS: readonly MetricColumn[] = [
  {
    key: 'arealScale.ratio',
    label: 'Area spread',
    units: 'max/min',
    better: 'lower',
    digits: 5,
    display: 'plain',
    explanation: 'How many times larger the most enlarged place in the region is drawn than the most shrunk one, area for area. 1 means every area is shown in true proportion.',
  },
  {
    key: 'angularDeformationDeg.mean',
    label: 'Mean angle bend',
    units: '°',
    better: 'lower',
    digits: 3,
    display: 'plain',
    explanation: 'The average, over the region, of the largest amount an angle on the ground is bent on the map (ω). 0° means shapes of small things are kept.',
  },
  {
    key: 'angularDeformationDeg.max',
    label: 'Worst angle bend',
    units: '°',
    better: 'lower',
    digits: 3,
    display: 'plain',
    explanation: 'The largest bending of angles (ω) anywhere in the region.',
  },
  {
    key: 'scaleError.mean',
    label: 'Mean scale error',
    units: '%',
    better: 'lower',
    digits: 3,
    display: 'ln-as-pct',
    explanation: 'After the whole map is rescaled by the one factor that suits the region best, how far the scale in the worst direction is from true, on average.',
  },
  {
    key: 'scaleError.max',
    label: 'Worst scale error',
    units: '%',
    better: 'lower',
    digits: 3,
    display: 'ln-as-pct',
    explanation: 'The same scale error at the worst place in the region.',
  },
  {
    key: 'airyKavrayskiy',
    label: 'Overall distortion',
    units: 'Airy–Kavrayskiy',
    better: 'lower',
    digits: 4,
    display: 'plain',
    explanation: 'One number for all distortion together (the Airy–Kavrayskiy measure): the root mean square of the logarithmic scale errors in every direction. 0 would be a perfect map.',
  },
  {
    key: 'distanceError.mean',
    label: 'Mean distance error',
    units: '%',
    better: 'lower',
    digits: 3,
    display: 'ln-as-pct',
    explanation: 'For many random pairs of places in the region, how far the straight-line distance measured on the map (after the best rescale) is from the true distance on the Earth, on average.',
  },
  {
    key: 'distanceError.p95',
    label: 'Distance error (95th percentile)',
    units: '%',
    better: 'lower',
    digits: 3,
    display: 'ln-as-pct',
    explanation: 'The distance error that 95 % of the place pairs stay within.',
  },
  {
    key: 'withinTolerance.angular1Deg',
    label: 'Area with angles within 1°',
    units: '% of region',
    better: 'higher',
    digits: 3,
    display: 'share',
    explanation: 'The share of the region where no angle is bent by more than 1°.',
  },
];

/** Which metric decides the ranking for each map purpose (ties go to the overall distortion). */
export const PURPOSE_METRIC: Readonly<Record<string, string>> = {
  'equal-area': 'arealScale.ratio',
  conformal: 'angularDeformationDeg.mean',
  reference: 'airyKavrayskiy',
  equidistant: 'distanceError.mean',
};

export function metricValue(metrics: Record<string, unknown>, key: string): number | null {
  let v: unknown = metrics;
  for (const part of key.split('.')) v = v && typeof v === 'object' ? (v as Record<string, unknown>)[part] : undefined;
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** A metric as the table shows it (see MetricColumn.display), or null when the engine reported none. */
export function displayValue(column: MetricColumn, metrics: Record<string, unknown>): number | null {
  const v = metricValue(metrics, column.key);
  if (v === null) return null;
  if (column.display === 'share') return v * 100;
  if (column.display === 'ln-as-pct') return (Math.exp(v) - 1) * 100;
  return v;
}

/** Relative difference below which two metric values rank as equal. */
const TIE_RELATIVE = 1e-9;

export const columnFor = (key: string) => SCORECARD_COLUMNS.find((c) => c.key === key)!;

/**
 * Candidate ids best first for the project's purpose: by the purpose's metric, then by the overall
 * distortion; candidates without a value go last.
 */
export function rankForPurpose(
  purpose: string,
  cards: readonly { candidateId: number; metrics: Record<string, unknown> }[],
): { column: MetricColumn; order: number[] } {
  const column = columnFor(PURPOSE_METRIC[purpose] ?? 'airyKavrayskiy');
  const sign = column.better === 'lower' ? 1 : -1;
  const key = (c: (typeof cards)[number]) => metricValue(c.metrics, column.key);
  const order = [...cards]
    .sort((x, y) => {
      const a = key(x), b = key(y);
      if (a === null || b === null) return a === b ? 0 : a === null ? 1 : -1;
      // Values equal to rounding (e.g. two equal-area maps, both with a spread of 1) are ties.
      const tie = Math.abs(a - b) <= TIE_RELATIVE * Math.max(Math.abs(a), Math.abs(b));
      return (tie ? 0 : sign * (a - b)) || (metricValue(x.metrics, 'airyKavrayskiy') ?? Infinity) - (metricValue(y.metrics, 'airyKavrayskiy') ?? Infinity);
    })
    .map((c) => c.candidateId);
  return { column, order };
}

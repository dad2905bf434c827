/** Area-weighted statistics over samples; NaN entries (undefined points) are skipped. */

export interface WeightedSummary {
  min: number;
  max: number;
  mean: number;
  /** Index of the sample holding the minimum / maximum. */
  argMin: number;
  argMax: number;
  /** Total weight of the finite samples. */
  weight: number;
}

/** Weighted min, max and mean. Example: weightedSummary([1, 3], [1, 1]).mean === 2. */
export function weightedSummary(values: ArrayLike<number>, weights: ArrayLike<number>): WeightedSummary {
  let min = Infinity;
  let max = -Infinity;
  let argMin = -1;
  let argMax = -1;
  let sum = 0;
  let wsum = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v !== v) continue;
    const w = weights[i];
    sum += v * w;
    wsum += w;
    if (v < min) [min, argMin] = [v, i];
    if (v > max) [max, argMax] = [v, i];
  }
  return { min: wsum ? min : NaN, max: wsum ? max : NaN, mean: wsum ? sum / wsum : NaN, argMin, argMax, weight: wsum };
}

/**
 * Weighted quantiles (the value below which a share q of the weight lies; lower value at ties).
 * Equal weights take a plain typed-array sort. Example: weightedQuantiles([1,2,3,4], [1,1,1,1], [0.5]) → [2].
 */
export function weightedQuantiles(values: ArrayLike<number>, weights: ArrayLike<number>, qs: number[]): number[] {
  const n = values.length;
  let equal = true;
  for (let i = 1; i < n && equal; i++) equal = weights[i] === weights[0];
  if (equal) {
    const v = new Float64Array(n);
    let m = 0;
    for (let i = 0; i < n; i++) if (values[i] === values[i]) v[m++] = values[i];
    if (!m) return qs.map(() => NaN);
    const sorted = v.subarray(0, m).sort();
    return qs.map((q) => sorted[Math.min(m - 1, Math.max(0, Math.ceil(q * m) - 1))]);
  }
  const idx: number[] = [];
  let total = 0;
  for (let i = 0; i < n; i++) if (values[i] === values[i]) (idx.push(i), (total += weights[i]));
  if (!idx.length) return qs.map(() => NaN);
  idx.sort((a, b) => values[a] - values[b]);
  return qs.map((q) => {
    let acc = 0;
    for (const i of idx) {
      acc += weights[i];
      if (acc >= q * total - 1e-12 * total) return values[i];
    }
    return values[idx[idx.length - 1]];
  });
}

/** Weighted share of finite samples for which test(value) holds. */
export function weightedShare(values: ArrayLike<number>, weights: ArrayLike<number>, test: (v: number) => boolean): number {
  let yes = 0;
  let all = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v !== v) continue;
    all += weights[i];
    if (test(v)) yes += weights[i];
  }
  return all ? yes / all : NaN;
}

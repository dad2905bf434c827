import geographiclib from 'geographiclib-geodesic';
import { seededRandom } from './interim-sampling.js';

/*
 * Interim scorecard of one candidate from its per-sample factors, used until the engine exposes
 * its own (see engine-instance.ts). All means are plain means over equal-area samples, i.e.
 * area-weighted over the region. Definitions follow the design's scorecard: areal scale s, maximum
 * angular deformation ω, scale error after the best uniform rescale c with ln c = −½ mean(ln a + ln b),
 * the Airy–Kavrayskiy measure E = √(mean ½[(ln ca)² + (ln cb)²]) (Airy 1861), shares within
 * tolerance, and the finite-distance error of geodesic pairs (GeographicLib inverse vs the
 * projected chord × c).
 */

export interface CandidateMetrics {
  samplesUsed: number;
  undefinedSamples: number;
  bestScale: number;
  arealScale: { min: number; max: number; mean: number; p5: number; p95: number; maxMinRatio: number };
  omegaDeg: { mean: number; p95: number; max: number };
  scaleError: { meanPct: number; maxPct: number };
  airyKavrayskiy: number;
  withinTolerance: { arealScale2Pct: number; omega1Deg: number };
  distanceError: { pairs: number; meanPct: number; p95Pct: number };
}

const geod = geographiclib.Geodesic.WGS84;

/** Linear-interpolated quantile of a sorted array (type 7 of Hyndman & Fan 1996). */
function quantile(sorted: Float64Array, q: number): number {
  if (!sorted.length) return NaN;
  const pos = (sorted.length - 1) * q;
  const i = Math.floor(pos);
  const f = pos - i;
  return i + 1 < sorted.length ? sorted[i] * (1 - f) + sorted[i + 1] * f : sorted[i];
}

export interface GeodesicPairs {
  i: Uint32Array;
  j: Uint32Array;
  groundM: Float64Array;
}

/** Random pairs of samples (seeded) with their WGS84 geodesic distance; the same pairs serve every candidate. */
export function geodesicPairs(lonDeg: Float64Array, latDeg: Float64Array, count: number, seed: number): GeodesicPairs {
  const n = lonDeg.length;
  const rand = seededRandom(seed ^ 0x5bd1e995);
  const i = new Uint32Array(count), j = new Uint32Array(count), groundM = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    i[k] = Math.floor(rand() * n);
    j[k] = Math.floor(rand() * n);
    groundM[k] = i[k] === j[k] ? 0 : geod.Inverse(latDeg[i[k]], lonDeg[i[k]], latDeg[j[k]], lonDeg[j[k]]).s12 ?? 0;
  }
  return { i, j, groundM };
}

export function scoreInterim(
  f: { s: ArrayLike<number>; omegaDeg: ArrayLike<number>; a: ArrayLike<number>; b: ArrayLike<number> },
  projected: { x: Float64Array; y: Float64Array },
  pairs: GeodesicPairs,
): CandidateMetrics {
  const n = f.s.length;
  let m = 0, sumLnAb = 0;
  for (let i = 0; i < n; i++) if (f.s[i] > 0) {
    m++;
    sumLnAb += Math.log(f.a[i]) + Math.log(f.b[i]);
  }
  if (!m) throw new Error('the projection is undefined over the whole region');
  const lnC = -sumLnAb / (2 * m);
  const s = new Float64Array(m), om = new Float64Array(m);
  let k = 0, sumS = 0, sumOm = 0, sumErr = 0, maxErr = 0, sumAk = 0, inS = 0, inOm = 0;
  for (let i = 0; i < n; i++) {
    if (!(f.s[i] > 0)) continue;
    s[k] = f.s[i];
    om[k] = f.omegaDeg[i];
    sumS += s[k];
    sumOm += om[k];
    const la = lnC + Math.log(f.a[i]), lb = lnC + Math.log(f.b[i]);
    const err = Math.max(Math.abs(la), Math.abs(lb));
    sumErr += Math.exp(err) - 1;
    if (err > maxErr) maxErr = err;
    sumAk += 0.5 * (la * la + lb * lb);
    if (Math.abs(s[k] - 1) <= 0.02) inS++;
    if (om[k] <= 1) inOm++;
    k++;
  }
  s.sort();
  om.sort();
  const rel: number[] = [];
  for (let p = 0; p < pairs.groundM.length; p++) {
    const g = pairs.groundM[p];
    const a = pairs.i[p], b = pairs.j[p];
    const dx = projected.x[a] - projected.x[b], dy = projected.y[a] - projected.y[b];
    if (!(g > 1) || !Number.isFinite(dx + dy)) continue;
    rel.push(Math.abs((Math.hypot(dx, dy) * Math.exp(lnC)) / g - 1));
  }
  const relSorted = Float64Array.from(rel).sort();
  const pct = (x: number) => x * 100;
  return {
    samplesUsed: m,
    undefinedSamples: n - m,
    bestScale: Math.exp(lnC),
    arealScale: { min: s[0], max: s[m - 1], mean: sumS / m, p5: quantile(s, 0.05), p95: quantile(s, 0.95), maxMinRatio: s[m - 1] / s[0] },
    omegaDeg: { mean: sumOm / m, p95: quantile(om, 0.95), max: om[m - 1] },
    scaleError: { meanPct: pct(sumErr / m), maxPct: pct(Math.exp(maxErr) - 1) },
    airyKavrayskiy: Math.sqrt(sumAk / m),
    withinTolerance: { arealScale2Pct: inS / m, omega1Deg: inOm / m },
    distanceError: {
      pairs: relSorted.length,
      meanPct: relSorted.length ? pct(relSorted.reduce((x, y) => x + y, 0) / relSorted.length) : NaN,
      p95Pct: pct(quantile(relSorted, 0.95)),
    },
  };
}

import { DEG_TO_RAD } from './constants';
import type { ResolvedDefinition } from './definition';
import { createFactorEvaluator, type FactorArrays } from './evaluator';
import { computeSampleFields, type SampleFields } from './fields';
import { geodesicDistanceM, geodesicFor } from './geodesic';
import type { PreparedRegion } from './region/prepare';
import type { RegionSamples } from './sampling';
import { weightedQuantiles, weightedShare, weightedSummary } from './stats';

export interface PointLocation {
  lonDeg: number;
  latDeg: number;
  value: number;
}

/** A candidate's area-weighted scorecard over a region (the JSON shape the CLI and server report). */
export interface CandidateMetrics {
  /** Raw areal scale s of the definition as given (before any rescaling). */
  arealScale: { min: number; max: number; mean: number; p5: number; p95: number; ratio: number };
  angularDeformationDeg: { mean: number; p95: number; max: number };
  /** max(|ln ca|, |ln cb|) per point after the best uniform rescale c. */
  scaleError: { mean: number; max: number };
  /** √(mean ½[(ln ca)² + (ln cb)²]) after the best uniform rescale (Airy 1861; Kavrayskiy). */
  airyKavrayskiy: number;
  /** |ln(projected / geodesic distance)| over sample pairs, after the best uniform rescale. */
  distanceError: { mean: number; p95: number; pairs: number };
  /** Shares of the region's area within tolerances (areal scale after the best rescale c²s). */
  withinTolerance: {
    arealScale1Pct: number;
    arealScale2Pct: number;
    arealScale5Pct: number;
    angular0_5Deg: number;
    angular1Deg: number;
    angular2Deg: number;
  };
  bestScale: number;
  worstPoints: { minArealScale: PointLocation; maxArealScale: PointLocation; maxAngularDeformation: PointLocation; maxScaleError: PointLocation };
  projectedVsGeodesicArea: { geodesicAreaKm2: number; projectedAreaKm2: number | null; integratedAreaKm2: number; ratio: number | null };
  /** Share of the region's area where the projection is undefined (excluded from every statistic). */
  undefinedShare: number;
}

export interface ScoreOptions {
  /** Factors already computed at the samples (e.g. by a worker pool). */
  factors?: FactorArrays;
}

/**
 * Scores a candidate over a sampled region. Every statistic is area-weighted over the samples
 * where the projection is defined; undefinedShare reports the rest.
 * Example: scoreCandidate(resolveDefinition('EPSG:3035'), sampleRegion(europe), prepareRegion(europe)).airyKavrayskiy.
 */
export function scoreCandidate(resolved: ResolvedDefinition, samples: RegionSamples, region?: PreparedRegion, options: ScoreOptions = {}): CandidateMetrics {
  const fields = computeSampleFields(resolved, samples, options.factors);
  return metricsFromFields(resolved, samples, fields, region);
}

/** The scorecard from per-sample fields (see computeSampleFields). */
export function metricsFromFields(resolved: ResolvedDefinition, samples: RegionSamples, f: SampleFields, region?: PreparedRegion): CandidateMetrics {
  const w = samples.weightKm2;
  const n = samples.count;
  const s = weightedSummary(f.s, w);
  const [p5, p95] = weightedQuantiles(f.s, w, [0.05, 0.95]);
  const om = weightedSummary(f.omegaDeg, w);
  const [omP95] = weightedQuantiles(f.omegaDeg, w, [0.95]);
  const se = weightedSummary(f.scaleError, w);
  const lnC = Math.log(f.bestScale);
  const c2 = f.bestScale * f.bestScale;
  let ak = 0;
  let akw = 0;
  for (let i = 0; i < n; i++) {
    if (f.a[i] !== f.a[i]) continue;
    const la = Math.log(f.a[i]) + lnC;
    const lb = Math.log(f.b[i]) + lnC;
    ak += w[i] * 0.5 * (la * la + lb * lb);
    akw += w[i];
  }
  const loc = (i: number, v: number): PointLocation => ({ lonDeg: i >= 0 ? samples.lonDeg[i] : NaN, latDeg: i >= 0 ? samples.latDeg[i] : NaN, value: v });
  const share = (t: (v: number) => boolean, values: ArrayLike<number>) => weightedShare(values, w, t);
  const rescaledS = f.s.map((v) => v * c2);
  const totalW = weightedSummary(new Float64Array(n).fill(1), w).weight;
  return {
    arealScale: { min: s.min, max: s.max, mean: s.mean, p5, p95, ratio: s.max / s.min },
    angularDeformationDeg: { mean: om.mean, p95: omP95, max: om.max },
    scaleError: { mean: se.mean, max: se.max },
    airyKavrayskiy: akw ? Math.sqrt(ak / akw) : NaN,
    distanceError: distanceError(resolved, samples),
    withinTolerance: {
      arealScale1Pct: share((v) => Math.abs(v - 1) <= 0.01, rescaledS),
      arealScale2Pct: share((v) => Math.abs(v - 1) <= 0.02, rescaledS),
      arealScale5Pct: share((v) => Math.abs(v - 1) <= 0.05, rescaledS),
      angular0_5Deg: share((v) => v <= 0.5, f.omegaDeg),
      angular1Deg: share((v) => v <= 1, f.omegaDeg),
      angular2Deg: share((v) => v <= 2, f.omegaDeg),
    },
    bestScale: f.bestScale,
    worstPoints: {
      minArealScale: loc(s.argMin, s.min),
      maxArealScale: loc(s.argMax, s.max),
      maxAngularDeformation: loc(om.argMax, om.max),
      maxScaleError: loc(se.argMax, se.max),
    },
    projectedVsGeodesicArea: projectedArea(resolved, samples, s.mean, s.weight, region),
    undefinedShare: totalW ? 1 - s.weight / totalW : NaN,
  };
}

/**
 * Finite-distance error: for each sample pair, r = ln(projected distance / geodesic distance) on
 * the surface the projection uses (GeographicLib inverse); the best uniform rescale removes the
 * mean of r (least squares in log), and mean and p95 of |r − mean r| are reported.
 */
function distanceError(resolved: ResolvedDefinition, samples: RegionSamples): CandidateMetrics['distanceError'] {
  const ev = createFactorEvaluator(resolved);
  const g = geodesicFor(resolved.factorEllipsoid);
  const m = samples.pairI.length;
  const r = new Float64Array(m);
  const p = new Float64Array(2);
  const q = new Float64Array(2);
  let sum = 0;
  let used = 0;
  for (let k = 0; k < m; k++) {
    const i = samples.pairI[k];
    const j = samples.pairJ[k];
    ev.forward(samples.lonDeg[i] * DEG_TO_RAD, samples.latDeg[i] * DEG_TO_RAD, p);
    ev.forward(samples.lonDeg[j] * DEG_TO_RAD, samples.latDeg[j] * DEG_TO_RAD, q);
    const dMap = Math.hypot(p[0] - q[0], p[1] - q[1]);
    const dGeo = geodesicDistanceM(g, samples.lonDeg[i], samples.latDeg[i], samples.lonDeg[j], samples.latDeg[j]);
    r[k] = dMap > 0 && dGeo > 0 && Number.isFinite(dMap) ? Math.log(dMap / dGeo) : NaN;
    if (r[k] === r[k]) (sum += r[k]), used++;
  }
  const mean = used ? sum / used : NaN;
  const abs = r.map((v) => Math.abs(v - mean));
  const ones = new Float64Array(m).fill(1);
  const [p95] = weightedQuantiles(abs, ones, [0.95]);
  return { mean: weightedSummary(abs, ones).mean, p95, pairs: used };
}

/** Projected area: the shoelace of the projected boundary where it maps whole, and ∫ s dA. */
function projectedArea(resolved: ResolvedDefinition, samples: RegionSamples, meanS: number, definedKm2: number, region?: PreparedRegion): CandidateMetrics['projectedVsGeodesicArea'] {
  const integratedAreaKm2 = meanS * definedKm2;
  let projectedAreaKm2: number | null = null;
  if (region && region.containsPole === 0) {
    const ev = createFactorEvaluator(resolved);
    const xy = new Float64Array(2);
    const perPolygon = new Map<number, number>();
    let ok = true;
    for (const { ring, isHole, polygon } of region.sourceRings) {
      let twice = 0;
      let x0 = NaN, y0 = NaN, xp = NaN, yp = NaN;
      const pts = densifyRing(ring, 0.1);
      for (let i = 0; i < pts.length && ok; i++) {
        ev.forward(pts[i][0] * DEG_TO_RAD, pts[i][1] * DEG_TO_RAD, xy);
        if (!Number.isFinite(xy[0]) || !Number.isFinite(xy[1])) ok = false;
        if (i === 0) [x0, y0] = [xy[0], xy[1]];
        else twice += xp * xy[1] - xy[0] * yp;
        [xp, yp] = [xy[0], xy[1]];
      }
      twice += xp * y0 - x0 * yp;
      const a = Math.abs(twice) / 2e6;
      perPolygon.set(polygon, (perPolygon.get(polygon) ?? 0) + (isHole ? -a : a));
    }
    if (ok) {
      projectedAreaKm2 = 0;
      for (const a of perPolygon.values()) projectedAreaKm2 += Math.abs(a);
      // A boundary torn by the projection's cut (e.g. the antimeridian of a cylinder) gives a
      // meaningless shoelace: trust it only when it agrees with ∫ s dA within 5 %.
      if (!(Math.abs(projectedAreaKm2 / integratedAreaKm2 - 1) < 0.05)) projectedAreaKm2 = null;
    }
  }
  const best = projectedAreaKm2 ?? integratedAreaKm2;
  return { geodesicAreaKm2: samples.areaKm2, projectedAreaKm2, integratedAreaKm2, ratio: samples.areaKm2 ? best / samples.areaKm2 : null };
}

function densifyRing(ring: readonly (readonly number[])[], stepDeg: number): number[][] {
  const out: number[][] = [];
  for (let i = 0; i + 1 < ring.length; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[i + 1];
    const k = Math.max(1, Math.ceil(Math.max(Math.abs(x1 - x0), Math.abs(y1 - y0)) / stepDeg));
    for (let j = 0; j < k; j++) out.push([x0 + ((x1 - x0) * j) / k, y0 + ((y1 - y0) * j) / k]);
  }
  return out;
}

import { resolveDefinitionWith as resolveDefinition } from './definition-core';
import { computeSampleFields } from './fields';
import type { RegionInput } from './region/geojson';
import { prepareRegion, type PreparedRegion } from './region/prepare';
import { regionSummary } from './region/summary';
import { sampleRegion, type RegionSamples } from './sampling';
import { metricsFromFields } from './scorecard';
import { minimise } from './nelder-mead';

export type Criterion = 'airy-kavrayskiy' | 'areal' | 'angular' | 'distance';
export const CRITERIA: readonly Criterion[] = ['airy-kavrayskiy', 'areal', 'angular', 'distance'];

export interface OptimiseOptions {
  /** Samples used during the search (default 4 000; the result is re-scored on the same ones). */
  samples?: number;
  seed?: number;
  /** Ellipsoid parameters appended to every definition (default +ellps=WGS84). */
  ellipsoid?: string;
  maxEvaluations?: number;
}

export interface OptimiseResult {
  family: string;
  criterion: Criterion;
  definition: string;
  params: Record<string, number>;
  metric: number;
  baseline: { definition: string; params: Record<string, number>; metric: number };
  /** 100·(baseline − optimum)/baseline. */
  gainPct: number;
  evaluations: number;
}

interface FamilySpace {
  names: string[];
  start: number[];
  bounds: [number, number][];
  build: (x: number[]) => string;
}

/**
 * The criterion for a definition over samples. For the scale-sensitive criteria the map is taken
 * as defined (no rescale), so k₀ and standard parallels matter:
 * airy-kavrayskiy √(mean ½[(ln a)² + (ln b)²]); areal √(mean (ln s)²); angular mean ω (degrees);
 * distance mean |ln(projected/geodesic)| after the best uniform rescale (scale-free).
 */
export function criterionValue(definition: string, samples: RegionSamples, criterion: Criterion): number {
  const resolved = resolveDefinition(definition);
  const f = computeSampleFields(resolved, samples);
  if (criterion === 'distance') return metricsFromFields(resolved, samples, f).distanceError.mean;
  let sum = 0;
  let wsum = 0;
  for (let i = 0; i < samples.count; i++) {
    const a = f.a[i];
    if (a !== a) continue;
    const w = samples.weightKm2[i];
    const la = Math.log(a);
    const lb = Math.log(f.b[i]);
    const v = criterion === 'airy-kavrayskiy' ? 0.5 * (la * la + lb * lb) : criterion === 'areal' ? (la + lb) ** 2 : f.omegaDeg[i];
    sum += w * v;
    wsum += w;
  }
  if (!wsum) return Infinity;
  return criterion === 'angular' ? sum / wsum : Math.sqrt(sum / wsum);
}

/**
 * Searches a family's parameters (standard parallels, centre, k₀) inside bounds set by the
 * region, with Nelder–Mead from the rule-of-thumb parameters, and reports the gain over them.
 * Families: lcc, aea, eqdc (lat_1, lat_2), laea, aeqd (lat_0, lon_0), stere (lat_0, lon_0, k_0),
 * tmerc (lon_0, k_0), merc, cea, eqc (lat_ts). k₀ is searched only for scale-sensitive criteria.
 * Example: optimise(usa48, 'lcc', 'airy-kavrayskiy').gainPct ≥ 0.
 */
export function optimise(input: RegionInput | PreparedRegion, family: string, criterion: Criterion, options: OptimiseOptions = {}): OptimiseResult {
  if (!CRITERIA.includes(criterion)) throw new Error(`unknown criterion "${criterion}" (one of ${CRITERIA.join(', ')})`);
  const region = 'rings' in input ? input : prepareRegion(input);
  const summary = regionSummary(region);
  const samples = sampleRegion(region, { count: options.samples ?? 4000, seed: options.seed ?? 1, pairs: criterion === 'distance' ? 1000 : 0 });
  const space = familySpace(family, summary, criterion !== 'angular' && criterion !== 'distance', options.ellipsoid ?? '+ellps=WGS84');
  const objective = (x: number[]) => {
    try {
      return criterionValue(space.build(x), samples, criterion);
    } catch {
      return Infinity;
    }
  };
  const baselineValue = objective(space.start);
  const result = minimise(objective, space.start, space.bounds, { maxEvaluations: options.maxEvaluations ?? 60 * space.start.length + 40 });
  const best = result.value <= baselineValue ? result : { x: space.start, value: baselineValue, evaluations: result.evaluations };
  const named = (x: number[]) => Object.fromEntries(space.names.map((k, i) => [k, Math.round(x[i] * 1e6) / 1e6]));
  return {
    family,
    criterion,
    definition: space.build(best.x),
    params: named(best.x),
    metric: best.value,
    baseline: { definition: space.build(space.start), params: named(space.start), metric: baselineValue },
    gainPct: baselineValue > 0 ? (100 * (baselineValue - best.value)) / baselineValue : 0,
    evaluations: result.evaluations,
  };
}

function familySpace(family: string, r: ReturnType<typeof regionSummary>, withScale: boolean, ell: string): FamilySpace {
  const [, south, , north] = r.bbox;
  const span = Math.max(north - south, 0.5);
  const lat0 = r.centreLatDeg;
  const lon0 = r.centreLonDeg;
  const latBounds: [number, number] = [Math.max(-89.5, south - span / 2), Math.min(89.5, north + span / 2)];
  const lonBounds: [number, number] = [lon0 - Math.max(r.lonSpanDeg, 1) / 2, lon0 + Math.max(r.lonSpanDeg, 1) / 2];
  const f = (x: number) => Number(x.toFixed(6));
  switch (family) {
    case 'lcc':
    case 'aea':
    case 'eqdc':
      return {
        names: ['lat_1', 'lat_2'],
        start: [south + span / 6, north - span / 6],
        bounds: [latBounds, latBounds],
        build: ([a, b]) => `+proj=${family} +lat_1=${f(a)} +lat_2=${f(b)} +lat_0=${f(lat0)} +lon_0=${f(lon0)} ${ell}`,
      };
    case 'laea':
    case 'aeqd':
      return {
        names: ['lat_0', 'lon_0'],
        start: [lat0, lon0],
        bounds: [[Math.max(-90, south), Math.min(90, north)], lonBounds],
        build: ([a, b]) => `+proj=${family} +lat_0=${f(a)} +lon_0=${f(b)} ${ell}`,
      };
    case 'stere':
      return withScale
        ? {
            names: ['lat_0', 'lon_0', 'k_0'],
            start: [lat0, lon0, 1],
            bounds: [[Math.max(-90, south), Math.min(90, north)], lonBounds, [0.9, 1.1]],
            build: ([a, b, k]) => `+proj=stere +lat_0=${f(a)} +lon_0=${f(b)} +k_0=${f(k)} ${ell}`,
          }
        : {
            names: ['lat_0', 'lon_0'],
            start: [lat0, lon0],
            bounds: [[Math.max(-90, south), Math.min(90, north)], lonBounds],
            build: ([a, b]) => `+proj=stere +lat_0=${f(a)} +lon_0=${f(b)} ${ell}`,
          };
    case 'tmerc':
      return withScale
        ? {
            names: ['lon_0', 'k_0'],
            start: [lon0, 0.9996],
            bounds: [lonBounds, [0.9, 1.1]],
            build: ([l, k]) => `+proj=tmerc +lon_0=${f(l)} +k_0=${f(k)} ${ell}`,
          }
        : { names: ['lon_0'], start: [lon0], bounds: [lonBounds], build: ([l]) => `+proj=tmerc +lon_0=${f(l)} ${ell}` };
    case 'merc':
    case 'cea':
    case 'eqc':
      return {
        names: ['lat_ts'],
        start: [Math.min(85, Math.abs(lat0))],
        bounds: [[0, 85]],
        build: ([t]) => `+proj=${family} +lat_ts=${f(t)} +lon_0=${f(lon0)} ${ell}`,
      };
    default:
      throw new Error(`optimise: family "${family}" has no parameter search (lcc, aea, eqdc, laea, aeqd, stere, tmerc, merc, cea, eqc)`);
  }
}

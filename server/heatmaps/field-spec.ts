import type { HeatmapField } from '../../shared/api/audits.schema.js';
import type { FieldStats } from '../jobs/fields-codec.js';
import { rampHex, type RampName } from './ramps.js';

/** Indices of the factor scratch array the engine's evaluator fills (h, k, s, ω°, a, b, …). */
const S = 2, OMEGA = 3, A = 4, B = 5;

/**
 * How one heatmap field is computed from the Tissot quantities at a point and coloured.
 * `value` reads the evaluator's scratch array; `toT` maps a value onto the ramp's 0–1.
 */
export interface FieldSpec {
  field: HeatmapField;
  label: string;
  units: string;
  explanation: string;
  ramp: RampName;
  /** The value range the ramp covers (values outside are clamped to its ends). */
  domain: [number, number];
  value: (f: Float64Array) => number;
  toT: (v: number) => number;
  /** A value as the legend prints it. */
  format: (v: number) => string;
}

/** Smallest half-range of ln s shown, so a near-equal-area map is not coloured by rounding noise. */
const MIN_LN_S_RANGE = Math.log(1.001);
const MIN_OMEGA_RANGE_DEG = 0.01;
const MIN_SCALE_ERROR_RANGE_PCT = 0.01;

/**
 * The spec of a field for one candidate of one audit. Domains come from that candidate's sample
 * statistics, so the legend is the same whatever the image size and the colours use the full ramp.
 */
export function fieldSpec(field: HeatmapField, stats: FieldStats): FieldSpec {
  if (field === 'areal-scale') {
    const L = Math.max(stats.lnArealScaleAbsMax, MIN_LN_S_RANGE);
    return {
      field,
      label: 'Areal scale s',
      units: 'ratio (1 = true area)',
      explanation: 'How much larger (red) or smaller (blue) areas appear than on the ground; coloured on a log scale centred on 1.',
      ramp: 'diverging',
      domain: [Math.exp(-L), Math.exp(L)],
      value: (f) => Math.log(f[S]),
      toT: (lnS) => (lnS + L) / (2 * L),
      format: (lnS) => Math.exp(lnS).toPrecision(4),
    };
  }
  if (field === 'angular-deformation') {
    const hi = Math.max(stats.omegaMaxDeg, MIN_OMEGA_RANGE_DEG);
    return {
      field,
      label: 'Angular deformation ω',
      units: 'degrees',
      explanation: 'The largest amount, in degrees, by which an angle on the ground is bent on the map at that place.',
      ramp: 'sequential',
      domain: [0, hi],
      value: (f) => f[OMEGA],
      toT: (w) => w / hi,
      format: (w) => `${w.toPrecision(3)}°`,
    };
  }
  const hi = Math.max(stats.scaleErrorMaxPct, MIN_SCALE_ERROR_RANGE_PCT);
  const lnC = Math.log(stats.bestScale);
  return {
    field,
    label: 'Scale error',
    units: 'per cent',
    explanation:
      'How far the scale in the worst direction is from true, after the whole map is rescaled by the single factor that fits the region best.',
    ramp: 'sequential',
    domain: [0, hi],
    value: (f) => (Math.exp(Math.max(Math.abs(lnC + Math.log(f[A])), Math.abs(lnC + Math.log(f[B])))) - 1) * 100,
    toT: (pct) => pct / hi,
    format: (pct) => `${pct.toPrecision(3)} %`,
  };
}

export interface Legend {
  field: HeatmapField;
  label: string;
  units: string;
  explanation: string;
  scale: 'log' | 'linear';
  domain: [number, number];
  /** Evenly spaced along the ramp: position t (0–1), colour and the value printed there. */
  stops: { t: number; color: string; value: number; text: string }[];
}

/** The legend of a field as data: nine stops along its ramp, with the values they stand for. */
export function legendFor(spec: FieldSpec): Legend {
  const log = spec.field === 'areal-scale';
  const [lo, hi] = log ? [Math.log(spec.domain[0]), Math.log(spec.domain[1])] : spec.domain;
  const stops = Array.from({ length: 9 }, (_, i) => {
    const t = i / 8;
    const v = lo + t * (hi - lo);
    return { t, color: rampHex(spec.ramp, t), value: log ? Math.exp(v) : v, text: spec.format(v) };
  });
  return {
    field: spec.field,
    label: spec.label,
    units: spec.units,
    explanation: spec.explanation,
    scale: log ? 'log' : 'linear',
    domain: spec.domain,
    stops,
  };
}

import { DEG_TO_RAD } from './constants';
import type { ResolvedDefinition } from './definition';
import { createFactorEvaluator } from './evaluator';

/** The Tissot quantities at one point (ω, convergence and θ′ in degrees). */
export interface PointFactors {
  defined: true;
  h: number;
  k: number;
  s: number;
  omegaDeg: number;
  a: number;
  b: number;
  convergenceDeg: number;
  thetaPrimeDeg: number;
}

/** A point where the projection is undefined (a singular pole, the far side of an azimuthal, …). */
export interface UndefinedFactors {
  defined: false;
}

/**
 * Tissot factors at one point on the definition's own ellipsoid (Snyder 1987, eqs. 4-9 to 4-12).
 * For many points use createFactorEvaluator, which compiles the projection once.
 * Example: factorsAt(resolveDefinition('+proj=merc +R=1'), 0, 60) → { h: 2, k: 2, s: 4, omegaDeg: 0, … }.
 */
export function factorsAt(resolved: ResolvedDefinition, lonDeg: number, latDeg: number): PointFactors | UndefinedFactors {
  const out = new Float64Array(8);
  const evaluator = createFactorEvaluator(resolved);
  if (!evaluator.factorsRad(lonDeg * DEG_TO_RAD, latDeg * DEG_TO_RAD, out, true)) return { defined: false };
  return {
    defined: true,
    h: out[0],
    k: out[1],
    s: out[2],
    omegaDeg: out[3],
    a: out[4],
    b: out[5],
    convergenceDeg: out[6],
    thetaPrimeDeg: out[7],
  };
}

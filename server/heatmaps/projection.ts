import type { ResolvedDefinition } from '../../shared/engine/definition.js';
import { createFactorEvaluator } from '../../shared/engine/evaluator.js';
import { createProj4Projection } from '../../shared/engine/proj4-object.js';
import type { ForwardDeg } from './frame.js';
import type { PixelProjection } from './render-field.js';

const DEG = Math.PI / 180;

export interface CandidateProjection extends PixelProjection {
  /** lon/lat degrees → projected metres (false origin included), or null where undefined. */
  forwardDeg: ForwardDeg;
}

/**
 * Forward, inverse and factors of one candidate: forward and factors from the engine's compiled
 * evaluator, the inverse from proj4's own inverse of the same definition. proj4 writes into the
 * point object it is given, so each call passes a fresh one.
 */
export function candidateProjection(resolved: ResolvedDefinition): CandidateProjection {
  const evaluator = createFactorEvaluator(resolved);
  const proj = createProj4Projection(resolved.proj4);
  const xy = new Float64Array(2);
  return {
    forwardDeg(lonDeg, latDeg) {
      evaluator.forward(lonDeg * DEG, latDeg * DEG, xy);
      return Number.isFinite(xy[0]) && Number.isFinite(xy[1]) ? [xy[0], xy[1]] : null;
    },
    inverse(xM, yM, out) {
      let r: { x: number; y: number } | null | undefined;
      try {
        r = proj.inverse({ x: xM, y: yM });
      } catch {
        return false;
      }
      if (!r || !Number.isFinite(r.x) || !Number.isFinite(r.y)) return false;
      out[0] = r.x;
      out[1] = r.y;
      return true;
    },
    factors: (lonRad, latRad, out) => evaluator.factorsRad(lonRad, latRad, out),
  };
}

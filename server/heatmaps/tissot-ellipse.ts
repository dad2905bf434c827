import type { ResolvedDefinition } from '../../shared/engine/definition.js';
import { meridianRadiusM, primeVerticalRadiusM } from '../../shared/engine/ellipsoid.js';
import type { CandidateProjection } from './projection.js';

const DEG = Math.PI / 180;
/** Central-difference step for the orientation only (the axes come from the engine). */
const STEP_DEG = 1e-4;

/**
 * Direction of the indicatrix's major axis on the map, in radians counter-clockwise from +x.
 * The images of the ground's east and north unit vectors are E = (∂x/∂λ, ∂y/∂λ)/(N cos φ) and
 * V = (∂x/∂φ, ∂y/∂φ)/M; the indicatrix is J·(unit circle) with J = [E V], whose major axis is the
 * leading eigenvector of J Jᵀ: θ = ½ atan2(2B, A − C) with A = Ex² + Vx², B = Ex Ey + Vx Vy,
 * C = Ey² + Vy² (the singular-value decomposition of a 2 × 2 matrix).
 */
export function majorAxisAngleRad(resolved: ResolvedDefinition, projection: CandidateProjection, lonDeg: number, latDeg: number): number | null {
  const e = projection.forwardDeg(lonDeg + STEP_DEG, latDeg), w = projection.forwardDeg(lonDeg - STEP_DEG, latDeg);
  const n = projection.forwardDeg(lonDeg, latDeg + STEP_DEG), s = projection.forwardDeg(lonDeg, latDeg - STEP_DEG);
  if (!e || !w || !n || !s) return null;
  const phi = latDeg * DEG;
  const ell = resolved.factorEllipsoid;
  const d = 2 * STEP_DEG * DEG;
  const nCos = primeVerticalRadiusM(ell, phi) * Math.cos(phi), m = meridianRadiusM(ell, phi);
  const ex = (e[0] - w[0]) / d / nCos, ey = (e[1] - w[1]) / d / nCos;
  const vx = (n[0] - s[0]) / d / m, vy = (n[1] - s[1]) / d / m;
  const A = ex * ex + vx * vx, B = ex * ey + vx * vy, C = ey * ey + vy * vy;
  return 0.5 * Math.atan2(2 * B, A - C);
}

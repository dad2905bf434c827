import { RAD_TO_DEG } from './constants';

/** Indices into the scratch array filled by tissotFromJacobian. */
export const T_H = 0, T_K = 1, T_S = 2, T_OMEGA_DEG = 3, T_A = 4, T_B = 5, T_CONV_DEG = 6, T_THETA_DEG = 7;

/**
 * The Tissot indicatrix from the partial derivatives of a forward projection
 * (Snyder 1987, eqs. 4-9 to 4-12; PROJ's pj_factors uses the same definitions).
 *
 * xl = ∂x/∂λ, yl = ∂y/∂λ, xp = ∂x/∂φ, yp = ∂y/∂φ in metres per radian; mM the meridian radius M,
 * nCosPhiM the parallel's radius N cos φ. With the east and north unit vectors' images
 * E = (xl, yl)/(N cos φ) = (p, q) and Nv = (xp, yp)/M = (r, t):
 *   h = |Nv|, k = |E|, s = p t − q r (areal scale), sin θ′ = s/(h k),
 *   a′ = √(h² + k² + 2s) = |(p + t, q − r)|, b′ = √(h² + k² − 2s) = |(p − t, q + r)|,
 *   a = (a′ + b′)/2, b = (a′ − b′)/2, ω = 2 asin(b′/a′), convergence γ = −atan2(xp, yp).
 * b′ is formed from the differences p − t and q + r, never as √(h² + k² − 2s), so it does not
 * cancel where h ≈ k: ω of a conformal map comes out at rounding level, not √ε.
 *
 * Example: a conformal map with xl = N cos φ, yp = M gives h = k = 1, ω = 0.
 * Writes h, k, s, ω°, a, b, γ° into out[0..6], and θ′° into out[7] when withTheta is set. A
 * reversed (mirrored) map has s < 0; its areal scale is reported as |s|.
 */
export function tissotFromJacobian(
  xl: number,
  yl: number,
  xp: number,
  yp: number,
  mM: number,
  nCosPhiM: number,
  out: Float64Array,
  withTheta = false,
): void {
  const p = xl / nCosPhiM;
  const q = yl / nCosPhiM;
  const r = xp / mM;
  const t = yp / mM;
  const h = Math.sqrt(r * r + t * t);
  const k = Math.sqrt(p * p + q * q);
  let s = p * t - q * r;
  const u1 = p + t, u2 = q - r, v1 = p - t, v2 = q + r;
  let aPrime = Math.sqrt(u1 * u1 + u2 * u2);
  let bPrime = Math.sqrt(v1 * v1 + v2 * v2);
  if (s < 0) {
    s = -s;
    const swap = aPrime;
    aPrime = bPrime;
    bPrime = swap;
  }
  out[T_H] = h;
  out[T_K] = k;
  out[T_S] = s;
  out[T_A] = 0.5 * (aPrime + bPrime);
  out[T_B] = 0.5 * (aPrime - bPrime);
  const ratio = bPrime / aPrime;
  out[T_OMEGA_DEG] = 2 * Math.asin(ratio > 1 ? 1 : ratio) * RAD_TO_DEG;
  out[T_CONV_DEG] = -Math.atan2(xp, yp) * RAD_TO_DEG;
  if (withTheta) {
    const sinTheta = s / (h * k);
    out[T_THETA_DEG] = Math.asin(sinTheta > 1 ? 1 : sinTheta) * RAD_TO_DEG;
  }
}

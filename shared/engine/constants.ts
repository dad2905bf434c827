/**
 * Numerical constants and clamped trigonometry shared by the whole engine.
 * Radians inside the engine; degrees only at its edges (input parsing and reports).
 */

export const DEG_TO_RAD = Math.PI / 180;
export const RAD_TO_DEG = 180 / Math.PI;
export const HALF_PI = Math.PI / 2;
export const TWO_PI = 2 * Math.PI;

/** Semi-major axis and flattening of WGS84 (NIMA TR8350.2, 2000). */
export const WGS84_A_M = 6378137;
export const WGS84_F = 1 / 298.257223563;

/**
 * Step of the central differences used for numerical derivatives of a forward projection.
 * Truncation error is ~stepRad² · f‴/6 and rounding error ~ε·|f|/stepRad; both are about
 * 1e-11 relative for stepRad = 1e-5 rad (≈ 64 m on the ground), the balance point (3ε)^(1/3).
 */
export const DERIVATIVE_STEP_RAD = 1e-5;

/** Latitudes closer than this to a pole are evaluated at this distance (the limit value). */
export const POLE_GUARD_RAD = 1e-9;

/** asin that never returns NaN for arguments a rounding error outside [−1, 1]. */
export function asinClamped(x: number): number {
  return Math.asin(x > 1 ? 1 : x < -1 ? -1 : x);
}

/** acos that never returns NaN for arguments a rounding error outside [−1, 1]. */
export function acosClamped(x: number): number {
  return Math.acos(x > 1 ? 1 : x < -1 ? -1 : x);
}

/** Wraps an angle in radians to [−π, π]. Example: wrapPi(3π/2) === −π/2. */
export function wrapPi(angleRad: number): number {
  if (angleRad >= -Math.PI && angleRad <= Math.PI) return angleRad;
  const r = angleRad - TWO_PI * Math.floor((angleRad + Math.PI) / TWO_PI);
  return r;
}

/** Wraps a longitude in degrees to [−180, 180]. Example: wrapLonDeg(190) === −170. */
export function wrapLonDeg(lonDeg: number): number {
  if (lonDeg >= -180 && lonDeg <= 180) return lonDeg;
  return lonDeg - 360 * Math.floor((lonDeg + 180) / 360);
}

/** Clamps x into [lo, hi]. */
export function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

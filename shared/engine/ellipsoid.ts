import { HALF_PI } from './constants';

/** An ellipsoid of revolution: semi-major axis aM (metres) and first eccentricity squared es (0 for a sphere). */
export interface Ellipsoid {
  aM: number;
  es: number;
  name?: string;
}

/** Builds an ellipsoid from a and inverse flattening (rf = 0 or Infinity gives a sphere). */
export function ellipsoidFromFlattening(aM: number, rf: number, name?: string): Ellipsoid {
  const f = rf && Number.isFinite(rf) ? 1 / rf : 0;
  return { aM, es: f * (2 - f), name };
}

/**
 * Meridian radius of curvature M = a(1 − e²)/(1 − e² sin²φ)^{3/2} (Snyder 1987, eq. 4-18).
 * Example: meridianRadiusM({ aM: 1, es: 0 }, 0.3) === 1.
 */
export function meridianRadiusM(ell: Ellipsoid, latRad: number): number {
  const sinPhi = Math.sin(latRad);
  const w = 1 - ell.es * sinPhi * sinPhi;
  return (ell.aM * (1 - ell.es)) / (w * Math.sqrt(w));
}

/**
 * Prime-vertical radius of curvature N = a/(1 − e² sin²φ)^{1/2} (Snyder 1987, eq. 4-20).
 * Example: primeVerticalRadiusM(WGS84, 0) === 6378137.
 */
export function primeVerticalRadiusM(ell: Ellipsoid, latRad: number): number {
  const sinPhi = Math.sin(latRad);
  return ell.aM / Math.sqrt(1 - ell.es * sinPhi * sinPhi);
}

/**
 * q(φ) of the authalic latitude (Snyder 1987, eq. 3-12):
 * q = (1 − e²)[sin φ/(1 − e² sin²φ) − 1/(2e) ln((1 − e sin φ)/(1 + e sin φ))]; on the sphere q = 2 sin φ.
 */
export function authalicQ(es: number, sinPhi: number): number {
  if (es < 1e-15) return 2 * sinPhi;
  const e = Math.sqrt(es);
  const esp = e * sinPhi;
  return (1 - es) * (sinPhi / (1 - esp * esp) - (1 / (2 * e)) * Math.log((1 - esp) / (1 + esp)));
}

/** q at the pole, q_p = q(90°) (Snyder 1987, eq. 3-12 with φ = 90°). */
export function authalicQPole(es: number): number {
  return authalicQ(es, 1);
}

/**
 * Authalic radius R_q = a √(q_p/2) (Snyder 1987, eq. 3-13): the sphere of the same area.
 * Example: WGS84 gives 6371007.18 m.
 */
export function authalicRadiusM(ell: Ellipsoid): number {
  return ell.aM * Math.sqrt(authalicQPole(ell.es) / 2);
}

/** Authalic latitude β = asin(q/q_p) (Snyder 1987, eq. 3-11). */
export function authalicLatitude(ell: Ellipsoid, latRad: number): number {
  const r = authalicQ(ell.es, Math.sin(latRad)) / authalicQPole(ell.es);
  return Math.asin(r > 1 ? 1 : r < -1 ? -1 : r);
}

/**
 * Geodetic latitude from authalic latitude: Snyder 1987, eq. 3-18 series, refined by one
 * Newton step of eq. 3-16, accurate to ~1e-15 rad for the Earth's ellipsoids.
 * Example: geodeticFromAuthalic(WGS84, authalicLatitude(WGS84, 0.7)) ≈ 0.7.
 */
export function geodeticFromAuthalic(ell: Ellipsoid, betaRad: number): number {
  const es = ell.es;
  if (es < 1e-15) return betaRad;
  if (Math.abs(betaRad) >= HALF_PI) return betaRad;
  const e4 = es * es;
  const e6 = e4 * es;
  let phi =
    betaRad +
    (es / 3 + (31 * e4) / 180 + (517 * e6) / 5040) * Math.sin(2 * betaRad) +
    ((23 * e4) / 360 + (251 * e6) / 3780) * Math.sin(4 * betaRad) +
    ((761 * e6) / 45360) * Math.sin(6 * betaRad);
  const q = authalicQPole(es) * Math.sin(betaRad);
  const e = Math.sqrt(es);
  for (let i = 0; i < 2; i++) {
    const sinPhi = Math.sin(phi);
    const cosPhi = Math.cos(phi);
    const w = 1 - es * sinPhi * sinPhi;
    const esp = e * sinPhi;
    const step =
      ((w * w) / (2 * cosPhi)) *
      (q / (1 - es) - sinPhi / w + (1 / (2 * e)) * Math.log((1 - esp) / (1 + esp)));
    phi += step;
    if (Math.abs(step) < 1e-15) break;
  }
  return phi;
}

/** Total area of the ellipsoid, 4π R_q² (Snyder 1987, eq. 3-13). Example: WGS84 gives 5.10066e14 m². */
export function ellipsoidAreaM2(ell: Ellipsoid): number {
  const rq = authalicRadiusM(ell);
  return 4 * Math.PI * rq * rq;
}

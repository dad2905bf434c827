/**
 * Rhumb lines between two places on an ellipsoid, in lon/lat degrees. The engine's own
 * rhumbPoints works on the sphere; on an ellipsoidal Mercator only the ellipsoid's isometric
 * latitude makes the loxodrome exactly straight, so routes are drawn with this one.
 */

const DEG = Math.PI / 180;

/**
 * Refuses a pair of places between which no route can be drawn: the same point, or antipodes
 * (every great circle through them is equally short, so "the" great circle is not defined).
 */
export function checkRouteEnds(a: [number, number], b: [number, number]): void {
  const v = ([lon, lat]: [number, number]) => [Math.cos(lat * DEG) * Math.cos(lon * DEG), Math.cos(lat * DEG) * Math.sin(lon * DEG), Math.sin(lat * DEG)];
  const p = v(a), q = v(b);
  const omega = Math.acos(Math.max(-1, Math.min(1, p[0] * q[0] + p[1] * q[1] + p[2] * q[2])));
  if (omega < 1e-9) throw new Error('the two places are the same point');
  if (Math.PI - omega < 1e-7) throw new Error('the two places are antipodal, so the great circle between them is not unique');
}

/**
 * Isometric latitude ψ = atanh(sin φ) − e·atanh(e sin φ) (Snyder 1987, eq. 3-7 in logarithmic
 * form); Mercator's y is a·ψ, so a line of constant bearing has ψ linear in λ.
 */
export function isometricLatitude(latRad: number, es: number): number {
  const s = Math.sin(latRad);
  const e = Math.sqrt(es);
  return Math.atanh(s) - e * Math.atanh(e * s);
}

/** Geodetic latitude from isometric latitude, by fixed-point iteration of Snyder 1987 eq. 7-9. */
export function latitudeFromIsometric(psi: number, es: number): number {
  const e = Math.sqrt(es);
  let phi = 2 * Math.atan(Math.exp(psi)) - Math.PI / 2;
  for (let i = 0; i < 30; i++) {
    const es_ = e * Math.sin(phi);
    const next = 2 * Math.atan(Math.exp(psi) * ((1 + es_) / (1 - es_)) ** (e / 2)) - Math.PI / 2;
    if (Math.abs(next - phi) < 1e-15) return next;
    phi = next;
  }
  return phi;
}

/**
 * n + 1 points along the rhumb line (loxodrome) from a to b on an ellipsoid of eccentricity² es,
 * the shorter way round in longitude: ψ and λ change in proportion (a straight line on Mercator).
 * An east–west rhumb (equal latitudes) follows the parallel.
 */
export function rhumbPoints(a: [number, number], b: [number, number], es: number, n = 128): [number, number][] {
  if (Math.abs(a[1]) >= 90 || Math.abs(b[1]) >= 90) throw new Error('a rhumb line cannot start or end at a pole');
  let dLon = b[0] - a[0];
  dLon -= 360 * Math.round(dLon / 360);
  const psiA = isometricLatitude(a[1] * DEG, es), psiB = isometricLatitude(b[1] * DEG, es);
  const out: [number, number][] = [];
  for (let i = 0; i <= n; i++) {
    const t = i / n;
    const lat = a[1] === b[1] ? a[1] : latitudeFromIsometric(psiA + t * (psiB - psiA), es) / DEG;
    out.push([a[0] + t * dLon, lat]);
  }
  return out;
}

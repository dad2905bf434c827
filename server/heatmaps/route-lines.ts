/**
 * Densified great-circle and rhumb-line routes between two places, in lon/lat degrees.
 * Kept apart from drawing so tests can check them against their defining properties.
 */

const DEG = Math.PI / 180;

/**
 * n + 1 points along the great circle from a to b on the sphere through the geodetic
 * coordinates (spherical linear interpolation of the unit vectors) — the line a gnomonic map,
 * itself computed on a sphere, draws straight. Throws for coincident or antipodal places,
 * between which the great circle is not defined or not unique.
 */
export function greatCirclePoints(a: [number, number], b: [number, number], n = 128): [number, number][] {
  const v = ([lon, lat]: [number, number]) => [Math.cos(lat * DEG) * Math.cos(lon * DEG), Math.cos(lat * DEG) * Math.sin(lon * DEG), Math.sin(lat * DEG)];
  const p = v(a), q = v(b);
  const dot = Math.max(-1, Math.min(1, p[0] * q[0] + p[1] * q[1] + p[2] * q[2]));
  const omega = Math.acos(dot);
  if (omega < 1e-12) throw new Error('the two places are the same point');
  if (Math.PI - omega < 1e-7) throw new Error('the two places are antipodal, so the great circle between them is not unique');
  const out: [number, number][] = [];
  for (let i = 0; i <= n; i++) {
    const t = i / n;
    const wa = Math.sin((1 - t) * omega) / Math.sin(omega), wb = Math.sin(t * omega) / Math.sin(omega);
    const x = wa * p[0] + wb * q[0], y = wa * p[1] + wb * q[1], z = wa * p[2] + wb * q[2];
    out.push([Math.atan2(y, x) / DEG, Math.atan2(z, Math.hypot(x, y)) / DEG]);
  }
  return unwrapLongitudes(out);
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

/** Makes consecutive longitudes differ by less than 180° (so a route across ±180° stays in one piece). */
function unwrapLongitudes(points: [number, number][]): [number, number][] {
  for (let i = 1; i < points.length; i++) {
    let lon = points[i][0];
    while (lon - points[i - 1][0] > 180) lon -= 360;
    while (lon - points[i - 1][0] < -180) lon += 360;
    points[i][0] = lon;
  }
  return points;
}

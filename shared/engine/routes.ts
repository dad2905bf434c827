import { DEG_TO_RAD, RAD_TO_DEG } from './constants';
import { geodesicFor } from './geodesic';
import { ellipsoidFromFlattening, type Ellipsoid } from './ellipsoid';
import { WGS84_A_M, WGS84_F } from './constants';

/**
 * Points along the geodesic (great ellipse on the sphere) from A to B, at most stepKm apart,
 * both ends included — GeographicLib's InverseLine and ArcPosition (Karney 2013).
 * Example: geodesicPoints([0, 0], [90, 0], 5000).length === 3 (the equator, 10 019 km).
 */
export function geodesicPoints(fromLonLat: readonly number[], toLonLat: readonly number[], stepKm: number, ell: Ellipsoid = ellipsoidFromFlattening(WGS84_A_M, 1 / WGS84_F)): [number, number][] {
  const g = geodesicFor(ell);
  const line = g.InverseLine(fromLonLat[1], fromLonLat[0], toLonLat[1], toLonLat[0]);
  const n = Math.max(1, Math.ceil(line.s13 / 1000 / stepKm));
  const out: [number, number][] = [];
  for (let i = 0; i <= n; i++) {
    const p = line.Position((line.s13 * i) / n);
    out.push([p.lon2 as number, p.lat2 as number]);
  }
  return out;
}

/**
 * Points along the rhumb line (loxodrome: constant bearing) from A to B on the sphere, evenly
 * spaced in isometric latitude ψ = atanh(sin φ) and longitude (Snyder 1987, eq. 7-7 with the
 * loxodrome's straight course on a Mercator map), the shorter way in longitude; count points.
 * Example: rhumbPoints([0, 0], [10, 0], 3) → [[0, 0], [5, 0], [10, 0]].
 */
export function rhumbPoints(fromLonLat: readonly number[], toLonLat: readonly number[], count: number): [number, number][] {
  const n = Math.max(2, Math.floor(count));
  const psi = (latDeg: number) => Math.atanh(Math.sin(Math.max(-89.999999, Math.min(89.999999, latDeg)) * DEG_TO_RAD));
  const p0 = psi(fromLonLat[1]);
  const p1 = psi(toLonLat[1]);
  let dl = toLonLat[0] - fromLonLat[0];
  dl -= 360 * Math.round(dl / 360);
  const out: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    const t = i / (n - 1);
    let lon = fromLonLat[0] + t * dl;
    lon -= 360 * Math.round(lon / 360);
    const lat = Math.abs(p1 - p0) < 1e-15 ? fromLonLat[1] + t * (toLonLat[1] - fromLonLat[1]) : Math.asin(Math.tanh(p0 + t * (p1 - p0))) * RAD_TO_DEG;
    out.push([lon, lat]);
  }
  return out;
}

/** Constant bearing of the rhumb line from A to B, degrees clockwise from north. */
export function rhumbBearingDeg(fromLonLat: readonly number[], toLonLat: readonly number[]): number {
  const psi = (latDeg: number) => Math.atanh(Math.sin(latDeg * DEG_TO_RAD));
  let dl = toLonLat[0] - fromLonLat[0];
  dl -= 360 * Math.round(dl / 360);
  const b = Math.atan2(dl * DEG_TO_RAD, psi(toLonLat[1]) - psi(fromLonLat[1])) * RAD_TO_DEG;
  return (b + 360) % 360;
}

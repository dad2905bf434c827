import { WGS84_A_M, WGS84_F } from '../constants';
import { ellipsoidAreaM2, ellipsoidFromFlattening, type Ellipsoid } from '../ellipsoid';
import { geodesicFor, ringGeodesicAreaM2 } from '../geodesic';
import type { Position } from './geojson';
import type { PreparedRegion } from './prepare';

/** Longest edge, in degrees, left undivided before a ring's geodesic area is taken. */
export const AREA_DENSIFY_DEG = 0.25;

/**
 * Geodesic area (m²) of a prepared region: GeographicLib's polygon area (Karney 2013) of each
 * ring, with edges longer than AREA_DENSIFY_DEG divided so that the area is that of the region's
 * straight lon/lat edges (RFC 7946) rather than of geodesic chords; holes subtract, and each
 * polygon counts |exterior − holes| (even–odd reading: some published data wraps a polar coast as
 * a "hole" in a ring hugging the pole). A ring around a pole counts the cap on its smaller side,
 * as prepareRegion reads it.
 * Example: regionAreaM2(prepareRegion(oneDegreeSquareAtEquator)) ≈ 1.2309e10.
 */
export function regionAreaM2(region: PreparedRegion, ell: Ellipsoid = ellipsoidFromFlattening(WGS84_A_M, 1 / WGS84_F)): number {
  const g = geodesicFor(ell);
  const total = ellipsoidAreaM2(ell);
  const perPolygon = new Map<number, number>();
  for (const { ring, isHole, pole, polygon } of region.sourceRings) {
    let a = Math.abs(ringGeodesicAreaM2(g, densify(ring)));
    if (pole !== 0) {
      a %= total;
      a = Math.min(a, total - a);
    }
    perPolygon.set(polygon, (perPolygon.get(polygon) ?? 0) + (isHole ? -a : a));
  }
  let area = 0;
  for (const a of perPolygon.values()) area += Math.abs(a);
  return area;
}

function densify(ring: Position[]): Position[] {
  const out: Position[] = [];
  for (let i = 0; i + 1 < ring.length; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[i + 1];
    const steps = Math.max(1, Math.ceil(Math.max(Math.abs(x1 - x0), Math.abs(y1 - y0)) / AREA_DENSIFY_DEG));
    for (let s = 0; s < steps; s++) out.push([x0 + ((x1 - x0) * s) / steps, y0 + ((y1 - y0) * s) / steps]);
  }
  out.push(ring[ring.length - 1]);
  return out;
}

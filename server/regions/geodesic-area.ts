import geodesic from 'geographiclib-geodesic';
import type { PolygonRings, Ring } from './polygon-rings.js';

const WGS84 = geodesic.Geodesic.WGS84;

/**
 * Signed area of a ring on the WGS84 ellipsoid with geodesic edges (GeographicLib, Karney 2013,
 * "Algorithms for geodesics", J. Geodesy 87), in m²: positive when counter-clockwise. Rings
 * that run along a pole or circle it are handled by GeographicLib's own bookkeeping.
 */
export function ringAreaM2(ring: Ring): number {
  const p = WGS84.Polygon(false);
  // The closing point repeats the first; GeographicLib closes rings itself.
  for (let i = 0; i < ring.length - 1; i++) p.AddPoint(ring[i][1], ring[i][0]);
  return p.Compute(false, true).area ?? 0;
}

/** Geodesic area of polygons in km²: exteriors minus holes (rings are in RFC 7946 order). */
export function polygonsAreaKm2(polygons: PolygonRings[]): number {
  let m2 = 0;
  for (const rings of polygons) for (const ring of rings) m2 += ringAreaM2(ring);
  return m2 / 1e6;
}

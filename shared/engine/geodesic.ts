import * as geographiclib from 'geographiclib-geodesic';
import type { Ellipsoid } from './ellipsoid';

// The package is CommonJS: its exports arrive on the namespace's default under Node's ESM loader.
const lib = ((geographiclib as unknown as { default?: typeof geographiclib }).default ?? geographiclib) as typeof geographiclib;
const { Geodesic, PolygonArea } = lib;

type GeodesicSolver = InstanceType<typeof Geodesic.Geodesic>;

/** A GeographicLib solver for an ellipsoid (Karney 2013, J. Geodesy 87). Build once per ellipsoid. */
export function geodesicFor(ell: Ellipsoid): GeodesicSolver {
  const f = 1 - Math.sqrt(1 - ell.es);
  return new Geodesic.Geodesic(ell.aM, f);
}

/** WGS84 ellipsoid as GeographicLib defines it. */
export function wgs84Geodesic(): GeodesicSolver {
  return Geodesic.WGS84;
}

/**
 * Geodesic distance in metres between two points (degrees), GeographicLib's inverse problem.
 * Example: geodesicDistanceM(wgs84Geodesic(), 0, 0, 1, 0) ≈ 111319.49 (one degree of the equator).
 */
export function geodesicDistanceM(g: GeodesicSolver, lon1Deg: number, lat1Deg: number, lon2Deg: number, lat2Deg: number): number {
  return g.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg, Geodesic.DISTANCE).s12 as number;
}

/**
 * Signed geodesic area (m², counter-clockwise positive) of a ring of [lon, lat] degrees with
 * geodesic edges (GeographicLib PolygonArea). A closing duplicate vertex is ignored.
 * Example: the ring (0,0) (1,0) (1,1) (0,1) has ≈ 1.2308e10 m² on WGS84.
 */
export function ringGeodesicAreaM2(g: GeodesicSolver, ring: readonly (readonly number[])[]): number {
  const poly = new PolygonArea.PolygonArea(g, false);
  let n = ring.length;
  if (n > 1 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n--;
  for (let i = 0; i < n; i++) poly.AddPoint(ring[i][1], ring[i][0]);
  return poly.Compute(false, true).area ?? 0;
}

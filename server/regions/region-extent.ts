import type { PolygonRings } from './polygon-rings.js';
import { ringShape } from './ring-shape.js';

export interface RegionExtent {
  /** [west, south, east, north] in degrees; west > east when the region spans the antimeridian (RFC 7946 §5.2). */
  bbox: [number, number, number, number];
  crossesAntimeridian: boolean;
  /** Poles inside the region. */
  poles: ('north' | 'south')[];
}

/**
 * The region's extent. The longitude range is the shortest arc holding every vertex: the
 * complement of the widest gap between consecutive vertex longitudes around the circle, so a
 * region split at ±180° (Fiji in Natural Earth) gets west 177°, east −178°, not the whole world.
 */
export function regionExtent(polygons: PolygonRings[]): RegionExtent {
  const lons: number[] = [];
  let south = 90;
  let north = -90;
  let crossing = false;
  let at180 = false;
  let atMinus180 = false;
  const poles = new Set<'north' | 'south'>();
  for (const rings of polygons) {
    rings.forEach((ring, i) => {
      const shape = ringShape(ring);
      if (shape.crossesAntimeridian) crossing = true;
      if (i === 0 && shape.pole) poles.add(shape.pole);
      for (const [lon, lat] of ring) {
        lons.push(lon === -180 ? 180 : lon);
        if (lat < south) south = lat;
        if (lat > north) north = lat;
        if (Math.abs(lat) < 90 && lon === 180) at180 = true;
        if (Math.abs(lat) < 90 && lon === -180) atMinus180 = true;
      }
    });
  }
  if (poles.has('north')) north = 90;
  if (poles.has('south')) south = -90;
  if (at180 && atMinus180) crossing = true;
  lons.sort((a, b) => a - b);
  let west = -180;
  let east = 180;
  if (poles.size === 0 && lons.length) {
    // Widest gap, the wrap-around gap (last → first + 360) included.
    let gap = lons[0] + 360 - lons[lons.length - 1];
    west = lons[0];
    east = lons[lons.length - 1];
    for (let i = 1; i < lons.length; i++) {
      const g = lons[i] - lons[i - 1];
      if (g > gap) {
        gap = g;
        west = lons[i];
        east = lons[i - 1];
      }
    }
    if (west === 180 && east !== 180) west = -180;
  }
  return { bbox: [west, south, east, north], crossesAntimeridian: crossing || west > east, poles: [...poles] };
}

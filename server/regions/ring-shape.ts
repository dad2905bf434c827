/** A closed ring of [lon, lat] degrees (first point repeated last). */
export type Ring = [number, number][];

export interface RingShape {
  /** Twice the signed planar area in lon/lat degrees², positive counter-clockwise. */
  area2: number;
  /** An edge of more than 180° of longitude (other than along a pole): the ring crosses ±180°. */
  crossesAntimeridian: boolean;
  /** The pole the ring goes around, if it does: by running along the pole line or by circling it. */
  pole: 'north' | 'south' | null;
}

const atPole = (lat: number) => Math.abs(lat) === 90;

/**
 * The planar shape of a lon/lat ring, with the two cases plain shoelace gets wrong:
 * - an edge crossing the antimeridian (|Δλ| > 180°) is unwrapped, so it is a short step, not a
 *   360° trip back; an edge along a pole line (both ends at ±90°, as Natural Earth's Antarctica
 *   has) is kept as drawn, since there it is the ring's real border in lon/lat;
 * - a ring whose unwrapped longitudes gain ±360° circles a pole without touching it; it is
 *   closed through the pole on its side (the sign of its mean latitude) to measure its area.
 * Example: ringShape([[0,0],[10,0],[10,10],[0,0]]).area2 === 100.
 */
export function ringShape(ring: Ring): RingShape {
  let area2 = 0;
  let shift = 0;
  let crosses = false;
  let touchesPole: 'north' | 'south' | null = null;
  let latSum = 0;
  let [px, py] = ring[0];
  let prevLon = px;
  for (let i = 1; i < ring.length; i++) {
    const [lon, lat] = ring[i];
    const prevLat = ring[i - 1][1];
    const d = lon - prevLon;
    if (atPole(lat) && atPole(prevLat) && lat === prevLat && d !== 0) {
      touchesPole = lat > 0 ? 'north' : 'south';
    } else if (d > 180) {
      shift -= 360;
      crosses = true;
    } else if (d < -180) {
      shift += 360;
      crosses = true;
    }
    prevLon = lon;
    const x = lon + shift;
    area2 += px * lat - x * py;
    px = x;
    py = lat;
    latSum += lat;
  }
  let pole = touchesPole;
  if (shift !== 0) {
    // Circles a pole: close along the pole line from the unwrapped end back to the start.
    const poleLat = latSum >= 0 ? 90 : -90;
    const [x0, y0] = ring[0];
    const path: [number, number][] = [[px, poleLat], [x0, poleLat], [x0, y0]];
    for (const [x, y] of path) {
      area2 += px * y - x * py;
      px = x;
      py = y;
    }
    pole = poleLat > 0 ? 'north' : 'south';
  }
  return { area2, crossesAntimeridian: crosses, pole };
}

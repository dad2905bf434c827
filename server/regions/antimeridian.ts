import { meridianCrossingLatDeg } from './geodesic-crossing.js';
import { ringShape, type Ring } from './ring-shape.js';

/**
 * Puts polygons that cross ±180° or go round a pole into the form RFC 7946 asks for (§3.1.9:
 * split at the antimeridian) and that planar code (point-in-polygon, shoelace, bounding boxes)
 * reads correctly in lon/lat:
 * - a ring that crosses the antimeridian and comes back is cut along ±180° into an east and a
 *   west part (Sutherland–Hodgman clipping of the unwrapped ring against the meridian, each
 *   edge cut where its geodesic meets the meridian, so geodesic areas are kept);
 * - a ring that goes once round a pole without touching it is read as the border of the polar
 *   cap on its side and closed explicitly along ±180° and the pole line, as Natural Earth draws
 *   Antarctica. Inside one polygon the largest such cap is the outer ring, smaller ones holes.
 */

export interface SplitTally {
  ringsSplitAtAntimeridian: number;
  polarRingsClosed: number;
  ringsLeftAsIs: number;
}

type Pt = [number, number];

const jumps = (ring: Ring) => {
  const out: number[] = [];
  for (let i = 1; i < ring.length; i++) {
    const bothAtPole = Math.abs(ring[i][1]) === 90 && ring[i][1] === ring[i - 1][1];
    if (!bothAtPole && Math.abs(ring[i][0] - ring[i - 1][0]) > 180) out.push(i);
  }
  return out;
};

/** Longitudes made continuous along the ring (may leave [−180, 180]). */
function unwrap(ring: Ring, nearLon?: number): Pt[] {
  const out: Pt[] = [];
  let shift = nearLon === undefined ? 0 : 360 * Math.round((nearLon - ring[0][0]) / 360);
  for (let i = 0; i < ring.length; i++) {
    if (i > 0) {
      const d = ring[i][0] - ring[i - 1][0];
      if (d > 180) shift -= 360;
      else if (d < -180) shift += 360;
    }
    out.push([ring[i][0] + shift, ring[i][1]]);
  }
  return out;
}

/** Clips a closed ring to the side `keep` of the meridian x = cut (Sutherland–Hodgman). */
function clip(ring: Pt[], cut: number, keep: 'west' | 'east'): Pt[] {
  const inside = (p: Pt) => (keep === 'west' ? p[0] <= cut : p[0] >= cut);
  const out: Pt[] = [];
  for (let i = 0; i < ring.length - 1; i++) {
    const a = ring[i];
    const b = ring[i + 1];
    if (inside(a)) out.push(a);
    if (inside(a) !== inside(b) && a[0] !== cut && b[0] !== cut) {
      out.push([cut, meridianCrossingLatDeg(a, b, cut)]);
    }
  }
  if (out.length) out.push([out[0][0], out[0][1]]);
  return out;
}

/** Moves a ring by `by` degrees of longitude, dropping points repeated by the clipping. */
function shiftRing(ring: Pt[], by: number): Ring {
  const out: Ring = [];
  for (const [x, y] of ring) {
    const p: Pt = [Math.round((x + by) * 1e9) / 1e9 + 0, Math.round(y * 1e9) / 1e9 + 0];
    const last = out[out.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) out.push(p);
  }
  return out;
}
const usable = (ring: Pt[]) => ring.length >= 4 && ringShape(ring).area2 !== 0;

/** Cuts one polygon along the antimeridian; returns one polygon per side that keeps area. */
function splitAtAntimeridian(rings: Ring[]): Ring[][] {
  const outer = unwrap(rings[0]);
  const xs = outer.map((p) => p[0]);
  const cut = Math.max(...xs) > 180 ? 180 : -180;
  const holes = rings.slice(1).map((h) => unwrap(h, outer[0][0]));
  const sides: Ring[][] = [];
  for (const keep of ['west', 'east'] as const) {
    // The part beyond ±180° is moved back by 360° into [−180, 180].
    const by = (keep === 'east') === (cut === 180) ? -Math.sign(cut) * 360 : 0;
    const piece = clip(outer, cut, keep);
    if (!usable(piece)) continue;
    const pieceHoles = holes.map((h) => clip(h, cut, keep)).filter(usable);
    sides.push([shiftRing(piece, by), ...pieceHoles.map((h) => shiftRing(h, by))]);
  }
  return sides;
}

/** Closes a ring that goes once round a pole along ±180° and the pole line. Null if it is more tangled. */
function closeRoundPole(ring: Ring, pole: 'north' | 'south'): Ring | null {
  const js = jumps(ring);
  if (js.length !== 1) return null;
  const i = js[0];
  const a = ring[i - 1];
  const b = ring[i];
  const eastward = b[0] - a[0] < -180; // e.g. 179° → −179° is a step east over 180°
  const edge = eastward ? 180 : -180;
  const bx = eastward ? b[0] + 360 : b[0] - 360;
  const latX = meridianCrossingLatDeg(a, [bx, b[1]], edge);
  const poleLat = pole === 'north' ? 90 : -90;
  const body: Ring = [...ring.slice(i, ring.length - 1), ...ring.slice(0, i)];
  const out: Ring = [[-edge, latX], ...body, [edge, latX], [edge, poleLat], [-edge, poleLat], [-edge, latX]];
  return out.filter((p, k) => k === 0 || p[0] !== out[k - 1][0] || p[1] !== out[k - 1][1]) as Ring;
}

/** Normalises one polygon's closed rings (outer first); may return several polygons. */
export function normaliseSphericalPolygon(rings: Ring[], tally: SplitTally): Ring[][] {
  const shapes = rings.map((r) => ({ ring: r, shape: ringShape(r), js: jumps(r).length }));
  const circling = shapes.filter((s) => s.js % 2 === 1);
  if (circling.length) {
    const caps: Ring[] = [];
    const others: Ring[] = [];
    for (const s of shapes) {
      if (s.js % 2 === 1 && s.shape.pole) {
        const closed = closeRoundPole(s.ring, s.shape.pole);
        if (closed) {
          caps.push(closed);
          tally.polarRingsClosed++;
          continue;
        }
        tally.ringsLeftAsIs++;
      }
      others.push(s.ring);
    }
    if (!caps.length) return [rings];
    caps.sort((p, q) => Math.abs(ringShape(q).area2) - Math.abs(ringShape(p).area2));
    return [[caps[0], ...caps.slice(1), ...others]];
  }
  if (shapes[0].js > 0) {
    tally.ringsSplitAtAntimeridian++;
    return splitAtAntimeridian(rings);
  }
  return [rings];
}

import { polygonsOf, type Position, type RegionInput } from './geojson';

/** A ring as a closed polygon in the region's longitude frame (closure implicit), degrees. */
export interface FrameRing {
  lon: Float64Array;
  lat: Float64Array;
  /** Around a pole: the ring's unwrapped longitude turns through 360°; closed through that pole. */
  pole: 0 | 1 | -1;
  isHole: boolean;
}

/** A region ready for point-in-region tests and sampling. */
export interface PreparedRegion {
  rings: FrameRing[];
  /** The longitude frame: every ring lies in [westDeg, westDeg + widthDeg]. */
  westDeg: number;
  widthDeg: number;
  southDeg: number;
  northDeg: number;
  polygonCount: number;
  holeCount: number;
  vertexCount: number;
  crossesAntimeridian: boolean;
  /** 1 or −1 when the region encloses the north or south pole, else 0. */
  containsPole: 0 | 1 | -1;
  /** The rings as given, longitudes unwrapped (no jump over 180°), for areas and boundaries. */
  sourceRings: { ring: Position[]; isHole: boolean; pole: 0 | 1 | -1; polygon: number }[];
}

/**
 * Signed longitude step of an edge: the short way round (an edge from 180° to −180° is no step at
 * all, as in data split at the antimeridian), except that a step of exactly ±180° goes the way it
 * is written, and so does a jump between ±180° when asWritten is set.
 */
const lonStep = (from: number, to: number, asWritten: boolean) => {
  const d = to - from;
  if (d >= -180 && d <= 180) return d;
  if (asWritten && Math.abs(from) === 180 && to === -from) return d;
  return d - 360 * Math.round(d / 360);
};

/** The ring with longitudes unwrapped, and its turns around the pole. */
function unwrap(ring: Position[], asWritten: boolean): { out: Position[]; turns: number } {
  const out: Position[] = [[ring[0][0], ring[0][1]]];
  let u = ring[0][0];
  for (let i = 1; i < ring.length; i++) {
    u += lonStep(ring[i - 1][0], ring[i][0], asWritten);
    out.push([u, ring[i][1]]);
  }
  return { out, turns: Math.round((u - ring[0][0]) / 360) };
}

/** Twice the planar (lon/lat) area of a closed ring. */
function shoelace(ring: Position[]): number {
  let a = 0;
  for (let i = 0; i + 1 < ring.length; i++) a += ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1];
  return a;
}

/**
 * Reads a region into rings on a common longitude frame. An edge is the straight line in
 * lon/lat between its ends (RFC 7946 §3.1.1) taken the short way round in longitude (a step of
 * exactly 180° goes the way it is written; a box from −180° to 180° stays a box), so rings that
 * cross the antimeridian unsplit, or split into parts at ±180°, come out whole. A ring whose
 * longitude turns through 360° encircles a pole; it is closed through the pole on the side of the
 * smaller area, whatever its winding. Inside-ness is even–odd over all rings, so a wrongly wound
 * ring never turns into the rest of the world.
 * Example: prepareRegion(fiji).crossesAntimeridian === true.
 */
export function prepareRegion(input: RegionInput): PreparedRegion {
  const polygons = polygonsOf(input);
  const src: PreparedRegion['sourceRings'] = [];
  let vertexCount = 0;
  let holeCount = 0;
  polygons.forEach((polygon, polygonIndex) => {
    polygon.forEach((ring, r) => {
      const n = ring.length - 1;
      vertexCount += n;
      if (r > 0) holeCount++;
      let { out, turns } = unwrap(ring, false);
      // Read the short way, a box written from −180° to 180° collapses to a line: read it as written.
      if (turns === 0 && Math.abs(shoelace(out)) < 1e-12) ({ out, turns } = unwrap(ring, true));
      if (Math.abs(turns) > 1) throw new Error(`a ring winds ${Math.abs(turns)} times around a pole`);
      if (turns === -1) out.reverse();
      const pole = turns === 0 ? 0 : chooseCap(out);
      src.push({ ring: out, isHole: r > 0, pole, polygon: polygonIndex });
    });
  });
  const hasPole = src.some((s) => s.pole !== 0);
  let west = -180;
  let width = 360;
  if (!hasPole) [west, width] = coveringArc(src.map((s) => lonRange(s.ring)));
  let south = 90;
  let north = -90;
  const rings: FrameRing[] = src.map((s) => {
    const path = s.pole === 0 ? shiftInto(s.ring, west) : cutAt(s.ring, west, s.pole);
    for (const p of path) {
      if (p[1] < south) south = p[1];
      if (p[1] > north) north = p[1];
    }
    return {
      lon: Float64Array.from(path, (p) => p[0]),
      lat: Float64Array.from(path, (p) => p[1]),
      pole: s.pole,
      isHole: s.isHole,
    };
  });
  const containsPole = (src.find((s) => s.pole !== 0)?.pole ?? 0) as 0 | 1 | -1;
  return {
    rings,
    westDeg: west,
    widthDeg: width,
    southDeg: south,
    northDeg: north,
    polygonCount: polygons.length,
    holeCount,
    vertexCount,
    crossesAntimeridian: hasPole || spansAntimeridian(west, width),
    containsPole,
    sourceRings: src,
  };
}

function spansAntimeridian(west: number, width: number): boolean {
  // Is some 180° + 360°k strictly inside (west, west + width)?
  const k = Math.floor((west - 180) / 360) + 1;
  return 180 + 360 * k < west + width - 1e-9 && 180 + 360 * k > west + 1e-9;
}

function lonRange(ring: Position[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of ring) {
    if (p[0] < lo) lo = p[0];
    if (p[0] > hi) hi = p[0];
  }
  return [lo, hi];
}

/** Smallest arc [west, west + width] of the circle covering all intervals (degrees). */
export function coveringArc(intervals: [number, number][]): [number, number] {
  const iv = intervals
    .map(([lo, hi]) => {
      const s = lo - 360 * Math.floor((lo + 180) / 360);
      return [s, s + (hi - lo)] as [number, number];
    })
    .sort((a, b) => a[0] - b[0]);
  if (iv.some(([lo, hi]) => hi - lo >= 360)) return [-180, 360];
  let bestGap = -1;
  let gapEnd = iv[0][0];
  let reach = iv[0][1];
  for (let i = 1; i < iv.length; i++) {
    if (iv[i][0] > reach && iv[i][0] - reach > bestGap) {
      bestGap = iv[i][0] - reach;
      gapEnd = iv[i][0];
    }
    reach = Math.max(reach, iv[i][1]);
  }
  const wrapGap = iv[0][0] + 360 - reach;
  if (wrapGap > bestGap) {
    bestGap = wrapGap;
    gapEnd = iv[0][0];
  }
  if (bestGap <= 0) return [-180, 360];
  return [gapEnd, 360 - bestGap];
}

function shiftInto(ring: Position[], west: number): Position[] {
  const [lo] = lonRange(ring);
  const k = 360 * Math.round((west + ((((lo - west) % 360) + 360) % 360) - lo) / 360);
  // Drop the closing duplicate: the frame ring's closure is implicit.
  return ring.slice(0, -1).map((p) => [p[0] + k, p[1]]);
}

/** The side (1 north, −1 south) a pole-encircling eastward ring bounds with the smaller area. */
function chooseCap(ring: Position[]): 1 | -1 {
  // Area south of the path in (λ, sin φ), which is proportional to area on the sphere.
  let south = 0;
  for (let i = 1; i < ring.length; i++) {
    const dl = ((ring[i][0] - ring[i - 1][0]) * Math.PI) / 180;
    const mid = 0.5 * (Math.sin((ring[i][1] * Math.PI) / 180) + Math.sin((ring[i - 1][1] * Math.PI) / 180));
    south += dl * (mid + 1);
  }
  return south <= 4 * Math.PI - south ? -1 : 1;
}

/** An eastward pole ring re-cut to run from λ = west to west + 360, closed through its pole. */
function cutAt(ring: Position[], west: number, pole: 1 | -1): Position[] {
  const shift = west + (((ring[0][0] - west) % 360) + 360) % 360 - ring[0][0];
  const u = ring.map((p) => [p[0] + shift, p[1]]);
  const end = west + 360;
  let i = 0;
  while (i < u.length - 1 && !(u[i][0] < end && u[i + 1][0] >= end)) i++;
  const [l0, p0] = u[i];
  const [l1, p1] = u[i + 1] ?? u[i];
  const t = l1 === l0 ? 0 : (end - l0) / (l1 - l0);
  const latCut = p0 + t * (p1 - p0);
  const path: Position[] = [[west, latCut]];
  for (let j = i + 1; j < u.length; j++) path.push([u[j][0] - 360, u[j][1]]);
  for (let j = 1; j <= i; j++) path.push(u[j]);
  path.push([end, latCut], [end, 90 * pole], [west, 90 * pole]);
  return path;
}

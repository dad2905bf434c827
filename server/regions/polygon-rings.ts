import type { Feature, Geometry, Position } from 'geojson';
import { invalidRegion } from './region-errors.js';
import { normaliseSphericalPolygon } from './antimeridian.js';
import { ringShape, type Ring } from './ring-shape.js';

export type { Ring } from './ring-shape.js';
/** A polygon as rings of [lon, lat]: the exterior first, then holes; every ring closed. */
export type PolygonRings = Ring[];

/** What cleaning changed, summed over a file. */
export interface CleanTally {
  ringsClosed: number;
  ringsRewound: number;
  duplicatePointsRemoved: number;
  degenerateRingsDropped: number;
  otherGeometriesIgnored: number;
  ringsSplitAtAntimeridian: number;
  polarRingsClosed: number;
  ringsLeftAsIs: number;
}

export const emptyTally = (): CleanTally => ({
  ringsClosed: 0,
  ringsRewound: 0,
  duplicatePointsRemoved: 0,
  degenerateRingsDropped: 0,
  otherGeometriesIgnored: 0,
  ringsSplitAtAntimeridian: 0,
  polarRingsClosed: 0,
  ringsLeftAsIs: 0,
});

/** 1e-9° is about 0.1 mm on the ground: far below any boundary's accuracy, and it makes the hash stable. */
const round9 = (x: number) => Math.round(x * 1e9) / 1e9 + 0;

/** A short quote of a bad coordinate; a list nested too deep to print (stack overflow) is named as such. */
function preview(p: unknown): string {
  try {
    return String(JSON.stringify(p)).slice(0, 60);
  } catch {
    return 'a list nested too deep to show';
  }
}

function checkPosition(p: Position, where: () => string): [number, number] {
  const lon = p?.[0];
  const lat = p?.[1];
  if (typeof lon !== 'number' || typeof lat !== 'number' || !Number.isFinite(lon) || !Number.isFinite(lat)) {
    throw invalidRegion(`${where()} has a coordinate that is not a pair of numbers (${preview(p)}).`);
  }
  if (lon < -180 || lon > 180 || lat < -90 || lat > 90) {
    throw invalidRegion(
      `${where()} has the coordinate [${lon}, ${lat}], outside longitude −180…180 / latitude −90…90. ` +
        'Coordinates must be WGS84 degrees; a shapefile in a projected CRS needs its .prj.',
    );
  }
  return [round9(lon), round9(lat)];
}

/** Cleans one ring: checks and rounds coordinates, drops repeated points, closes it. Null when degenerate. */
function cleanRing(raw: Position[], tally: CleanTally, where: () => string): Ring | null {
  if (!Array.isArray(raw)) throw invalidRegion(`${where()} has a ring that is not a list of coordinates.`);
  const ring: Ring = [];
  for (const p of raw) {
    const q = checkPosition(p, where);
    const last = ring[ring.length - 1];
    if (last && last[0] === q[0] && last[1] === q[1]) tally.duplicatePointsRemoved++;
    else ring.push(q);
  }
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (ring.length && (first[0] !== last[0] || first[1] !== last[1])) {
    ring.push([first[0], first[1]]);
    tally.ringsClosed++;
  }
  if (ring.length < 4 || ringShape(ring).area2 === 0) {
    tally.degenerateRingsDropped++;
    return null;
  }
  return ring;
}

function orient(ring: Ring, counterClockwise: boolean, tally: CleanTally): Ring {
  if (ringShape(ring).area2 > 0 === counterClockwise) return ring;
  tally.ringsRewound++;
  return ring.slice().reverse();
}

/** GeometryCollections nested deeper than this are refused (real files nest one or two levels). */
const MAX_COLLECTION_DEPTH = 32;

function polygonsOf(g: Geometry | null, tally: CleanTally, depth = 0): Position[][][] {
  if (!g) return [];
  if (g.type === 'Polygon') return [g.coordinates];
  if (g.type === 'MultiPolygon') return g.coordinates;
  if (g.type === 'GeometryCollection') {
    if (depth >= MAX_COLLECTION_DEPTH) throw invalidRegion(`The file nests GeometryCollections more than ${MAX_COLLECTION_DEPTH} levels deep; flatten it first.`);
    if (!Array.isArray(g.geometries)) throw invalidRegion('The file has a GeometryCollection without a "geometries" list.');
    return g.geometries.flatMap((x) => polygonsOf(x, tally, depth + 1));
  }
  tally.otherGeometriesIgnored++;
  return [];
}

/**
 * A feature's polygons, cleaned, in RFC 7946 order (exterior rings counter-clockwise, holes
 * clockwise). Out-of-range or non-numeric coordinates are refused, naming the first one.
 */
export function featurePolygons(feature: Feature, label: string, tally: CleanTally): PolygonRings[] {
  const out: PolygonRings[] = [];
  polygonsOf(feature.geometry, tally).forEach((rings, pi) => {
    if (!Array.isArray(rings)) throw invalidRegion(`${label} has a polygon that is not a list of rings.`);
    const cleaned: PolygonRings = [];
    rings.forEach((raw, ri) => {
      const where = () => `${label}, polygon ${pi + 1}, ring ${ri + 1}`;
      const ring = cleanRing(raw, tally, where);
      // A degenerate outer ring takes its holes with it (cleaned stays empty, holes are skipped).
      if (ring && (ri === 0 || cleaned.length)) cleaned.push(ring);
    });
    if (!cleaned.length) return;
    for (const part of normaliseSphericalPolygon(cleaned, tally)) {
      out.push(part.map((ring, i) => orient(ring, i === 0, tally)));
    }
  });
  return out;
}

export const vertexCountOf = (polygons: PolygonRings[]) =>
  polygons.reduce((n, rings) => n + rings.reduce((m, r) => m + r.length - 1, 0), 0);

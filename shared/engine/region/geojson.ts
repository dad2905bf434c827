/** The GeoJSON the engine accepts as a region, and a flattening of it into polygons. */

export type Position = number[];
export type Ring = Position[];
export type PolygonCoords = Ring[];

export interface PolygonGeometry {
  type: 'Polygon';
  coordinates: PolygonCoords;
}
export interface MultiPolygonGeometry {
  type: 'MultiPolygon';
  coordinates: PolygonCoords[];
}
export type RegionGeometry = PolygonGeometry | MultiPolygonGeometry;
export interface RegionFeature {
  type: 'Feature';
  geometry: RegionGeometry | { type: string } | null;
  properties?: Record<string, unknown> | null;
}
export interface RegionFeatureCollection {
  type: 'FeatureCollection';
  features: RegionFeature[];
}
/** A region: a Polygon or MultiPolygon (lon/lat degrees), bare or inside a Feature or FeatureCollection. */
export type RegionInput = RegionGeometry | RegionFeature | RegionFeatureCollection;

/**
 * All polygons of a region (each an exterior ring followed by its holes), with coordinates checked:
 * throws an Error saying what is wrong for an empty region, a non-polygon geometry, an open or
 * short ring or an out-of-range coordinate.
 * Example: polygonsOf({ type: 'Polygon', coordinates: [[[0,0],[1,0],[1,1],[0,0]]] }).length === 1.
 */
export function polygonsOf(input: RegionInput): PolygonCoords[] {
  const out: PolygonCoords[] = [];
  const visit = (g: unknown, where: string) => {
    const geom = g as { type?: string; coordinates?: unknown; geometries?: unknown[] } | null;
    if (!geom || typeof geom !== 'object') return;
    if (geom.type === 'Polygon') out.push(checkPolygon(geom.coordinates, where));
    else if (geom.type === 'MultiPolygon') {
      if (!Array.isArray(geom.coordinates)) throw new Error(`${where}: MultiPolygon without coordinates`);
      geom.coordinates.forEach((p, i) => out.push(checkPolygon(p, `${where}, part ${i + 1}`)));
    } else if (geom.type === 'GeometryCollection' && Array.isArray(geom.geometries)) {
      geom.geometries.forEach((x, i) => visit(x, `${where}, geometry ${i + 1}`));
    }
  };
  const root = input as { type?: string; features?: RegionFeature[]; geometry?: unknown };
  if (root?.type === 'FeatureCollection') {
    if (!Array.isArray(root.features)) throw new Error('FeatureCollection without a features array');
    root.features.forEach((f, i) => visit(f?.geometry, `feature ${i + 1}`));
  } else if (root?.type === 'Feature') visit(root.geometry, 'feature');
  else visit(root, 'geometry');
  if (!out.length) throw new Error('the region has no Polygon or MultiPolygon geometry');
  return out;
}

function checkPolygon(coords: unknown, where: string): PolygonCoords {
  if (!Array.isArray(coords) || !coords.length) throw new Error(`${where}: polygon without rings`);
  return coords.map((ring, r) => {
    const label = r === 0 ? `${where}, exterior ring` : `${where}, hole ${r}`;
    if (!Array.isArray(ring) || ring.length < 4) throw new Error(`${label}: a ring needs at least 4 positions (closed)`);
    for (const p of ring) {
      if (!Array.isArray(p) || p.length < 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
        throw new Error(`${label}: position ${JSON.stringify(p)} is not [lon, lat]`);
      }
      if (p[1] < -90 || p[1] > 90 || p[0] < -540 || p[0] > 540) {
        throw new Error(`${label}: position [${p[0]}, ${p[1]}] is out of range (lon/lat degrees expected)`);
      }
    }
    const a = ring[0];
    const b = ring[ring.length - 1];
    if (a[0] !== b[0] || a[1] !== b[1]) throw new Error(`${label}: ring is not closed (first and last positions differ)`);
    return ring as Ring;
  });
}

import type { Feature, Geometry } from 'geojson';
import { feature as topoFeature } from 'topojson-client';
import type { Topology } from 'topojson-specification';
import type { ParsedRegionFile } from './read-shapefile.js';
import { invalidRegion } from './region-errors.js';

const GEOMETRY_TYPES = new Set(['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon', 'GeometryCollection']);

function parseJson(buffer: Buffer, fileName: string): unknown {
  const text = buffer.toString('utf8').replace(/^\uFEFF/, '');
  try {
    return JSON.parse(text);
  } catch (err) {
    throw invalidRegion(`${fileName} is not valid JSON (${(err as Error).message.slice(0, 100)}).`);
  }
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function asGeometry(g: unknown, where: string): Geometry | null {
  if (g === null) return null;
  if (!isObject(g) || typeof g.type !== 'string' || !GEOMETRY_TYPES.has(g.type)) {
    throw invalidRegion(`${where} has no valid GeoJSON geometry (its "type" should be Polygon, MultiPolygon, …).`);
  }
  if (g.type === 'GeometryCollection') {
    if (!Array.isArray(g.geometries)) throw invalidRegion(`${where} is a GeometryCollection without "geometries".`);
  } else if (!Array.isArray(g.coordinates)) {
    throw invalidRegion(`${where} is a ${g.type} without a "coordinates" array.`);
  }
  return g as unknown as Geometry;
}

function asFeature(f: unknown, where: string): Feature {
  if (!isObject(f) || f.type !== 'Feature') throw invalidRegion(`${where} is not a GeoJSON Feature.`);
  return {
    type: 'Feature',
    geometry: asGeometry(f.geometry, where) as Geometry,
    properties: isObject(f.properties) ? f.properties : {},
    ...(f.id !== undefined ? { id: f.id as string | number } : {}),
  };
}

/** GeoJSON (RFC 7946): a FeatureCollection, a Feature or a bare geometry, in WGS84 lon/lat. */
function fromGeoJson(doc: Record<string, unknown>, fileName: string): ParsedRegionFile {
  const notes: string[] = [];
  if ('crs' in doc) notes.push('The file has a "crs" member, which RFC 7946 removed; its coordinates were read as WGS84 longitude/latitude.');
  let features: Feature[];
  if (doc.type === 'FeatureCollection') {
    if (!Array.isArray(doc.features)) throw invalidRegion(`${fileName} is a FeatureCollection without a "features" array.`);
    features = doc.features.map((f, i) => asFeature(f, `Feature ${i + 1} of ${fileName}`));
  } else if (doc.type === 'Feature') {
    features = [asFeature(doc, fileName)];
  } else {
    features = [{ type: 'Feature', geometry: asGeometry(doc, fileName) as Geometry, properties: {} }];
  }
  return { format: 'geojson', sourceCrs: 'EPSG:4326', features: features.filter((f) => f.geometry), notes };
}

/** TopoJSON: every object of the topology, its arcs decoded to lon/lat features. */
function fromTopoJson(doc: Record<string, unknown>, fileName: string): ParsedRegionFile {
  if (!isObject(doc.objects) || !Array.isArray(doc.arcs)) {
    throw invalidRegion(`${fileName} is a TopoJSON Topology without "objects" and "arcs".`);
  }
  const features: Feature[] = [];
  for (const [name, object] of Object.entries(doc.objects)) {
    try {
      const out = topoFeature(doc as unknown as Topology, object as never) as unknown as Feature | { features: Feature[] };
      const list = 'features' in out ? out.features : [out];
      for (const f of list) {
        if (f.geometry) features.push({ ...f, properties: { ...(f.properties ?? {}), layer: name } });
      }
    } catch (err) {
      // topojson-client throws plain JavaScript errors on bad input; their text means nothing to a cartographer.
      const why = err instanceof TypeError || err instanceof RangeError ? 'its arcs, transform or geometry are malformed' : (err as Error).message.slice(0, 100);
      throw invalidRegion(`Object "${name}" of ${fileName} could not be decoded (${why}).`);
    }
  }
  return { format: 'topojson', sourceCrs: 'EPSG:4326', features, notes: [] };
}

/** Reads GeoJSON or TopoJSON (told apart by content: a Topology is TopoJSON). */
export function readJsonRegion(buffer: Buffer, fileName: string): ParsedRegionFile {
  const doc = parseJson(buffer, fileName);
  if (!isObject(doc) || typeof doc.type !== 'string') {
    throw invalidRegion(`${fileName} is JSON but neither GeoJSON nor TopoJSON (it has no "type").`);
  }
  return doc.type === 'Topology' ? fromTopoJson(doc, fileName) : fromGeoJson(doc, fileName);
}

import shp from 'shpjs';
import { feature } from 'topojson-client';
import type { Topology } from 'topojson-specification';
import { polygonsOf, type RegionFeature, type RegionFeatureCollection } from '../../shared/engine/region/geojson';

/**
 * Reads an uploaded or local region file into a GeoJSON FeatureCollection of its polygons:
 * GeoJSON (.geojson/.json, RFC 7946), TopoJSON (every object, via topojson-client) or a zipped
 * shapefile (.zip, via shpjs, which reprojects to WGS84 lon/lat from the .prj). Throws an Error
 * whose message says, in plain words, what is wrong with the file.
 * Example: await readRegion(readFileSync('france.geojson'), 'france.geojson').
 */
export async function readRegion(buffer: Uint8Array, fileName: string): Promise<RegionFeatureCollection> {
  const lower = fileName.toLowerCase();
  let collection: RegionFeatureCollection;
  if (lower.endsWith('.zip') || isZip(buffer)) {
    collection = await readShapefileZip(buffer, fileName);
  } else {
    const text = new TextDecoder('utf-8', { fatal: false }).decode(buffer).replace(/^\uFEFF/, '');
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (err) {
      throw new Error(`${fileName} is not valid JSON (${err instanceof Error ? err.message : String(err)})`);
    }
    collection = fromJson(json, fileName);
  }
  try {
    polygonsOf(collection);
  } catch (err) {
    throw new Error(`${fileName}: ${err instanceof Error ? err.message : String(err)}`);
  }
  return collection;
}

function isZip(b: Uint8Array): boolean {
  return b.length > 3 && b[0] === 0x50 && b[1] === 0x4b && b[2] === 0x03 && b[3] === 0x04;
}

function fromJson(json: unknown, fileName: string): RegionFeatureCollection {
  const obj = json as { type?: string };
  if (!obj || typeof obj !== 'object' || typeof obj.type !== 'string') {
    throw new Error(`${fileName} is JSON but neither GeoJSON nor TopoJSON (no "type")`);
  }
  if (obj.type === 'Topology') {
    const topo = json as Topology;
    const features: RegionFeature[] = [];
    for (const [name, object] of Object.entries(topo.objects ?? {})) {
      const f = feature(topo, object) as unknown as RegionFeature | RegionFeatureCollection;
      if (f.type === 'FeatureCollection') features.push(...f.features);
      else features.push({ ...f, properties: { ...(f.properties ?? {}), layer: name } });
    }
    return { type: 'FeatureCollection', features };
  }
  if (obj.type === 'FeatureCollection') return json as RegionFeatureCollection;
  if (obj.type === 'Feature') return { type: 'FeatureCollection', features: [json as RegionFeature] };
  if (obj.type === 'Polygon' || obj.type === 'MultiPolygon' || obj.type === 'GeometryCollection') {
    return { type: 'FeatureCollection', features: [{ type: 'Feature', geometry: json as RegionFeature['geometry'], properties: {} }] };
  }
  throw new Error(`${fileName}: GeoJSON of type "${obj.type}" holds no polygons`);
}

async function readShapefileZip(buffer: Uint8Array, fileName: string): Promise<RegionFeatureCollection> {
  let parsed: Awaited<ReturnType<typeof shp>>;
  try {
    parsed = await shp(buffer);
  } catch (err) {
    throw new Error(`${fileName} could not be read as a zipped shapefile (${err instanceof Error ? err.message : String(err)})`);
  }
  const layers = Array.isArray(parsed) ? parsed : [parsed];
  const features = layers.flatMap((l) => (l.features ?? []) as RegionFeature[]);
  if (!features.length) throw new Error(`${fileName}: the shapefile has no features`);
  return { type: 'FeatureCollection', features };
}

import type { ParsedRegionFile } from './read-shapefile.js';
import { readZippedShapefile } from './read-shapefile.js';
import { readJsonRegion } from './read-json-region.js';
import { invalidRegion } from './region-errors.js';

export type { ParsedRegionFile } from './read-shapefile.js';

const ZIP_MAGIC = Buffer.from([0x50, 0x4b, 0x03, 0x04]);
const EMPTY_ZIP_MAGIC = Buffer.from([0x50, 0x4b, 0x05, 0x06]);

/**
 * Reads an uploaded region file into WGS84 lon/lat features: a zipped shapefile (by its zip
 * signature or a .zip name), or GeoJSON / TopoJSON (by a .json/.geojson/.topojson name or a
 * leading "{"). Anything else is refused with the formats we accept.
 */
export async function readUploadedRegion(buffer: Buffer, fileName: string): Promise<ParsedRegionFile> {
  const name = fileName.toLowerCase();
  if (!buffer.length) throw invalidRegion(`${fileName} is empty.`);
  const head = buffer.subarray(0, 4);
  if (head.equals(ZIP_MAGIC) || head.equals(EMPTY_ZIP_MAGIC) || name.endsWith('.zip')) {
    return readZippedShapefile(buffer, fileName);
  }
  const firstChar = buffer.toString('utf8', 0, Math.min(buffer.length, 64)).replace(/^\uFEFF/, '').trimStart()[0];
  if (/\.(geo|topo)?json$/.test(name) || firstChar === '{') return readJsonRegion(buffer, fileName);
  throw invalidRegion(
    `${fileName} is not a format we read: upload a zipped shapefile (.zip with .shp, .shx, .dbf and .prj), GeoJSON or TopoJSON.`,
  );
}

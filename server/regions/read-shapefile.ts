import type { Feature } from 'geojson';
import proj4 from 'proj4';
import { parseDbf, parseShp } from 'shpjs';
import { invalidRegion } from './region-errors.js';
import { checkShapefileStructure } from './shapefile-structure.js';
import { openZip, readZipEntry, type ZipEntryInfo } from './zip-archive.js';

export interface ParsedRegionFile {
  format: 'shapefile' | 'geojson' | 'topojson';
  /** The CRS the coordinates were in: the .prj WKT, or EPSG:4326. */
  sourceCrs: string;
  features: Feature[];
  /** Things worth telling the person that did not stop the upload. */
  notes: string[];
}

const ext = (name: string) => name.slice(name.lastIndexOf('.') + 1).toLowerCase();
const stem = (name: string) => name.slice(0, name.lastIndexOf('.'));
const baseName = (name: string) => name.slice(name.lastIndexOf('/') + 1);
const ignored = (name: string) => name.startsWith('__MACOSX/') || baseName(name).startsWith('.');

/** Checks a .prj is a CRS proj4 can use both ways; returns the text handed to the shapefile parser. */
function checkPrj(text: string, name: string): string {
  const wkt = text.replace(/^\uFEFF/, '').trim();
  if (!wkt) throw invalidRegion(`${name} is empty; remove it if the coordinates are WGS84 longitude/latitude, or add the CRS as WKT.`);
  let ok = false;
  try {
    const conv = proj4(wkt);
    const probe = conv.forward([0.5, 0.5]);
    ok = Array.isArray(probe) && probe.every(Number.isFinite);
  } catch {
    ok = false;
  }
  if (!ok) {
    throw invalidRegion(`${name} could not be read as a coordinate reference system (expected WKT such as PROJCS[…] or GEOGCS[…]).`);
  }
  return wkt;
}

/** A .cpg names the attribute text encoding; parsedbf accepts labels and bare Windows code pages. */
function checkCpg(text: string, name: string, notes: string[]): string | undefined {
  const label = text.trim();
  if (!label) return undefined;
  for (const candidate of [label, /^(?:ANSI\s)?(\d+)$/i.test(label) ? `windows-${label.replace(/\D/g, '')}` : '']) {
    if (!candidate) continue;
    try {
      new TextDecoder(candidate);
      return label;
    } catch {
      // try the next spelling
    }
  }
  notes.push(`${name} names an unknown encoding "${label.slice(0, 40)}"; attribute text was read as UTF-8.`);
  return undefined;
}

/**
 * Reads a zipped shapefile (one layer: .shp, .shx and .dbf required, .prj and .cpg honoured)
 * into WGS84 lon/lat features. The zip is checked before anything is unpacked (zip-archive.ts)
 * and the parts before they are parsed (shapefile-structure.ts).
 */
export async function readZippedShapefile(buffer: Buffer, fileName: string): Promise<ParsedRegionFile> {
  const entries = (await openZip(buffer, fileName)).filter((e) => !ignored(e.name));
  const shps = entries.filter((e) => ext(e.name) === 'shp');
  if (!shps.length) {
    const names = entries.map((e) => baseName(e.name)).slice(0, 8).join(', ') || 'nothing';
    throw invalidRegion(`${fileName} holds no .shp file (found: ${names}); zip the .shp, .shx, .dbf (and .prj) of one layer.`);
  }
  if (shps.length > 1) {
    throw invalidRegion(`${fileName} holds ${shps.length} shapefiles (${shps.map((e) => baseName(e.name)).join(', ')}); upload one layer at a time.`);
  }
  const base = stem(shps[0].name);
  const part = (x: string): ZipEntryInfo | undefined => entries.find((e) => stem(e.name) === base && ext(e.name) === x);
  const shown = baseName(base);
  for (const required of ['shx', 'dbf']) {
    if (!part(required)) {
      throw invalidRegion(`${fileName} has ${shown}.shp but no ${shown}.${required}; a shapefile needs .shp, .shx and .dbf together.`);
    }
  }
  const [shp, shx, dbf] = await Promise.all(['shp', 'shx', 'dbf'].map((x) => readZipEntry(part(x)!)));
  const prjEntry = part('prj');
  const cpgEntry = part('cpg');
  const prjText = prjEntry ? (await readZipEntry(prjEntry)).toString('utf8') : undefined;
  const cpgText = cpgEntry ? (await readZipEntry(cpgEntry)).toString('latin1') : undefined;

  const names = { shp: `${shown}.shp`, shx: `${shown}.shx`, dbf: `${shown}.dbf` };
  const structure = checkShapefileStructure(shp, shx, dbf, names);
  const notes: string[] = [];
  const prj = prjText === undefined ? undefined : checkPrj(prjText, `${shown}.prj`);
  if (!prj) notes.push(`No ${shown}.prj: coordinates were taken as WGS84 longitude/latitude.`);
  const cpg = cpgText === undefined ? undefined : checkCpg(cpgText, `${shown}.cpg`, notes);
  if (structure.nullRecords) notes.push(`${structure.nullRecords} record(s) of ${names.shp} have no shape and were skipped.`);

  let geometries: ReturnType<typeof parseShp>;
  let rows: Record<string, unknown>[];
  try {
    geometries = parseShp(shp, prj ?? false);
    rows = parseDbf(dbf, cpg);
  } catch (err) {
    throw invalidRegion(`${fileName} could not be parsed (${(err as Error).message.slice(0, 120)}).`);
  }
  const features: Feature[] = [];
  geometries.forEach((geometry, i) => {
    if (geometry) features.push({ type: 'Feature', geometry, properties: rows[i] ?? {} });
  });
  return { format: 'shapefile', sourceCrs: prj ?? 'EPSG:4326', features, notes };
}

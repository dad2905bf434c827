import { invalidRegion } from './region-errors.js';

/**
 * Structural checks of the three mandatory shapefile parts against the ESRI Shapefile Technical
 * Description (1998): main file and index start with file code 9994 (big-endian) and give their
 * length in 16-bit words at byte 24; version 1000 and the shape type are little-endian at 28
 * and 32; records follow the 100-byte header, each with an 8-byte big-endian header (record
 * number, content length in words). The dBASE table gives its record count at byte 4.
 * A parser that stops at the first short record would silently drop the rest, so we check first.
 */

export const SHAPE_TYPE_NAMES: Record<number, string> = {
  0: 'null shapes', 1: 'points', 3: 'lines', 5: 'polygons', 8: 'multipoints',
  11: 'points (Z)', 13: 'lines (Z)', 15: 'polygons (Z)', 18: 'multipoints (Z)',
  21: 'points (M)', 23: 'lines (M)', 25: 'polygons (M)', 28: 'multipoints (M)', 31: 'multipatches',
};
const POLYGON_TYPES = new Set([5, 15, 25]);
const HEADER_BYTES = 100;

export interface ShapefileStructure {
  shapeType: number;
  records: number;
  nullRecords: number;
}

function checkHeader(buf: Buffer, name: string): number {
  if (buf.length < HEADER_BYTES) throw invalidRegion(`${name} is truncated: it has ${buf.length} bytes, shorter than the 100-byte header.`);
  if (buf.readInt32BE(0) !== 9994) throw invalidRegion(`${name} is not a shapefile part (its first bytes are not the shapefile file code).`);
  const declared = buf.readInt32BE(24) * 2;
  if (declared > buf.length) {
    throw invalidRegion(`${name} is truncated: its header declares ${declared} bytes but the file has ${buf.length}.`);
  }
  if (buf.readInt32LE(28) !== 1000) throw invalidRegion(`${name} has an unknown shapefile version ${buf.readInt32LE(28)}.`);
  return declared;
}

/** Checks .shp, .shx and .dbf agree; returns the shape type and the record count. */
export function checkShapefileStructure(
  shp: Buffer,
  shx: Buffer,
  dbf: Buffer,
  names: { shp: string; shx: string; dbf: string },
): ShapefileStructure {
  const shpBytes = checkHeader(shp, names.shp);
  const shapeType = shp.readInt32LE(32);
  if (!POLYGON_TYPES.has(shapeType)) {
    throw invalidRegion(
      `${names.shp} holds ${SHAPE_TYPE_NAMES[shapeType] ?? `shape type ${shapeType}`}, not polygons; a region needs a polygon shapefile.`,
    );
  }
  let offset = HEADER_BYTES;
  let records = 0;
  let nullRecords = 0;
  while (offset < shpBytes) {
    if (offset + 8 > shpBytes) throw invalidRegion(`${names.shp} is truncated inside record ${records + 1}'s header.`);
    const contentBytes = shp.readInt32BE(offset + 4) * 2;
    if (contentBytes < 4 || offset + 8 + contentBytes > shpBytes) {
      throw invalidRegion(`${names.shp} is truncated or damaged at record ${records + 1} (byte ${offset}).`);
    }
    const type = shp.readInt32LE(offset + 8);
    if (type === 0) nullRecords++;
    else if (type !== shapeType) {
      throw invalidRegion(`${names.shp}: record ${records + 1} has shape type ${type} in a file of type ${shapeType}.`);
    }
    records++;
    offset += 8 + contentBytes;
  }

  const shxBytes = checkHeader(shx, names.shx);
  const indexed = (shxBytes - HEADER_BYTES) / 8;
  if (indexed !== records) {
    throw invalidRegion(`${names.shx} indexes ${indexed} records but ${names.shp} holds ${records}; the two files do not belong together.`);
  }

  if (dbf.length < 32) throw invalidRegion(`${names.dbf} is truncated: it is shorter than a dBASE header.`);
  const rows = dbf.readUInt32LE(4);
  const headerBytes = dbf.readUInt16LE(8);
  const rowBytes = dbf.readUInt16LE(10);
  if (rows !== records) {
    throw invalidRegion(`${names.dbf} has ${rows} attribute rows but ${names.shp} holds ${records} shapes; the files do not belong together.`);
  }
  if (headerBytes < 33 || headerBytes + rows * rowBytes > dbf.length) {
    throw invalidRegion(`${names.dbf} is truncated: its header declares ${headerBytes + rows * rowBytes} bytes but the file has ${dbf.length}.`);
  }
  return { shapeType, records, nullRecords };
}

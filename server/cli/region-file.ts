import { readFile } from 'node:fs/promises';
import { readRegion } from '../regions/read-region';

/** Reads a region file for a command, turning file-system errors into plain messages. */
export async function loadRegionFile(path: string | undefined) {
  if (!path) throw new Error('missing region file (GeoJSON, TopoJSON or zipped shapefile)');
  let buffer: Buffer;
  try {
    buffer = await readFile(path);
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new Error(code === 'ENOENT' ? `cannot read ${path}: no such file` : `cannot read ${path}: ${(err as Error).message}`);
  }
  return readRegion(buffer, path);
}

import { HttpError } from '../http/errors.js';

/**
 * Refusals of an uploaded region file. The message names what is wrong in the file (and where)
 * so the person can fix it; it is repeated under `fields.file` for the upload form.
 */
export const invalidRegion = (message: string) => new HttpError(422, 'invalid_region', message, { file: message });

/** The file, or what it unpacks to, is larger than we accept. */
export const regionTooLarge = (message: string) => new HttpError(413, 'too_large', message, { file: message });

/** Upload bounds: the file as sent, and everything a zip unpacks to. */
export const UPLOAD_LIMITS = {
  fileBytes: 25 * 1024 * 1024,
  unzippedBytes: 200 * 1024 * 1024,
  /** Real shapefiles deflate 2–10×; a far higher ratio on a sizeable entry is a decompression bomb. */
  maxRatio: 100,
  /** Entries smaller than this may have any ratio (a .cpg of 5 bytes "deflates" oddly). */
  ratioFloorBytes: 1024 * 1024,
  zipEntries: 100,
  /** Coordinates kept per region: enough for a 10m world country, bounded for the engine. */
  vertices: 2_000_000,
} as const;

export const mb = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

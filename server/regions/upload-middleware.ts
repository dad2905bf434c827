import type { RequestHandler } from 'express';
import multer from 'multer';
import { badRequest } from '../http/errors.js';
import { mb, regionTooLarge, UPLOAD_LIMITS } from './region-errors.js';

/** The uploaded region file as the route hands it to the service. */
export interface UploadedFile {
  buffer: Buffer;
  fileName: string;
}

// Held in memory (bounded): region files are parsed at once and only the result is stored.
const single = multer({
  storage: multer.memoryStorage(),
  // Every limit multer's own security advice names: the form has flat, short field names
  // ("file", "features"), so nested or indexed names (a[b], a[3]) are refused outright.
  limits: {
    fileSize: UPLOAD_LIMITS.fileBytes,
    files: 1,
    fields: 5,
    fieldSize: 4096,
    parts: 8,
    fieldNameSize: 100,
    headerPairs: 100,
    fieldNestingDepth: 0,
    fieldArrayIndexLimit: 0,
  },
  defParamCharset: 'utf8',
} as multer.Options).single('file');

/** Multipart upload of one file in the field `file`; limit breaches become clear 4xx answers. */
export const regionUpload: RequestHandler = (req, res, next) => {
  single(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(regionTooLarge(`The file is larger than ${mb(UPLOAD_LIMITS.fileBytes)}; simplify or split the boundary first.`));
      }
      if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
        return next(badRequest('Send exactly one file, in the form field named "file".', { file: 'Choose one file.' }));
      }
      return next(badRequest(`The upload was refused (${err.message}).`));
    }
    next(badRequest('The upload could not be read; please send it again.'));
  });
};

/** The file of a request that went through regionUpload, or a 400 asking for one. */
export function uploadedFile(file: Express.Multer.File | undefined): UploadedFile {
  if (!file || !file.buffer) {
    throw badRequest('Choose a region file to upload (a zipped shapefile, GeoJSON or TopoJSON).', { file: 'Choose a file.' });
  }
  const fileName = (file.originalname || 'upload').replace(/[\\/]/g, '_').slice(0, 200);
  return { buffer: file.buffer, fileName };
}

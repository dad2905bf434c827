import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';
import { HttpError } from '../http/errors.js';

const DB_DOWN_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'PROTOCOL_CONNECTION_LOST', 'ETIMEDOUT', 'EPIPE',
  'ER_SERVER_SHUTDOWN', 'ER_CON_COUNT_ERROR', 'PROTOCOL_SEQUENCE_TIMEOUT', 'ENOTCONN',
]);

/** True when an error means the database (or another backing service) is unreachable. */
export function isServiceDown(err: unknown): boolean {
  const e = err as { code?: string; driverError?: { code?: string }; cause?: { code?: string } };
  const code = e?.code ?? e?.driverError?.code ?? e?.cause?.code;
  return typeof code === 'string' && DB_DOWN_CODES.has(code);
}

/** Turns zod issues into `{ field: message }` for forms. */
export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.join('.') || '_';
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

/** An http-errors style 4xx from Express or body-parser (they set `status` and `expose`). */
function clientFault(err: unknown): err is { status: number; type?: string } {
  const e = err as { status?: unknown; expose?: unknown };
  return typeof e?.status === 'number' && e.status >= 400 && e.status < 500 && e.expose !== false;
}

function clientFaultBody(err: { status: number; type?: string; message?: string }): { code: string; message: string } {
  if (err.type === 'encoding.unsupported') return { code: 'unsupported_encoding', message: 'Send the request body uncompressed, or compressed with gzip or deflate.' };
  if (err.type === 'charset.unsupported') return { code: 'unsupported_charset', message: 'Send the request body as UTF-8.' };
  if (/decode param/i.test(err.message ?? '')) return { code: 'bad_url', message: 'The address contains a malformed %-escape.' };
  if (err.status === 413) return { code: 'too_large', message: 'The request body is too large.' };
  return { code: 'bad_request', message: 'The request could not be read.' };
}

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.path}.` } });
};

/**
 * The one error handler: known errors keep their status; nothing internal reaches the client.
 * A failure's error is logged through `logger`, the app's fully redacting logger — not `req.log`,
 * the access log's, whose redaction covers only the access line's own fields.
 */
export const createErrorHandler = (logger: Logger): ErrorRequestHandler => (err, req, res, _next) => {
  if (res.headersSent) return;
  let status = 500;
  let body: { code: string; message: string; fields?: Record<string, string> };
  if (err instanceof HttpError) {
    status = err.status;
    body = { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) };
  } else if (err instanceof ZodError) {
    status = 422;
    body = { code: 'validation_failed', message: 'Some fields need attention.', fields: zodFields(err) };
  } else if (err?.type === 'entity.parse.failed') {
    status = 400;
    body = { code: 'bad_json', message: 'The request body is not valid JSON.' };
  } else if (err?.type === 'entity.too.large') {
    status = 413;
    body = { code: 'too_large', message: 'The request body is too large.' };
  } else if (clientFault(err)) {
    // Refusals raised by Express or body-parser themselves (a malformed %-escape in the path, a
    // compressed or non-UTF-8 body): the caller's fault, so a 4xx in our words, not a 500.
    status = err.status;
    body = clientFaultBody(err);
  } else if (isServiceDown(err)) {
    status = 503;
    body = { code: 'unavailable', message: 'The database is not reachable right now. Please try again in a moment.' };
  } else {
    body = { code: 'internal', message: 'Something went wrong on our side. The error was logged.' };
  }
  // A refusal carries only its code, so the request's own access logger (already bound to the
  // request, redacting its fields) is enough and cheaper; a failure's error object gets the full walk.
  if (status >= 500) logger.error({ req: { id: req.id, method: req.method, url: req.originalUrl }, err }, 'request failed');
  else (req.log ?? logger).info({ code: body.code, status }, 'request refused');
  res.status(status).json({ error: body });
};

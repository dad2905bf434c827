/**
 * Errors thrown anywhere on the request path carry their HTTP status and a message a person
 * understands; the single error handler (server/middleware/error-handler.ts) turns them into
 * `{ error: { code, message, fields? } }`.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, 'bad_request', message, fields);
export const validationFailed = (message: string, fields: Record<string, string>) =>
  new HttpError(422, 'validation_failed', message, fields);
export const unauthorized = (message = 'Please sign in first.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'That item') => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);
export const tooLarge = (message: string) => new HttpError(413, 'too_large', message);
export const unavailable = (message: string) => new HttpError(503, 'unavailable', message);

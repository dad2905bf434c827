import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { HttpError } from '../http/errors.js';

/**
 * Synchronizer-token CSRF protection: the token lives in the server-side session and must come
 * back in the `X-CSRF-Token` header of every state-changing request. A cross-site form can send
 * the cookie but cannot read the token. SameSite=Lax cookies are a second line of defence.
 */
export const CSRF_HEADER = 'x-csrf-token';

export function csrfTokenFor(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

export const csrfCheck: RequestHandler = (req, _res, next) => {
  const sent = req.get(CSRF_HEADER) ?? '';
  const expected = req.session?.csrfToken ?? '';
  const ok =
    sent.length > 0 &&
    sent.length === expected.length &&
    timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
  if (!ok) {
    return next(
      new HttpError(403, 'csrf_failed', 'This request is missing its security token. Reload the page and try again.'),
    );
  }
  next();
};

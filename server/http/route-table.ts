import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { ZodType } from 'zod';
import type { Role } from '../../shared/api/roles.js';
import { forbidden, unauthorized } from './errors.js';

/**
 * Who may call a route: nobody signed in (`public`), anyone signed in, or the listed roles.
 * Every API route is declared in a table of RouteSpecs; the table is both what the router is
 * built from and what the role × route test iterates over, so the two can never drift apart.
 */
export type Access = 'public' | 'signed-in' | readonly Role[];

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec {
  method: Method;
  /** Path below /api, in Express syntax (`/projects/:projectId`). */
  path: string;
  access: Access;
  /** Runs after the access check, before the handler (uploads, rate limits). */
  before?: RequestHandler[];
  /** State-changing routes need the CSRF token unless this is false (signed webhooks only). */
  csrf?: boolean;
  /** Returns the JSON body (status 200 unless the handler set another), or sends the response itself. */
  handler: (req: Request, res: Response) => unknown;
  /** One line for the API index and the docs. */
  summary?: string;
  /**
   * Optional: the zod schema of the JSON body / the query the handler parses. Declaring them is
   * not required for the route to work; the bad-input test generates malformed payloads from them.
   */
  body?: ZodType;
  query?: ZodType;
}

export const ALL_ROLES: readonly Role[] = ['admin', 'cartographer', 'editor', 'client'];

export const isStateChanging = (m: Method) => m !== 'get';

export function allows(access: Access, role: Role | undefined): boolean {
  if (access === 'public') return true;
  if (!role) return false;
  if (access === 'signed-in') return true;
  return access.includes(role);
}

/** Middleware enforcing a route's Access against `req.actor` (set by load-actor). */
export function requireAccess(access: Access): RequestHandler {
  return (req, _res, next) => {
    if (access === 'public') return next();
    if (!req.actor) return next(unauthorized());
    if (!allows(access, req.actor.role)) return next(forbidden());
    next();
  };
}

/** Builds an Express router from route tables, wiring access → CSRF → before → handler. */
export function buildRouter(specs: readonly RouteSpec[], csrfCheck: RequestHandler): Router {
  const router = Router();
  for (const spec of specs) {
    const chain: RequestHandler[] = [requireAccess(spec.access)];
    if (isStateChanging(spec.method) && spec.csrf !== false) chain.push(csrfCheck);
    chain.push(...(spec.before ?? []));
    chain.push(async (req, res) => {
      const body = await spec.handler(req, res);
      if (!res.headersSent) {
        if (body === undefined) res.status(res.statusCode === 200 ? 204 : res.statusCode).end();
        else res.json(body);
      }
    });
    router[spec.method](spec.path, ...chain);
  }
  return router;
}

import type { Request, Response } from 'express';
import {
  resetPasswordSchema,
  resetRequestSchema,
  signInSchema,
  signUpSchema,
  type SessionInfo,
} from '../../shared/api/auth.schema.js';
import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { csrfTokenFor } from '../middleware/csrf.js';
import { resetRequestLimiters, signInLimiters } from '../middleware/rate-limit.js';
import {
  actorFor,
  authenticate,
  requestPasswordReset,
  resetPassword,
  sessionInfo,
  signUp,
  warmUpPasswordCheck,
} from '../services/auth.service.js';

const regenerate = (req: Request) => new Promise<void>((ok, fail) => req.session.regenerate((err) => (err ? fail(err) : ok())));
const destroy = (req: Request) => new Promise<void>((ok, fail) => req.session.destroy((err) => (err ? fail(err) : ok())));

/**
 * Signs a person in to a membership on a brand-new session id (a session-fixation defence:
 * an id planted before sign-in is worth nothing after it) with a fresh CSRF token.
 */
export async function startSession(deps: AppDeps, req: Request, ids: { userId: number; membershipId: number }): Promise<SessionInfo> {
  await regenerate(req);
  req.session.userId = ids.userId;
  req.session.membershipId = ids.membershipId;
  const actor = await actorFor(deps.dataSource, ids.membershipId);
  req.actor = actor;
  return sessionInfo(deps.dataSource, actor, csrfTokenFor(req));
}

/** Sign-up, sign-in, sign-out, the session and password reset. */
export function authRoutes(deps: AppDeps): RouteSpec[] {
  warmUpPasswordCheck();
  return [
    {
      method: 'get',
      path: '/auth/csrf',
      access: 'public',
      summary: "The session's CSRF token",
      handler: (req) => ({ csrfToken: csrfTokenFor(req) }),
    },
    {
      method: 'get',
      path: '/auth/session',
      access: 'public',
      summary: 'Who is signed in, and the CSRF token',
      handler: (req) => sessionInfo(deps.dataSource, req.actor, csrfTokenFor(req)),
    },
    {
      method: 'post',
      path: '/auth/sign-up',
      access: 'public',
      summary: 'Create a studio and its first admin, and sign in',
      handler: async (req, res: Response) => {
        const input = signUpSchema.parse(req.body);
        const ids = await signUp(deps.dataSource, input);
        const body = await startSession(deps, req, ids);
        res.status(201);
        return body;
      },
    },
    {
      method: 'post',
      path: '/auth/sign-in',
      access: 'public',
      before: signInLimiters(),
      summary: 'Sign in with e-mail and password',
      handler: async (req) => {
        const ids = await authenticate(deps.dataSource, signInSchema.parse(req.body));
        return startSession(deps, req, ids);
      },
    },
    {
      method: 'post',
      path: '/auth/sign-out',
      access: 'signed-in',
      summary: 'Sign out (ends the session)',
      handler: async (req, res: Response) => {
        await destroy(req);
        res.clearCookie('wm.sid', { path: '/' });
        res.status(204);
      },
    },
    {
      method: 'post',
      path: '/auth/reset-request',
      access: 'public',
      before: resetRequestLimiters(),
      summary: 'E-mail a password-reset link (always 202)',
      handler: async (req, res: Response) => {
        const { email } = resetRequestSchema.parse(req.body);
        await requestPasswordReset(deps, email);
        res.status(202);
        return { message: 'If an account uses this address, a link to choose a new password is on its way.' };
      },
    },
    {
      method: 'post',
      path: '/auth/reset',
      access: 'public',
      summary: 'Choose a new password with a reset link',
      handler: async (req, res: Response) => {
        const input = resetPasswordSchema.parse(req.body);
        await resetPassword(deps.dataSource, input.token, input.password);
        res.status(204);
      },
    },
  ];
}

import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { HttpError } from '../http/errors.js';

/**
 * Rate limits for the routes attackers like: sign-in, password-reset requests and invitations.
 * Each factory call makes fresh counters, so each app (and each test app) counts on its own.
 * Counters live in memory (one app process); a multi-process deployment would give them a
 * shared store. `WARPMETER_RATE_LIMIT_SCALE` multiplies every limit (e.g. `2` doubles them)
 * so a test run or a demo can loosen them without switching them off; they are never off.
 */
export function rateLimitScale(env: NodeJS.ProcessEnv = process.env): number {
  const scale = Number(env.WARPMETER_RATE_LIMIT_SCALE ?? '1');
  return Number.isFinite(scale) && scale > 0 ? scale : 1;
}

export interface LimitOptions {
  /** Requests allowed per window before 429. */
  limit: number;
  windowMs: number;
  /** Which bucket a request counts against. */
  key: (req: Request) => string;
  /** Only failed requests count (a correct sign-in does not use up the allowance). */
  countFailuresOnly?: boolean;
  /** What was limited, for the message ("sign-in attempts"). */
  what: string;
}

const ipOf = (req: Request) => ipKeyGenerator(req.ip ?? 'unknown');
const bodyEmail = (req: Request) =>
  typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase().slice(0, 254) : '';

/** Keys for the common buckets. */
export const byIp = (req: Request) => `ip:${ipOf(req)}`;
export const byIpAndEmail = (req: Request) => `ip:${ipOf(req)}|email:${bodyEmail(req)}`;
export const byStudio = (req: Request) => (req.actor ? `studio:${req.actor.studioId}` : `ip:${ipOf(req)}`);

function waitWords(resetTime: Date | undefined): string {
  const seconds = Math.max(1, Math.ceil(((resetTime?.getTime() ?? Date.now() + 60_000) - Date.now()) / 1000));
  if (seconds < 90) return `${seconds} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? '1 minute' : `${minutes} minutes`;
}

/** One limiter; a refused request reaches the error handler as a 429 in the usual error shape. */
export function createLimiter(opts: LimitOptions, scale = rateLimitScale()): RequestHandler {
  return rateLimit({
    windowMs: opts.windowMs,
    limit: Math.max(1, Math.round(opts.limit * scale)),
    keyGenerator: opts.key,
    skipSuccessfulRequests: opts.countFailuresOnly ?? false,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (req, res, next) => {
      const info = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit;
      const wait = waitWords(info?.resetTime);
      next(new HttpError(429, 'rate_limited', `Too many ${opts.what}. Please wait ${wait} and try again.`));
    },
  });
}

const MINUTE = 60_000;

/** 10 failed sign-ins per 15 min for one e-mail from one address, 50 per address overall. */
export const signInLimiters = (scale = rateLimitScale()) => [
  createLimiter({ what: 'sign-in attempts', limit: 10, windowMs: 15 * MINUTE, key: byIpAndEmail, countFailuresOnly: true }, scale),
  createLimiter({ what: 'sign-in attempts from your network', limit: 50, windowMs: 15 * MINUTE, key: byIp, countFailuresOnly: true }, scale),
];

/** 5 reset requests per hour for one e-mail from one address, 20 per address overall. */
export const resetRequestLimiters = (scale = rateLimitScale()) => [
  createLimiter({ what: 'password-reset requests', limit: 5, windowMs: 60 * MINUTE, key: byIpAndEmail }, scale),
  createLimiter({ what: 'password-reset requests from your network', limit: 20, windowMs: 60 * MINUTE, key: byIp }, scale),
];

/** 30 invitations per hour per studio. */
export const inviteLimiters = (scale = rateLimitScale()) => [
  createLimiter({ what: 'invitations sent from your studio', limit: 30, windowMs: 60 * MINUTE, key: byStudio }, scale),
];

import 'reflect-metadata';
import './http/actor.js';
import fs from 'node:fs';
import type { IncomingMessage, ServerResponse } from 'node:http';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import session from 'express-session';
import { pinoHttp } from 'pino-http';
import type { AppDeps } from './deps.js';
import { buildRouter } from './http/route-table.js';
import { createSessionStore } from './http/session-store.js';
import { csrfCheck } from './middleware/csrf.js';
import { createErrorHandler, notFoundHandler } from './middleware/error-handler.js';
import { loadActor } from './middleware/load-actor.js';
import { ACCESS_LOG_REDACTION } from './log-redaction.js';
import { apiRoutes } from './routes/index.js';

const ROOT = path.resolve(import.meta.dirname, '..');

interface TouchingStore {
  touch(sid: string, session: unknown, cb?: (err?: unknown) => void): void;
}

/** At most one expiry refresh per session per minute (the expiry is 12 hours). */
const TOUCH_INTERVAL_MS = 60_000;

/**
 * Rolling sessions make express-session refresh the stored expiry on every request: an UPDATE of
 * the sessions table behind every GET. Refreshing it at most once a minute per session keeps the
 * 12-hour rolling expiry (to within a minute) at a fraction of the writes.
 */
function throttleTouches(store: TouchingStore): void {
  const touch = store.touch.bind(store);
  const last = new Map<string, number>();
  store.touch = (sid, session, cb) => {
    const now = Date.now();
    if (now - (last.get(sid) ?? 0) < TOUCH_INTERVAL_MS) return void cb?.();
    if (last.size > 50_000) last.clear();
    last.set(sid, now);
    touch(sid, session, cb);
  };
}

/** Request headers an access line keeps; the secret ones (cookie, CSRF token) are there to show that they were sent, and ACCESS_LOG_REDACTION masks them. */
const LOGGED_HEADERS = ['host', 'user-agent', 'referer', 'content-type', 'content-length', 'x-forwarded-for', 'cookie', 'authorization', 'x-csrf-token'];

function accessLogRequest(req: IncomingMessage & { id?: unknown; originalUrl?: string }) {
  const headers: Record<string, unknown> = {};
  for (const h of LOGGED_HEADERS) if (req.headers[h] !== undefined) headers[h] = req.headers[h];
  return { id: req.id, method: req.method, url: req.originalUrl ?? req.url, remoteAddress: req.socket?.remoteAddress, headers };
}

/** Builds the Express app; never listens (server/index.ts does, tests use supertest). */
export function createApp(deps: AppDeps): Express {
  const { config } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    pinoHttp({
      // The access log's own logger: its lines hold only what the serializers below pick, so it
      // redacts those exact fields instead of walking every object for secrets (see
      // ACCESS_LOG_REDACTION). Errors are logged by the error handler through the app's logger.
      logger: deps.logger.child({}, { redact: ACCESS_LOG_REDACTION }),
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // A short access line: the request's method, address and a few headers, the answer's status.
      // Every request writes one, so it stays small: the whole header set, walked by the
      // redaction twice per request, was one of the larger costs of a request in a profile.
      wrapSerializers: false,
      serializers: { req: accessLogRequest, res: (res: ServerResponse) => ({ statusCode: res.statusCode }) },
      // A failed request's access line says that it failed; the error itself is in the error
      // handler's line (same request id), which the app's logger redacts in full.
      customErrorObject: (_req, _res, _err, line: Record<string, unknown>) => ({ res: line.res, responseTime: line.responseTime }),
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      hsts: config.secureCookies ? { maxAge: 31536000, includeSubDomains: true } : false,
      crossOriginEmbedderPolicy: false,
    }),
  );

  const store = createSessionStore(deps.dataSource);
  deps.services.sessionStore = store;
  throttleTouches(store as unknown as TouchingStore);

  const api = express.Router();
  // Raw bodies for signed webhooks are read by their own route; everything else is JSON.
  api.use((req, res, next) => (req.path.startsWith('/billing/webhook') ? next() : express.json({ limit: '2mb' })(req, res, next)));
  api.use(
    session({
      name: 'wm.sid',
      secret: config.sessionSecret,
      store: store as never,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: 1000 * 60 * 60 * 12 },
    }),
  );
  api.use(loadActor);
  api.use(buildRouter(apiRoutes(deps), csrfCheck));
  api.use(notFoundHandler);
  app.use('/api', api);

  const fonts = path.join(ROOT, 'fonts');
  app.use('/fonts', express.static(fonts, { maxAge: '30d', immutable: true }));
  const dist = path.join(ROOT, 'dist');
  if (fs.existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }
  app.use(createErrorHandler(deps.logger));
  return app;
}

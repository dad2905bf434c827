import 'reflect-metadata';
import pino, { type DestinationStream, type Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { loadConfig, type Config } from './config.js';
import { createDataSource } from './data-source.js';
import type { AppDeps } from './deps.js';
import { createMailer } from './mail/mailer.js';

const SECRET_KEYS = ['password', 'passwordHash', 'token', 'csrfToken', 'sessionSecret', 'apiKey', 'webhookSecret'];

/**
 * What never reaches a log line: cookies (they carry the session id), the CSRF header, set-cookie
 * answers, and any password, token or secret in a logged object (up to three levels deep). In
 * URLs only the token part is masked (`/api/invitations/<token>`, `?token=`), so paths stay useful.
 */
export const LOG_REDACTION = {
  paths: [
    'req.headers.cookie',
    'req.headers.authorization',
    'req.headers["x-csrf-token"]',
    'res.headers["set-cookie"]',
    'req.url',
    ...SECRET_KEYS.flatMap((k) => [k, `*.${k}`, `*.*.${k}`]),
  ],
  censor: (value: unknown, path: string[]) =>
    path[path.length - 1] === 'url' && typeof value === 'string'
      ? value.replace(/(\/invitations\/)(?!accept\b)[^/?#]+/, '$1[redacted]').replace(/([?&]token=)[^&#]*/g, '$1[redacted]')
      : '[redacted]',
};

/** The app's logger, with LOG_REDACTION applied. */
export function createLogger(level = process.env.LOG_LEVEL ?? 'info', destination?: DestinationStream): Logger {
  return pino({ level, redact: LOG_REDACTION }, destination);
}

/**
 * Opens every connection of the pool now (the pool otherwise opens them one by one under the
 * first burst of requests, each a handshake while requests wait). Concurrent queries make it.
 */
async function openPool(dataSource: DataSource, size: number): Promise<void> {
  await Promise.all(Array.from({ length: size }, () => dataSource.query('SELECT 1')));
}

/** Connects to MariaDB, runs pending migrations and assembles the app's dependencies. */
export async function bootstrap(config: Config = loadConfig(), logger?: Logger): Promise<AppDeps> {
  const log = logger ?? createLogger();
  const dataSource = createDataSource(config.db);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  await openPool(dataSource, config.db.poolSize);
  return { config, dataSource, logger: log, mailer: createMailer(config.smtp, dataSource, log), services: {} };
}

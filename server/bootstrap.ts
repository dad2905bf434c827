import 'reflect-metadata';
import pino, { type DestinationStream, type Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { loadConfig, type Config } from './config.js';
import { createDataSource } from './data-source.js';
import type { AppDeps } from './deps.js';
import { LOG_REDACTION } from './log-redaction.js';
import { createMailer } from './mail/mailer.js';

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

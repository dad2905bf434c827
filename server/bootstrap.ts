import 'reflect-metadata';
import pino, { type Logger } from 'pino';
import { loadConfig, type Config } from './config.js';
import { createDataSource } from './data-source.js';
import type { AppDeps } from './deps.js';
import { createMailer } from './mail/mailer.js';

/** Connects to MariaDB, runs pending migrations and assembles the app's dependencies. */
export async function bootstrap(config: Config = loadConfig(), logger?: Logger): Promise<AppDeps> {
  const log = logger ?? pino({ level: process.env.LOG_LEVEL ?? 'info' });
  const dataSource = createDataSource(config.db);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  return { config, dataSource, logger: log, mailer: createMailer(config.smtp, dataSource, log), services: {} };
}

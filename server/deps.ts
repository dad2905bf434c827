import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Config } from './config.js';
import type { Mailer } from './mail/mailer.js';

/**
 * Everything the app needs from the outside world, passed in so tests can build an app
 * against their own database and fakes. Later features add their optional services here.
 */
export interface AppDeps {
  config: Config;
  dataSource: DataSource;
  logger: Logger;
  mailer: Mailer;
  /** Extra services keyed by name (job queue, payment client, …), set by the modules that own them. */
  services: Record<string, unknown>;
}

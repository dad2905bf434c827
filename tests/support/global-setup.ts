import type { TestProject } from 'vitest/node';
import { loadConfig } from '../../server/config.js';
import { startFakeSmtp, type FakeSmtp } from '../../server/fakes/smtp.js';
import { startFakePay } from '../../server/fakes/pay.js';
import { createFreshDatabase } from './fresh-database.js';

/**
 * Once per test run: make sure MariaDB and Redis are up (installing them when missing), create a
 * fresh database for this run, migrate it, and start this run's own fake SMTP and payment servers.
 * Environment variables set here reach the test workers, which build their apps from them.
 */
export default async function setup(project: TestProject) {
  const db = await createFreshDatabase('wm_test');
  const { dbName } = db;

  const smtp: FakeSmtp = await startFakeSmtp();
  // This run's own payment provider; tests that need its webhooks point it at their app through
  // its control route `POST /_fake/config {webhookUrl}`.
  const pay = await startFakePay({ webhookSecret: loadConfig().pay.webhookSecret });
  process.env.WARPMETER_PAY_PORT = String(pay.port);
  process.env.WARPMETER_DB_NAME = dbName;
  process.env.WARPMETER_SMTP_PORT = String(smtp.smtpPort);
  process.env.WARPMETER_MAILBOX_URL = `http://127.0.0.1:${smtp.httpPort}`;
  process.env.WARPMETER_QUEUE_PREFIX = `wmtest-${dbName}`;
  process.env.LOG_LEVEL = process.env.LOG_LEVEL ?? 'silent';
  project.provide('dbName', dbName);

  return async () => {
    await smtp.close();
    await pay.close();
    await db.close({ keepDatabase: Boolean(process.env.WARPMETER_KEEP_TEST_DB) });
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    dbName: string;
  }
}

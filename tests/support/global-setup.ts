import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import mysql from 'mysql2/promise';
import type { TestProject } from 'vitest/node';
import { loadConfig } from '../../server/config.js';
import { createDataSource } from '../../server/data-source.js';
import { startFakeSmtp, type FakeSmtp } from '../../server/fakes/smtp.js';
import { startFakePay } from '../../server/fakes/pay.js';

const ROOT = path.resolve(import.meta.dirname, '../..');

/**
 * Once per test run: make sure MariaDB and Redis are up (installing them when missing), create a
 * fresh database for this run, migrate it, and start this run's own fake SMTP and payment servers.
 * Environment variables set here reach the test workers, which build their apps from them.
 */
export default async function setup(project: TestProject) {
  execFileSync('bash', [path.join(ROOT, 'server/scripts/services.sh', ), 'up'], {
    stdio: 'inherit',
    env: { ...process.env, WARPMETER_NO_FAKES: '1' },
  });
  const dbName = `wm_test_${Date.now().toString(36)}_${randomBytes(3).toString('hex')}`;
  const base = loadConfig().db;
  const admin = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password });
  await admin.query(`CREATE DATABASE \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  const ds = createDataSource({ ...base, database: dbName });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();

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
    if (!process.env.WARPMETER_KEEP_TEST_DB) await admin.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
    await admin.end();
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    dbName: string;
  }
}

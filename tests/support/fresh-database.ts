import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { loadConfig } from '../../server/config.js';
import { createDataSource } from '../../server/data-source.js';

const ROOT = path.resolve(import.meta.dirname, '../..');

export interface FreshDatabase {
  dbName: string;
  /** A unique tag for this database's queue prefix and folders. */
  tag: string;
  /** Drops the database (unless keepDatabase, to look at it afterwards) and ends the admin connection. */
  close(opts?: { keepDatabase?: boolean }): Promise<void>;
}

/**
 * Makes sure MariaDB and Redis are up (installing them when missing), then creates a database of
 * the caller's own, named `<prefix>_<tag>`, and runs every migration on it. Test runs and bench
 * sections each get one, so they never share rows.
 */
export async function createFreshDatabase(prefix: string): Promise<FreshDatabase> {
  execFileSync('bash', [path.join(ROOT, 'server/scripts/services.sh'), 'up'], {
    stdio: 'inherit',
    env: { ...process.env, WARPMETER_NO_FAKES: '1' },
  });
  const tag = `${Date.now().toString(36)}_${randomBytes(3).toString('hex')}`;
  const dbName = `${prefix}_${tag}`;
  const base = loadConfig().db;
  const admin = await mysql.createConnection({ host: base.host, port: base.port, user: base.user, password: base.password });
  await admin.query(`CREATE DATABASE \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  const ds = createDataSource({ ...base, database: dbName });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
  return {
    dbName,
    tag,
    async close({ keepDatabase = false } = {}) {
      if (!keepDatabase) await admin.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
      await admin.end();
    },
  };
}

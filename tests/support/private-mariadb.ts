import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { freePort, ROOT, sleep } from './process.js';

/**
 * A MariaDB server of a test's own (own port, own datadir under tests/.tmp/), so a fault test
 * can stop and start it without touching the server every other test shares. Set up the way
 * server/scripts/services.sh sets up the project's server: mariadb-install-db, then mariadbd,
 * both with --no-defaults and the charset flags passed by hand.
 */
export interface PrivateMariadb {
  port: number;
  user: string;
  password: string;
  database: string;
  /** Stops the server (clean shutdown) and waits until it no longer answers. */
  stop(): Promise<void>;
  /** Starts it again on the same port and datadir and waits until it answers. */
  start(): Promise<void>;
  /** Stops it and removes its datadir. */
  destroy(): Promise<void>;
}

const MARIADBD = '/usr/sbin/mariadbd';

function ensureInstalled() {
  execFileSync('bash', [path.join(ROOT, 'server/scripts/ensure-debian.sh'), `${MARIADBD}:mariadb-server`, 'mariadb-admin:mariadb-client'], { stdio: 'inherit' });
}

export async function startPrivateMariadb(): Promise<PrivateMariadb> {
  ensureInstalled();
  const dir = path.join(ROOT, 'tests/.tmp', `mariadb-${randomBytes(4).toString('hex')}`);
  const data = path.join(dir, 'data');
  const socket = path.join(dir, 'mysqld.sock');
  fs.mkdirSync(data, { recursive: true });
  execFileSync('mariadb-install-db', ['--no-defaults', '--user=root', `--datadir=${data}`, '--auth-root-authentication-method=socket', '--skip-test-db'], {
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  const port = await freePort();
  const db: PrivateMariadb = {
    port,
    user: 'warpmeter',
    password: `pw-${randomBytes(6).toString('hex')}`,
    database: 'wm_fault',
    async start() {
      const child = spawn(
        MARIADBD,
        [
          '--no-defaults', '--user=root', `--datadir=${data}`, `--socket=${socket}`, `--pid-file=${path.join(dir, 'mariadb.pid')}`,
          `--log-error=${path.join(dir, 'mariadb.err')}`, `--port=${port}`, '--bind-address=127.0.0.1', '--skip-name-resolve',
          '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci', '--max-allowed-packet=64M',
          '--innodb-buffer-pool-size=32M', '--innodb-log-file-size=16M', '--performance-schema=OFF',
        ],
        { detached: true, stdio: 'ignore' },
      );
      child.unref();
      for (let i = 0; i < 300 && !ping(socket); i++) await sleep(100);
      if (!ping(socket)) throw new Error(`private MariaDB did not start; see ${path.join(dir, 'mariadb.err')}`);
    },
    async stop() {
      try {
        execFileSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-u', 'root', 'shutdown'], { stdio: 'ignore' });
      } catch {
        // already down
      }
      for (let i = 0; i < 100 && ping(socket); i++) await sleep(100);
    },
    async destroy() {
      await db.stop();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
  await db.start();
  execFileSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-u', 'root'], {
    input: `CREATE DATABASE \`${db.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER '${db.user}'@'127.0.0.1' IDENTIFIED BY '${db.password}';
GRANT ALL PRIVILEGES ON *.* TO '${db.user}'@'127.0.0.1';
FLUSH PRIVILEGES;`,
  });
  return db;
}

function ping(socket: string): boolean {
  try {
    execFileSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-u', 'root', 'ping'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { Express } from 'express';
import type { AppDeps } from '../../server/deps.js';
import { createHttpServer } from '../../server/http/http-server.js';
import { createTestApp } from './test-app.js';

const ROOT = path.resolve(import.meta.dirname, '../..');
const DIST_INDEX = path.join(ROOT, 'dist/index.html');
// What the client bundle is built from; a newer file here means dist/ is stale.
const CLIENT_SOURCES = ['index.html', 'src', 'shared/api', 'vite.config.ts', 'postcss.config.js'];

function newestMtimeMs(p: string): number {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of fs.readdirSync(p)) newest = Math.max(newest, newestMtimeMs(path.join(p, entry)));
  return newest;
}

const distIsFresh = () =>
  fs.existsSync(DIST_INDEX) &&
  fs.statSync(DIST_INDEX).mtimeMs >= Math.max(...CLIENT_SOURCES.map((s) => newestMtimeMs(path.join(ROOT, s))));

/**
 * Builds the client when dist/ is missing or older than its sources (tests/run-all.sh builds it
 * before vitest, so this only runs when a browser test is started on its own). A lock keeps
 * parallel runs from building over each other.
 */
export function ensureClientBuilt() {
  if (distIsFresh()) return;
  const lock = path.join(ROOT, '.data/run/vite-build.lock');
  fs.mkdirSync(path.dirname(lock), { recursive: true });
  const script = `[ -f dist/index.html ] && [ -z "$(find ${CLIENT_SOURCES.join(' ')} -newer dist/index.html -print -quit 2>/dev/null)" ] || npx vite build --logLevel warn`;
  execFileSync('flock', [lock, 'bash', '-c', script], { cwd: ROOT, stdio: 'inherit' });
}

export interface ServedApp {
  /** Base URL, e.g. http://127.0.0.1:41234 (no trailing slash). */
  url: string;
  app: Express;
  deps: AppDeps;
  close(): Promise<void>;
}

/** The whole app (API and built client) on this run's test database, on a free loopback port. */
export async function serveApp(): Promise<ServedApp> {
  ensureClientBuilt();
  const t = await createTestApp();
  const server = createHttpServer(t.app).listen(0, '127.0.0.1');
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    app: t.app,
    deps: t.deps,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
    },
  };
}

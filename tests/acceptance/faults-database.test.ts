import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import { createApp } from '../../server/app.js';
import { bootstrap } from '../../server/bootstrap.js';
import { loadConfig } from '../../server/config.js';
import type { AppDeps } from '../../server/deps.js';
import { MapProject } from '../../server/entities/index.js';
import { startPrivateMariadb, type PrivateMariadb } from '../support/private-mariadb.js';
import { sleep } from '../support/process.js';
import { anonymousClient } from '../support/studio-fixture.js';
import type { Client } from '../support/test-app.js';

/**
 * MariaDB goes away under a running app and comes back: while it is down every request answers
 * a clean 503 JSON within a few seconds (no hang, no 500, no stack), /api/health says the
 * database is down, and once it is back the SAME app process serves again — sessions included,
 * since they live in the database too. Runs against a private MariaDB of its own, never the
 * server the other tests share.
 */
const DOWN_ANSWER_MS = 6000;

let db: PrivateMariadb;
let deps: AppDeps;
let app: Express;
let c: Client;

beforeAll(async () => {
  db = await startPrivateMariadb();
  const base = loadConfig();
  deps = await bootstrap({ ...base, db: { host: '127.0.0.1', port: db.port, user: db.user, password: db.password, database: db.database, poolSize: base.db.poolSize } }, pino({ level: 'silent' }));
  app = createApp(deps);
  c = await anonymousClient(app);
  const up = await c.post('/api/auth/sign-up', { studioName: 'Outage Studio', name: 'Olga', email: 'olga@outage.test', password: 'outage-password-1' });
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  c.csrf = up.body.csrfToken;
}, 120_000);

afterAll(async () => {
  await (deps?.services.sessionStore as { close?: () => Promise<void> } | undefined)?.close?.().catch(() => {});
  await deps?.dataSource.destroy().catch(() => {});
  await db?.destroy();
});

const timed = async <T>(run: () => Promise<T>) => {
  const t0 = Date.now();
  const out = await run();
  return { out, ms: Date.now() - t0 };
};
const newProject = (title: string) => ({ title, clientName: 'Outage client', purpose: 'reference', scaleBand: 'country' });

describe('MariaDB restarts under a running app', () => {
  it('answers 503 while it is down and recovers by itself when it is back', async () => {
    expect((await c.post('/api/projects', newProject('Before the outage'))).status).toBe(201);

    // Requests in flight while the server shuts down: each gets an answer, none a 500.
    const inFlight = Array.from({ length: 20 }, (_, i) => (i % 2 ? c.get('/api/projects') : c.post('/api/projects', newProject(`During ${i}`))));
    await db.stop();
    for (const res of await Promise.all(inFlight)) {
      expect([200, 201, 503]).toContain(res.status);
      if (res.status === 503) expect(res.body.error.code).toBe('unavailable');
    }

    const downAnswers = [];
    for (const run of [() => c.get('/api/projects'), () => c.post('/api/projects', newProject('While down')), () => c.get('/api/auth/session')]) {
      downAnswers.push(await timed(run));
    }
    for (const { out: res, ms } of downAnswers) {
      expect(res.status, res.text).toBe(503);
      expect(res.body).toEqual({ error: { code: 'unavailable', message: expect.stringMatching(/database/i) } });
      expect(ms).toBeLessThan(DOWN_ANSWER_MS);
    }
    // A monitoring probe (no session cookie) gets the health body itself.
    const health = await timed(() => request(app).get('/api/health'));
    expect(health.out.status).toBe(503);
    expect(health.out.body).toEqual({ status: 'degraded', database: 'down' });
    expect(health.ms).toBeLessThan(DOWN_ANSWER_MS);

    await db.start();
    // The same app process, no restart: the pools reconnect on their own.
    let recoveredAfterMs = -1;
    const t0 = Date.now();
    while (Date.now() - t0 < 20_000) {
      const res = await c.get('/api/projects');
      if (res.status === 200) {
        recoveredAfterMs = Date.now() - t0;
        break;
      }
      expect(res.status).toBe(503);
      await sleep(200);
    }
    expect(recoveredAfterMs).toBeGreaterThanOrEqual(0);
    console.info(`faults-database: 503 answers while down took ${downAnswers.map((d) => d.ms).join('/')} ms; recovered ${recoveredAfterMs} ms after the restart`);
    expect((await c.get('/api/health')).body).toEqual({ status: 'ok', database: 'up' });
    // Still signed in (the session survived in MariaDB), and writes work again.
    expect((await c.get('/api/auth/session')).body.user.email).toBe('olga@outage.test');
    expect((await c.post('/api/projects', newProject('After the outage'))).status).toBe(201);
    const titles = (await deps.dataSource.getRepository(MapProject).find()).map((p) => p.title);
    expect(titles).toContain('Before the outage');
    expect(titles).toContain('After the outage');
    expect(titles).not.toContain('While down');
  }, 90_000);
});

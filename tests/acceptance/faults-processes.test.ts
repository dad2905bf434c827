import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { Audit, Scorecard } from '../../server/entities/index.js';
import { auditJobId, createAuditQueue } from '../../server/jobs/queue.js';
import { createAuditProject } from '../support/audit-fixture.js';
import { freePort, killHard, ROOT, sleep, startAppProcess, startWorkerProcess, stopGently, type Proc } from '../support/process.js';
import { createStudioWithRoles, signedInClient } from '../support/studio-fixture.js';
import { createTestApp, type Client } from '../support/test-app.js';

/**
 * kill -9 of BOTH the app server process (with its own in-process audit worker) and an extra
 * `npm run worker` process in the middle of an audit, then both restarted: the audit finishes
 * exactly once — one scorecard per candidate, one completed BullMQ job — and at no moment, polled
 * through the API and straight from the database, is a partial set of scorecards visible.
 */
const RUN_TAG = randomBytes(3).toString('hex');
const PREFIX = `${process.env.WARPMETER_QUEUE_PREFIX}-kill-${RUN_TAG}`;
const LOGS = path.join(ROOT, 'tests/.tmp', `faults-processes-${RUN_TAG}`);
const env = {
  WARPMETER_QUEUE_PREFIX: PREFIX,
  // Short locks so a dead worker's job is handed on within seconds (production keeps 10 s / 5 s).
  WARPMETER_JOB_LOCK_MS: '3000',
  WARPMETER_JOB_STALL_CHECK_MS: '1000',
  WARPMETER_DATA_DIR: path.join(LOGS, 'files'),
  WARPMETER_RATE_LIMIT_SCALE: '10',
  LOG_LEVEL: 'info',
};
const DEFINITIONS = [
  '+proj=tmerc +lat_0=0 +lon_0=-71 +k_0=0.9996 +x_0=500000 +y_0=10000000 +ellps=WGS84',
  '+proj=laea +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=lcc +lat_1=-22 +lat_2=-48 +lat_0=-35 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=aeqd +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
];

let t: Awaited<ReturnType<typeof createTestApp>>;
const procs: Proc[] = [];

beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  for (const p of procs) await killHard(p);
  await t.close();
  fs.rmSync(LOGS, { recursive: true, force: true });
});

async function startServer(port: number, n: number) {
  const p = await startAppProcess({ port, env, logFile: path.join(LOGS, `app-${n}.log`) });
  procs.push(p);
  return p;
}
async function startWorker(n: number) {
  const p = await startWorkerProcess(env, path.join(LOGS, `worker-${n}.log`));
  procs.push(p);
  return p;
}

describe('server and worker killed during an audit', () => {
  it('the audit completes exactly once after both restart, never showing a partial scorecard', async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const [server1, worker1] = await Promise.all([startServer(port, 1), startWorker(1)]);
    const s = await createStudioWithRoles(t);
    const p = await createAuditProject(t.deps, s, { definitions: DEFINITIONS });
    const carto = await signedInClient(url as unknown as Express, s.users.cartographer.email, s.users.cartographer.password);
    const editor = await signedInClient(url as unknown as Express, s.users.editor.email, s.users.editor.password);

    const started = await carto.post(`/api/projects/${p.projectId}/audits`, { samples: 400_000, seed: 5 });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    const auditId: number = started.body.id;
    const audits = t.deps.dataSource.getRepository(Audit);
    const cards = t.deps.dataSource.getRepository(Scorecard);

    // Watch the database the whole time: the count of scorecards is 0 until the audit is done, then all.
    const seenCounts = new Set<number>();
    let watching = true;
    const watcher = (async () => {
      while (watching) {
        const [n, row] = await Promise.all([cards.countBy({ auditId }), audits.findOneByOrFail({ id: auditId })]);
        seenCounts.add(n);
        if (n !== 0 && (n !== DEFINITIONS.length || row.status !== 'done')) seenCounts.add(-1000 - n);
        await sleep(25);
      }
    })();
    const apiViews: string[] = [];
    const poll = async (c: Client) => {
      const res = await c.get(`/api/audits/${auditId}`);
      if (res.status !== 200) return undefined;
      const view = `${res.body.status}:${res.body.scorecards.length}`;
      apiViews.push(view);
      return res.body as { status: string; progress: number; scorecards: unknown[] };
    };

    // Part-way through, kill both processes for real.
    const until = Date.now() + 90_000;
    for (;;) {
      const a = await poll(editor);
      if (a?.status === 'running' && a.progress > 0.05) break;
      if (a?.status === 'done' || Date.now() > until) throw new Error(`never saw the audit mid-run: ${JSON.stringify(a)}`);
      await sleep(50);
    }
    await Promise.all([killHard(server1), killHard(worker1)]);
    expect(server1.child.signalCode ?? 'SIGKILL').toBe('SIGKILL');
    const mid = await audits.findOneByOrFail({ id: auditId });
    expect(mid.status).toBe('running');
    expect(await cards.countBy({ auditId })).toBe(0);

    // Restart both; the session cookie still works (sessions live in MariaDB).
    await Promise.all([startServer(port, 2), startWorker(2)]);
    const t0 = Date.now();
    let final;
    for (;;) {
      final = await poll(editor);
      if (final?.status === 'done' || final?.status === 'failed') break;
      if (Date.now() - t0 > 120_000) throw new Error(`audit still ${final?.status} ${final?.progress} two minutes after the restart`);
      await sleep(150);
    }
    watching = false;
    await watcher;
    console.info(`faults-processes: audit ${auditId} finished ${Date.now() - t0} ms after the restart; DB scorecard counts seen ${[...seenCounts].join(',')}; ${apiViews.length} API polls`);

    expect(final!.status).toBe('done');
    expect(final!.scorecards).toHaveLength(DEFINITIONS.length);
    // Exactly once: one row per candidate, and BullMQ completed the one job once.
    const rows = await cards.findBy({ auditId });
    expect(rows.map((r) => r.candidateId).sort()).toEqual([...p.candidateIds].sort());
    const queue = createAuditQueue({ ...loadConfig(), redis: { ...loadConfig().redis, prefix: PREFIX } });
    try {
      const job = await queue.getJob(auditJobId(auditId));
      expect(await job!.getState()).toBe('completed');
      expect(await queue.getCompletedCount()).toBe(1);
      expect(await queue.getFailedCount()).toBe(0);
    } finally {
      await queue.close();
    }
    // Never partial: neither in the database nor through the API.
    expect([...seenCounts].filter((n) => n !== 0 && n !== DEFINITIONS.length)).toEqual([]);
    expect(apiViews.filter((v) => v !== `done:${DEFINITIONS.length}` && !/^(queued|running):0$/.test(v))).toEqual([]);
    // What the processes logged through all this holds no secret of their configuration.
    const config = loadConfig();
    const logs = procs.map((pr) => pr.tail(5_000_000)).join('\n');
    expect(logs).toContain('audit worker ready');
    for (const secret of [config.sessionSecret, config.db.password, config.pay.apiKey, config.pay.webhookSecret]) expect(logs).not.toContain(secret);
    for (const pr of procs.filter((x) => x.child.exitCode === null && x.child.signalCode === null)) await stopGently(pr);
  }, 240_000);
});

import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Audit, Scorecard } from '../../server/entities/index.js';
import { auditJobId } from '../../server/jobs/queue.js';
import { auditJobs, stopAuditJobs } from '../../server/jobs/runner.js';
import { createAuditProject } from '../support/audit-fixture.js';
import { createStudioWithRoles } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

const ROOT = path.resolve(import.meta.dirname, '../..');
const basePrefix = process.env.WARPMETER_QUEUE_PREFIX;
// A queue of this file's own, so no other test's worker can take the job before ours is killed.
const PREFIX = `${basePrefix}-crash`;

/** A real `npm run worker` process (same entry point) on this run's database and queue. */
function startWorker(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/jobs/worker-main.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      WARPMETER_QUEUE_PREFIX: PREFIX,
      WARPMETER_WORKER_NICE: '0',
      WARPMETER_JOB_LOCK_MS: '3000',
      WARPMETER_JOB_STALL_CHECK_MS: '1000',
      LOG_LEVEL: 'info',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  return new Promise((resolve, reject) => {
    let out = '';
    const onData = (b: Buffer) => {
      out += b.toString();
      if (out.includes('audit worker ready')) resolve(child);
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (b: Buffer) => (out += b.toString()));
    child.once('exit', (code) => reject(new Error(`worker exited (${code}) before it was ready:\n${out}`)));
    setTimeout(() => reject(new Error(`worker not ready after 60 s:\n${out}`)), 60_000).unref();
  });
}

const exited = (child: ChildProcess) => new Promise<void>((r) => (child.exitCode !== null || child.signalCode ? r() : child.once('exit', () => r())));

describe('an audit survives its worker being killed', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  const children: ChildProcess[] = [];

  beforeAll(async () => {
    process.env.WARPMETER_QUEUE_PREFIX = PREFIX;
    t = await createTestApp();
  });
  afterAll(async () => {
    for (const c of children) if (c.exitCode === null && !c.signalCode) c.kill('SIGKILL');
    await stopAuditJobs(t.deps);
    await t.close();
    process.env.WARPMETER_QUEUE_PREFIX = basePrefix;
  });

  it('finishes exactly once on another worker after kill -9 mid-audit', async () => {
    const s = await createStudioWithRoles(t);
    const p = await createAuditProject(t.deps, s, {
      definitions: [
        '+proj=tmerc +lat_0=0 +lon_0=-71 +k_0=0.9996 +x_0=500000 +y_0=10000000 +ellps=WGS84',
        '+proj=laea +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
        '+proj=lcc +lat_1=-22 +lat_2=-48 +lat_0=-35 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
      ],
    });
    const first = await startWorker();
    children.push(first);
    const res = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 1_000_000, seed: 11 });
    expect(res.status).toBe(202);
    const auditId = res.body.id as number;
    const audits = t.deps.dataSource.getRepository(Audit);

    // Kill the worker for real once it is part-way through.
    const until = Date.now() + 60_000;
    let row = await audits.findOneByOrFail({ id: auditId });
    while (!(row.status === 'running' && row.progress > 0.05)) {
      if (Date.now() > until || row.status === 'done') throw new Error(`audit never seen mid-run (status ${row.status}, progress ${row.progress})`);
      await new Promise((r) => setTimeout(r, 50));
      row = await audits.findOneByOrFail({ id: auditId });
    }
    first.kill('SIGKILL');
    await exited(first);
    expect(first.signalCode).toBe('SIGKILL');
    const startedAt = row.startedAt;
    row = await audits.findOneByOrFail({ id: auditId });
    expect(row.status).toBe('running');
    expect(row.progress).toBeLessThan(1);
    expect(await t.deps.dataSource.getRepository(Scorecard).countBy({ auditId })).toBe(0);

    const second = await startWorker();
    children.push(second);
    const deadline = Date.now() + 90_000;
    while (row.status !== 'done') {
      if (row.status === 'failed') throw new Error(`audit failed after the restart: ${row.error}`);
      if (Date.now() > deadline) throw new Error(`audit still ${row.status} at ${row.progress} after the restart`);
      await new Promise((r) => setTimeout(r, 200));
      row = await audits.findOneByOrFail({ id: auditId });
    }
    const cards = await t.deps.dataSource.getRepository(Scorecard).findBy({ auditId });
    expect(cards.map((c) => c.candidateId).sort()).toEqual([...p.candidateIds].sort());
    expect(row.startedAt?.getTime()).toBe(startedAt?.getTime());

    // BullMQ's record agrees: one job, recovered from the stalled worker, completed once.
    const job = await auditJobs(t.deps).queue.getJob(auditJobId(auditId));
    expect(await job!.getState()).toBe('completed');
    expect(job!.returnvalue).toBe('done');
    expect(job!.stalledCounter).toBeGreaterThanOrEqual(1);
    second.kill('SIGTERM');
    await exited(second);
  }, 180_000);
});

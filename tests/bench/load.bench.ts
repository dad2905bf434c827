/**
 * Load on the real server process (`node --import tsx server/index.ts`, NODE_ENV=production,
 * serving the production client build) on a loopback port, against a throw-away database with
 * demo-like data: 25 projects, one of them with a finished 8-candidate audit. 50 signed-in
 * clients, each connection on its own session, load:
 *   GET /api/projects, GET /api/audits/:id (the scorecard of 8 candidates), and a cached heatmap PNG;
 * first at a steady 300 requests per second (the latency at the target rate: Poisson arrivals,
 * open loop, measured from each request's due time — see paced-load.ts for why not autocannon's
 * own rate limit), after a 5-second warm-up at that rate whose p99 is printed beside the row,
 * then flat out with autocannon (the requests per second the server sustains); the restarted
 * server of the last part gets the same warm-up.
 * The JSON runs are made once more while two audits run in the background (started through the
 * API, the steady run first while they are young) — in the app's own worker (a configuration
 * `npm start` no longer uses), then in a separate worker process (`npm run worker`, which puts
 * its session in the background: autogroup nice 19; what `npm start` runs).
 * Each figure is printed beside its target: p99 ≤ 50 ms at ≥ 300 requests/s for JSON, ≥ 200
 * cached heatmaps/s. The server's CPU time per request (from /proc) is printed too: unlike the
 * rates, it does not depend on what else the machine is running, and the machine's load average
 * closes the table. Nothing here asserts a time. WM_BENCH_LOAD_SECONDS sets the run length
 * (default 10), WM_BENCH_PROFILE=<dir> writes the server's CPU profile there.
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { PacedLoadOptions, PacedLoadResult } from './paced-load';
import { CHILE_CANDIDATES as DEFINITIONS } from './chile-candidates';
import type { BenchRow, BenchSection } from './run';

const CONNECTIONS = 50;
const SECONDS = Number(process.env.WM_BENCH_LOAD_SECONDS ?? 10);
const TARGET = { jsonRps: 300, jsonP99Ms: 50, heatmapRps: 200 };
/** Seconds at the target rate before each endpoint's first measured run on a fresh server. */
const WARM_UP_SECONDS = 5;

/** A database, queue prefix and data directory of this bench's own. */
async function loadEnvironment() {
  const { createFreshDatabase } = await import('../support/fresh-database.js');
  const db = await createFreshDatabase('wm_load');
  const { dbName, tag } = db;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wm-load-'));
  const env = {
    WARPMETER_DB_NAME: dbName,
    WARPMETER_QUEUE_PREFIX: `wmload-${tag}`,
    WARPMETER_DATA_DIR: path.join(dir, 'files'),
    LOG_LEVEL: 'info',
  };
  Object.assign(process.env, env, { LOG_LEVEL: 'silent' });
  return {
    env,
    dir,
    async close() {
      await db.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Demo-like data through the API of an in-process app on the same database: returns ids and logins. */
async function seed() {
  const { createTestApp } = await import('../support/test-app.js');
  const { createStudioWithRoles } = await import('../support/studio-fixture.js');
  const { createAuditProject, worldCountry } = await import('../support/audit-fixture.js');
  const { processAudit } = await import('../../server/jobs/audit-processor.js');
  const { sharedAuditEngine, closeSharedAuditEngine } = await import('../../server/jobs/engine-instance.js');
  const { stopAuditJobs } = await import('../../server/jobs/runner.js');
  const t = await createTestApp();
  try {
    const s = await createStudioWithRoles(t, { seatCount: 5 });
    const audited = await createAuditProject(t.deps, s, { title: 'Chile, national atlas', geometry: worldCountry('Chile', '50m'), definitions: DEFINITIONS, purpose: 'equal-area' });
    const started = await s.cartographer.post(`/api/projects/${audited.projectId}/audits`, { samples: 20_000, seed: 1 });
    if (started.status !== 202) throw new Error(`audit not started: ${started.status} ${JSON.stringify(started.body)}`);
    const engine = await sharedAuditEngine();
    await processAudit({ dataSource: t.deps.dataSource, logger: t.deps.logger, engine }, started.body.id);
    const purposes = ['equal-area', 'conformal', 'reference', 'equidistant'];
    for (let i = 0; i < 22; i++) {
      const res = await s.cartographer.post('/api/projects', { title: `Atlas sheet ${i + 1}`, clientName: `Client ${i % 5}`, purpose: purposes[i % 4], scaleBand: 'country', notes: 'x'.repeat(200) });
      if (res.status !== 201) throw new Error(`project not created: ${res.status}`);
    }
    // Two more projects, ready to audit during the load runs.
    const spare = [];
    for (const name of ['Argentina', 'Peru']) {
      spare.push(await createAuditProject(t.deps, s, { title: `${name}, background audit`, geometry: worldCountry(name, '50m'), definitions: DEFINITIONS }));
    }
    await stopAuditJobs(t.deps);
    await closeSharedAuditEngine();
    return { users: s.users, auditId: started.body.id as number, candidateId: audited.candidateIds[0], spareProjectIds: spare.map((p) => p.projectId) };
  } finally {
    await t.close();
  }
}

interface Session {
  cookie: string;
  csrf: string;
}

/** Signs in over HTTP: a fresh session with its cookie and CSRF token. */
async function signIn(url: string, email: string, password: string): Promise<Session> {
  const first = await fetch(`${url}/api/auth/csrf`);
  const anon = first.headers.getSetCookie()[0].split(';')[0];
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { cookie: anon, 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  const body = (await res.json()) as { csrfToken: string };
  return { cookie: res.headers.getSetCookie()[0].split(';')[0], csrf: body.csrfToken };
}

/** The server process whose CPU time each run reads (utime + stime from /proc, Linux). */
let serverPid = 0;
const TICKS_PER_S = 100; // USER_HZ on Linux (getconf CLK_TCK)
function cpuMsOf(pid: number): number {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS_PER_S;
  } catch {
    return NaN;
  }
}

interface LoadResult {
  /** Server-process CPU per request (all its threads), independent of how busy the machine is. */
  cpuMsPerReq: number;
  rps: number;
  p50: number;
  p99: number;
  non2xx: number;
  errors: number;
  requests: number;
  /** Steady runs: how late the generator itself sent requests (p99, ms) — a check on the measurement. */
  sendLagP99?: number;
  /** Steady runs on a fresh server: the p99 of the warm-up run before it (ms), for reference. */
  warmUpP99?: number;
}

/** autocannon flat out against one path; every connection keeps one session of `sessions` for the whole run. */
async function load(url: string, pathName: string, sessions: Session[]): Promise<LoadResult> {
  let next = 0;
  const cpu0 = cpuMsOf(serverPid);
  const result = await autocannon({
    url: `${url}${pathName}`,
    connections: CONNECTIONS,
    duration: SECONDS,
    requests: [
      {
        setupRequest: (req, context) => {
          const ctx = context as { cookie?: string };
          ctx.cookie ??= sessions[next++ % sessions.length].cookie;
          return { ...req, headers: { ...req.headers, cookie: ctx.cookie } };
        },
      },
    ],
  });
  return {
    cpuMsPerReq: (cpuMsOf(serverPid) - cpu0) / Math.max(1, result.requests.total),
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
    requests: result.requests.total,
  };
}

/** The target rate, steady (Poisson arrivals, open loop) over the same 50 sessions, one connection each, from a process of its own. */
async function paced(url: string, pathName: string, sessions: Session[], seed = 1, seconds = SECONDS): Promise<LoadResult> {
  const cpu0 = cpuMsOf(serverPid);
  const opts: PacedLoadOptions = { url, path: pathName, cookies: sessions.map((s) => s.cookie), ratePerS: TARGET.jsonRps, seconds, connections: CONNECTIONS, seed };
  const out = execFileSync(process.execPath, ['--import', 'tsx', fileURLToPath(new URL('./paced-load-main.ts', import.meta.url))], {
    env: { ...process.env, WM_PACED_LOAD: JSON.stringify(opts) },
    encoding: 'utf8',
    maxBuffer: 1 << 20,
  });
  const r = JSON.parse(out.trim().split('\n').pop()!) as PacedLoadResult;
  return { ...r, cpuMsPerReq: (cpuMsOf(serverPid) - cpu0) / Math.max(1, r.requests), errors: r.errors };
}

const verdict = (ok: boolean) => (ok ? 'meets target' : 'MISSES target');

function jsonRows(label: string, flat: LoadResult, steady: LoadResult): BenchRow[] {
  return [
    {
      run: `${label}, flat out`,
      'req/s': flat.rps.toFixed(0),
      'p50 ms': flat.p50,
      'p99 ms': flat.p99,
      'non-2xx/errors': `${flat.non2xx}/${flat.errors}`,
      'server CPU ms/req': flat.cpuMsPerReq.toFixed(2),
      target: `≥ ${TARGET.jsonRps} req/s`,
      ratio: `${(flat.rps / TARGET.jsonRps).toFixed(2)}× — ${verdict(flat.rps >= TARGET.jsonRps)}`,
    },
    {
      run: `${label}, steady ${TARGET.jsonRps} req/s (Poisson, open loop)`,
      'req/s': steady.rps.toFixed(0),
      'p50 ms': steady.p50,
      'p99 ms': steady.p99,
      'non-2xx/errors': `${steady.non2xx}/${steady.errors}`,
      'server CPU ms/req': steady.cpuMsPerReq.toFixed(2),
      'generator lag p99 ms': steady.sendLagP99 ?? '',
      'warm-up p99 ms': steady.warmUpP99 ?? '',
      target: `p99 ≤ ${TARGET.jsonP99Ms} ms`,
      ratio: `${(TARGET.jsonP99Ms / Math.max(steady.p99, 0.01)).toFixed(2)}× — ${verdict(steady.p99 <= TARGET.jsonP99Ms && steady.rps >= TARGET.jsonRps * 0.95)}`,
    },
  ];
}

/**
 * One request on a connection of its own, closed after the answer: the bench's own calls (start
 * an audit, poll it) come seconds apart, and a pooled keep-alive connection left idle that long
 * can be closed by the server just as the next call goes out ("other side closed"), or belong to
 * a server the bench has since restarted.
 */
function controlRequest(url: string, init: { method?: string; headers: Record<string, string>; body?: string }): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: init.method ?? 'GET', headers: init.headers, agent: false }, (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (chunk) => (text += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text ? JSON.parse(text) : null }));
    });
    req.on('error', reject);
    req.end(init.body);
  });
}

/** Two audits started through the API, then each JSON endpoint flat out and at the target rate while they run; on a fresh server each endpoint is warmed up first. */
async function duringAudits(url: string, endpoints: ReadonlyArray<readonly [string, string]>, sessions: Session[], projectIds: number[], where: string, freshServer = false): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const carto = sessions[1];
  const auditOf = async (id: number) => (await controlRequest(`${url}/api/audits/${id}`, { headers: { cookie: carto.cookie } })).body as { status: string; progress: number };
  for (const [label, p] of endpoints) {
    // The same warm-up as the first runs get (see the section's run below), before the audits start.
    const warmUpP99 = freshServer ? (await paced(url, p, sessions, 99, WARM_UP_SECONDS)).p99 : undefined;
    const ids: number[] = [];
    for (const projectId of projectIds) {
      const res = await controlRequest(`${url}/api/projects/${projectId}/audits`, {
        method: 'POST',
        headers: { cookie: carto.cookie, 'x-csrf-token': carto.csrf, 'content-type': 'application/json' },
        body: JSON.stringify({ samples: 200_000, seed: Math.floor(Math.random() * 1e6) }),
      });
      if (res.status !== 202) throw new Error(`background audit refused: ${res.status} ${JSON.stringify(res.body)}`);
      ids.push((res.body as { id: number }).id);
    }
    const t0 = performance.now();
    // The steady run first, while the audits are young (they take a few seconds): it is the one
    // the latency target is read from.
    const steady = await paced(url, p, sessions);
    const flat = await load(url, p, sessions);
    const states = await Promise.all(ids.map(auditOf));
    rows.push(...jsonRows(`${label} during 2 audits ${where}`, flat, { ...steady, warmUpP99 }));
    rows.push({ run: `  (the 2 audits after ${((performance.now() - t0) / 1000).toFixed(0)} s of load)`, 'req/s': '', 'p50 ms': '', 'p99 ms': '', 'non-2xx/errors': '', target: '', ratio: states.map((s) => `${s.status} ${(s.progress * 100).toFixed(0)}%`).join(', ') });
    // Let them finish before the next endpoint starts its own pair.
    for (const id of ids) {
      for (let i = 0; i < 900 && !['done', 'failed'].includes((await auditOf(id)).status); i++) await new Promise((r) => setTimeout(r, 200));
    }
  }
  return rows;
}

const loadSection: BenchSection = {
  name: `load: ${CONNECTIONS} signed-in clients on the production server (autocannon, ${SECONDS} s per run)`,
  async run() {
    const environment = await loadEnvironment();
    const { ensureClientBuilt } = await import('../support/serve-app.js');
    const { freePort, startAppProcess, startWorkerProcess, stopGently } = await import('../support/process.js');
    ensureClientBuilt();
    const data = await seed();
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    // WM_BENCH_PROFILE=<dir> writes a CPU profile of the server process there (for finding hot paths).
    const nodeArgs = process.env.WM_BENCH_PROFILE ? ['--cpu-prof', `--cpu-prof-dir=${process.env.WM_BENCH_PROFILE}`] : [];
    const loadAtStart = os.loadavg().slice(0, 2).map((l) => l.toFixed(1)).join(' / ');
    let worker: Awaited<ReturnType<typeof startWorkerProcess>> | undefined;
    let server = await startAppProcess({ port, env: { ...environment.env, NODE_ENV: 'production' }, logFile: path.join(environment.dir, 'app.log'), nodeArgs });
    serverPid = server.pid;
    const rows: BenchRow[] = [];
    try {
      // 50 sessions over three staff accounts (successful sign-ins do not count against the limits).
      const logins = [data.users.editor, data.users.cartographer, data.users.admin];
      const sessions: Session[] = [];
      for (let i = 0; i < CONNECTIONS; i += 5) {
        sessions.push(...(await Promise.all(Array.from({ length: 5 }, (_, k) => signIn(url, logins[(i + k) % 3].email, logins[(i + k) % 3].password)))));
      }
      const heatmapPath = `/api/audits/${data.auditId}/candidates/${data.candidateId}/heatmap/areal-scale.png?size=512`;
      const warm = await fetch(`${url}${heatmapPath}`, { headers: { cookie: sessions[0].cookie } });
      if (warm.status !== 200) throw new Error(`heatmap warm-up failed: ${warm.status}`);
      const endpoints = [
        ['GET /api/projects', '/api/projects'],
        ['GET /api/audits/:id (8 scorecards)', `/api/audits/${data.auditId}`],
      ] as const;
      for (const [label, p] of endpoints) {
        // Warm-up: the first seconds at the target rate after the server starts pay for the JIT
        // compiling this endpoint's code (measured: ~15 % more CPU per request, p99 ~95 ms where
        // later runs gave 15–45 ms). Its p99 is printed beside the row, not read against the target.
        const warm = await paced(url, p, sessions, 99, WARM_UP_SECONDS);
        // Steady before flat out: the latency at the target rate is measured on its own, not in
        // the wake of a saturating run.
        const steady = await paced(url, p, sessions);
        rows.push(...jsonRows(label, await load(url, p, sessions), { ...steady, warmUpP99: warm.p99 }));
      }
      const png = await load(url, heatmapPath, sessions);
      rows.push({
        run: 'cached heatmap PNG 512², flat out',
        'req/s': png.rps.toFixed(0),
        'p50 ms': png.p50,
        'p99 ms': png.p99,
        'non-2xx/errors': `${png.non2xx}/${png.errors}`,
        'server CPU ms/req': png.cpuMsPerReq.toFixed(2),
        target: `≥ ${TARGET.heatmapRps} req/s`,
        ratio: `${(png.rps / TARGET.heatmapRps).toFixed(2)}× — ${verdict(png.rps >= TARGET.heatmapRps)}`,
      });

      // The JSON runs again while two audits (8 candidates × 200 000 samples each) run: first in
      // the app process's own worker (the default), then with the app's worker off and the audits
      // in an `npm run worker` process, which lowers its own session's CPU priority.
      rows.push(...(await duringAudits(url, endpoints, sessions, data.spareProjectIds, 'in the app’s worker')));
      await stopGently(server);
      server = await startAppProcess({ port, env: { ...environment.env, NODE_ENV: 'production', WARPMETER_NO_INPROCESS_WORKER: '1' }, logFile: path.join(environment.dir, 'app-2.log'), nodeArgs });
      serverPid = server.pid;
      worker = await startWorkerProcess({ ...environment.env, WARPMETER_WORKER_NICE: '19' }, path.join(environment.dir, 'worker.log'));
      rows.push(...(await duringAudits(url, endpoints, sessions, data.spareProjectIds, 'in a background worker process', true)));
      const [l1, l5] = os.loadavg();
      rows.push({ run: `machine load average at the end: ${l1.toFixed(1)} (1 min), ${l5.toFixed(1)} (5 min) on ${os.cpus().length} cores; at the start ${loadAtStart}`, 'req/s': '', 'p50 ms': '', 'p99 ms': '', 'non-2xx/errors': '', target: '', ratio: '' });
    } finally {
      await stopGently(server);
      if (worker) await stopGently(worker);
      await environment.close();
    }
    return rows;
  },
};

export const sections: BenchSection[] = [loadSection];

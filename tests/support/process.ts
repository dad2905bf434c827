import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

/**
 * Real OS processes for fault and load tests: the app (`node --import tsx server/index.ts`) and
 * extra audit workers (`server/jobs/worker-main.ts`), each on its own environment, with their
 * output kept in a log file so a failing test can show what the process said.
 */
export const ROOT = path.resolve(import.meta.dirname, '../..');

/** A TCP port nothing listens on right now (the kernel picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface Proc {
  child: ChildProcess;
  pid: number;
  logFile: string;
  /** Resolves with the exit code or signal once the process has ended. */
  exited: Promise<number | string>;
  /** The tail of what the process wrote, for assertion messages. */
  tail(chars?: number): string;
}

/** Starts `node --import tsx <script>` in its own process group with `env` added to ours. */
export function startNodeProcess(script: string, env: Record<string, string>, logFile: string, nodeArgs: string[] = [], prefix: string[] = []): Proc {
  fs.mkdirSync(path.dirname(logFile), { recursive: true });
  const out = fs.openSync(logFile, 'a');
  // `prefix` runs node under another command, e.g. ['nice', '-n', '10'].
  const argv = [...prefix, process.execPath, ...nodeArgs, '--import', 'tsx', path.join(ROOT, script)];
  const child = spawn(argv[0], argv.slice(1), {
    cwd: ROOT,
    env: { ...process.env, ...env },
    stdio: ['ignore', out, out],
    detached: true,
  });
  fs.closeSync(out);
  const exited = new Promise<number | string>((resolve) => child.once('exit', (code, signal) => resolve(code ?? signal ?? -1)));
  return {
    child,
    pid: child.pid!,
    logFile,
    exited,
    tail: (chars = 3000) => (fs.existsSync(logFile) ? fs.readFileSync(logFile, 'utf8').slice(-chars) : ''),
  };
}

/** kill -9 the process (its whole group, so tsx's own child goes too) and wait until it is gone. */
export async function killHard(p: Proc): Promise<void> {
  if (p.child.exitCode !== null || p.child.signalCode !== null) return;
  try {
    process.kill(-p.pid, 'SIGKILL');
  } catch {
    p.child.kill('SIGKILL');
  }
  await p.exited;
}

/** SIGTERM, then SIGKILL after `graceMs`. */
export async function stopGently(p: Proc, graceMs = 5000): Promise<void> {
  if (p.child.exitCode !== null || p.child.signalCode !== null) return;
  try {
    process.kill(-p.pid, 'SIGTERM');
  } catch {
    p.child.kill('SIGTERM');
  }
  const timer = setTimeout(() => void killHard(p), graceMs);
  await p.exited;
  clearTimeout(timer);
}

/** Polls `url` until it answers 200, or throws with the process's last words. */
export async function waitForHttp(url: string, p: Proc, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    if (p.child.exitCode !== null) throw new Error(`process ended (${p.child.exitCode}) before ${url} answered:\n${p.tail()}`);
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > until) throw new Error(`${url} did not answer within ${timeoutMs} ms:\n${p.tail()}`);
    await sleep(150);
  }
}

/** Waits until the log file contains `text` (e.g. a worker's "ready" line). */
export async function waitForLog(p: Proc, text: string, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!p.tail(1_000_000).includes(text)) {
    if (p.child.exitCode !== null) throw new Error(`process ended (${p.child.exitCode}) before logging "${text}":\n${p.tail()}`);
    if (Date.now() > until) throw new Error(`no "${text}" in the log within ${timeoutMs} ms:\n${p.tail()}`);
    await sleep(100);
  }
}

export interface AppProcessOptions {
  port: number;
  env: Record<string, string>;
  logFile: string;
  /** Extra node flags (e.g. --cpu-prof). */
  nodeArgs?: string[];
}

/** The real server process on a loopback port, waited for until /api/health answers 200. */
export async function startAppProcess(opts: AppProcessOptions): Promise<Proc> {
  const p = startNodeProcess('server/index.ts', { ...opts.env, PORT: String(opts.port), HOST: '127.0.0.1' }, opts.logFile, opts.nodeArgs);
  await waitForHttp(`http://127.0.0.1:${opts.port}/api/health`, p);
  return p;
}

/** An extra audit worker process (`npm run worker`), waited for until BullMQ says it is ready. */
export async function startWorkerProcess(env: Record<string, string>, logFile: string, prefix: string[] = []): Promise<Proc> {
  // Normal priority unless asked: a test's worker must not starve behind the rest of the suite.
  const p = startNodeProcess('server/jobs/worker-main.ts', { LOG_LEVEL: 'info', WARPMETER_WORKER_NICE: '0', ...env }, logFile, [], prefix);
  await waitForLog(p, 'audit worker ready');
  return p;
}

/**
 * An open-loop load at a steady rate: requests arrive as a Poisson process of the given rate
 * (seeded, so a run can be repeated), spread round-robin over `connections` keep-alive
 * connections, each signed in with its own session. Each latency is measured from the moment
 * the request was due, not from when it could be sent, so a server that falls behind shows it in
 * full (no coordinated omission: a request waiting behind a slow one on its connection counts
 * its wait).
 *
 * Why not autocannon's `overallRate`: autocannon paces each connection with its own one-second
 * quota, and all connections start their seconds together, so "300 requests per second" over 50
 * connections arrives as one burst of 300 at the top of every second, then silence. That
 * measures how fast a burst drains, not the latency at a steady 300 requests per second.
 */
import http from 'node:http';

export interface PacedLoadOptions {
  url: string;
  path: string;
  /** One cookie header per session; connection i uses cookies[i % cookies.length]. */
  cookies: string[];
  ratePerS: number;
  seconds: number;
  connections: number;
  seed?: number;
}

export interface PacedLoadResult {
  /** Completed requests per second over the run. */
  rps: number;
  p50: number;
  p90: number;
  p99: number;
  max: number;
  non2xx: number;
  errors: number;
  requests: number;
  /** 99th percentile of how late the generator itself sent a request after its due time, ms. */
  sendLagP99: number;
}

/** mulberry32: a small seeded generator, so the arrival times of a run can be replayed. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The q-quantile of sorted values (nearest rank). */
const quantile = (sorted: number[], q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)] : NaN);

export async function pacedLoad(opts: PacedLoadOptions): Promise<PacedLoadResult> {
  const { hostname, port } = new URL(opts.url);
  const agents = Array.from({ length: opts.connections }, () => new http.Agent({ keepAlive: true, maxSockets: 1 }));
  const random = seeded(opts.seed ?? 1);
  const latencies: number[] = [];
  let non2xx = 0;
  let errors = 0;
  const inFlight = new Set<Promise<void>>();

  const sendLags: number[] = [];
  const send = (k: number, dueMs: number) => {
    sendLags.push(performance.now() - dueMs);
    const c = k % opts.connections;
    const done = new Promise<void>((resolve) => {
      const req = http.request(
        { hostname, port, path: opts.path, agent: agents[c], headers: { cookie: opts.cookies[c % opts.cookies.length] }, timeout: 10_000 },
        (res) => {
          res.resume();
          res.on('end', () => {
            latencies.push(performance.now() - dueMs);
            if ((res.statusCode ?? 0) < 200 || (res.statusCode ?? 0) >= 300) non2xx++;
            resolve();
          });
        },
      );
      req.on('timeout', () => req.destroy(new Error('timed out')));
      req.on('error', () => (errors++, resolve()));
      req.end();
    });
    inFlight.add(done);
    void done.then(() => inFlight.delete(done));
  };

  const start = performance.now();
  const endMs = start + opts.seconds * 1000;
  let due = start;
  let k = 0;
  // Send every request whose arrival time has come, then sleep until the next one is due.
  while (due < endMs) {
    const now = performance.now();
    while (due <= now && due < endMs) {
      send(k++, due);
      due += (-Math.log(1 - random()) / opts.ratePerS) * 1000;
    }
    await new Promise((r) => setTimeout(r, Math.max(0, due - performance.now())));
  }
  await Promise.all(inFlight);
  const elapsedS = (performance.now() - start) / 1000;
  for (const a of agents) a.destroy();
  latencies.sort((a, b) => a - b);
  sendLags.sort((a, b) => a - b);
  const round = (v: number) => Math.round(v * 10) / 10;
  return {
    rps: latencies.length / elapsedS,
    p50: round(quantile(latencies, 0.5)),
    p90: round(quantile(latencies, 0.9)),
    p99: round(quantile(latencies, 0.99)),
    max: round(latencies[latencies.length - 1] ?? NaN),
    non2xx,
    errors,
    requests: k,
    sendLagP99: round(quantile(sendLags, 0.99)),
  };
}

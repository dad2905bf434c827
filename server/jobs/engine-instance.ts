import { ENGINE_VERSION } from '../../shared/engine/version.js';
import { resolveDefinition } from '../candidates/resolve-definition.js';
import { FactorPool } from '../engine-pool/pool.js';
import type { AuditEngine, AuditInput, AuditResult, CandidateResult } from './audit-engine.js';

/** The engine version recorded with every audit and hashed into its input hash. */
export { ENGINE_VERSION };

const SAMPLING_SHARE = 0.1;
/**
 * Most samples whose fields are stored per candidate (every k-th sample beyond it, k fixed by the
 * count): enough for heatmap domains, worst points and exports, while a million-sample audit's
 * scorecards stay a few megabytes. The scorecard itself always uses every sample.
 */
export const STORED_FIELD_CAP = 50_000;

/**
 * Scores every candidate of an audit with the engine on one shared set of samples, all of it in
 * the worker-thread pool: every worker prepares and samples the region (sampleRegion, same count
 * and seed → the same points in each), then each candidate is scored whole in a worker — factors, fields and
 * scorecard, exactly what scoreCandidate does in one thread — the candidates spread over the
 * workers. This thread only routes messages and writes progress, so the HTTP server sharing it
 * keeps answering promptly while audits run (the pool threads run at a lower priority).
 */
export async function scoreAudit(pool: FactorPool, input: AuditInput, onProgress: (fraction: number) => Promise<void> = async () => {}): Promise<AuditResult> {
  const t0 = performance.now();
  const { audit, count: n } = await pool.sampleAudit(input.geometry, input.samples, input.seed);
  const tSample = performance.now() - t0;
  // Sampling is reported as the first tenth of the work, the candidates' factors as the rest.
  await onProgress(SAMPLING_SHARE);
  const total = input.candidates.length * n;
  const doneOf = new Array<number>(input.candidates.length).fill(0);
  // Progress arrives from several workers at once; the writes go out one at a time, in order.
  let reported = SAMPLING_SHARE;
  let writes = Promise.resolve();
  const report = () => {
    const fraction = SAMPLING_SHARE + (1 - SAMPLING_SHARE) * (doneOf.reduce((a, b) => a + b, 0) / total);
    if (fraction <= reported) return;
    reported = fraction;
    writes = writes.then(() => onProgress(fraction));
    writes.catch(() => {}); // awaited after the candidates; a failed write must not go unhandled meanwhile
  };
  const scored = await Promise.all(
    input.candidates.map((cand, ci) =>
      pool.auditCandidate(resolveDefinition(cand.definition), cand.label, audit, STORED_FIELD_CAP, (done) => {
        doneOf[ci] = done;
        report();
      }),
    ),
  );
  await writes;
  const out: CandidateResult[] = scored.map((r, ci) => ({ candidateId: input.candidates[ci].id, metrics: r.metrics, fields: r.fields }));
  return { candidates: out, timingsMs: { samplingMs: Math.round(tSample), computeMs: Math.round(performance.now() - t0) } };
}

let shared: Promise<{ pool: FactorPool; engine: AuditEngine }> | undefined;

/** Families most audits include; their code is compiled in the threads right after start. */
const WARM_UP = ['+proj=tmerc +lon_0=0 +ellps=WGS84', '+proj=lcc +lat_1=30 +lat_2=50 +lat_0=40 +ellps=WGS84', '+proj=laea +lat_0=40 +ellps=WGS84', '+proj=aea +lat_1=30 +lat_2=50 +lat_0=40 +ellps=WGS84'];

/**
 * Runs each warm-up family over a few thousand points in the background, so the first real audit
 * does not pay for the JIT compiling the engine in every thread (seconds on a cold 2-core machine).
 */
function warmUp(pool: FactorPool): void {
  const n = 8192;
  const lon = Float64Array.from({ length: n }, (_, i) => -20 + (i % 64) * 0.6);
  const lat = Float64Array.from({ length: n }, (_, i) => 20 + Math.floor(i / 64) * 0.3);
  void (async () => {
    for (const d of WARM_UP) await pool.factors(resolveDefinition(d), lon, lat).catch(() => {});
  })();
}

/** This process's audit engine on one persistent worker-thread pool, started on first use. */
export async function sharedAuditEngine(): Promise<AuditEngine> {
  shared ??= FactorPool.start().then((pool) => (warmUp(pool), {
    pool,
    engine: {
      scoreCandidates: (input, onProgress) => scoreAudit(pool, input, onProgress),
      close: closeSharedAuditEngine,
    },
  }));
  return (await shared).engine;
}

/** Whether this process's engine threads are already running (so a caller knows whether it opened them). */
export const sharedAuditEngineRunning = () => shared !== undefined;

export async function closeSharedAuditEngine(): Promise<void> {
  const s = shared;
  shared = undefined;
  if (s) await (await s).pool.close();
}

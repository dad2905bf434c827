import { ENGINE_VERSION } from '../../shared/engine/version.js';
import { resolveDefinition } from '../../shared/engine/definition.js';
import { allocFactorArrays } from '../../shared/engine/evaluator.js';
import { computeSampleFields } from '../../shared/engine/fields.js';
import { prepareRegion } from '../../shared/engine/region/prepare.js';
import { sampleRegion } from '../../shared/engine/sampling.js';
import { metricsFromFields } from '../../shared/engine/scorecard.js';
import { FactorPool } from '../engine-pool/pool.js';
import type { AuditEngine, AuditInput, AuditResult, CandidateResult } from './audit-engine.js';
import type { SampleFields as StoredFields } from './fields-codec.js';

/** The engine version recorded with every audit and hashed into its input hash. */
export { ENGINE_VERSION };

const SAMPLING_SHARE = 0.1;
/** Samples per block sent to the worker threads; progress is reported after each block. */
const BLOCK = 25_000;
/**
 * Most samples whose fields are stored per candidate (every k-th sample beyond it, k fixed by the
 * count): enough for heatmap domains, worst points and exports, while a million-sample audit's
 * scorecards stay a few megabytes. The scorecard itself always uses every sample.
 */
export const STORED_FIELD_CAP = 50_000;

const FACTOR_KEYS = ['h', 'k', 's', 'omegaDeg', 'a', 'b', 'convergenceDeg'] as const;

/**
 * Scores every candidate of an audit with the engine on one shared set of samples: the region is
 * prepared and sampled once (sampleRegion, same count and seed → same points), the factors of
 * each block of samples are computed on the persistent worker-thread pool (so the event loop
 * stays free to renew the job's lock), and the engine's scorecard is formed from them
 * (computeSampleFields + metricsFromFields, exactly what scoreCandidate does in one thread).
 */
export async function scoreAudit(pool: FactorPool, input: AuditInput, onProgress: (fraction: number) => Promise<void> = async () => {}): Promise<AuditResult> {
  const t0 = performance.now();
  const region = prepareRegion(input.geometry);
  const samples = sampleRegion(region, { count: input.samples, seed: input.seed });
  const tSample = performance.now() - t0;
  // Sampling is reported as the first tenth of the work, the candidates' factors as the rest.
  await onProgress(SAMPLING_SHARE);
  const n = samples.count;
  const total = input.candidates.length * n;
  let doneSamples = 0;
  /** A candidate's factors, block by block on the pool, reporting progress as blocks finish. */
  const factorsOf = async (ci: number) => {
    const resolved = resolveDefinition(input.candidates[ci].definition);
    const factors = allocFactorArrays(n);
    for (let start = 0; start < n; start += BLOCK) {
      const end = Math.min(n, start + BLOCK);
      const r = await pool.factors(resolved, samples.lonDeg.subarray(start, end), samples.latDeg.subarray(start, end));
      for (const key of FACTOR_KEYS) factors[key].set(r[key], start);
      doneSamples += end - start;
      await onProgress(SAMPLING_SHARE + (1 - SAMPLING_SHARE) * (doneSamples / total));
    }
    return { resolved, factors };
  };
  const out: CandidateResult[] = [];
  // One candidate ahead: the threads compute the next candidate's factors while this thread forms
  // the current one's scorecard (at most two candidates' factors are held at once).
  let next = factorsOf(0);
  for (const [ci, cand] of input.candidates.entries()) {
    const { resolved, factors } = await next;
    if (ci + 1 < input.candidates.length) {
      next = factorsOf(ci + 1);
      next.catch(() => {}); // awaited on the next turn; an error here must not go unhandled meanwhile
    }
    if (!factors.s.some((v) => v > 0)) {
      throw new Error(`${cand.label} is undefined over the whole region, so it cannot map it; remove it from the audit or change its centre.`);
    }
    const fields = computeSampleFields(resolved, samples, factors);
    const metrics = metricsFromFields(resolved, samples, fields, region);
    out.push({
      candidateId: cand.id,
      metrics: JSON.parse(JSON.stringify(metrics)) as Record<string, unknown>,
      fields: capFields({ lonDeg: samples.lonDeg, latDeg: samples.latDeg, h: fields.h, k: fields.k, s: fields.s, omegaDeg: fields.omegaDeg, a: fields.a, b: fields.b }),
    });
  }
  return { candidates: out, timingsMs: { samplingMs: Math.round(tSample), computeMs: Math.round(performance.now() - t0) } };
}

/** Every k-th sample's fields, k = ⌈n / STORED_FIELD_CAP⌉, factors narrowed to float32 for storage. */
function capFields(f: Record<keyof StoredFields, Float64Array>): StoredFields {
  const n = f.lonDeg.length;
  const stride = Math.max(1, Math.ceil(n / STORED_FIELD_CAP));
  const m = Math.ceil(n / stride);
  const pick = <T extends Float64Array | Float32Array>(src: Float64Array, dst: T): T => {
    for (let i = 0, j = 0; j < m; i += stride, j++) dst[j] = src[i];
    return dst;
  };
  return {
    lonDeg: pick(f.lonDeg, new Float64Array(m)),
    latDeg: pick(f.latDeg, new Float64Array(m)),
    h: pick(f.h, new Float32Array(m)),
    k: pick(f.k, new Float32Array(m)),
    s: pick(f.s, new Float32Array(m)),
    omegaDeg: pick(f.omegaDeg, new Float32Array(m)),
    a: pick(f.a, new Float32Array(m)),
    b: pick(f.b, new Float32Array(m)),
  };
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

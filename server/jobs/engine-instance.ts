import type { MultiPolygon, Polygon } from 'geojson';
import { resolveDefinition } from '../../shared/engine/definition.js';
import { createFactorEvaluator } from '../../shared/engine/evaluator.js';
import { FactorPool } from '../engine-pool/pool.js';
import type { AuditEngine, AuditInput, AuditResult, CandidateResult } from './audit-engine.js';
import { geodesicPairs, scoreInterim } from './interim-scoring.js';
import { sampleRegionInterim } from './interim-sampling.js';

/**
 * The version recorded with every audit (and hashed into its input hash): which sampler and
 * scorecard produced the numbers. Interim until the engine publishes its own ENGINE_VERSION.
 */
export const ENGINE_VERSION = 'audit-interim-1';

/** Samples per block sent to the worker threads; progress is reported after each block. */
const BLOCK = 25_000;
/** Geodesic pairs for the finite-distance error. */
const PAIRS = 2_000;
const DEG = Math.PI / 180;
/**
 * Most samples whose fields are stored per candidate (every k-th sample beyond it, k fixed by the
 * count): enough for heatmap domains, worst points and exports, while a million-sample audit's
 * scorecards stay a few megabytes. The scorecard itself always uses every sample.
 */
export const STORED_FIELD_CAP = 50_000;

const ringsOf = (g: Polygon | MultiPolygon) => (g.type === 'Polygon' ? g.coordinates : g.coordinates.flat());

/**
 * Scores every candidate of an audit on one shared set of samples: the region is sampled once,
 * the factors of each block of samples are computed on the persistent worker-thread pool (so the
 * event loop stays free to renew the job's lock), and the scorecard is formed from them.
 * Deterministic for the same region, definitions, sample count and seed.
 */
export async function scoreAudit(pool: FactorPool, input: AuditInput, onProgress: (fraction: number) => Promise<void> = async () => {}): Promise<AuditResult> {
  const t0 = performance.now();
  const { lonDeg, latDeg } = sampleRegionInterim(ringsOf(input.geometry), input.samples, input.seed);
  const pairs = geodesicPairs(lonDeg, latDeg, PAIRS, input.seed);
  const tSample = performance.now() - t0;
  const n = lonDeg.length;
  const total = input.candidates.length * n;
  const out: CandidateResult[] = [];
  for (const [ci, cand] of input.candidates.entries()) {
    const resolved = resolveDefinition(cand.definition);
    const fields = {
      lonDeg,
      latDeg,
      h: new Float32Array(n), k: new Float32Array(n), s: new Float32Array(n),
      omegaDeg: new Float32Array(n), a: new Float32Array(n), b: new Float32Array(n),
    };
    const s = new Float64Array(n), omegaDeg = new Float64Array(n), a = new Float64Array(n), b = new Float64Array(n);
    for (let start = 0; start < n; start += BLOCK) {
      const end = Math.min(n, start + BLOCK);
      const r = await pool.factors(resolved, lonDeg.subarray(start, end), latDeg.subarray(start, end));
      for (const [key, arr] of [['h', r.h], ['k', r.k], ['s', r.s], ['omegaDeg', r.omegaDeg], ['a', r.a], ['b', r.b]] as const) fields[key].set(arr, start);
      s.set(r.s, start);
      omegaDeg.set(r.omegaDeg, start);
      a.set(r.a, start);
      b.set(r.b, start);
      await onProgress((ci * n + end) / total);
    }
    const ev = createFactorEvaluator(resolved);
    const xy = new Float64Array(2), x = new Float64Array(n), y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      ev.forward(lonDeg[i] * DEG, latDeg[i] * DEG, xy);
      x[i] = xy[0];
      y[i] = xy[1];
    }
    const metrics = scoreInterim({ s, omegaDeg, a, b }, { x, y }, pairs);
    out.push({ candidateId: cand.id, metrics: metrics as unknown as Record<string, unknown>, fields: capFields(fields) });
  }
  return { candidates: out, timingsMs: { samplingMs: Math.round(tSample), computeMs: Math.round(performance.now() - t0) } };
}

/** Every k-th sample's fields, k = ⌈n / STORED_FIELD_CAP⌉. */
function capFields<T extends Record<string, Float64Array | Float32Array>>(f: T): T {
  const n = f.lonDeg.length;
  const stride = Math.ceil(n / STORED_FIELD_CAP);
  if (stride <= 1) return f;
  const out = {} as Record<string, Float64Array | Float32Array>;
  for (const [key, arr] of Object.entries(f)) {
    const picked = new (arr.constructor as Float64ArrayConstructor | Float32ArrayConstructor)(Math.ceil(n / stride));
    for (let i = 0, j = 0; i < n; i += stride, j++) picked[j] = arr[i];
    out[key] = picked;
  }
  return out as T;
}

let shared: Promise<{ pool: FactorPool; engine: AuditEngine }> | undefined;

/** This process's audit engine on one persistent worker-thread pool, started on first use. */
export async function sharedAuditEngine(): Promise<AuditEngine> {
  shared ??= FactorPool.start().then((pool) => ({
    pool,
    engine: {
      scoreCandidates: (input, onProgress) => scoreAudit(pool, input, onProgress),
      close: closeSharedAuditEngine,
    },
  }));
  return (await shared).engine;
}

export async function closeSharedAuditEngine(): Promise<void> {
  const s = shared;
  shared = undefined;
  if (s) await (await s).pool.close();
}

import type { ResolvedDefinition } from '../../shared/engine/definition';
import { allocFactorArrays, createFactorEvaluator } from '../../shared/engine/evaluator';
import { computeSampleFields } from '../../shared/engine/fields';
import type { PreparedRegion } from '../../shared/engine/region/prepare';
import type { RegionSamples } from '../../shared/engine/sampling';
import { metricsFromFields } from '../../shared/engine/scorecard';
import type { SampleFields as StoredFields } from '../jobs/fields-codec';

/** Samples per block; progress is reported after each. */
export const AUDIT_BLOCK = 25_000;

/** One candidate of an audit, scored: the scorecard and the (thinned) fields stored beside it. */
export interface AuditCandidateResult {
  metrics: Record<string, unknown>;
  fields: StoredFields;
}

/**
 * Everything an audit computes for one candidate, in the calling thread (a pool worker): the
 * factors at every sample, block by block, the per-sample fields, the scorecard
 * (computeSampleFields + metricsFromFields, exactly what scoreCandidate does) and the stored
 * fields thinned to at most `storedCap` samples. `onBlock` hears the samples done so far.
 */
export function scoreAuditCandidate(
  resolved: ResolvedDefinition,
  samples: RegionSamples,
  region: PreparedRegion | undefined,
  storedCap: number,
  label: string,
  onBlock: (samplesDone: number) => void = () => {},
): AuditCandidateResult {
  const n = samples.count;
  const factors = allocFactorArrays(n);
  const evaluator = createFactorEvaluator(resolved);
  for (let start = 0; start < n; start += AUDIT_BLOCK) {
    const end = Math.min(n, start + AUDIT_BLOCK);
    evaluator.factorsBatchDeg(samples.lonDeg, samples.latDeg, factors, start, end);
    onBlock(end);
  }
  if (!factors.s.some((v) => v > 0)) {
    throw new Error(`${label} is undefined over the whole region, so it cannot map it; remove it from the audit or change its centre.`);
  }
  const fields = computeSampleFields(resolved, samples, factors);
  const metrics = metricsFromFields(resolved, samples, fields, region);
  return {
    // Plain JSON (no NaN/Infinity or typed arrays), as it is stored.
    metrics: JSON.parse(JSON.stringify(metrics)) as Record<string, unknown>,
    fields: thinFields({ lonDeg: samples.lonDeg, latDeg: samples.latDeg, h: fields.h, k: fields.k, s: fields.s, omegaDeg: fields.omegaDeg, a: fields.a, b: fields.b }, storedCap),
  };
}

/** Every k-th sample's fields, k = ⌈n / cap⌉, factors narrowed to float32 for storage. */
export function thinFields(f: Record<keyof StoredFields, Float64Array>, cap: number): StoredFields {
  const n = f.lonDeg.length;
  const stride = Math.max(1, Math.ceil(n / cap));
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

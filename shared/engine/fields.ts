import type { ResolvedDefinition } from './definition';
import { allocFactorArrays, createFactorEvaluator, type FactorArrays } from './evaluator';
import type { RegionSamples } from './sampling';

/** Per-sample fields for heatmaps and scorecards (NaN where the projection is undefined). */
export interface SampleFields extends FactorArrays {
  /** max(|ln(c·a)|, |ln(c·b)|): the worst linear scale error at the sample after the best uniform rescale c. */
  scaleError: Float64Array;
  /** The best uniform rescale c, ln c = −½·mean(ln a + ln b) (Airy 1861; Kavrayskiy): closed form. */
  bestScale: number;
}

/**
 * Factors at every sample and the scale error after the best uniform rescale. Pass factors
 * already computed (e.g. by a worker pool) to skip that step.
 * Example: computeSampleFields(resolveDefinition('EPSG:3035'), sampleRegion(europe)).s.
 */
export function computeSampleFields(resolved: ResolvedDefinition, samples: RegionSamples, factors?: FactorArrays): SampleFields {
  const n = samples.count;
  let f = factors;
  if (!f) {
    f = allocFactorArrays(n);
    createFactorEvaluator(resolved).factorsBatchDeg(samples.lonDeg, samples.latDeg, f);
  }
  let sum = 0;
  let wsum = 0;
  for (let i = 0; i < n; i++) {
    const a = f.a[i];
    if (a !== a) continue;
    const w = samples.weightKm2[i];
    sum += w * (Math.log(a) + Math.log(f.b[i]));
    wsum += w;
  }
  const lnC = wsum ? (-0.5 * sum) / wsum : NaN;
  const scaleError = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const la = Math.log(f.a[i]) + lnC;
    const lb = Math.log(f.b[i]) + lnC;
    scaleError[i] = Math.max(Math.abs(la), Math.abs(lb));
  }
  return { ...f, scaleError, bestScale: Math.exp(lnC) };
}

import type { ResolvedDefinition } from '../../shared/engine/definition-core';
import { resolveDefinition } from '../candidates/resolve-definition';
import { prepareRegion } from '../../shared/engine/region/prepare';
import { regionSummary } from '../../shared/engine/region/summary';
import { DEFAULT_SAMPLE_COUNT, MAX_SAMPLE_COUNT, sampleRegion } from '../../shared/engine/sampling';
import { scoreCandidate, type CandidateMetrics } from '../../shared/engine/scorecard';
import { ENGINE_VERSION } from '../../shared/engine/version';
import { FactorPool } from '../engine-pool/pool';
import { intOption, parseArgs, UsageError } from './args';
import type { CliIo } from './io';
import { loadRegionFile } from './region-file';

/** Work (samples × candidates) above which the factors go to a worker pool. */
const POOL_THRESHOLD = 150_000;

export interface AuditReport {
  engineVersion: string;
  region: { areaKm2: number; bbox: [number, number, number, number]; samples: number; seed: number; parts: number; holes: number; vertexCount: number; crossesAntimeridian: boolean; containsPole: string | null };
  candidates: { label: string; definition: string; resolved: string; family: string; metrics: CandidateMetrics }[];
  /** Sampling the region, and scoring every candidate (factors and statistics). */
  timingsMs: { sampling: number; scoring: number };
}

/** `warpmeter audit <region> --proj <def> [--proj …] [--samples N] [--seed S] [--json] [--threads N]`. */
export async function auditCommand(argv: string[], io: CliIo): Promise<number> {
  const args = parseArgs(argv, ['proj', 'samples', 'seed', 'threads'], ['json']);
  if (args.positional.length !== 1) throw new UsageError('audit needs exactly one region file');
  const defs = args.options.get('proj') ?? [];
  if (!defs.length) throw new UsageError('audit needs at least one --proj <definition>');
  const count = intOption(args, 'samples', DEFAULT_SAMPLE_COUNT, 1, MAX_SAMPLE_COUNT);
  const seed = intOption(args, 'seed', 1, 0, 2 ** 32 - 1);
  const threads = intOption(args, 'threads', 2, 1, 64);
  const resolved = defs.map((d) => {
    try {
      return resolveDefinition(d);
    } catch (err) {
      throw new Error(`--proj '${d}': ${(err as Error).message}`);
    }
  });
  const report = await runAudit(await loadRegionFile(args.positional[0]), resolved, { count, seed, threads });
  io.stdout.write(args.flags.has('json') ? `${JSON.stringify(report, null, 2)}\n` : formatReport(report));
  return 0;
}

/** Samples the region once, computes every candidate's factors (in a pool when large) and scores them. */
export async function runAudit(geojson: Parameters<typeof prepareRegion>[0], resolved: ResolvedDefinition[], opts: { count: number; seed: number; threads: number; pool?: FactorPool }): Promise<AuditReport> {
  const t0 = performance.now();
  const region = prepareRegion(geojson);
  const samples = sampleRegion(region, { count: opts.count, seed: opts.seed });
  const summary = regionSummary(region, { samples });
  const t1 = performance.now();
  const usePool = opts.pool ?? (opts.threads > 1 && opts.count * resolved.length >= POOL_THRESHOLD ? await FactorPool.start(opts.threads) : undefined);
  let metrics: CandidateMetrics[];
  try {
    // In a pool each candidate is scored whole (factors and statistics) in a worker.
    metrics = usePool ? await Promise.all(resolved.map((r) => usePool.score(r, samples, region))) : resolved.map((r) => scoreCandidate(r, samples, region));
  } finally {
    if (usePool && !opts.pool) await usePool.close();
  }
  const t2 = performance.now();
  const candidates = resolved.map((r, i) => ({ label: r.label, definition: r.input, resolved: r.resolved, family: r.family.id, metrics: metrics[i] }));
  return {
    engineVersion: ENGINE_VERSION,
    region: {
      areaKm2: samples.areaKm2,
      bbox: summary.bbox,
      samples: samples.count,
      seed: samples.seed,
      parts: summary.parts,
      holes: summary.holes,
      vertexCount: summary.vertexCount,
      crossesAntimeridian: summary.crossesAntimeridian,
      containsPole: summary.containsPole,
    },
    candidates,
    timingsMs: { sampling: t1 - t0, scoring: t2 - t1 },
  };
}

const f = (x: number | null, digits = 4) => (x === null || !Number.isFinite(x) ? '—' : Number(x.toPrecision(digits)).toString());
const pct = (x: number) => (Number.isFinite(x) ? `${(100 * x).toFixed(1)} %` : '—');

function formatReport(r: AuditReport): string {
  const lines = [
    `region: ${f(r.region.areaKm2, 7)} km², bbox [${r.region.bbox.map((v) => f(v, 6)).join(', ')}], ${r.region.parts} part(s), ${r.region.samples} samples (seed ${r.region.seed})`,
    '',
  ];
  for (const c of r.candidates) {
    const m = c.metrics;
    lines.push(
      `${c.label}`,
      `  ${c.resolved}`,
      `  areal scale s        min ${f(m.arealScale.min)}  mean ${f(m.arealScale.mean)}  max ${f(m.arealScale.max)}  p5 ${f(m.arealScale.p5)}  p95 ${f(m.arealScale.p95)}  max/min ${f(m.arealScale.ratio)}`,
      `  angular deformation  mean ${f(m.angularDeformationDeg.mean)}°  p95 ${f(m.angularDeformationDeg.p95)}°  max ${f(m.angularDeformationDeg.max)}°`,
      `  scale error          mean ${f(m.scaleError.mean)}  max ${f(m.scaleError.max)}  (after best uniform scale ×${f(m.bestScale, 6)})`,
      `  Airy–Kavrayskiy E    ${f(m.airyKavrayskiy)}`,
      `  distance error       mean ${f(m.distanceError.mean)}  p95 ${f(m.distanceError.p95)}  (${m.distanceError.pairs} pairs)`,
      `  within tolerance     |s−1| ≤ 1/2/5 %: ${pct(m.withinTolerance.arealScale1Pct)} / ${pct(m.withinTolerance.arealScale2Pct)} / ${pct(m.withinTolerance.arealScale5Pct)}   ω ≤ 0.5/1/2°: ${pct(m.withinTolerance.angular0_5Deg)} / ${pct(m.withinTolerance.angular1Deg)} / ${pct(m.withinTolerance.angular2Deg)}`,
      `  projected / geodesic area  ${f(m.projectedVsGeodesicArea.ratio, 6)}${m.undefinedShare > 0 ? `   undefined over ${pct(m.undefinedShare)} of the region` : ''}`,
      '',
    );
  }
  return lines.join('\n');
}

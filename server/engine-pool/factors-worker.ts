import os from 'node:os';
import { parentPort } from 'node:worker_threads';
import type { ResolvedDefinition } from '../../shared/engine/definition';
import { allocFactorArrays, createFactorEvaluator, type FactorEvaluator } from '../../shared/engine/evaluator';
import type { RegionInput } from '../../shared/engine/region/geojson';
import { prepareRegion, type PreparedRegion } from '../../shared/engine/region/prepare';
import { sampleRegion, type RegionSamples } from '../../shared/engine/sampling';
import { scoreCandidate } from '../../shared/engine/scorecard';
import { scoreAuditCandidate } from './audit-candidate';
import { createFactorLineProcessor, type FactorLinesResult } from './factor-lines';

/** Messages the pool sends to a worker. */
export type WorkerRequest =
  | { id: number; kind: 'points'; resolved: ResolvedDefinition; lonDeg: Float64Array; latDeg: Float64Array }
  | { id: number; kind: 'lines'; resolved: ResolvedDefinition; text: string }
  | { id: number; kind: 'score'; resolved: ResolvedDefinition; dataset: number; samples?: RegionSamples; region?: PreparedRegion }
  | { id: number; kind: 'sample'; audit: AuditDataset }
  | { id: number; kind: 'audit'; resolved: ResolvedDefinition; label: string; storedCap: number; audit: AuditDataset };

/**
 * An audit's region and sampling settings, under a key: each worker prepares and samples the
 * region itself (the same inputs give the same points), so neither the samples nor the prepared
 * region ever pass through the thread that serves requests.
 */
export interface AuditDataset {
  key: number;
  geometry: RegionInput;
  count: number;
  seed: number;
}

/** Samples and regions already received, by dataset id (the pool sends each once per worker). */
const datasets = new Map<number, { samples: RegionSamples; region?: PreparedRegion }>();
const KEEP_DATASETS = 4;

/**
 * Pool threads do background maths (audits, batch factors): they run at the lowest priority
 * (nice 19) so that, on a small machine, the HTTP thread of the same process keeps answering
 * promptly while audits run. On Linux the nice value is per thread, so this lowers only this
 * thread (and it weighs against the other threads of this process's session; see
 * background-priority.ts for the separate worker process). Best effort.
 */
const POOL_THREAD_NICE = 19;
try {
  os.setPriority(0, POOL_THREAD_NICE);
} catch {
  // not permitted here; run at the normal priority
}

const evaluators = new Map<string, FactorEvaluator>();
const lineProcessors = new Map<string, (text: string) => FactorLinesResult>();

/** Audit datasets this worker prepared, by key (a few kept; an evicted one is prepared again). */
const auditDatasets = new Map<number, { samples: RegionSamples; region: PreparedRegion }>();

function auditDataset(a: AuditDataset) {
  let data = auditDatasets.get(a.key);
  if (!data) {
    const region = prepareRegion(a.geometry);
    data = { region, samples: sampleRegion(region, { count: a.count, seed: a.seed }) };
    auditDatasets.set(a.key, data);
    while (auditDatasets.size > KEEP_DATASETS) auditDatasets.delete(auditDatasets.keys().next().value as number);
  }
  return data;
}

function handle(msg: WorkerRequest): void {
  try {
    if (msg.kind === 'sample') {
      parentPort!.postMessage({ id: msg.id, ok: true, result: { count: auditDataset(msg.audit).samples.count } });
      return;
    }
    const key = msg.resolved.proj4;
    if (msg.kind === 'lines') {
      let proc = lineProcessors.get(key);
      if (!proc) lineProcessors.set(key, (proc = createFactorLineProcessor(msg.resolved)));
      const result = proc(msg.text);
      parentPort!.postMessage({ id: msg.id, ok: true, result }, [result.out.buffer as ArrayBuffer]);
      return;
    }
    if (msg.kind === 'score') {
      if (msg.samples) {
        datasets.set(msg.dataset, { samples: msg.samples, region: msg.region });
        while (datasets.size > KEEP_DATASETS) datasets.delete(datasets.keys().next().value as number);
      }
      const data = datasets.get(msg.dataset);
      if (!data) throw new Error(`dataset ${msg.dataset} is not in this worker any more`);
      parentPort!.postMessage({ id: msg.id, ok: true, result: scoreCandidate(msg.resolved, data.samples, data.region) });
      return;
    }
    if (msg.kind === 'audit') {
      const data = auditDataset(msg.audit);
      const result = scoreAuditCandidate(msg.resolved, data.samples, data.region, msg.storedCap, msg.label, (done) =>
        parentPort!.postMessage({ id: msg.id, progress: done }),
      );
      parentPort!.postMessage({ id: msg.id, ok: true, result }, Object.values(result.fields).map((a) => (a as Float64Array).buffer as ArrayBuffer));
      return;
    }
    let ev = evaluators.get(key);
    if (!ev) evaluators.set(key, (ev = createFactorEvaluator(msg.resolved)));
    const out = allocFactorArrays(msg.lonDeg.length);
    ev.factorsBatchDeg(msg.lonDeg, msg.latDeg, out);
    const buffers = Object.values(out).map((a) => (a as Float64Array).buffer as ArrayBuffer);
    parentPort!.postMessage({ id: msg.id, ok: true, result: out }, buffers);
  } catch (err) {
    parentPort!.postMessage({ id: msg.id, ok: false, error: err instanceof Error ? err.message : String(err) });
  }
}

parentPort!.on('message', handle);
parentPort!.postMessage({ ready: true });

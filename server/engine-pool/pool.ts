import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { ResolvedDefinition } from '../../shared/engine/definition';
import { allocFactorArrays, type FactorArrays } from '../../shared/engine/evaluator';
import type { PreparedRegion } from '../../shared/engine/region/prepare';
import type { RegionSamples } from '../../shared/engine/sampling';
import type { CandidateMetrics } from '../../shared/engine/scorecard';
import type { RegionInput } from '../../shared/engine/region/geojson';
import type { AuditCandidateResult } from './audit-candidate';
import type { FactorLinesResult } from './factor-lines';
import { bundledWorkerPath } from './worker-bundle';
import type { AuditDataset, WorkerRequest } from './factors-worker';

type Pending = { resolve: (v: unknown) => void; reject: (e: Error) => void; onProgress?: (done: number) => void };
type WithoutId<T> = T extends unknown ? Omit<T, 'id'> : never;

interface Slot {
  worker: Worker;
  busy: number;
  /** Dataset ids this worker holds, oldest first (it keeps the last four). */
  datasets: number[];
}

/**
 * A persistent pool of worker threads computing factors. Start it once (workers take
 * 100–300 ms to boot) and reuse it for every job; close it when the process is done.
 */
export class FactorPool {
  private nextId = 1;
  private readonly pending = new Map<number, Pending>();
  private nextDataset = 1;
  private readonly datasetIds = new WeakMap<RegionSamples, number>();

  private constructor(private readonly slots: Slot[]) {
    for (const slot of slots) {
      slot.worker.on('message', (msg: { id: number; ok?: boolean; result?: unknown; error?: string; progress?: number }) => {
        const p = this.pending.get(msg.id);
        if (!p) return;
        if (msg.progress !== undefined) return void p.onProgress?.(msg.progress);
        this.pending.delete(msg.id);
        slot.busy--;
        if (msg.ok) p.resolve(msg.result);
        else p.reject(new Error(msg.error));
      });
      slot.worker.on('error', (err) => {
        for (const p of this.pending.values()) p.reject(err);
        this.pending.clear();
      });
    }
  }

  /** Starts size workers (default: one per core) and resolves once all are ready. */
  static async start(size = availableParallelism()): Promise<FactorPool> {
    const bundled = await bundledWorkerPath();
    const url = bundled ? new URL(`file://${bundled}`) : new URL('./worker.mjs', import.meta.url);
    const slots = await Promise.all(
      Array.from({ length: Math.max(1, size) }, () => {
        const worker = new Worker(url);
        return new Promise<Slot>((resolve, reject) => {
          worker.once('message', () => resolve({ worker, busy: 0, datasets: [] }));
          worker.once('error', reject);
        });
      }),
    );
    return new FactorPool(slots);
  }

  private leastBusy(): Slot {
    return this.slots.reduce((best, s) => (s.busy < best.busy ? s : best));
  }

  get size(): number {
    return this.slots.length;
  }

  private send<T>(req: WithoutId<WorkerRequest>, transfer: ArrayBuffer[] = [], chosen?: Slot, onProgress?: (done: number) => void): Promise<T> {
    const slot = chosen ?? this.leastBusy();
    const id = this.nextId++;
    slot.busy++;
    return new Promise<T>((resolve, reject) => {
      this.pending.set(id, { resolve: resolve as (v: unknown) => void, reject, onProgress });
      slot.worker.postMessage({ ...req, id }, transfer);
    });
  }

  /** Factor lines for a block of "lon lat" text (see createFactorLineProcessor). */
  factorLines(resolved: ResolvedDefinition, text: string): Promise<FactorLinesResult> {
    return this.send({ kind: 'lines', resolved, text });
  }

  /** Factors for points in degrees, split across the workers; results in input order. */
  async factors(resolved: ResolvedDefinition, lonDeg: ArrayLike<number>, latDeg: ArrayLike<number>): Promise<FactorArrays> {
    const n = lonDeg.length;
    const parts = Math.min(this.slots.length * 2, Math.max(1, Math.ceil(n / 4096)));
    const size = Math.ceil(n / parts);
    const jobs: Promise<FactorArrays>[] = [];
    for (let start = 0; start < n; start += size) {
      const end = Math.min(n, start + size);
      const lon = copyRange(lonDeg, start, end);
      const lat = copyRange(latDeg, start, end);
      jobs.push(this.send({ kind: 'points', resolved, lonDeg: lon, latDeg: lat }, [lon.buffer as ArrayBuffer, lat.buffer as ArrayBuffer]));
    }
    const results = await Promise.all(jobs);
    const out = allocFactorArrays(n);
    let offset = 0;
    for (const r of results) {
      for (const key of Object.keys(out) as (keyof FactorArrays)[]) out[key].set(r[key], offset);
      offset += r.h.length;
    }
    return out;
  }

  /** A candidate's whole scorecard (factors and statistics) computed in a worker. */
  score(resolved: ResolvedDefinition, samples: RegionSamples, region?: PreparedRegion): Promise<CandidateMetrics> {
    // The samples and region travel to each worker once; later candidates refer to them by id.
    let dataset = this.datasetIds.get(samples);
    if (dataset === undefined) this.datasetIds.set(samples, (dataset = this.nextDataset++));
    const slot = this.leastBusy();
    const known = slot.datasets.includes(dataset);
    if (!known) {
      slot.datasets.push(dataset);
      if (slot.datasets.length > 4) slot.datasets.shift();
    }
    return this.send({ kind: 'score', resolved, dataset, ...(known ? {} : { samples, region }) }, [], slot);
  }

  /**
   * Prepares and samples an audit's region in every worker at once (each keeps it for the audit's
   * candidates); resolves with the sample count. Nothing large comes back to this thread.
   */
  async sampleAudit(geometry: RegionInput, count: number, seed: number): Promise<{ audit: AuditDataset; count: number }> {
    const audit: AuditDataset = { key: this.nextDataset++, geometry, count, seed };
    const counts = await Promise.all(this.slots.map((slot) => this.send<{ count: number }>({ kind: 'sample', audit }, [], slot)));
    return { audit, count: counts[0].count };
  }

  /**
   * One audit candidate scored in a worker (see scoreAuditCandidate): its scorecard and stored
   * fields. `onProgress` hears the samples done so far, block by block.
   */
  auditCandidate(
    resolved: ResolvedDefinition,
    label: string,
    audit: AuditDataset,
    storedCap: number,
    onProgress?: (samplesDone: number) => void,
  ): Promise<AuditCandidateResult> {
    return this.send({ kind: 'audit', resolved, label, storedCap, audit }, [], undefined, onProgress);
  }

  /** Terminates the workers. */
  async close(): Promise<void> {
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }
}

function copyRange(src: ArrayLike<number>, start: number, end: number): Float64Array {
  if (src instanceof Float64Array) return src.slice(start, end);
  const out = new Float64Array(end - start);
  for (let i = start; i < end; i++) out[i - start] = src[i];
  return out;
}

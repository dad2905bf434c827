import { Worker } from 'node:worker_threads';
import { HttpError, unavailable } from '../http/errors.js';
import type { EngineRunner, EngineTask, EngineTaskResult } from './engine-tasks.js';

interface Waiting {
  resolve: (v: EngineTaskResult) => void;
  reject: (e: Error) => void;
  timer: NodeJS.Timeout;
}

/**
 * One persistent worker thread for region checks, proposals and optimisation, started on first
 * use (loading the engine takes a moment, so it is kept). It is unref'd, but on Node 20 the
 * worker's internal messaging port still holds the process open, so whoever made the app closes
 * it (closeSharedEngineThread). Tasks queue in order; a task that runs past its time limit has the
 * thread replaced, and too long a queue is refused with a 503 rather than piling up.
 */
export class EngineThread implements EngineRunner {
  private worker: Worker | undefined;
  private ready: Promise<Worker> | undefined;
  private nextId = 1;
  private readonly waiting = new Map<number, Waiting>();

  constructor(private readonly maxQueued = 8) {}

  private start(): Promise<Worker> {
    if (this.ready) return this.ready;
    const worker = new Worker(new URL('./engine-task-worker.mjs', import.meta.url));
    worker.unref();
    this.worker = worker;
    this.ready = new Promise<Worker>((resolve, reject) => {
      type Reply = {
        ready?: boolean;
        id?: number;
        ok?: boolean;
        result?: EngineTaskResult;
        error?: string;
        http?: { status: number; code: string; fields?: Record<string, string> };
      };
      worker.on('message', (msg: Reply) => {
        if (msg.ready) return resolve(worker);
        const w = this.waiting.get(msg.id!);
        if (!w) return;
        this.waiting.delete(msg.id!);
        clearTimeout(w.timer);
        if (msg.ok) w.resolve(msg.result!);
        else w.reject(msg.http ? new HttpError(msg.http.status, msg.http.code, msg.error ?? '', msg.http.fields) : new Error(msg.error));
      });
      worker.on('error', (err) => {
        reject(err);
        this.fail(err);
      });
      worker.on('exit', () => {
        if (this.worker === worker) this.reset();
      });
    });
    return this.ready;
  }

  private reset() {
    this.worker = undefined;
    this.ready = undefined;
  }

  private fail(err: Error) {
    for (const w of this.waiting.values()) {
      clearTimeout(w.timer);
      w.reject(err);
    }
    this.waiting.clear();
    this.reset();
  }

  /** Runs a task in the thread; rejects with the task's own error, or 503 when busy or too slow. */
  run<K extends EngineTask['kind']>(task: Extract<EngineTask, { kind: K }>): Promise<Extract<EngineTaskResult, { kind: K }>> {
    return this.runAny(task) as never;
  }

  private async runAny(task: EngineTask, timeoutMs = 60_000): Promise<EngineTaskResult> {
    if (this.waiting.size >= this.maxQueued) throw unavailable('The engine is busy with other requests; try again in a moment.');
    const worker = await this.start();
    const id = this.nextId++;
    return new Promise<EngineTaskResult>((resolve, reject) => {
      const timer = setTimeout(() => {
        this.waiting.delete(id);
        reject(unavailable('The engine took too long on this request; try again with a simpler region.'));
        const w = this.worker;
        this.fail(new Error('engine thread restarted after a time-out'));
        void w?.terminate();
      }, timeoutMs);
      timer.unref();
      this.waiting.set(id, { resolve, reject, timer });
      // An upload's bytes are copied once into the thread (structured clone of a Uint8Array).
      worker.postMessage({ id, task });
    });
  }

  async close(): Promise<void> {
    const w = this.worker;
    this.reset();
    await w?.terminate();
  }
}

/** The app's one engine thread, made on first use and kept in deps.services. */
export function sharedEngineThread(services: Record<string, unknown>): EngineThread {
  return (services.engineThread ??= new EngineThread()) as EngineThread;
}

/** Ends the app's engine thread, if it was started (a test app or bench closing down). */
export async function closeSharedEngineThread(services: Record<string, unknown>): Promise<void> {
  const thread = services.engineThread as EngineThread | undefined;
  delete services.engineThread;
  await thread?.close();
}

import type { Queue, Worker } from 'bullmq';
import type { AppDeps } from '../deps.js';
import { closeSharedAuditEngine, sharedAuditEngine } from './engine-instance.js';
import { createAuditQueue, enqueueAudit, type AuditJobData } from './queue.js';
import { recoverAudits } from './recover.js';
import { createAuditWorker } from './worker.js';

/** The audit queue of an app, kept in deps.services under this key. */
export interface AuditJobs {
  queue: Queue<AuditJobData>;
  enqueue(auditId: number): Promise<void>;
  worker?: Worker<AuditJobData>;
  close(): Promise<void>;
}

const KEY = 'auditJobs';

/** The app's audit queue, created on first use (so apps that never start an audit open no Redis connection). */
export function auditJobs(deps: AppDeps): AuditJobs {
  const existing = deps.services[KEY] as AuditJobs | undefined;
  if (existing) return existing;
  const queue = createAuditQueue(deps.config);
  const jobs: AuditJobs = {
    queue,
    enqueue: (auditId) => enqueueAudit(queue, auditId),
    async close() {
      await jobs.worker?.close(true);
      await queue.close();
      delete deps.services[KEY];
    },
  };
  deps.services[KEY] = jobs;
  return jobs;
}

/**
 * Starts the app process's own audit worker (unless WARPMETER_NO_INPROCESS_WORKER=1, for
 * deployments that run only `npm run worker` processes) and re-enqueues audits left without a job.
 * Extra `npm run worker` processes, here or on other machines, share the same queue.
 */
export async function startAuditJobs(deps: AppDeps, env: NodeJS.ProcessEnv = process.env): Promise<AuditJobs> {
  const jobs = auditJobs(deps);
  if (env.WARPMETER_NO_INPROCESS_WORKER !== '1' && !jobs.worker) {
    const engine = await sharedAuditEngine();
    jobs.worker = createAuditWorker(deps.config, { dataSource: deps.dataSource, logger: deps.logger, engine });
  }
  await recoverAudits(deps.dataSource, jobs.queue, deps.logger);
  return jobs;
}

/** Closes the queue, the worker and the engine's threads, if this app opened them. */
export async function stopAuditJobs(deps: AppDeps): Promise<void> {
  const jobs = deps.services[KEY] as AuditJobs | undefined;
  await jobs?.close();
  await closeSharedAuditEngine();
}

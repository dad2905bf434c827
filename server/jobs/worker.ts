import { Worker } from 'bullmq';
import type { Config } from '../config.js';
import { Audit } from '../entities/index.js';
import { processAudit, type ProcessorContext } from './audit-processor.js';
import { jobTimingFromEnv, type JobTiming } from './job-timing.js';
import { AUDIT_QUEUE, redisConnection, type AuditJobData } from './queue.js';

export interface AuditWorkerOptions {
  /** Audits run at once in this process; each already uses every core through the engine's threads. */
  concurrency?: number;
  timing?: JobTiming;
}

/**
 * A BullMQ worker for audit jobs. The job's lock is renewed from this thread while the maths runs
 * on worker threads; a killed process stops renewing it, and the stalled-job check of any live
 * worker puts the job back in the queue (see job-timing.ts).
 */
export function createAuditWorker(config: Config, ctx: ProcessorContext, opts: AuditWorkerOptions = {}): Worker<AuditJobData> {
  const timing = opts.timing ?? jobTimingFromEnv();
  const worker = new Worker<AuditJobData>(
    AUDIT_QUEUE,
    async (job) => processAudit(ctx, job.data.auditId, (p) => job.updateProgress(Math.round(p * 1000) / 10)),
    {
      connection: redisConnection(config),
      prefix: config.redis.prefix,
      concurrency: opts.concurrency ?? 1,
      lockDuration: timing.lockDurationMs,
      stalledInterval: timing.stalledIntervalMs,
      maxStalledCount: timing.maxStalledCount,
    },
  );
  worker.on('failed', async (job, err) => {
    if (!job) return;
    // A job failed by the stall limit never reached processAudit's own error handling.
    const audits = ctx.dataSource.getRepository(Audit);
    await audits
      .update(
        { id: job.data.auditId, status: 'running' },
        { status: 'failed', error: `The audit could not finish: ${err.message}`.slice(0, 2000), finishedAt: new Date() },
      )
      .catch(() => {});
  });
  worker.on('error', (err) => ctx.logger.error({ err }, 'audit worker error'));
  return worker;
}

import type { Queue } from 'bullmq';
import type { Logger } from 'pino';
import { In, type DataSource } from 'typeorm';
import { Audit } from '../entities/index.js';
import { auditJobId, enqueueAudit, type AuditJobData } from './queue.js';

/**
 * On start: every audit still queued or running must have a live job. A job lost with Redis's
 * data, or finished without its audit being marked, is enqueued again; one that BullMQ failed
 * (e.g. it stalled too often) marks its audit failed with the reason. Enqueueing is idempotent by
 * job id, so several processes starting at once enqueue each audit once.
 */
export async function recoverAudits(db: DataSource, queue: Queue<AuditJobData>, log: Logger): Promise<number> {
  const stuck = await db.getRepository(Audit).find({ select: { id: true }, where: { status: In(['queued', 'running']) } });
  let requeued = 0;
  for (const { id } of stuck) {
    const job = await queue.getJob(auditJobId(id));
    const state = job ? await job.getState() : 'missing';
    if (state === 'failed') {
      await db
        .getRepository(Audit)
        .update({ id }, { status: 'failed', error: `The audit could not finish: ${job?.failedReason ?? 'its job failed.'}`.slice(0, 2000) });
      continue;
    }
    if (state === 'completed' || state === 'unknown') await job?.remove().catch(() => {});
    if (state === 'missing' || state === 'completed' || state === 'unknown') {
      await enqueueAudit(queue, id);
      requeued++;
    }
  }
  if (requeued) log.info({ requeued }, 'audits re-enqueued after start');
  return requeued;
}

import { Queue, type ConnectionOptions } from 'bullmq';
import type { Config } from '../config.js';

/** The BullMQ queue every audit job goes through. */
export const AUDIT_QUEUE = 'audits';

/** One job per audit: BullMQ ignores an add whose id already exists, so enqueueing is idempotent. */
export const auditJobId = (auditId: number) => `audit-${auditId}`;

export interface AuditJobData {
  auditId: number;
}

/** Redis connection options for BullMQ (it opens its own connections from them). */
export function redisConnection(config: Config): ConnectionOptions {
  return {
    host: config.redis.host,
    port: config.redis.port,
    // Workers block on Redis; BullMQ requires unlimited retries per request for them.
    maxRetriesPerRequest: null,
    enableOfflineQueue: true,
  };
}

export function createAuditQueue(config: Config): Queue<AuditJobData> {
  return new Queue<AuditJobData>(AUDIT_QUEUE, {
    connection: redisConnection(config),
    prefix: config.redis.prefix,
    defaultJobOptions: {
      // An engine error is deterministic: no automatic retry (the audit shows the message instead).
      // A worker that dies is a different matter: stalled-job detection hands the job to another.
      attempts: 1,
      removeOnComplete: { age: 7 * 24 * 3600, count: 10_000 },
      removeOnFail: { age: 30 * 24 * 3600 },
    },
  });
}

/** Adds the audit's job unless one with its id is already queued, running or kept. */
export async function enqueueAudit(queue: Queue<AuditJobData>, auditId: number): Promise<void> {
  await queue.add('audit', { auditId }, { jobId: auditJobId(auditId) });
}

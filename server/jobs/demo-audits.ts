import pino from 'pino';
import { Audit, Candidate, MapProject, Region } from '../entities/index.js';
import type { DemoContext } from '../seed/index.js';
import { createAuditRow } from '../services/audits.service.js';
import { processAudit } from './audit-processor.js';
import { closeSharedAuditEngine, sharedAuditEngine, sharedAuditEngineRunning } from './engine-instance.js';

/**
 * Demo seeding step: every demo project that has a region and candidates but no audit yet
 * gets one, computed right here with the engine (no queue needed at seed time), so the demo opens
 * on real scorecards and heatmaps. Idempotent: a second start finds the audits and does nothing.
 * Runs after the seeder that creates the demo projects.
 */
export async function seedDemoAudits(ctx: DemoContext): Promise<void> {
  const ds = ctx.ds;
  const projects = await ds.getRepository(MapProject).find({ where: { studioId: ctx.studioId }, order: { id: 'ASC' } });
  const logger = pino({ level: process.env.LOG_LEVEL ?? 'warn' });
  // Close the engine's threads afterwards only if this step started them (demo seeding runs in its own process).
  const wasRunning = sharedAuditEngineRunning();
  let opened = false;
  try {
    for (const project of projects) {
      // Any audit at all: a finished one is what we want, a queued one is re-enqueued by the app at
      // start (recoverAudits), and a failed one should be looked at rather than retried on every start.
      if (await ds.getRepository(Audit).existsBy({ projectId: project.id })) continue;
      const hasRegion = await ds.getRepository(Region).existsBy({ projectId: project.id, isCurrent: true });
      const hasCandidates = await ds.getRepository(Candidate).existsBy({ projectId: project.id });
      if (!hasRegion || !hasCandidates) continue;
      const audit = await createAuditRow(ds, project, ctx.people.cartographer.userId, {});
      const engine = await sharedAuditEngine();
      opened = !wasRunning;
      await processAudit({ dataSource: ds, logger, engine }, audit.id);
      logger.info({ projectId: project.id, auditId: audit.id }, 'demo audit computed');
    }
  } finally {
    if (opened) await closeSharedAuditEngine();
  }
}

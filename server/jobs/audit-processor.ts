import type { Logger } from 'pino';
import { In, type DataSource } from 'typeorm';
import { Audit, Region, Scorecard } from '../entities/index.js';
import type { AuditEngine } from './audit-engine.js';
import { readSettings } from './audit-settings.js';
import { recordActivity } from '../services/activity.service.js';
import { encodeFields } from './fields-codec.js';
import { insertScorecard } from './insert-scorecard.js';

export interface ProcessorContext {
  dataSource: DataSource;
  logger: Logger;
  engine: AuditEngine;
}

/** Least change of progress written to the audit row, so a fast audit does not flood MariaDB. */
const PROGRESS_STEP = 0.02;

/** The text stored in audit.error: what went wrong, in words the cartographer can act on. */
export function failureMessage(err: unknown): string {
  const raw = err instanceof Error ? err.message : String(err);
  return `The audit could not finish: ${raw.replace(/^Error:\s*/, '')}`.slice(0, 2000);
}

/**
 * Runs one audit to completion. Safe to run again for the same audit (after a crash, or when a
 * stalled job is handed to a second worker): all scorecards are written in ONE transaction that
 * first locks the audit row, skips if another run already finished it, and replaces any earlier
 * rows — so there is never a partial or duplicate set of scorecards.
 */
export async function processAudit(
  ctx: ProcessorContext,
  auditId: number,
  onProgress: (fraction: number) => Promise<void> | void = () => {},
): Promise<'done' | 'already-done' | 'not-runnable' | 'missing'> {
  const db = ctx.dataSource;
  const audits = db.getRepository(Audit);
  const audit = await audits.findOneBy({ id: auditId });
  if (!audit) return 'missing';
  if (audit.status === 'done') return 'already-done';
  const started = Date.now();
  // Conditional, so a run that lost the race to another worker never reopens a finished audit.
  const claimed = await audits.update(
    { id: auditId, status: In(['queued', 'running']) },
    { status: 'running', progress: 0, error: null, startedAt: audit.startedAt ?? new Date() },
  );
  if (!claimed.affected) return (await audits.existsBy({ id: auditId, status: 'done' })) ? 'already-done' : 'not-runnable';

  try {
    const region = await db.getRepository(Region).findOneBy({ id: audit.regionId, studioId: audit.studioId });
    if (!region) throw new Error('its region is no longer stored.');
    const settings = readSettings(audit.settings);
    if (!settings.candidates.length) throw new Error('it has no candidates.');

    let written = 0;
    // Reports may come from work running side by side: writes go one after another, rising only.
    let writes: Promise<unknown> = Promise.resolve();
    const result = await ctx.engine.scoreCandidates(
      { geometry: region.geometry as never, candidates: settings.candidates, samples: settings.samples, seed: settings.seed },
      (fraction) => {
        if (fraction - written < PROGRESS_STEP && fraction < 1) return writes.then(() => {});
        written = fraction;
        const p = Math.min(0.99, fraction);
        writes = writes.then(async () => {
          await audits.update({ id: auditId, status: 'running' }, { progress: p });
          await onProgress(p);
        });
        return writes.then(() => {});
      },
    );
    await writes;

    const finished = await db.transaction(async (tx) => {
      const row = await tx.getRepository(Audit).findOne({ where: { id: auditId }, lock: { mode: 'pessimistic_write' } });
      if (!row || row.status === 'done') return false;
      await tx.getRepository(Scorecard).delete({ auditId });
      // One statement per candidate, its field blob (up to ~2 MB) sent as binary: the database and
      // this thread work in short steps that other requests can interleave with, instead of one
      // statement of every blob at once; the transaction still makes them appear together.
      for (const r of result.candidates) {
        await insertScorecard(tx, { auditId, candidateId: r.candidateId, studioId: audit.studioId, metrics: r.metrics, fields: encodeFields(r.fields) });
      }
      await tx.getRepository(Audit).update(
        { id: auditId },
        { status: 'done', progress: 1, error: null, finishedAt: new Date(), timings: { totalMs: Date.now() - started, ...result.timingsMs } },
      );
      await recordActivity(tx, {
        projectId: audit.projectId, studioId: audit.studioId, actor: null, kind: 'audit.finished',
        summary: `Audit #${auditId} finished: ${result.candidates.length} candidate${result.candidates.length === 1 ? '' : 's'} scored`,
        details: { auditId },
      });
      return true;
    });
    await onProgress(1);
    return finished ? 'done' : 'already-done';
  } catch (err) {
    ctx.logger.warn({ err, auditId }, 'audit failed');
    // Never over a finished audit: another worker may have completed it while this run failed.
    await audits.update({ id: auditId, status: In(['queued', 'running']) }, { status: 'failed', error: failureMessage(err), finishedAt: new Date() });
    // The history line must never hide the failure itself.
    await recordActivity(db, {
      projectId: audit.projectId, studioId: audit.studioId, actor: null, kind: 'audit.failed',
      summary: `Audit #${auditId} failed: ${failureMessage(err).slice(0, 200)}`, details: { auditId },
    }).catch(() => {});
    throw err;
  }
}

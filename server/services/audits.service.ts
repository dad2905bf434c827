import type { DataSource } from 'typeorm';
import {
  SAMPLES_DEFAULT,
  type AuditDetail,
  type AuditSummary,
  type StartAuditInput,
} from '../../shared/api/audits.schema.js';
import { isStaffRole } from '../../shared/api/roles.js';
import { ActivityEvent, Audit, Candidate, MapProject, ProjectAccess, Region, Scorecard } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, notFound, unavailable, validationFailed } from '../http/errors.js';
import { readSettings, type AuditCandidateSnapshot, type StoredAuditSettings } from '../jobs/audit-settings.js';
import { ENGINE_VERSION } from '../jobs/engine-instance.js';
import { canonicalSha256 } from '../regions/canonical-json.js';
import { recordActivity } from './activity.service.js';
import { hydrate, poolQuery, selectColumns, tableOf } from './raw-rows.js';
import { loadProjectFor } from './project-guard.js';
import { scorecardViews } from './scorecards.service.js';

/** Seed used when none is given, so the same inputs give the same audit (and the same input hash). */
export const DEFAULT_SEED = 1;

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function auditSummary(a: Audit): AuditSummary {
  const s = readSettings(a.settings);
  return {
    id: a.id,
    projectId: a.projectId,
    regionId: a.regionId,
    candidateIds: a.candidateIds,
    status: a.status,
    progress: a.progress,
    error: a.error,
    settings: { samples: s.samples, seed: s.seed },
    engineVersion: a.engineVersion,
    inputHash: a.inputHash,
    createdAt: a.createdAt.toISOString(),
    startedAt: iso(a.startedAt),
    finishedAt: iso(a.finishedAt),
  };
}

/**
 * The SHA-256 of everything an audit's numbers depend on — the region geometry's hash, each
 * candidate's definition, the sampling settings and the engine version — as canonical JSON, so
 * anyone holding the same inputs can recompute it.
 */
export function auditInputHash(regionSha256: string, settings: StoredAuditSettings, engineVersion: string): string {
  return canonicalSha256({
    region: regionSha256,
    // As entered (what the engine evaluates) and as resolved (the PROJ string shown and exported).
    definitions: settings.candidates.map((c) => ({ definition: c.definition, resolved: c.resolved })),
    settings: { samples: settings.samples, seed: settings.seed },
    engineVersion,
  });
}

/**
 * Creates a queued audit (see createAuditRow) and hands it to the queue. If the queue cannot take
 * it, the audit row is removed again, so no audit is left that nothing will run.
 */
export async function startAudit(
  db: DataSource,
  actor: Actor,
  projectId: number,
  input: StartAuditInput,
  enqueue: (auditId: number) => Promise<void>,
): Promise<AuditSummary> {
  const project = await loadProjectFor(db, actor, projectId, 'write');
  const audit = await createAuditRow(db, project, actor.userId, input);
  // Written before the job is queued, so the history never shows an audit finishing before it started.
  const { samples, seed } = readSettings(audit.settings);
  const startedLine = await recordActivity(db, {
    projectId: project.id, studioId: project.studioId, actor, kind: 'audit.started',
    summary: `Started audit #${audit.id} of ${audit.candidateIds.length} candidate${audit.candidateIds.length === 1 ? '' : 's'} (${samples} samples, seed ${seed})`,
    details: { auditId: audit.id },
  });
  try {
    await enqueue(audit.id);
  } catch {
    await db.getRepository(Audit).delete({ id: audit.id });
    await db.getRepository(ActivityEvent).delete({ id: startedLine });
    throw unavailable('The job queue is not reachable right now, so the audit was not started. Please try again in a moment.');
  }
  return auditSummary(audit);
}

/**
 * Writes a queued audit of the project's current region over the chosen candidates (all of the
 * project's when none are named), with its own copy of the candidates and its input hash.
 * Refuses (and writes nothing) without a region, without candidates or with foreign candidate ids.
 */
export async function createAuditRow(db: DataSource, project: MapProject, createdById: number, input: StartAuditInput): Promise<Audit> {
  const studioId = project.studioId;
  const region = await db.getRepository(Region).findOne({
    select: { id: true, sha256: true },
    where: { projectId: project.id, studioId, isCurrent: true },
  });
  if (!region) throw conflict('Upload the region to map before starting an audit.');
  const all = await db.getRepository(Candidate).find({ where: { projectId: project.id, studioId }, order: { id: 'ASC' } });
  let chosen = all;
  if (input.candidateIds) {
    const byId = new Map(all.map((c) => [c.id, c]));
    const unknown = input.candidateIds.filter((id) => !byId.has(id));
    if (unknown.length) {
      throw validationFailed('Some candidates are not part of this project.', {
        candidateIds: `Not a candidate of this project: ${unknown.join(', ')}.`,
      });
    }
    chosen = [...new Set(input.candidateIds)].map((id) => byId.get(id)!);
  }
  if (!chosen.length) throw conflict('Add at least one candidate projection before starting an audit.');

  const candidates: AuditCandidateSnapshot[] = chosen.map((c) => ({
    id: c.id,
    label: c.label,
    family: c.family,
    definition: c.definition,
    resolved: c.resolved,
  }));
  const settings: StoredAuditSettings = { samples: input.samples ?? SAMPLES_DEFAULT, seed: input.seed ?? DEFAULT_SEED, candidates };
  return db.getRepository(Audit).save(
    db.getRepository(Audit).create({
      projectId: project.id,
      studioId,
      regionId: region.id,
      candidateIds: candidates.map((c) => c.id),
      status: 'queued',
      progress: 0,
      settings,
      engineVersion: ENGINE_VERSION,
      inputHash: auditInputHash(region.sha256, settings, ENGINE_VERSION),
      createdById,
    }),
  );
}

export async function listAudits(db: DataSource, actor: Actor, projectId: number): Promise<AuditSummary[]> {
  const project = await loadProjectFor(db, actor, projectId, 'read');
  const rows = await db.getRepository(Audit).find({
    where: { projectId: project.id, studioId: actor.studioId },
    order: { createdAt: 'DESC', id: 'DESC' },
  });
  return rows.map(auditSummary);
}

/**
 * Loads an audit the actor may read, with its project, in one query: the same rules as the
 * project guard (other studios' audits and, for client reviewers, audits of projects not shared
 * with them are simply not found). Pictures, exports and the scorecard page all start here.
 */
export async function loadAuditFor(db: DataSource, actor: Actor, auditId: number): Promise<{ audit: Audit; project: MapProject }> {
  const client = !isStaffRole(actor.role);
  const sql =
    `SELECT ${selectColumns(db, Audit, 'a')}, ${selectColumns(db, MapProject, 'p')} FROM ${tableOf(db, Audit)} a ` +
    `JOIN ${tableOf(db, MapProject)} p ON p.id = a.projectId AND p.studioId = a.studioId ` +
    (client ? `JOIN ${tableOf(db, ProjectAccess)} pa ON pa.projectId = p.id AND pa.userId = ? ` : '') +
    'WHERE a.id = ? AND a.studioId = ?';
  const [row] = await poolQuery(db, sql, client ? [actor.userId, auditId, actor.studioId] : [auditId, actor.studioId]);
  if (!row) throw notFound('That audit');
  return { audit: hydrate(db, Audit, row, 'a'), project: hydrate(db, MapProject, row, 'p') };
}

export async function getAudit(db: DataSource, actor: Actor, auditId: number): Promise<AuditDetail> {
  const { audit, project } = await loadAuditFor(db, actor, auditId);
  const cards =
    audit.status === 'done' && audit.candidateIds.length
      ? (
          await poolQuery(
            db,
            `SELECT ${selectColumns(db, Scorecard, 's', ['candidateId', 'metrics'])} FROM ${tableOf(db, Scorecard)} s WHERE s.auditId = ? AND s.studioId = ? AND s.candidateId IN (?)`,
            [audit.id, actor.studioId, audit.candidateIds],
          )
        ).map((row) => hydrate(db, Scorecard, row, 's', ['candidateId', 'metrics']))
      : [];
  return { ...auditSummary(audit), purpose: project.purpose, scorecards: scorecardViews(audit, cards) };
}

import type { DataSource, EntityManager } from 'typeorm';
import type { ActivityView } from '../../shared/api/review.schema.js';
import { ActivityEvent } from '../entities/index.js';
import type { Actor } from '../http/actor.js';

export interface ActivityInput {
  projectId: number;
  studioId: number;
  /** Who acted; null for the system (a background job finishing on its own). */
  actor: Pick<Actor, 'userId' | 'name' | 'role'> | null;
  /** Dotted kind: `region.uploaded`, `candidate.added`, `candidate.removed`, `audit.started`, `round.requested`, … */
  kind: string;
  /** One line a person reads in the project's history ("Uploaded france.zip (3 parts)"). */
  summary: string;
  details?: Record<string, unknown>;
}

/**
 * Appends one line to a project's history and returns its id. Pass the transaction's manager so
 * the line is written with the change it describes, or not at all.
 */
export async function recordActivity(db: EntityManager | DataSource, input: ActivityInput): Promise<number> {
  const repo = db.getRepository(ActivityEvent);
  const saved = await repo.save(repo.create({
    projectId: input.projectId,
    studioId: input.studioId,
    actorId: input.actor?.userId ?? null,
    actorName: (input.actor?.name ?? 'Warpmeter').slice(0, 120),
    actorRole: input.actor?.role ?? 'system',
    kind: input.kind.slice(0, 60),
    summary: input.summary.slice(0, 300),
    details: input.details ?? null,
  }));
  return saved.id;
}

const toView = (e: ActivityEvent): ActivityView => ({
  id: e.id,
  kind: e.kind,
  summary: e.summary,
  actorName: e.actorName,
  actorRole: e.actorRole,
  details: e.details ?? null,
  createdAt: e.createdAt.toISOString(),
});

/** A project's history, newest first (the caller has already checked the project is visible). */
export async function listActivity(db: DataSource, studioId: number, projectId: number, limit = 200): Promise<ActivityView[]> {
  const rows = await db.getRepository(ActivityEvent).find({
    where: { studioId, projectId },
    order: { createdAt: 'DESC', id: 'DESC' },
    take: limit,
  });
  return rows.map(toView);
}

import type { DataSource, EntityManager } from 'typeorm';
import { isStaffRole } from '../../shared/api/roles.js';
import { MapProject, ProjectAccess } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { forbidden, notFound } from '../http/errors.js';

export type ProjectMode = 'read' | 'write';

/**
 * Loads a project the actor may see, or throws. Tenancy first: a project of another studio, or
 * one a client reviewer was not invited to, is simply not found (404), so ids leak nothing.
 * `write` is for studio staff working on the map (cartographers and admins); editors and
 * clients read. Routes that let editors act (shortlists, recommendations) check their own role.
 */
export async function loadProjectFor(
  db: DataSource | EntityManager,
  actor: Actor,
  projectId: number,
  mode: ProjectMode = 'read',
): Promise<MapProject> {
  if (!Number.isInteger(projectId) || projectId <= 0) throw notFound('That project');
  const project = await db.getRepository(MapProject).findOneBy({ id: projectId, studioId: actor.studioId });
  if (!project) throw notFound('That project');
  if (!isStaffRole(actor.role)) {
    const shared = await db.getRepository(ProjectAccess).existsBy({ projectId, userId: actor.userId });
    if (!shared) throw notFound('That project');
    if (mode === 'write') throw forbidden('Client reviewers can read shared projects but not change them.');
  }
  if (mode === 'write' && !['cartographer', 'admin'].includes(actor.role)) {
    throw forbidden('Only cartographers and admins change a project’s region, candidates and audits.');
  }
  return project;
}

/**
 * Parses an id route parameter: a positive decimal integer that fits MariaDB's INT. Anything else
 * ("1.0", "1e3", "+1", "") is a 404, like an id that does not exist, never a 500.
 */
export function idParam(value: unknown, what = 'That item'): number {
  const raw = String(value ?? '');
  const id = /^[1-9]\d{0,9}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(id) || id > 2_147_483_647) throw notFound(what);
  return id;
}

import { In, type DataSource } from 'typeorm';
import type {
  CreateProjectInput,
  ListProjectsQuery,
  ProjectView,
  UpdateProjectInput,
} from '../../shared/api/projects.schema.js';
import { listProjectsQuerySchema } from '../../shared/api/projects.schema.js';
import { isStaffRole } from '../../shared/api/roles.js';
import { Audit, Candidate, MapProject, ProjectAccess, Region } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { recordActivity } from './activity.service.js';
import { poolQuery, tableOf } from './raw-rows.js';
import { loadProjectFor } from './project-guard.js';

/** Per-project figures shown beside a project in lists and on its page. */
interface ProjectExtras {
  region: ProjectView['region'];
  candidateCount: number;
  auditCount: number;
}

/** The fields of a project a view shows (an entity, or a row of the list query). */
type ProjectFields = Pick<MapProject, 'id' | 'title' | 'clientName' | 'purpose' | 'scaleBand' | 'status' | 'notes' | 'createdAt' | 'updatedAt'>;

const toView = (p: ProjectFields, x: ProjectExtras): ProjectView => ({
  id: p.id,
  title: p.title,
  clientName: p.clientName,
  purpose: p.purpose,
  scaleBand: p.scaleBand,
  status: p.status,
  notes: p.notes,
  createdAt: p.createdAt.toISOString(),
  updatedAt: p.updatedAt.toISOString(),
  ...x,
});

/**
 * Loads the current region and the candidate/audit counts of the given projects in three queries
 * (whatever their number). The list forms the same figures in its own single query.
 */
async function extrasFor(ds: DataSource, studioId: number, ids: number[]): Promise<Map<number, ProjectExtras>> {
  const out = new Map<number, ProjectExtras>(ids.map((id) => [id, { region: null, candidateCount: 0, auditCount: 0 }]));
  if (!ids.length) return out;
  const [regions, candidates, audits] = await Promise.all([
    ds.getRepository(Region).find({
      select: { id: true, projectId: true, name: true, areaKm2: true },
      where: { studioId, projectId: In(ids), isCurrent: true },
    }),
    countBy(ds, Candidate, studioId, ids),
    countBy(ds, Audit, studioId, ids),
  ]);
  for (const r of regions) out.get(r.projectId)!.region = { id: r.id, name: r.name, areaKm2: r.areaKm2 };
  for (const [id, n] of candidates) out.get(id)!.candidateCount = n;
  for (const [id, n] of audits) out.get(id)!.auditCount = n;
  return out;
}

async function countBy(
  ds: DataSource,
  entity: typeof Candidate | typeof Audit,
  studioId: number,
  ids: number[],
): Promise<Map<number, number>> {
  const rows: { projectId: number; n: string | number }[] = await ds
    .getRepository(entity)
    .createQueryBuilder('t')
    .select('t.projectId', 'projectId')
    .addSelect('COUNT(*)', 'n')
    .where('t.studioId = :studioId AND t.projectId IN (:...ids)', { studioId, ids })
    .groupBy('t.projectId')
    .getRawMany();
  return new Map(rows.map((r) => [Number(r.projectId), Number(r.n)]));
}

/** Escapes LIKE wildcards so a search for "50%" means the characters, not a pattern. */
const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** A row of the list query: the project, its current region in brief, and its two counts. */
interface ProjectListRow extends ProjectFields {
  regionId: number | null; regionName: string | null; regionAreaKm2: number | null;
  candidateCount: string | number; auditCount: string | number;
}

/**
 * The studio's projects the actor may see (clients: only those shared with them), searched by
 * title, client name or notes, filtered by status and purpose, sorted — with each project's
 * current region and its candidate and audit counts, in one query (the list is the busiest read
 * of the product; one round trip instead of four).
 */
export async function listProjects(ds: DataSource, actor: Actor, query: ListProjectsQuery): Promise<ProjectView[]> {
  const q = listProjectsQuerySchema.parse(query);
  const t = { projects: tableOf(ds, MapProject), access: tableOf(ds, ProjectAccess), regions: tableOf(ds, Region), candidates: tableOf(ds, Candidate), audits: tableOf(ds, Audit) };
  const params: unknown[] = [];
  let sql =
    'SELECT p.id, p.title, p.clientName, p.purpose, p.scaleBand, p.status, p.notes, p.createdAt, p.updatedAt, ' +
    'r.id AS regionId, r.name AS regionName, r.areaKm2 AS regionAreaKm2, ' +
    `(SELECT COUNT(*) FROM ${t.candidates} c WHERE c.projectId = p.id AND c.studioId = p.studioId) AS candidateCount, ` +
    `(SELECT COUNT(*) FROM ${t.audits} a WHERE a.projectId = p.id AND a.studioId = p.studioId) AS auditCount ` +
    `FROM ${t.projects} p `;
  if (!isStaffRole(actor.role)) {
    sql += `JOIN ${t.access} pa ON pa.projectId = p.id AND pa.userId = ? `;
    params.push(actor.userId);
  }
  // At most one region per project is current (regions.service switches them in one transaction).
  sql += `LEFT JOIN ${t.regions} r ON r.projectId = p.id AND r.studioId = p.studioId AND r.isCurrent = 1 WHERE p.studioId = ?`;
  params.push(actor.studioId);
  if (q.q) {
    sql += ' AND (p.title LIKE ? OR p.clientName LIKE ? OR p.notes LIKE ?)';
    const like = `%${likeEscape(q.q)}%`;
    params.push(like, like, like);
  }
  if (q.status) (sql += ' AND p.status = ?'), params.push(q.status);
  if (q.purpose) (sql += ' AND p.purpose = ?'), params.push(q.purpose);
  const column = { updated: 'p.updatedAt', title: 'p.title', status: 'p.status' }[q.sort];
  const dir = (q.dir ?? (q.sort === 'updated' ? 'desc' : 'asc')) === 'desc' ? 'DESC' : 'ASC';
  sql += ` ORDER BY ${column} ${dir}, p.id ${dir} LIMIT 500`;
  const rows = await poolQuery<ProjectListRow>(ds, sql, params);
  return rows.map((r) =>
    toView(r, {
      region: r.regionId === null ? null : { id: r.regionId, name: r.regionName!, areaKm2: Number(r.regionAreaKm2) },
      candidateCount: Number(r.candidateCount),
      auditCount: Number(r.auditCount),
    }),
  );
}

/** One project with its figures; 404 when the actor may not see it. */
export async function getProject(ds: DataSource, actor: Actor, projectId: number): Promise<ProjectView> {
  const project = await loadProjectFor(ds, actor, projectId, 'read');
  const extras = await extrasFor(ds, actor.studioId, [project.id]);
  return toView(project, extras.get(project.id)!);
}

export async function createProject(ds: DataSource, actor: Actor, input: CreateProjectInput): Promise<ProjectView> {
  const repo = ds.getRepository(MapProject);
  const saved = await repo.save(
    repo.create({
      studioId: actor.studioId,
      title: input.title,
      clientName: input.clientName,
      purpose: input.purpose,
      scaleBand: input.scaleBand,
      notes: input.notes || null,
      status: 'draft',
      createdById: actor.userId,
    }),
  );
  await recordActivity(ds, {
    projectId: saved.id, studioId: actor.studioId, actor, kind: 'project.created',
    summary: `Created the project “${saved.title}” for ${saved.clientName}`,
  });
  const fresh = await repo.findOneByOrFail({ id: saved.id });
  return toView(fresh, { region: null, candidateCount: 0, auditCount: 0 });
}

export async function updateProject(
  ds: DataSource,
  actor: Actor,
  projectId: number,
  input: UpdateProjectInput,
): Promise<ProjectView> {
  const project = await loadProjectFor(ds, actor, projectId, 'write');
  const changes: Partial<MapProject> = {};
  if (input.title !== undefined) changes.title = input.title;
  if (input.clientName !== undefined) changes.clientName = input.clientName;
  if (input.purpose !== undefined) changes.purpose = input.purpose;
  if (input.scaleBand !== undefined) changes.scaleBand = input.scaleBand;
  if (input.notes !== undefined) changes.notes = input.notes || null;
  // Stamped by the database with milliseconds (TypeORM's own stamp here would drop them).
  await ds
    .getRepository(MapProject)
    .update({ id: project.id, studioId: actor.studioId }, { ...changes, updatedAt: () => 'CURRENT_TIMESTAMP(3)' });
  await recordActivity(ds, {
    projectId: project.id, studioId: actor.studioId, actor, kind: 'project.edited',
    summary: `Edited the project’s ${Object.keys(changes).join(', ') || 'details'}`, details: { fields: Object.keys(changes) },
  });
  return getProject(ds, actor, project.id);
}

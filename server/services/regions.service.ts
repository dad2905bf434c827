import type { DataSource } from 'typeorm';
import type { FeaturePick, RegionInspection, RegionView, RegionWithGeometry } from '../../shared/api/regions.schema.js';
import { MapProject, Region } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import type { EngineRunner } from '../engine-tasks/engine-tasks.js';
import { canonicalSha256 } from '../regions/canonical-json.js';
import type { UploadedFile } from '../regions/upload-middleware.js';
import { recordActivity } from './activity.service.js';
import { loadProjectFor } from './project-guard.js';

const toView = (r: Region): RegionView => ({
  id: r.id,
  projectId: r.projectId,
  name: r.name,
  sourceFileName: r.sourceFileName,
  sourceFormat: r.sourceFormat,
  sourceCrs: r.sourceCrs,
  sha256: r.sha256,
  areaKm2: r.areaKm2,
  bbox: r.bbox as RegionView['bbox'],
  vertexCount: r.vertexCount,
  partCount: r.partCount,
  holeCount: r.holeCount,
  report: r.report as RegionView['report'],
  isCurrent: r.isCurrent,
  createdAt: r.createdAt.toISOString(),
});

/** Reads and checks a file for the feature picker; stores nothing. */
export async function inspectRegion(
  ds: DataSource,
  engine: EngineRunner,
  actor: Actor,
  projectId: number,
  upload: UploadedFile,
): Promise<RegionInspection> {
  await loadProjectFor(ds, actor, projectId, 'write');
  const out = await engine.run({ kind: 'inspect-region', file: upload.buffer, fileName: upload.fileName });
  return out.inspection;
}

/**
 * Stores the picked features of a file as the project's current region. Every check runs
 * before the transaction; inside it, earlier regions stop being current and the new one is
 * inserted, so a failure leaves the project as it was.
 */
export async function storeRegion(
  ds: DataSource,
  engine: EngineRunner,
  actor: Actor,
  projectId: number,
  upload: UploadedFile,
  pick: FeaturePick,
  name?: string,
): Promise<RegionView> {
  const project = await loadProjectFor(ds, actor, projectId, 'write');
  const { region } = await engine.run({ kind: 'read-region', file: upload.buffer, fileName: upload.fileName, pick });
  const { geometry, report } = region;
  const saved = await ds.transaction(async (m) => {
    const repo = m.getRepository(Region);
    // Two uploads at once to one project: the second waits here, so exactly one region stays current.
    await m.query('SELECT id FROM map_projects WHERE id = ? FOR UPDATE', [project.id]);
    await repo.update({ projectId: project.id, studioId: actor.studioId, isCurrent: true }, { isCurrent: false });
    const row = await repo.save(
      repo.create({
        projectId: project.id,
        studioId: actor.studioId,
        name: name || region.name,
        sourceFileName: upload.fileName,
        sourceFormat: region.format,
        sourceCrs: region.sourceCrs,
        geometry,
        sha256: canonicalSha256(geometry),
        areaKm2: report.areaKm2,
        bbox: report.bbox,
        vertexCount: report.vertexCount,
        partCount: report.partCount,
        holeCount: report.holeCount,
        report,
        isCurrent: true,
        createdById: actor.userId,
      }),
    );
    await m.getRepository(MapProject).update({ id: project.id }, { updatedAt: () => 'CURRENT_TIMESTAMP(3)' });
    await recordActivity(m, {
      projectId: project.id, studioId: actor.studioId, actor, kind: 'region.uploaded',
      summary: `Uploaded the region “${row.name}” from ${upload.fileName} (${report.partCount} part${report.partCount === 1 ? '' : 's'}, ${report.vertexCount} vertices)`,
      details: { regionId: row.id, sha256: row.sha256, sourceFormat: row.sourceFormat },
    });
    return repo.findOneByOrFail({ id: row.id });
  });
  return toView(saved);
}

/** Every region uploaded to the project, newest first (without geometry). */
export async function listRegions(ds: DataSource, actor: Actor, projectId: number): Promise<RegionView[]> {
  const project = await loadProjectFor(ds, actor, projectId, 'read');
  const rows = await ds.getRepository(Region).find({
    select: {
      id: true, projectId: true, name: true, sourceFileName: true, sourceFormat: true, sourceCrs: true, sha256: true,
      areaKm2: true, bbox: true, vertexCount: true, partCount: true, holeCount: true, report: true, isCurrent: true, createdAt: true,
    },
    where: { projectId: project.id, studioId: actor.studioId },
    order: { createdAt: 'DESC', id: 'DESC' },
  });
  return rows.map(toView);
}

/** The region audits use now, with its geometry for the preview map; null before any upload. */
export async function currentRegion(ds: DataSource, actor: Actor, projectId: number): Promise<RegionWithGeometry | null> {
  const project = await loadProjectFor(ds, actor, projectId, 'read');
  const row = await ds.getRepository(Region).findOneBy({ projectId: project.id, studioId: actor.studioId, isCurrent: true });
  return row ? { ...toView(row), geometry: row.geometry as RegionWithGeometry['geometry'] } : null;
}

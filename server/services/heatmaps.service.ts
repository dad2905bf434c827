import { createHash } from 'node:crypto';
import type { Polygon, MultiPolygon } from 'geojson';
import type { DataSource } from 'typeorm';
import type { HeatmapField } from '../../shared/api/audits.schema.js';
import type { ResolvedDefinition } from '../../shared/engine/definition-core.js';
import { resolveDefinition } from '../candidates/resolve-definition.js';
import { Region, Scorecard, type Audit, type MapProject } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, notFound } from '../http/errors.js';
import { HeatmapDiskCache } from '../heatmaps/disk-cache.js';
import { fieldSpec, legendFor, type Legend } from '../heatmaps/field-spec.js';
import { candidateProjection, type CandidateProjection } from '../heatmaps/projection.js';
import { renderHeatmap } from '../heatmaps/render-heatmap.js';
import { readSettings, type AuditCandidateSnapshot } from '../jobs/audit-settings.js';
import { decodeFields, fieldStats, type FieldStats, type SampleFields } from '../jobs/fields-codec.js';
import { loadAuditFor } from './audits.service.js';

/** Bumped whenever the rendering changes, so cached pictures of the old kind are not served. */
const RENDER_VERSION = 1;

/** Everything about one candidate of one finished audit that pictures and exports are drawn from. */
export interface CandidateContext {
  audit: Audit;
  project: MapProject;
  candidate: AuditCandidateSnapshot;
  geometry: Polygon | MultiPolygon;
  /** [west, south, east, north] of the region, degrees. */
  bbox: number[];
  resolved: ResolvedDefinition;
  projection: CandidateProjection;
  fields: SampleFields;
  stats: FieldStats;
  metrics: Record<string, unknown>;
}

/** The best uniform scale the engine reported, when it did; otherwise fieldStats computes it from the samples. */
function engineBestScale(metrics: Record<string, unknown>): number | undefined {
  const v = (metrics as { bestScale?: unknown }).bestScale;
  return typeof v === 'number' && v > 0 ? v : undefined;
}

/** The audit and one of its candidates, checked (tenancy, membership, finished) without loading any field data. */
async function auditCandidate(db: DataSource, actor: Actor, auditId: number, candidateId: number) {
  const { audit, project } = await loadAuditFor(db, actor, auditId);
  const candidate = readSettings(audit.settings).candidates.find((c) => c.id === candidateId);
  if (!candidate) throw notFound('That candidate in this audit');
  if (audit.status !== 'done') throw conflict('This audit has not finished yet; its pictures and exports appear when it is done.');
  return { audit, project, candidate };
}

export async function loadCandidateContext(db: DataSource, actor: Actor, auditId: number, candidateId: number): Promise<CandidateContext> {
  return contextOf(db, actor, await auditCandidate(db, actor, auditId, candidateId));
}

async function contextOf(db: DataSource, actor: Actor, head: Awaited<ReturnType<typeof auditCandidate>>): Promise<CandidateContext> {
  const { audit, project, candidate } = head;
  const candidateId = candidate.id;
  const [card, region] = await Promise.all([
    db.getRepository(Scorecard).findOneBy({ auditId: audit.id, candidateId, studioId: actor.studioId }),
    db.getRepository(Region).findOneBy({ id: audit.regionId, studioId: actor.studioId }),
  ]);
  if (!card?.fields || !region) throw notFound('That candidate in this audit');
  const resolved = resolveDefinition(candidate.definition);
  const fields = decodeFields(card.fields);
  const metrics = card.metrics as Record<string, unknown>;
  return {
    audit,
    project,
    candidate,
    geometry: region.geometry as Polygon | MultiPolygon,
    bbox: region.bbox,
    resolved,
    projection: candidateProjection(resolved),
    fields,
    stats: fieldStats(fields, engineBestScale(metrics)),
    metrics,
  };
}

export interface HeatmapResponse {
  png: Buffer;
  etag: string;
  cached: boolean;
}

const caches = new Map<string, HeatmapDiskCache>();
const cacheFor = (dataDir: string) => {
  let c = caches.get(dataDir);
  if (!c) caches.set(dataDir, (c = new HeatmapDiskCache(dataDir)));
  return c;
};

/** The heatmap PNG, rendered on first request and then served from the disk cache. */
export async function heatmapPng(
  db: DataSource,
  dataDir: string,
  actor: Actor,
  auditId: number,
  candidateId: number,
  field: HeatmapField,
  sizePx: number,
): Promise<HeatmapResponse> {
  // The cache key needs only the audit row: a cached picture is served without loading the
  // region and decoding the sample fields (the hot path under load).
  const head = await auditCandidate(db, actor, auditId, candidateId);
  const key = createHash('sha256')
    .update(JSON.stringify([RENDER_VERSION, head.audit.inputHash, head.candidate.definition, field, sizePx]))
    .digest('hex')
    .slice(0, 24);
  const name = `${candidateId}-${field}-${sizePx}-${key}.png`;
  const { png, cached } = await cacheFor(dataDir).getOrRender(head.audit.id, name, async () => {
    const ctx = await contextOf(db, actor, head);
    const out = await renderHeatmap(ctx.geometry, ctx.projection, fieldSpec(field, ctx.stats), sizePx);
    return out.png;
  });
  return { png, etag: `"${key}"`, cached };
}

export async function heatmapLegend(db: DataSource, actor: Actor, auditId: number, candidateId: number, field: HeatmapField): Promise<Legend> {
  const ctx = await loadCandidateContext(db, actor, auditId, candidateId);
  return legendFor(fieldSpec(field, ctx.stats));
}

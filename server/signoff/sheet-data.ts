import { HEATMAP_FIELDS } from '../../shared/api/audits.schema.js';
import { SCORECARD_COLUMNS } from '../../shared/api/audit-metrics.js';
import { metricText } from '../../shared/review/metric-display.js';
import { PURPOSE_LABELS, SCALE_BAND_LABELS, type MapPurposeName, type ScaleBandName } from '../../shared/api/projects.schema.js';
import { epsgWkt, resolveDefinition } from '../candidates/resolve-definition.js';
import type { AppDeps } from '../deps.js';
import { ReviewRound, type SignOff } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { heatmapLegend, heatmapPng } from '../services/heatmaps.service.js';
import { wkt1For } from '../services/wkt1-writer.js';
import type { SignOffRecord } from './record.js';
import type { SheetData, SheetHeatmap } from './sheet-pdf.js';

const HEATMAP_PX = 360;
const utc = (iso: string) => `${iso.slice(0, 19).replace('T', ' ')} UTC`;

/** WKT of the recorded definition: the registry's text for EPSG codes, the WKT as entered, else WKT1 written from the parameters. */
export function wktOf(definition: string, label: string): string | null {
  try {
    const resolved = resolveDefinition(definition);
    if (resolved.kind === 'epsg') return epsgWkt(definition);
    if (resolved.kind === 'wkt') return definition.trim();
    return wkt1For(resolved, label);
  } catch {
    return null;
  }
}

/** The heatmaps of the approved candidate, drawn by the audit's own heatmap service; left out when the audit kept no sample fields. */
async function heatmapsFor(deps: AppDeps, actor: Actor, auditId: number, candidateId: number): Promise<SheetHeatmap[]> {
  const out: SheetHeatmap[] = [];
  for (const field of HEATMAP_FIELDS) {
    try {
      const [{ png }, legend] = await Promise.all([
        heatmapPng(deps.dataSource, deps.config.dataDir, actor, auditId, candidateId, field, HEATMAP_PX),
        heatmapLegend(deps.dataSource, actor, auditId, candidateId, field),
      ]);
      const first = legend.stops[0];
      const last = legend.stops[legend.stops.length - 1];
      out.push({
        title: legend.label,
        png,
        legend: `${first.text} to ${last.text}${legend.scale === 'log' ? ', log scale' : ''}`,
        stops: legend.stops.map((s) => ({ t: s.t, color: s.color })),
      });
    } catch (err) {
      deps.logger.info({ err, auditId, candidateId, field }, 'heatmap left off the sign-off sheet');
    }
  }
  return out;
}

/** Everything the sheet prints, read from the sealed record (the authority) plus pictures of it. */
export async function sheetDataFor(deps: AppDeps, actor: Actor, signOff: SignOff): Promise<SheetData> {
  const r = JSON.parse(signOff.recordJson) as SignOffRecord;
  const round = await deps.dataSource.getRepository(ReviewRound).findOneBy({ id: signOff.roundId, studioId: actor.studioId });
  const metrics = (r.scorecard ?? {}) as Record<string, unknown>;
  const settings = (r.audit.settings ?? {}) as { samples?: number; seed?: number };
  return {
    projectTitle: r.project.title,
    clientName: r.project.clientName,
    purposeLabel: PURPOSE_LABELS[r.project.purpose as MapPurposeName] ?? r.project.purpose,
    scaleBandLabel: SCALE_BAND_LABELS[r.project.scaleBand as ScaleBandName] ?? r.project.scaleBand,
    regionLine: `${r.region.name} (from ${r.region.sourceFileName}, ${r.region.sourceFormat})`,
    candidateLabel: r.candidate.label,
    definitionEntered: r.candidate.definition,
    projString: r.candidate.resolved,
    wkt: wktOf(r.candidate.definition, r.candidate.label),
    metrics: SCORECARD_COLUMNS.map((col) => ({ label: col.label, value: metricText(col, metrics) })),
    heatmaps: await heatmapsFor(deps, actor, r.audit.id, r.candidate.id),
    recommendation: round?.recommendation ?? '',
    recordHash: signOff.recordHash,
    regionHash: r.region.sha256,
    engineVersion: r.audit.engineVersion,
    samplingLine: `${settings.samples ?? '?'} samples, seed ${settings.seed ?? '?'} (audit ${r.audit.id})`,
    reviewerName: r.reviewer.name,
    reviewerEmail: r.reviewer.email,
    signature: r.reviewer.signature,
    approvedAtUtc: utc(r.approvedAt),
    roundNumber: r.round.number,
    comment: r.reviewer.comment,
    generatedAtUtc: utc(new Date().toISOString()),
  };
}

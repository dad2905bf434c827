import type { DataSource } from 'typeorm';
import type { ScorecardView } from '../../shared/api/audits.schema.js';
import { SCORECARD_COLUMNS, displayValue, rankForPurpose } from '../../shared/api/audit-metrics.js';
import { Scorecard, type Audit } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict } from '../http/errors.js';
import { readSettings } from '../jobs/audit-settings.js';
import { loadAuditFor } from './audits.service.js';

/** Scorecards in the audit's candidate order, labelled from the audit's own copy of the candidates. */
export function scorecardViews(audit: Audit, cards: Pick<Scorecard, 'candidateId' | 'metrics'>[]): ScorecardView[] {
  const byId = new Map(cards.map((c) => [c.candidateId, c]));
  return readSettings(audit.settings).candidates.flatMap((c) => {
    const card = byId.get(c.id);
    if (!card) return [];
    return [{ candidateId: c.id, label: c.label, family: c.family, definition: c.definition, resolved: c.resolved, metrics: card.metrics as Record<string, unknown> }];
  });
}

async function doneScorecards(db: DataSource, actor: Actor, auditId: number) {
  const { audit, project } = await loadAuditFor(db, actor, auditId);
  if (audit.status !== 'done') throw conflict('This audit has not finished yet, so it has no scorecards to export.');
  const cards = await db.getRepository(Scorecard).find({
    select: { id: true, candidateId: true, metrics: true },
    where: { auditId: audit.id, studioId: actor.studioId },
  });
  return { audit, project, views: scorecardViews(audit, cards) };
}

/** Everything an export file says about the audit itself. */
function auditHeader(audit: Audit, purpose: string) {
  const s = readSettings(audit.settings);
  return {
    auditId: audit.id,
    projectId: audit.projectId,
    purpose,
    samples: s.samples,
    seed: s.seed,
    engineVersion: audit.engineVersion,
    inputHash: audit.inputHash,
    finishedAt: audit.finishedAt?.toISOString() ?? null,
  };
}

/** `scorecards.json`: the audit's settings and every candidate's full metrics, with the purpose's ranking. */
export async function scorecardsJson(db: DataSource, actor: Actor, auditId: number) {
  const { audit, project, views } = await doneScorecards(db, actor, auditId);
  const ranking = rankForPurpose(project.purpose, views);
  return {
    audit: auditHeader(audit, project.purpose),
    ranking: { metric: ranking.column.key, label: ranking.column.label, order: ranking.order },
    scorecards: views,
  };
}

/** RFC 4180 field: quoted when it holds a comma, quote or line break. */
const csvField = (v: unknown) => {
  const s = v === null || v === undefined ? '' : String(v);
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

/**
 * `scorecards.csv`: one row per candidate, the main metrics as columns in the units the table
 * shows (named in the header), and the candidate's rank for the project's purpose (1 = best).
 * scorecards.json carries every metric exactly as the engine reported it.
 */
export async function scorecardsCsv(db: DataSource, actor: Actor, auditId: number): Promise<string> {
  const { project, views } = await doneScorecards(db, actor, auditId);
  const ranking = rankForPurpose(project.purpose, views);
  const rankOf = new Map(ranking.order.map((id, i) => [id, i + 1]));
  const header = [
    'candidate_id',
    'label',
    'family',
    'definition',
    `rank_for_${project.purpose}`,
    ...SCORECARD_COLUMNS.map((c) => (c.units ? `${c.key} (${c.units})` : c.key)),
  ];
  const rows = views.map((v) => [
    v.candidateId,
    v.label,
    v.family,
    v.resolved,
    rankOf.get(v.candidateId) ?? '',
    ...SCORECARD_COLUMNS.map((c) => displayValue(c, v.metrics) ?? ''),
  ]);
  return [header, ...rows].map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}

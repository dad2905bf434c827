import type { MultiPolygon, Polygon } from 'geojson';
import type { DataSource } from 'typeorm';
import type {
  CandidateView,
  CreateCandidateInput,
  OptimiseInput,
  OptimiseResultView,
  ProposalList,
  ResolvedDefinitionView,
  UpdateCandidateInput,
} from '../../shared/api/candidates.schema.js';
import { createCandidateSchema } from '../../shared/api/candidates.schema.js';
import type { ResolvedDefinition } from '../../shared/engine/definition-core.js';
import { FAMILIES } from '../../shared/engine/families.js';
import type { MapPurpose } from '../../shared/engine/suggest.js';
import { resolveDefinition } from '../candidates/resolve-definition.js';
import { checkDefinitionSanity } from '../candidates/definition-checks.js';
import type { EngineRunner } from '../engine-tasks/engine-tasks.js';
import { Candidate, Region } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, notFound, validationFailed } from '../http/errors.js';
import { recordActivity } from './activity.service.js';
import { loadProjectFor } from './project-guard.js';

export const MAX_CANDIDATES_PER_PROJECT = 50;
/** Samples the optimiser scores each trial on: enough to rank parameters, small enough for ~1 s. */
export const OPTIMISE_SAMPLES = 4000;

const familyTitle = (id: string) => FAMILIES[id]?.title ?? id;

const toView = (c: Candidate): CandidateView => ({
  id: c.id,
  projectId: c.projectId,
  label: c.label,
  definition: c.definition,
  resolved: c.resolved,
  family: c.family,
  familyTitle: familyTitle(c.family),
  origin: c.origin,
  reason: c.reason,
  params: (c.params as Record<string, unknown> | null) ?? null,
  createdAt: c.createdAt.toISOString(),
});

/** Resolves a definition with the engine; its refusal becomes a 422 on the `definition` field. */
export function resolveOrRefuse(definition: string): ResolvedDefinition {
  try {
    const resolved = resolveDefinition(definition);
    checkDefinitionSanity(resolved);
    return resolved;
  } catch (err) {
    const message = (err as Error).message || 'This definition could not be read.';
    const text = message[0].toUpperCase() + message.slice(1);
    throw validationFailed(`The definition could not be used: ${message}.`, { definition: text.endsWith('.') ? text : `${text}.` });
  }
}

/** `POST /api/definitions/resolve`: what a definition resolves to, for live validation. */
export function describeDefinition(definition: string): ResolvedDefinitionView {
  const r = resolveOrRefuse(definition);
  const { es, aM } = r.ellipsoid;
  // e² = f(2 − f) ⇒ f = 1 − √(1 − e²).
  const f = 1 - Math.sqrt(1 - es);
  return {
    kind: r.kind,
    label: r.label,
    resolved: r.resolved,
    family: { id: r.family.id, title: r.family.title, class: r.family.class, property: r.family.property },
    ellipsoid: { semiMajorAxisM: aM, inverseFlattening: f > 0 ? Number((1 / f).toPrecision(12)) : null },
    params: { ...r.params },
  };
}

export async function listCandidates(ds: DataSource, actor: Actor, projectId: number): Promise<CandidateView[]> {
  const project = await loadProjectFor(ds, actor, projectId, 'read');
  const rows = await ds.getRepository(Candidate).find({ where: { projectId: project.id, studioId: actor.studioId }, order: { id: 'ASC' } });
  return rows.map(toView);
}

/** Adds a candidate; the same resolved projection twice is refused, naming the one already there. */
export async function addCandidate(ds: DataSource, actor: Actor, projectId: number, input: CreateCandidateInput): Promise<CandidateView> {
  const data = createCandidateSchema.parse(input);
  const project = await loadProjectFor(ds, actor, projectId, 'write');
  const resolved = resolveOrRefuse(data.definition);
  return ds.transaction(async (m) => {
    const repo = m.getRepository(Candidate);
    // Serialise additions to one project so the duplicate and count checks hold.
    await m.query('SELECT id FROM map_projects WHERE id = ? FOR UPDATE', [project.id]);
    const existing = await repo.find({ where: { projectId: project.id, studioId: actor.studioId } });
    const same = existing.find((c) => c.resolved === resolved.resolved);
    if (same) throw conflict(`This projection is already a candidate (“${same.label}”).`);
    if (existing.length >= MAX_CANDIDATES_PER_PROJECT) {
      throw conflict(`A project holds at most ${MAX_CANDIDATES_PER_PROJECT} candidates; remove some first.`);
    }
    const saved = await repo.save(
      repo.create({
        projectId: project.id,
        studioId: actor.studioId,
        label: (data.label || resolved.label).slice(0, 160),
        definition: data.definition,
        resolved: resolved.resolved,
        family: resolved.family.id,
        origin: data.origin,
        reason: data.reason || null,
        params: data.params ?? null,
        createdById: actor.userId,
      }),
    );
    await recordActivity(m, {
      projectId: project.id, studioId: actor.studioId, actor, kind: 'candidate.added',
      summary: `Added the candidate “${saved.label}” (${data.origin})`,
      details: { candidateId: saved.id, definition: data.definition },
    });
    return toView(await repo.findOneByOrFail({ id: saved.id }));
  });
}

async function loadCandidate(ds: DataSource, actor: Actor, projectId: number, candidateId: number, mode: 'read' | 'write') {
  const project = await loadProjectFor(ds, actor, projectId, mode);
  const c = await ds.getRepository(Candidate).findOneBy({ id: candidateId, projectId: project.id, studioId: actor.studioId });
  if (!c) throw notFound('That candidate');
  return c;
}

export async function relabelCandidate(
  ds: DataSource,
  actor: Actor,
  projectId: number,
  candidateId: number,
  input: UpdateCandidateInput,
): Promise<CandidateView> {
  const c = await loadCandidate(ds, actor, projectId, candidateId, 'write');
  await ds.transaction(async (m) => {
    await m.getRepository(Candidate).update({ id: c.id }, { label: input.label });
    await recordActivity(m, {
      projectId: c.projectId, studioId: actor.studioId, actor, kind: 'candidate.relabelled',
      summary: `Renamed the candidate “${c.label}” to “${input.label}”`, details: { candidateId: c.id },
    });
  });
  return toView({ ...c, label: input.label } as Candidate);
}

/** Removes a candidate no audit has used; audited ones stay, since scorecards and sign-offs refer to them. */
export async function removeCandidate(ds: DataSource, actor: Actor, projectId: number, candidateId: number): Promise<void> {
  const c = await loadCandidate(ds, actor, projectId, candidateId, 'write');
  const used: { id: number }[] = await ds.query(
    'SELECT id FROM audits WHERE projectId = ? AND studioId = ? AND JSON_CONTAINS(candidateIds, ?) ORDER BY id LIMIT 1',
    [c.projectId, actor.studioId, String(c.id)],
  );
  if (used.length) {
    throw conflict(`“${c.label}” was used in audit #${used[0].id}; it stays so that audit’s scorecards keep their candidate.`);
  }
  await ds.transaction(async (m) => {
    await m.getRepository(Candidate).delete({ id: c.id, studioId: actor.studioId });
    await recordActivity(m, {
      projectId: c.projectId, studioId: actor.studioId, actor, kind: 'candidate.removed',
      summary: `Removed the candidate “${c.label}”`, details: { candidateId: c.id, definition: c.definition },
    });
  });
}

async function currentRegionRow(ds: DataSource, actor: Actor, projectId: number) {
  return ds.getRepository(Region).findOne({
    select: { id: true, sha256: true, geometry: true },
    where: { projectId, studioId: actor.studioId, isCurrent: true },
  });
}

/** Proposals are deterministic per region and purpose; remembered for repeat page loads. */
const proposalCache = new Map<string, ProposalList['proposals']>();

export async function listProposals(ds: DataSource, engine: EngineRunner, actor: Actor, projectId: number): Promise<ProposalList> {
  const project = await loadProjectFor(ds, actor, projectId, 'read');
  const region = await currentRegionRow(ds, actor, project.id);
  if (!region) return { regionId: null, purpose: project.purpose, proposals: [] };
  const key = `${region.sha256}:${project.purpose}`;
  let proposals = proposalCache.get(key);
  if (!proposals) {
    const out = await engine.run({ kind: 'suggest', geometry: region.geometry as Polygon | MultiPolygon, purpose: project.purpose as MapPurpose });
    proposals = out.proposals.map((p) => ({ ...p, candidateId: null }));
    if (proposalCache.size > 200) proposalCache.delete(proposalCache.keys().next().value!);
    proposalCache.set(key, proposals);
  }
  const candidates = await ds.getRepository(Candidate).find({ select: { id: true, resolved: true }, where: { projectId: project.id, studioId: actor.studioId } });
  const byResolved = new Map(candidates.map((c) => [c.resolved, c.id]));
  return {
    regionId: region.id,
    purpose: project.purpose,
    proposals: proposals.map((p) => {
      let resolved: string | undefined;
      try {
        resolved = resolveDefinition(p.definition).resolved;
      } catch {
        resolved = undefined;
      }
      return { ...p, candidateId: (resolved && byResolved.get(resolved)) || null };
    }),
  };
}

/** Tunes a family's parameters for the current region; the result is offered, not stored. */
export async function optimiseFamily(
  ds: DataSource,
  engine: EngineRunner,
  actor: Actor,
  projectId: number,
  input: OptimiseInput,
): Promise<OptimiseResultView> {
  const project = await loadProjectFor(ds, actor, projectId, 'write');
  const region = await currentRegionRow(ds, actor, project.id);
  if (!region) throw conflict('Upload the project’s region first: the optimiser fits parameters to it.');
  let out;
  try {
    out = await engine.run({
      kind: 'optimise',
      geometry: region.geometry as Polygon | MultiPolygon,
      family: input.family,
      criterion: input.criterion,
      samples: OPTIMISE_SAMPLES,
      seed: 1,
    });
  } catch (err) {
    if ((err as { status?: number }).status) throw err;
    throw validationFailed(`The optimiser could not tune this family for the region: ${(err as Error).message}.`, { family: (err as Error).message });
  }
  const r = out.result;
  const params = Object.entries(r.params).map(([k, v]) => `${k} ${v}`).join(', ');
  return {
    family: r.family,
    criterion: input.criterion,
    definition: r.definition,
    label: `${familyTitle(r.family)}, tuned (${params})`.slice(0, 160),
    params: r.params,
    metric: r.metric,
    baseline: r.baseline,
    gainPct: r.gainPct,
    evaluations: r.evaluations,
    samples: OPTIMISE_SAMPLES,
    regionId: region.id,
  };
}

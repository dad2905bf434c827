import type { DataSource } from 'typeorm';
import { epsgWkt, resolveDefinition } from '../candidates/resolve-definition.js';
import { Candidate } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { notFound, validationFailed } from '../http/errors.js';
import type { CandidateContext } from './heatmaps.service.js';
import { loadProjectFor } from './project-guard.js';
import { wkt1For } from './wkt1-writer.js';

async function loadCandidate(db: DataSource, actor: Actor, projectId: number, candidateId: number): Promise<Candidate> {
  const project = await loadProjectFor(db, actor, projectId, 'read');
  const c = await db.getRepository(Candidate).findOneBy({ id: candidateId, projectId: project.id, studioId: actor.studioId });
  if (!c) throw notFound('That candidate');
  return c;
}

const fileSafe = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'candidate';

/** The candidate's PROJ string, as the engine resolved it. */
export async function definitionProj(db: DataSource, actor: Actor, projectId: number, candidateId: number) {
  const c = await loadCandidate(db, actor, projectId, candidateId);
  return { text: `${c.resolved}\n`, fileName: `${fileSafe(c.label)}.proj` };
}

/**
 * The candidate's WKT: the registry's own text for an EPSG code, the text as entered for a WKT
 * candidate, and otherwise WKT1 written from the resolved parameters.
 */
export async function definitionWkt(db: DataSource, actor: Actor, projectId: number, candidateId: number) {
  const c = await loadCandidate(db, actor, projectId, candidateId);
  const resolved = resolveDefinition(c.definition);
  let wkt: string | null = null;
  if (resolved.kind === 'epsg') wkt = epsgWkt(c.definition);
  if (resolved.kind === 'wkt') wkt = c.definition.trim();
  wkt ??= wkt1For(resolved, c.label);
  if (!wkt) {
    throw validationFailed(`WKT is not available for the ${resolved.family.title} family; use the PROJ string instead.`, {
      definition: 'No WKT form for this family.',
    });
  }
  return { text: `${wkt}\n`, fileName: `${fileSafe(c.label)}.prj` };
}

/**
 * The audit's sample points for one candidate as a GeoJSON FeatureCollection (RFC 7946: WGS84
 * lon/lat), each with its Tissot quantities h, k, s, ω (degrees), a and b.
 */
export function samplesGeoJson(ctx: CandidateContext) {
  const f = ctx.fields;
  const r = (v: number) => (Number.isFinite(v) ? Number(v.toPrecision(7)) : null);
  const features = [];
  for (let i = 0; i < f.lonDeg.length; i++) {
    features.push({
      type: 'Feature' as const,
      geometry: { type: 'Point' as const, coordinates: [Number(f.lonDeg[i].toFixed(7)), Number(f.latDeg[i].toFixed(7))] },
      properties: { h: r(f.h[i]), k: r(f.k[i]), s: r(f.s[i]), omega: r(f.omegaDeg[i]), a: r(f.a[i]), b: r(f.b[i]) },
    });
  }
  return {
    type: 'FeatureCollection' as const,
    properties: {
      auditId: ctx.audit.id,
      candidateId: ctx.candidate.id,
      label: ctx.candidate.label,
      definition: ctx.candidate.resolved,
      engineVersion: ctx.audit.engineVersion,
      inputHash: ctx.audit.inputHash,
      units: { omega: 'degrees', h: 'ratio', k: 'ratio', s: 'ratio', a: 'ratio', b: 'ratio' },
    },
    features,
  };
}

import type { Polygon } from 'geojson';
import { Audit, Candidate, Region, Scorecard } from '../../server/entities/index.js';
import type { AppDeps } from '../../server/deps.js';
import { ENGINE_VERSION, sharedAuditEngine } from '../../server/jobs/engine-instance.js';
import { encodeFields } from '../../server/jobs/fields-codec.js';
import { canonicalSha256 } from '../../server/regions/canonical-json.js';
import type { StudioFixture } from './studio-fixture.js';

/**
 * A project with a region, three candidates and one finished audit, ready to shortlist. The
 * project goes through the projects API; the region, candidates, audit and scorecards are written
 * straight to the database so review tests do not wait on uploads or background jobs. Pass
 * `score: engineScore` to fill the scorecards with the audit engine's real output and sample fields
 * (needed when a test verifies a record or draws heatmaps).
 */
export interface AuditedProject {
  projectId: number;
  regionId: number;
  auditId: number;
  candidateIds: number[];
  geometry: Polygon;
  metricsById: Map<number, Record<string, unknown>>;
}

export interface CandidateSeed {
  label: string;
  family: string;
  definition: string;
  resolved: string;
}

export const SEED_CANDIDATES: CandidateSeed[] = [
  {
    label: 'Albers equal-area, one-sixth rule',
    family: 'aea',
    definition: '+proj=aea +lat_1=44 +lat_2=49 +lat_0=46.5 +lon_0=2.5 +x_0=0 +y_0=0 +ellps=WGS84',
    resolved: '+proj=aea +lat_0=46.5 +lon_0=2.5 +lat_1=44 +lat_2=49 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs',
  },
  {
    label: 'Lambert conformal conic',
    family: 'lcc',
    definition: '+proj=lcc +lat_1=44 +lat_2=49 +lat_0=46.5 +lon_0=2.5 +x_0=0 +y_0=0 +ellps=WGS84',
    resolved: '+proj=lcc +lat_0=46.5 +lon_0=2.5 +lat_1=44 +lat_2=49 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs',
  },
  {
    label: 'Lambert azimuthal equal-area',
    family: 'laea',
    definition: '+proj=laea +lat_0=46.5 +lon_0=2.5 +x_0=0 +y_0=0 +ellps=WGS84',
    resolved: '+proj=laea +lat_0=46.5 +lon_0=2.5 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs',
  },
];

/** A small quadrilateral over central France (lon/lat degrees, counter-clockwise as RFC 7946 wants). */
export const SEED_GEOMETRY: Polygon = {
  type: 'Polygon',
  coordinates: [[[0, 44], [5, 44], [5, 49], [0, 49], [0, 44]]],
};

export interface ScoredCandidate {
  metrics: Record<string, unknown>;
  /** Packed sample fields (heatmaps need them); null when the scorer made none. */
  fields: Buffer | null;
}

export type ScoreFn = (input: {
  geometry: Polygon;
  candidates: Array<CandidateSeed & { id: number }>;
  samples: number;
  seed: number;
}) => Promise<Map<number, ScoredCandidate>>;

/** Plausible but made-up metrics, distinct per candidate, for tests that never re-run the engine. */
const fakeScore: ScoreFn = async ({ candidates }) =>
  new Map(
    candidates.map((c, i) => [c.id, { metrics: { arealScale: { ratio: 1.01 + i / 100 }, angularDeformationDeg: { mean: i * 0.4, max: i * 0.7 } }, fields: null }]),
  );

/** Scores with the audit engine itself (the one the background jobs run), as an audit would. */
export const engineScore: ScoreFn = async ({ geometry, candidates, samples, seed }) => {
  const engine = await sharedAuditEngine();
  const result = await engine.scoreCandidates({ geometry, candidates, samples, seed }, async () => {});
  return new Map(result.candidates.map((r) => [r.candidateId, { metrics: r.metrics, fields: encodeFields(r.fields) }]));
};

export async function seedAuditedProject(
  deps: AppDeps,
  s: StudioFixture,
  opts: { title?: string; score?: ScoreFn; engineVersion?: string; samples?: number; seed?: number } = {},
): Promise<AuditedProject> {
  const res = await s.cartographer.post('/api/projects', {
    title: opts.title ?? 'Rivers of central France',
    clientName: 'Blue Heron Press',
    purpose: 'equal-area',
    scaleBand: 'country',
  });
  if (res.status !== 201) throw new Error(`project not created: ${res.status} ${JSON.stringify(res.body)}`);
  const projectId: number = res.body.id;
  const studioId = s.studioId;
  const createdById = s.users.cartographer.userId;
  const ds = deps.dataSource;
  const geometry = SEED_GEOMETRY;
  const samples = opts.samples ?? 2000;
  const seed = opts.seed ?? 20261202;

  const region = await ds.getRepository(Region).save(
    ds.getRepository(Region).create({
      projectId, studioId, name: 'Central France', sourceFileName: 'central-france.geojson', sourceFormat: 'geojson',
      sourceCrs: 'EPSG:4326', geometry, sha256: canonicalSha256(geometry), areaKm2: 220_000, bbox: [0, 44, 5, 49],
      vertexCount: 4, partCount: 1, holeCount: 0, report: { warnings: [] }, isCurrent: true, createdById,
    }),
  );
  const candidates = [];
  for (const c of SEED_CANDIDATES) {
    const row = await ds.getRepository(Candidate).save(
      ds.getRepository(Candidate).create({ projectId, studioId, ...c, origin: 'entered', reason: null, params: null, createdById }),
    );
    candidates.push({ ...c, id: row.id });
  }
  const scored = await (opts.score ?? fakeScore)({ geometry, candidates, samples, seed });
  const metricsById = new Map([...scored].map(([id, v]) => [id, v.metrics]));
  const settings = { samples, seed, candidates: candidates.map((c) => ({ id: c.id, label: c.label, family: c.family, definition: c.definition, resolved: c.resolved })) };
  const audit = await ds.getRepository(Audit).save(
    ds.getRepository(Audit).create({
      projectId, studioId, regionId: region.id, candidateIds: candidates.map((c) => c.id), status: 'done', progress: 1,
      settings, engineVersion: opts.engineVersion ?? (opts.score === engineScore ? ENGINE_VERSION : 'test-seed'), inputHash: canonicalSha256({ region: region.sha256, settings }),
      createdById, startedAt: new Date(), finishedAt: new Date(),
    }),
  );
  await ds.getRepository(Scorecard).insert(
    candidates.map((c) => ({ auditId: audit.id, candidateId: c.id, studioId, metrics: scored.get(c.id)!.metrics, fields: scored.get(c.id)!.fields })),
  );
  return { projectId, regionId: region.id, auditId: audit.id, candidateIds: candidates.map((c) => c.id), geometry, metricsById };
}

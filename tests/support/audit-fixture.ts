import fs from 'node:fs';
import path from 'node:path';
import type { Feature, MultiPolygon, Polygon } from 'geojson';
import { feature } from 'topojson-client';
import type { Topology } from 'topojson-specification';
import { resolveDefinition } from '../../shared/engine/definition.js';
import { Candidate, Region } from '../../server/entities/index.js';
import type { AppDeps } from '../../server/deps.js';
import { canonicalSha256 } from '../../server/regions/canonical-json.js';
import type { StudioFixture } from './studio-fixture.js';

const ROOT = path.resolve(import.meta.dirname, '../..');
const atlasCache = new Map<string, Feature<Polygon | MultiPolygon>[]>();

/** A country's boundary from world-atlas (Natural Earth, public domain), in WGS84 lon/lat. */
export function worldCountry(name: string, resolution: '110m' | '50m' | '10m' = '50m'): Polygon | MultiPolygon {
  let countries = atlasCache.get(resolution);
  if (!countries) {
    const topo = JSON.parse(fs.readFileSync(path.join(ROOT, `node_modules/world-atlas/countries-${resolution}.json`), 'utf8')) as Topology;
    countries = (feature(topo, topo.objects.countries) as unknown as { features: Feature<Polygon | MultiPolygon>[] }).features;
    atlasCache.set(resolution, countries);
  }
  const f = countries.find((c) => c.properties?.name === name);
  if (!f) throw new Error(`world-atlas has no country named ${name}`);
  return f.geometry;
}

function bboxOf(g: Polygon | MultiPolygon): number[] {
  const rings = g.type === 'Polygon' ? g.coordinates : g.coordinates.flat();
  let w = Infinity, s = Infinity, e = -Infinity, n = -Infinity;
  for (const r of rings) for (const [x, y] of r) {
    w = Math.min(w, x); e = Math.max(e, x); s = Math.min(s, y); n = Math.max(n, y);
  }
  return [w, s, e, n];
}

export interface AuditProject {
  projectId: number;
  regionId: number;
  candidateIds: number[];
  geometry: Polygon | MultiPolygon;
}

/**
 * A project of the fixture's studio (created through the API by its cartographer) with a current
 * region and candidates written straight to the database, so audit tests do not depend on the
 * upload and candidate screens.
 */
export async function createAuditProject(
  deps: AppDeps,
  s: StudioFixture,
  opts: { title?: string; purpose?: string; geometry?: Polygon | MultiPolygon; definitions: string[] },
): Promise<AuditProject> {
  const res = await s.cartographer.post('/api/projects', {
    title: opts.title ?? 'Audit test map',
    clientName: 'Test client',
    purpose: opts.purpose ?? 'reference',
    scaleBand: 'country',
  });
  if (res.status !== 201) throw new Error(`project creation failed: ${res.status} ${JSON.stringify(res.body)}`);
  const projectId = res.body.id as number;
  const geometry = opts.geometry ?? worldCountry('Chile', '110m');
  const ds = deps.dataSource;
  const region = await ds.getRepository(Region).save(
    ds.getRepository(Region).create({
      projectId,
      studioId: s.studioId,
      name: 'Test region',
      sourceFileName: 'test.geojson',
      sourceFormat: 'geojson',
      sourceCrs: 'EPSG:4326',
      geometry,
      sha256: canonicalSha256(geometry),
      areaKm2: 1,
      bbox: bboxOf(geometry),
      vertexCount: 1,
      partCount: 1,
      holeCount: 0,
      report: {},
      isCurrent: true,
      createdById: s.users.cartographer.userId,
    }),
  );
  const candidateIds: number[] = [];
  for (const def of opts.definitions) {
    const r = resolveDefinition(def);
    const c = await ds.getRepository(Candidate).save(
      ds.getRepository(Candidate).create({
        projectId,
        studioId: s.studioId,
        label: r.label,
        definition: def,
        resolved: r.resolved,
        family: r.family.id,
        origin: 'entered',
        reason: null,
        params: null,
        createdById: s.users.cartographer.userId,
      }),
    );
    candidateIds.push(c.id);
  }
  return { projectId, regionId: region.id, candidateIds, geometry };
}

/** Polls an audit until it is done or failed. */
export async function waitForAudit(get: (url: string) => Promise<{ status: number; body: any }>, auditId: number, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  const seen: number[] = [];
  for (;;) {
    const res = await get(`/api/audits/${auditId}`);
    if (res.status !== 200) throw new Error(`GET audit ${auditId}: ${res.status} ${JSON.stringify(res.body)}`);
    seen.push(res.body.progress);
    if (res.body.status === 'done' || res.body.status === 'failed') return { audit: res.body, progressSeen: seen };
    if (Date.now() > until) throw new Error(`audit ${auditId} still ${res.body.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Feature, FeatureCollection } from 'geojson';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import type { CreateProjectInput } from '../../shared/api/projects.schema.js';
import { inlineRunner } from '../engine-tasks/engine-tasks.js';
import { Candidate, MapProject, Region } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { addCandidate } from '../services/candidates.service.js';
import { createProject } from '../services/projects.service.js';
import { storeRegion } from '../services/regions.service.js';
import type { DemoContext } from './demo-studio.js';

/**
 * The demo studio's invented scenario: three commissions from made-up clients, each on real
 * public-domain boundaries (us-atlas 3: US Census 2017; world-atlas 2: Natural Earth), with the
 * engine's proposals added as candidates. The audits are computed by the seeder that runs after
 * this one. Idempotent: projects are found by title, and a project that already has a region or
 * candidates keeps them.
 */
interface DemoProject {
  input: CreateProjectInput;
  /** Boundaries as lon/lat features, and the file name the region is stored under. */
  features: () => Feature[];
  fileName: string;
  regionName: string;
  proposals: number;
  /** Definitions entered by hand, as a client would send them. */
  entered: { definition: string; label: string }[];
}

const nodeRequire = createRequire(import.meta.url);
const topo = (id: string) => JSON.parse(readFileSync(nodeRequire.resolve(id), 'utf8')) as Topology;

function pick(id: string, object: string, names: string[]): Feature[] {
  const t = topo(id);
  const fc = feature(t, t.objects[object] as GeometryCollection) as FeatureCollection;
  return names.map((n) => {
    const f = fc.features.find((x) => x.properties?.name === n);
    if (!f) throw new Error(`demo seed: ${n} is missing from ${id}`);
    return f;
  });
}

export const DEMO_PROJECTS: readonly DemoProject[] = [
  {
    input: {
      title: 'Great Lakes watershed atlas',
      clientName: 'Tamarack Lane Press',
      purpose: 'equal-area',
      scaleBand: 'province',
      notes: 'Thematic plates of land cover and population for the eight Great Lakes states; areas must compare fairly across the spread.',
    },
    features: () =>
      pick('us-atlas/states-10m.json', 'states', ['Minnesota', 'Wisconsin', 'Illinois', 'Indiana', 'Michigan', 'Ohio', 'Pennsylvania', 'New York']),
    fileName: 'great-lakes-states.geojson',
    regionName: 'The eight Great Lakes states',
    proposals: 3,
    entered: [{ definition: 'EPSG:5070', label: 'Client house standard (NAD83 / Conus Albers)' }],
  },
  {
    input: {
      title: 'Andean rail corridor',
      clientName: 'Cordillera Transit Trust',
      purpose: 'conformal',
      scaleBand: 'country',
      notes: 'Engineering overview of a proposed line from the Pacific coast to the altiplano; bearings and local shapes matter most.',
    },
    features: () => pick('world-atlas/countries-50m.json', 'countries', ['Peru', 'Bolivia']),
    fileName: 'peru-bolivia.geojson',
    regionName: 'Peru and Bolivia',
    proposals: 3,
    entered: [{ definition: 'EPSG:32719', label: 'Survey grid (WGS 84 / UTM zone 19S)' }],
  },
  {
    input: {
      title: 'Arctic shipping outlook',
      clientName: 'Polar Sea Review',
      purpose: 'equidistant',
      scaleBand: 'continent',
      notes: 'Feature spread on sea routes around Greenland and Iceland; readers will measure distances from the map.',
    },
    features: () => pick('world-atlas/countries-50m.json', 'countries', ['Greenland', 'Iceland']),
    fileName: 'greenland-iceland.geojson',
    regionName: 'Greenland and Iceland',
    proposals: 4,
    entered: [],
  },
];

const actorFor = (ctx: DemoContext): Actor => ({
  userId: ctx.people.cartographer.userId,
  studioId: ctx.studioId,
  membershipId: ctx.people.cartographer.membershipId,
  role: 'cartographer',
  email: ctx.people.cartographer.email,
  name: ctx.people.cartographer.name,
});

/** Creates the demo projects with their regions and candidates where they are missing. */
export async function seedDemoProjects(ctx: DemoContext): Promise<void> {
  const ds = ctx.ds;
  const actor = actorFor(ctx);
  for (const demo of DEMO_PROJECTS) {
    const found = await ds.getRepository(MapProject).findOneBy({ studioId: ctx.studioId, title: demo.input.title });
    const projectId = found?.id ?? (await createProject(ds, actor, demo.input)).id;
    if (!(await ds.getRepository(Region).existsBy({ projectId, isCurrent: true }))) {
      const buffer = Buffer.from(JSON.stringify({ type: 'FeatureCollection', features: demo.features() }));
      await storeRegion(ds, inlineRunner, actor, projectId, { buffer, fileName: demo.fileName }, 'all', demo.regionName);
    }
    const { geometry } = await ds.getRepository(Region).findOneByOrFail({ projectId, isCurrent: true });
    if (await ds.getRepository(Candidate).existsBy({ projectId })) continue;
    const out = await inlineRunner.run({ kind: 'suggest', geometry: geometry as never, purpose: demo.input.purpose });
    const proposals = out.proposals.slice(0, demo.proposals);
    for (const p of proposals) {
      await addCandidate(ds, actor, projectId, { definition: p.definition, label: p.label, origin: 'proposed', reason: p.reason });
    }
    for (const e of demo.entered) await addCandidate(ds, actor, projectId, { definition: e.definition, label: e.label, origin: 'entered' });
  }
}

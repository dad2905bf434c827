import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Audit, Candidate, ProjectAccess } from '../../server/entities/index.js';
import * as fx from '../fixtures/make-upload-fixtures.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

type TestApp = Awaited<ReturnType<typeof createTestApp>>;
let t: TestApp;
let s: StudioFixture;
let other: StudioFixture;
let projectId: number;
let emptyProjectId: number;

const newProject = async (title: string) =>
  (await s.cartographer.post('/api/projects', { title, clientName: 'Lakes Press', purpose: 'equal-area', scaleBand: 'province' })).body.id as number;

beforeAll(async () => {
  t = await createTestApp();
  [s, other] = await Promise.all([createStudioWithRoles(t), createStudioWithRoles(t)]);
  projectId = await newProject('Candidates');
  emptyProjectId = await newProject('No region yet');
  const up = await s.cartographer.agent
    .post(`/api/projects/${projectId}/regions`)
    .set('x-csrf-token', s.cartographer.csrf)
    .field('features', '0,1,2,3,4,5')
    .attach('file', fx.fixture('great-lakes-states.geojson'), 'lakes.geojson');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
});
afterAll(async () => t?.close());

const candidateRows = () => t.deps.dataSource.getRepository(Candidate).countBy({ projectId });

describe('definitions: live validation', () => {
  it('resolves an EPSG code to its PROJ form, family and ellipsoid', async () => {
    const res = await s.editor.post('/api/definitions/resolve', { definition: 'EPSG:5070' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ kind: 'epsg', family: { id: 'aea', property: 'equal-area' } });
    expect(res.body.label).toMatch(/Conus Albers/);
    // GRS 1980: a = 6378137 m, 1/f = 298.257222101 (Moritz 1980, Geodetic Reference System 1980).
    expect(res.body.ellipsoid.semiMajorAxisM).toBe(6378137);
    expect(res.body.ellipsoid.inverseFlattening).toBeCloseTo(298.257222101, 6);
    expect(res.body.params).toMatchObject({ lat1Deg: 29.5, lat2Deg: 45.5, lat0Deg: 23, lon0Deg: -96 });
    // PROJ's own view of the same code (Debian proj-bin) names the same parameters.
    const projInfo = execFileSync('projinfo', ['-o', 'PROJ', '-q', 'EPSG:5070']).toString();
    for (const p of ['+proj=aea', '+lat_1=29.5', '+lat_2=45.5', '+lat_0=23', '+lon_0=-96']) {
      expect(projInfo).toContain(p);
      expect(res.body.resolved).toContain(p);
    }
  });

  it('resolves PROJ strings and WKT', async () => {
    const proj = await s.cartographer.post('/api/definitions/resolve', { definition: '+proj=laea +lat_0=52 +lon_0=10 +x_0=4321000 +y_0=3210000 +ellps=GRS80' });
    expect(proj.body).toMatchObject({ kind: 'proj', family: { id: 'laea' } });
    const wkt = fx.fixture(fx.SHAPEFILE_FIXTURE) && (await fx.unzipFixture(fx.SHAPEFILE_FIXTURE))['michigan.prj'].toString();
    const res = await s.cartographer.post('/api/definitions/resolve', { definition: wkt });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ kind: 'wkt', family: { id: 'aea' } });
  });

  it('answers 422 with the engine’s message under fields.definition', async () => {
    for (const [definition, message] of [
      ['EPSG:4326', /not a projected CRS/],
      ['EPSG:999999', /unknown EPSG code 999999/i],
      ['+proj=merc +lat_ts=abc', /\+lat_ts=abc is not a number/],
      ['+proj=aea +lat_1=100 +lat_2=20', /\+lat_1=100 is not a latitude/],
      ['+proj=tmerc +k_0=0', /scale factor \+k_0=0 must be positive/],
      ['+proj=utm +zone=99', /not a UTM zone/],
      ['+proj=nonsense', /not supported/i],
      ['hello world', /unrecognised definition/i],
    ] as const) {
      const res = await s.cartographer.post('/api/definitions/resolve', { definition });
      expect(res.status, definition).toBe(422);
      expect(res.body.error.fields.definition).toMatch(message);
    }
    expect((await s.cartographer.post('/api/definitions/resolve', { definition: '  ' })).body.error.fields.definition).toMatch(/Enter an EPSG code/);
  });

  it('is for studio staff only', async () => {
    expect((await s.client.post('/api/definitions/resolve', { definition: 'EPSG:5070' })).status).toBe(403);
    expect((await (await s.anonymous()).post('/api/definitions/resolve', { definition: 'EPSG:5070' })).status).toBe(401);
  });
});

describe('proposals and candidates', () => {
  it('proposes candidates with reasons for the region and purpose; one click adds one', async () => {
    const res = await s.editor.get(`/api/projects/${projectId}/proposals`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.purpose).toBe('equal-area');
    expect(res.body.proposals.length).toBeGreaterThanOrEqual(4);
    const first = res.body.proposals[0];
    // A mid-latitude region wider than tall, equal-area purpose: an Albers cone with one-sixth-rule parallels first.
    expect(first.family).toBe('aea');
    expect(first.reason.length).toBeGreaterThan(10);
    expect(first.candidateId).toBeNull();

    const add = await s.cartographer.post(`/api/projects/${projectId}/candidates`, {
      definition: first.definition,
      label: first.label,
      origin: 'proposed',
      reason: first.reason,
    });
    expect(add.status, JSON.stringify(add.body)).toBe(201);
    expect(add.body).toMatchObject({ origin: 'proposed', family: 'aea', familyTitle: 'Albers equal-area conic', reason: first.reason });
    const again = await s.editor.get(`/api/projects/${projectId}/proposals`);
    expect(again.body.proposals[0].candidateId).toBe(add.body.id);
    const dup = await s.cartographer.post(`/api/projects/${projectId}/candidates`, { definition: first.definition, origin: 'proposed' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toMatch(/already a candidate/);
  });

  it('a project without a region has no proposals, and cannot be optimised', async () => {
    const res = await s.editor.get(`/api/projects/${emptyProjectId}/proposals`);
    expect(res.body).toMatchObject({ regionId: null, proposals: [] });
    const opt = await s.cartographer.post(`/api/projects/${emptyProjectId}/optimise`, { family: 'lcc', criterion: 'angular' });
    expect(opt.status).toBe(409);
    expect(opt.body.error.message).toMatch(/Upload the project’s region first/);
  });

  it('manual entry: resolved, labelled, listed; a bad definition stores nothing', async () => {
    const before = await candidateRows();
    const bad = await s.cartographer.post(`/api/projects/${projectId}/candidates`, { definition: '+proj=merc +lat_ts=abc' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.definition).toBeTruthy();
    expect(await candidateRows()).toBe(before);

    const res = await s.cartographer.post(`/api/projects/${projectId}/candidates`, { definition: 'EPSG:3857' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ origin: 'entered', family: 'merc', definition: 'EPSG:3857' });
    expect(res.body.label).toMatch(/Pseudo-Mercator/);
    const list = await s.client.get(`/api/projects/${projectId}/candidates`);
    expect(list.status).toBe(404); // not shared with the client
    const seen = await s.editor.get(`/api/projects/${projectId}/candidates`);
    expect(seen.body.candidates.map((c: { id: number }) => c.id)).toContain(res.body.id);
  });

  it('relabels and removes; an audited candidate cannot be removed', async () => {
    const c = (await s.cartographer.post(`/api/projects/${projectId}/candidates`, { definition: '+proj=eqdc +lat_1=40 +lat_2=47 +lat_0=43 +lon_0=-89 +ellps=WGS84' })).body;
    const renamed = await s.cartographer.patch(`/api/projects/${projectId}/candidates/${c.id}`, { label: 'Cone for the atlas' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.label).toBe('Cone for the atlas');
    expect((await s.cartographer.patch(`/api/projects/${projectId}/candidates/${c.id}`, { label: '' })).status).toBe(422);
    expect((await s.editor.patch(`/api/projects/${projectId}/candidates/${c.id}`, { label: 'x' })).status).toBe(403);
    expect((await s.editor.delete(`/api/projects/${projectId}/candidates/${c.id}`)).status).toBe(403);

    const audited = (await s.cartographer.post(`/api/projects/${projectId}/candidates`, { definition: '+proj=laea +lat_0=44 +lon_0=-88 +ellps=WGS84' })).body;
    const audit = await t.deps.dataSource.getRepository(Audit).save({
      projectId, studioId: s.studioId, regionId: 1, candidateIds: [audited.id], status: 'done' as const, progress: 1,
      settings: { samples: 1000, seed: 1 }, engineVersion: 'test', inputHash: '0'.repeat(64), createdById: s.users.cartographer.userId,
    });
    const refused = await s.cartographer.delete(`/api/projects/${projectId}/candidates/${audited.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(new RegExp(`used in audit #${audit.id}`));

    expect((await s.cartographer.delete(`/api/projects/${projectId}/candidates/${c.id}`)).status).toBe(204);
    expect((await s.cartographer.delete(`/api/projects/${projectId}/candidates/${c.id}`)).status).toBe(404);
    const ids = (await s.editor.get(`/api/projects/${projectId}/candidates`)).body.candidates.map((x: { id: number }) => x.id);
    expect(ids).not.toContain(c.id);
    expect(ids).toContain(audited.id);
  });

  it('optimises a family for a criterion and shows the gain; the optimum can be added', async () => {
    const res = await s.cartographer.post(`/api/projects/${projectId}/optimise`, { family: 'lcc', criterion: 'angular' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ family: 'lcc', criterion: 'angular', samples: 4000 });
    expect(res.body.gainPct).toBeGreaterThanOrEqual(0);
    expect(res.body.metric).toBeLessThanOrEqual(res.body.baseline.metric);
    expect(Object.keys(res.body.params).sort()).toEqual(['lat_1', 'lat_2']);
    const add = await s.cartographer.post(`/api/projects/${projectId}/candidates`, {
      definition: res.body.definition,
      label: res.body.label,
      origin: 'optimised',
      params: res.body.params,
    });
    expect(add.status, JSON.stringify(add.body)).toBe(201);
    expect(add.body).toMatchObject({ origin: 'optimised', params: res.body.params });

    const bad = await s.cartographer.post(`/api/projects/${projectId}/optimise`, { family: 'robin', criterion: 'beauty' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['criterion', 'family']);
    expect((await s.editor.post(`/api/projects/${projectId}/optimise`, { family: 'lcc', criterion: 'angular' })).status).toBe(403);
  });
});

describe('candidate routes: roles and tenancy', () => {
  it('editors read but cannot add; unshared clients get 404, shared clients read', async () => {
    expect((await s.editor.post(`/api/projects/${projectId}/candidates`, { definition: 'EPSG:3035' })).status).toBe(403);
    expect((await s.client.post(`/api/projects/${projectId}/candidates`, { definition: 'EPSG:3035' })).status).toBe(403);
    expect((await s.client.get(`/api/projects/${projectId}/proposals`)).status).toBe(404);
    await t.deps.dataSource.getRepository(ProjectAccess).insert({ projectId, studioId: s.studioId, userId: s.users.client.userId, grantedById: null });
    expect((await s.client.get(`/api/projects/${projectId}/candidates`)).status).toBe(200);
    expect((await s.client.get(`/api/projects/${projectId}/proposals`)).status).toBe(200);
  });

  it('another studio gets 404 everywhere and changes nothing', async () => {
    const before = await candidateRows();
    const c = (await s.editor.get(`/api/projects/${projectId}/candidates`)).body.candidates[0];
    const o = other.cartographer;
    expect((await o.get(`/api/projects/${projectId}/candidates`)).status).toBe(404);
    expect((await o.get(`/api/projects/${projectId}/proposals`)).status).toBe(404);
    expect((await o.post(`/api/projects/${projectId}/candidates`, { definition: 'EPSG:3035' })).status).toBe(404);
    expect((await o.patch(`/api/projects/${projectId}/candidates/${c.id}`, { label: 'mine' })).status).toBe(404);
    expect((await o.delete(`/api/projects/${projectId}/candidates/${c.id}`)).status).toBe(404);
    expect((await o.post(`/api/projects/${projectId}/optimise`, { family: 'lcc', criterion: 'angular' })).status).toBe(404);
    expect(await candidateRows()).toBe(before);
    // A candidate id of another project of the same studio is not found under this one.
    expect((await s.cartographer.patch(`/api/projects/${emptyProjectId}/candidates/${c.id}`, { label: 'x' })).status).toBe(404);
  });
});

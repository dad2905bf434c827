import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Candidate, MapProject, ProjectAccess, Region } from '../../server/entities/index.js';
import { DEMO_PROJECTS, seedDemoProjects } from '../../server/seed/demo-projects.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

type TestApp = Awaited<ReturnType<typeof createTestApp>>;
let t: TestApp;
let s: StudioFixture;
let other: StudioFixture;

const base = { clientName: 'Northwind Press', purpose: 'equal-area', scaleBand: 'country' } as const;

beforeAll(async () => {
  t = await createTestApp();
  [s, other] = await Promise.all([createStudioWithRoles(t), createStudioWithRoles(t)]);
});
afterAll(async () => t?.close());

async function create(title: string, extra: Record<string, unknown> = {}) {
  const res = await s.cartographer.post('/api/projects', { ...base, title, ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: number; title: string };
}

describe('map projects', () => {
  it('a cartographer creates a project; it starts as a draft with no region', async () => {
    const res = await s.cartographer.post('/api/projects', { ...base, title: '  Lake atlas  ', notes: 'Spring edition' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ title: 'Lake atlas', status: 'draft', notes: 'Spring edition', region: null, candidateCount: 0, auditCount: 0 });
    const again = await s.editor.get(`/api/projects/${res.body.id}`);
    expect(again.status).toBe(200);
    expect(again.body.title).toBe('Lake atlas');
  });

  it('missing or unknown fields answer 422 naming each field, and nothing is stored', async () => {
    const before = (await s.admin.get('/api/projects')).body.projects.length;
    const res = await s.cartographer.post('/api/projects', { title: '', purpose: 'pretty', scaleBand: 'galaxy' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['clientName', 'purpose', 'scaleBand', 'title']);
    expect(res.body.error.fields.purpose).toMatch(/purpose/i);
    expect((await s.admin.get('/api/projects')).body.projects.length).toBe(before);
  });

  it('roles: cartographers and admins write; editors and clients cannot', async () => {
    expect((await s.admin.post('/api/projects', { ...base, title: 'By admin' })).status).toBe(201);
    expect((await s.editor.post('/api/projects', { ...base, title: 'By editor' })).status).toBe(403);
    expect((await s.client.post('/api/projects', { ...base, title: 'By client' })).status).toBe(403);
    const p = await create('Editable');
    expect((await s.editor.patch(`/api/projects/${p.id}`, { title: 'x' })).status).toBe(403);
    const anon = await s.anonymous();
    expect((await anon.get('/api/projects')).status).toBe(401);
    expect((await anon.get(`/api/projects/${p.id}`)).status).toBe(401);
  });

  it('edits keep the other fields and refuse an empty change', async () => {
    const p = await create('Before edit', { notes: 'keep me' });
    const res = await s.cartographer.patch(`/api/projects/${p.id}`, { title: 'After edit', scaleBand: 'province' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ title: 'After edit', scaleBand: 'province', notes: 'keep me', clientName: base.clientName });
    expect((await s.cartographer.patch(`/api/projects/${p.id}`, {})).status).toBe(422);
    expect((await s.cartographer.patch(`/api/projects/${p.id}`, { purpose: 'nice' })).status).toBe(422);
  });

  it('another studio sees nothing: list excludes, read and edit answer 404', async () => {
    const p = await create('Private to studio one');
    const list = await other.admin.get('/api/projects');
    expect(list.body.projects.map((x: { id: number }) => x.id)).not.toContain(p.id);
    expect((await other.editor.get(`/api/projects/${p.id}`)).status).toBe(404);
    expect((await other.cartographer.patch(`/api/projects/${p.id}`, { title: 'stolen' })).status).toBe(404);
    expect((await s.editor.get('/api/projects/abc')).status).toBe(404);
  });

  it('a client sees only projects shared with them, read-only', async () => {
    const shared = await create('Shared with client');
    const hidden = await create('Not shared');
    expect((await s.client.get(`/api/projects/${shared.id}`)).status).toBe(404);
    await t.deps.dataSource.getRepository(ProjectAccess).insert({
      projectId: shared.id,
      studioId: s.studioId,
      userId: s.users.client.userId,
      grantedById: s.users.editor.userId,
    });
    const list = await s.client.get('/api/projects');
    expect(list.status).toBe(200);
    expect(list.body.projects.map((x: { id: number }) => x.id)).toEqual([shared.id]);
    expect((await s.client.get(`/api/projects/${shared.id}`)).status).toBe(200);
    expect((await s.client.get(`/api/projects/${hidden.id}`)).status).toBe(404);
    expect((await s.client.patch(`/api/projects/${shared.id}`, { title: 'x' })).status).toBe(403);
  });

  it('lists with search, filters and sorting, and the current region and counts of each', async () => {
    const tag = Math.random().toString(36).slice(2, 8);
    const a = await create(`Alpha ${tag}`, { purpose: 'conformal' });
    const b = await create(`Bravo ${tag}`, { purpose: 'equal-area' });
    const c = await create(`Charlie ${tag}`, { purpose: 'conformal', clientName: `Special 50%_ ${tag}` });
    const ds = t.deps.dataSource;
    await ds.getRepository(Candidate).insert(
      [1, 2].map((i) => ({
        projectId: a.id, studioId: s.studioId, label: `c${i}`, definition: 'EPSG:3857', resolved: '+proj=merc',
        family: 'merc', origin: 'entered' as const, createdById: s.users.cartographer.userId,
      })),
    );
    const region = {
      projectId: a.id, studioId: s.studioId, sourceFileName: 'x.geojson', sourceFormat: 'geojson' as const, sourceCrs: 'EPSG:4326',
      geometry: { type: 'Polygon', coordinates: [] }, sha256: '0'.repeat(64), bbox: [0, 0, 1, 1], vertexCount: 4, partCount: 1,
      holeCount: 0, report: {}, createdById: s.users.cartographer.userId,
    };
    await ds.getRepository(Region).insert([
      { ...region, name: 'Old outline', areaKm2: 1, isCurrent: false },
      { ...region, name: 'New outline', areaKm2: 12345.5, isCurrent: true },
    ]);

    const byTitle = await s.editor.get(`/api/projects?q=${tag}&sort=title`);
    expect(byTitle.body.projects.map((p: { id: number }) => p.id)).toEqual([a.id, b.id, c.id]);
    const desc = await s.editor.get(`/api/projects?q=${tag}&sort=title&dir=desc`);
    expect(desc.body.projects.map((p: { id: number }) => p.id)).toEqual([c.id, b.id, a.id]);
    const conformal = await s.editor.get(`/api/projects?q=${tag}&purpose=conformal&sort=title`);
    expect(conformal.body.projects.map((p: { id: number }) => p.id)).toEqual([a.id, c.id]);
    // "%" and "_" are searched as characters, not as patterns.
    const literal = await s.editor.get(`/api/projects?q=${encodeURIComponent('50%_')}`);
    expect(literal.body.projects.map((p: { id: number }) => p.id)).toEqual([c.id]);
    const none = await s.editor.get(`/api/projects?q=${tag}&status=signed-off`);
    expect(none.body.projects).toEqual([]);

    const first = byTitle.body.projects[0];
    expect(first.region).toMatchObject({ name: 'New outline', areaKm2: 12345.5 });
    expect(first.candidateCount).toBe(2);
    expect(byTitle.body.projects[1]).toMatchObject({ region: null, candidateCount: 0, auditCount: 0 });

    // Most recently updated first by default.
    await s.cartographer.patch(`/api/projects/${b.id}`, { notes: 'touched' });
    const recent = await s.editor.get(`/api/projects?q=${tag}`);
    expect(recent.body.projects[0].id).toBe(b.id);

    expect((await s.editor.get('/api/projects?sort=colour')).status).toBe(422);
    expect((await s.editor.get('/api/projects?status=lost')).status).toBe(422);
  });
});

describe('demo projects', () => {
  it('seeds three projects on real boundaries with proposed candidates, once', async () => {
    const demo = await createStudioWithRoles(t);
    const person = (role: 'admin' | 'cartographer' | 'editor' | 'client') => ({ ...demo.users[role] });
    const ctx = { ds: t.deps.dataSource, studioId: demo.studioId, people: { admin: person('admin'), cartographer: person('cartographer'), editor: person('editor'), client: person('client') } };
    await seedDemoProjects(ctx);
    const ds = t.deps.dataSource;
    const projects = await ds.getRepository(MapProject).find({ where: { studioId: demo.studioId }, order: { id: 'ASC' } });
    expect(projects.map((p) => p.title)).toEqual(DEMO_PROJECTS.map((d) => d.input.title));
    const counts = async () =>
      Promise.all(projects.map(async (p) => [await ds.getRepository(Region).countBy({ projectId: p.id }), await ds.getRepository(Candidate).countBy({ projectId: p.id })]));
    const before = await counts();
    for (const [i, p] of projects.entries()) {
      const region = await ds.getRepository(Region).findOneByOrFail({ projectId: p.id, isCurrent: true });
      expect(region.name).toBe(DEMO_PROJECTS[i].regionName);
      expect(region.areaKm2).toBeGreaterThan(100_000);
      const candidates = await ds.getRepository(Candidate).findBy({ projectId: p.id });
      expect(candidates.filter((c) => c.origin === 'proposed')).toHaveLength(DEMO_PROJECTS[i].proposals);
      expect(candidates.every((c) => c.origin !== 'proposed' || (c.reason ?? '').length > 10)).toBe(true);
    }
    // The Arctic project sits at high latitude: its proposals are polar aspects.
    const arctic = await ds.getRepository(Candidate).findBy({ projectId: projects[2].id });
    expect(arctic.some((c) => /\+lat_0=90\b/.test(c.resolved))).toBe(true);
    // Editors see them through the API like any project.
    const list = await demo.editor.get('/api/projects?sort=title');
    expect(list.body.projects.map((p: { title: string }) => p.title)).toEqual([...DEMO_PROJECTS.map((d) => d.input.title)].sort());
    await seedDemoProjects(ctx);
    expect(await counts()).toEqual(before);
    expect(await ds.getRepository(MapProject).countBy({ studioId: demo.studioId })).toBe(3);
  });
});

import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteSpec } from '../../server/http/route-table.js';
import { entities } from '../../server/entities/index.js';
import { startAuditJobs, stopAuditJobs } from '../../server/jobs/runner.js';
import { apiRoutes } from '../../server/routes/index.js';
import type { Role } from '../../shared/api/roles.js';
import { seedAuditedProject } from '../support/signoff-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp, type Client } from '../support/test-app.js';

/**
 * Tenancy, swept over the whole route table: studio B calls every id-bearing route with REAL ids
 * of studio A (and, on routes with several ids, B's own ids with one of A's swapped in). The
 * answer must be exactly the answer to an id that does not exist — same status, same code, same
 * message — so it tells B nothing, never a 2xx, and 404 wherever B's request was otherwise valid.
 * Afterwards none of A's rows has changed. A positive control shows A's own GETs succeed on the
 * same URLs, so a 404 means tenancy and not a wrong URL.
 */
const ROOT = path.resolve(import.meta.dirname, '../..');
const FIXTURE_GEOJSON = path.join(ROOT, 'fixtures/regions/great-lakes-states.geojson');
const MISSING_ID = 2_000_000_000;
const label = (s: RouteSpec) => `${s.method.toUpperCase()} ${s.path}`;
const paramsOf = (p: string) => [...p.matchAll(/:(\w+)/g)].map((m) => m[1]);
const ROLE_ORDER: Role[] = ['cartographer', 'editor', 'admin', 'client'];

/** Params that are not ids of a studio's rows. */
const FIXED_PARAMS: Record<string, string> = { field: 'areal-scale' };
/** Public routes whose parameter is a secret link token, not a studio's id. */
const NOT_TENANT_SCOPED = new Set(['GET /invitations/:token']);

type Ids = Record<string, number>;

let t: Awaited<ReturnType<typeof createTestApp>>;
let a: StudioFixture;
let b: StudioFixture;
let aIds: Ids;
let bIds: Ids;
let specs: RouteSpec[];

/** Queries a route needs before it looks anything up. */
const QUERIES: Record<string, string> = { 'GET /audits/:auditId/candidates/:candidateId/route': '?from=-87.6,41.9&to=-83.0,42.3' };

function urlFor(spec: RouteSpec, ids: Ids): string {
  return `/api${spec.path.replace(/:(\w+)/g, (_m, name: string) => {
    if (name in FIXED_PARAMS) return FIXED_PARAMS[name];
    if (!(name in ids)) throw new Error(`the tenancy sweep has no id for :${name} (${label(spec)}); add one to its fixture`);
    return String(ids[name]);
  })}${QUERIES[label(spec)] ?? ''}`;
}

function callerOf(s: StudioFixture, spec: RouteSpec): Client {
  if (spec.access === 'public' || spec.access === 'signed-in') return s.admin;
  const role = ROLE_ORDER.find((r) => (spec.access as readonly Role[]).includes(r))!;
  return s[role];
}

/** A request B could legitimately send for its own data, so that only tenancy can refuse it. */
function validBody(spec: RouteSpec): { json?: unknown; file?: boolean } {
  switch (label(spec)) {
    case 'PATCH /projects/:projectId':
      return { json: { title: 'Taken over' } };
    case 'POST /projects/:projectId/audits':
      return { json: { samples: 1000 } };
    case 'POST /projects/:projectId/rounds':
      return { json: { auditId: aIds.auditId, candidateIds: [aIds.candidateId], recommendation: 'Take this one.', reviewerEmails: [b.users.client.email] } };
    case 'POST /rounds/:roundId/approve':
      return { json: { candidateId: aIds.candidateId, signature: b.users.client.name } };
    case 'POST /rounds/:roundId/return':
      return { json: { comment: 'Please change it.' } };
    case 'POST /projects/:projectId/comments':
      return { json: { body: 'A comment from the wrong studio.' } };
    case 'PATCH /people/:membershipId':
      return { json: { role: 'client' } };
    case 'POST /projects/:projectId/regions/inspect':
    case 'POST /projects/:projectId/regions':
      return { file: true };
    case 'POST /projects/:projectId/candidates':
      return { json: { definition: 'EPSG:3857' } };
    case 'PATCH /projects/:projectId/candidates/:candidateId':
      return { json: { label: 'Renamed by the wrong studio' } };
    default:
      return { json: {} };
  }
}

async function send(c: Client, spec: RouteSpec, url: string) {
  const body = validBody(spec);
  if (spec.method === 'get') return c.get(url);
  if (spec.method === 'delete') return c.delete(url);
  const req = c.agent[spec.method](url).set('x-csrf-token', c.csrf);
  if (body.file) return req.attach('file', FIXTURE_GEOJSON);
  return req.send(body.json as object);
}

/** Every row of studio A, table by table, as JSON: must not change while B probes. */
async function snapshotOfStudio(studioId: number): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const entity of entities as Function[]) {
    const meta = t.deps.dataSource.getMetadata(entity);
    if (!meta.findColumnWithPropertyName('studioId')) continue;
    const rows = await t.deps.dataSource.getRepository(entity).find({ where: { studioId } as never, order: { id: 'ASC' } as never });
    out[meta.tableName] = JSON.stringify(rows);
  }
  return out;
}

beforeAll(async () => {
  t = await createTestApp();
  await startAuditJobs(t.deps);
  specs = apiRoutes(t.deps);
  [a, b] = await Promise.all([createStudioWithRoles(t, { seatCount: 4 }), createStudioWithRoles(t, { seatCount: 4 })]);

  // Studio A: a project with a real finished audit (heatmaps need its fields), a signed-off
  // round, a second project with an open round, a comment and a pending invitation.
  const p1 = await seedAuditedProject(t.deps, a, { title: `Tenancy A ${randomBytes(3).toString('hex')}` });
  const started = await a.cartographer.post(`/api/projects/${p1.projectId}/audits`, { samples: 1000 });
  expect(started.status, JSON.stringify(started.body)).toBe(202);
  const auditId: number = started.body.id;
  for (let i = 0; ; i++) {
    const res = await a.editor.get(`/api/audits/${auditId}`);
    if (res.body.status === 'done') break;
    if (res.body.status === 'failed' || i > 1500) throw new Error(`A's audit did not finish: ${JSON.stringify(res.body)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  const round1 = await a.editor.post(`/api/projects/${p1.projectId}/rounds`, {
    auditId, candidateIds: p1.candidateIds.slice(0, 2), recommendation: 'The first one.', reviewerEmails: [a.users.client.email],
  });
  expect(round1.status, JSON.stringify(round1.body)).toBe(201);
  const approved = await a.client.post(`/api/rounds/${round1.body.id}/approve`, { candidateId: p1.candidateIds[0], signature: a.users.client.name });
  expect(approved.status, JSON.stringify(approved.body)).toBe(201);
  const p2 = await seedAuditedProject(t.deps, a, { title: 'Tenancy A, open round' });
  const round2 = await a.editor.post(`/api/projects/${p2.projectId}/rounds`, {
    auditId: p2.auditId, candidateIds: [p2.candidateIds[0]], recommendation: 'Open.', reviewerEmails: [a.users.client.email],
  });
  expect(round2.status, JSON.stringify(round2.body)).toBe(201);
  expect((await a.client.post(`/api/projects/${p1.projectId}/comments`, { body: 'From A’s client.' })).status).toBe(201);
  const invite = await a.admin.post('/api/people/invitations', { email: `pending.${randomBytes(3).toString('hex')}@tenancy.test`, role: 'client' });
  expect(invite.status).toBe(201);
  aIds = {
    projectId: p1.projectId,
    auditId,
    candidateId: p1.candidateIds[0],
    regionId: p1.regionId,
    roundId: round2.body.id,
    signOffId: approved.body.id,
    membershipId: a.users.editor.membershipId,
    invitationId: invite.body.id,
  };
  const q = await seedAuditedProject(t.deps, b, { title: 'Tenancy B' });
  bIds = { projectId: q.projectId, auditId: q.auditId, candidateId: q.candidateIds[0], regionId: q.regionId };
}, 180_000);

afterAll(async () => {
  await stopAuditJobs(t.deps);
  await t.close();
});

describe('another studio’s ids', () => {
  it('the sweep covers the id-bearing routes, and A reads its own data on the same URLs', async () => {
    const idRoutes = specs.filter((s) => paramsOf(s.path).some((p) => !(p in FIXED_PARAMS)) && !NOT_TENANT_SCOPED.has(label(s)));
    expect(idRoutes.length).toBeGreaterThanOrEqual(25);
    const failed: string[] = [];
    for (const spec of idRoutes.filter((s) => s.method === 'get')) {
      const res = await callerOf(a, spec).get(urlFor(spec, aIds));
      if (res.status !== 200) failed.push(`${label(spec)} → ${res.status} ${JSON.stringify(res.body?.error ?? '')}`);
    }
    expect(failed).toEqual([]);
  });

  it('answers B exactly as for an id that does not exist, on every id-bearing route, and changes none of A’s rows', async () => {
    const before = await snapshotOfStudio(a.studioId);
    const missing = Object.fromEntries(Object.keys(aIds).map((k) => [k, MISSING_ID]));
    const leaks: string[] = [];
    let probed = 0;
    for (const spec of specs) {
      const names = paramsOf(spec.path).filter((p) => !(p in FIXED_PARAMS));
      if (!names.length || NOT_TENANT_SCOPED.has(label(spec))) continue;
      const caller = callerOf(b, spec);
      // All of A's ids, then (routes with several ids) B's own ids with one of A's swapped in.
      // Each variant is compared with the same URL where A's id is replaced by one that does not exist.
      const variants: Array<[string, Ids, Ids]> = [['A’s ids', aIds, missing]];
      if (names.length > 1 && names.every((n) => n in bIds)) {
        for (const n of names) variants.push([`B’s ids with A’s ${n}`, { ...bIds, [n]: aIds[n] }, { ...bIds, [n]: MISSING_ID }]);
      }
      for (const [what, ids, missingIds] of variants) {
        probed++;
        const ref = await send(caller, spec, urlFor(spec, missingIds));
        const res = await send(caller, spec, urlFor(spec, ids));
        const same = res.status === ref.status && res.body?.error?.code === ref.body?.error?.code && res.body?.error?.message === ref.body?.error?.message;
        // With a valid request, only tenancy can refuse: that must be a 404 (405 on the sealed-record stubs).
        const body = validBody(spec);
        const mustBe404 = spec.method === 'get' || spec.method === 'delete' || body.file || JSON.stringify(body.json) !== '{}';
        const notFoundLike = res.status === 404 || (res.status === 405 && ref.status === 405);
        if (res.status < 400 || !same || (mustBe404 && !notFoundLike)) {
          leaks.push(`${label(spec)} with ${what} → ${res.status} ${JSON.stringify(res.body?.error ?? res.text?.slice(0, 80))} (missing id → ${ref.status} ${ref.body?.error?.code})`);
        }
      }
    }
    expect(leaks).toEqual([]);
    expect(probed).toBeGreaterThanOrEqual(30);
    const after = await snapshotOfStudio(a.studioId);
    for (const table of Object.keys(before)) expect(after[table], `studio A's ${table}`).toBe(before[table]);
  });

  it('never lists A’s rows to B', async () => {
    const listings = ['/api/projects', '/api/people', '/api/review/requests'];
    const aText = [String(a.studioName), a.users.cartographer.email, a.users.client.email, 'Tenancy A'];
    for (const url of listings) {
      for (const role of ['admin', 'cartographer', 'editor', 'client'] as const) {
        const res = await b[role].get(url);
        for (const s of aText) expect(res.text, `${url} as B's ${role}`).not.toContain(s);
      }
    }
  });
});

describe('a client reviewer of the same studio', () => {
  it('gets 404, like a stranger, on every project-scoped GET of a project not shared with them', async () => {
    const c = await createStudioWithRoles(t);
    const p = await seedAuditedProject(t.deps, c, { title: 'Not shared' });
    const ids: Ids = { projectId: p.projectId, auditId: p.auditId, candidateId: p.candidateIds[0], regionId: p.regionId };
    const wrong: string[] = [];
    for (const spec of specs.filter((s) => s.method === 'get' && /^\/(projects|audits)\/:/.test(s.path))) {
      if (!Array.isArray(spec.access) || !spec.access.includes('client')) continue;
      if (!paramsOf(spec.path).every((n) => n in ids || n in FIXED_PARAMS)) continue;
      const res = await c.client.get(urlFor(spec, ids));
      if (res.status !== 404) wrong.push(`${label(spec)} → ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });
});

// Keep the fixture file honest: the sweep's upload body must be a real region file.
it('uses a real region fixture for the upload routes', () => {
  expect(fs.statSync(FIXTURE_GEOJSON).size).toBeGreaterThan(1000);
});

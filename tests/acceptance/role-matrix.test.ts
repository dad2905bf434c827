import { randomBytes } from 'node:crypto';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ALL_ROLES, isStateChanging, type RouteSpec } from '../../server/http/route-table.js';
import { Membership } from '../../server/entities/index.js';
import { apiRoutes } from '../../server/routes/index.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

/**
 * Generated from the router's own table, so every route anyone adds is covered: signed out → 401
 * on every non-public route, every role outside a route's access list → 403, and every
 * state-changing route without its CSRF token → 403 csrf_failed. The access and CSRF checks run
 * before any parsing or upload handling, so no bodies are sent and nothing is written.
 */
const DUMMY_ID = '999999';

/** A concrete URL for a route pattern: every parameter becomes a dummy id, optional parts are kept. */
function concretePath(pattern: string): string {
  return `/api${pattern
    .replace(/[{}]/g, '')
    .replace(/:(\w+)/g, DUMMY_ID)
    .replace(/\*(\w+)/g, 'x')}`;
}

const label = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;

/** Which spec Express itself would run for each spec's concrete URL (an earlier pattern may shadow it). */
async function firstMatches(specs: RouteSpec[]): Promise<number[]> {
  const probe = express();
  specs.forEach((spec, i) => probe[spec.method](`/api${spec.path}`, (_req, res) => void res.json({ i })));
  return Promise.all(specs.map(async (spec) => (await request(probe)[spec.method](concretePath(spec.path))).body.i as number));
}

describe('role × route matrix', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  let s: StudioFixture;
  let specs: RouteSpec[];
  beforeAll(async () => {
    t = await createTestApp();
    s = await createStudioWithRoles(t);
    specs = apiRoutes(t.deps);
  });
  afterAll(() => t.close());

  it('has a reachable, uniquely declared route for every entry of the table', async () => {
    const keys = specs.map(label);
    expect(keys.filter((k, i) => keys.indexOf(k) !== i)).toEqual([]);
    const winners = await firstMatches(specs);
    const shadowed = specs.flatMap((spec, i) =>
      winners[i] === i ? [] : [`${label(spec)} (answered by ${specs[winners[i]] ? label(specs[winners[i]]) : 'nothing'})`],
    );
    expect(shadowed).toEqual([]);
    // The foundation's routes are all in the table.
    for (const k of ['POST /auth/sign-in', 'GET /people', 'PATCH /people/:membershipId', 'POST /invitations/accept']) expect(keys).toContain(k);
    // Managing people is for admins only.
    for (const spec of specs.filter((r) => r.path.startsWith('/people'))) expect(spec.access).toEqual(['admin']);
  });

  it('answers 401 to a signed-out caller on every non-public route', async () => {
    const wrong: string[] = [];
    for (const spec of specs.filter((r) => r.access !== 'public')) {
      const res = await request(t.app)[spec.method](concretePath(spec.path));
      if (res.status !== 401) wrong.push(`${label(spec)} → ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });

  it('answers 403 to every role outside a route’s access list', async () => {
    const wrong: string[] = [];
    let checked = 0;
    for (const spec of specs) {
      if (!Array.isArray(spec.access)) continue;
      for (const role of ALL_ROLES.filter((r) => !(spec.access as readonly string[]).includes(r))) {
        const c = s[role];
        const res = await c.agent[spec.method](concretePath(spec.path)).set('x-csrf-token', c.csrf);
        checked++;
        if (res.status !== 403 || res.body?.error?.code !== 'forbidden') wrong.push(`${label(spec)} as ${role} → ${res.status}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(checked).toBeGreaterThan(0);
  });

  it('answers 403 csrf_failed to every state-changing route called without its token', async () => {
    const wrong: string[] = [];
    for (const spec of specs.filter((r) => isStateChanging(r.method) && r.csrf !== false)) {
      const role = spec.access === 'public' || spec.access === 'signed-in' ? 'admin' : spec.access[0];
      const agent = spec.access === 'public' ? request.agent(t.app) : s[role].agent;
      const res = await agent[spec.method](concretePath(spec.path));
      if (res.status !== 403 || res.body?.error?.code !== 'csrf_failed') wrong.push(`${label(spec)} as ${spec.access === 'public' ? 'anyone' : role} → ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });
});

describe('studio tenancy', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('shows a studio none of another studio’s people, and answers 404 to its ids', async () => {
    const a = await createStudioWithRoles(t, { seatCount: 4 });
    const b = await createStudioWithRoles(t);
    const invitedEmail = `pending.${randomBytes(4).toString('hex')}@tenancy.warpmeter.test`;
    const invite = await a.admin.post('/api/people/invitations', { email: invitedEmail, role: 'editor' });
    expect(invite.status).toBe(201);

    const seenByB = (await b.admin.get('/api/people')).body;
    const aMembershipIds = Object.values(a.users).map((u) => u.membershipId);
    const aEmails = Object.values(a.users).map((u) => u.email);
    expect(seenByB.members).toHaveLength(4);
    expect(seenByB.members.filter((m: { membershipId: number }) => aMembershipIds.includes(m.membershipId))).toEqual([]);
    expect(seenByB.members.filter((m: { email: string }) => aEmails.includes(m.email))).toEqual([]);
    expect(seenByB.invitations).toEqual([]);
    expect(seenByB.seats).toEqual({ used: 3, total: 3 });

    const patch = await b.admin.patch(`/api/people/${a.users.editor.membershipId}`, { status: 'deactivated' });
    expect(patch.status).toBe(404);
    expect((await t.deps.dataSource.getRepository(Membership).findOneByOrFail({ id: a.users.editor.membershipId })).status).toBe('active');
    expect((await b.admin.delete(`/api/people/invitations/${invite.body.id}`)).status).toBe(404);
    expect((await a.admin.get('/api/people')).body.invitations.map((i: { email: string }) => i.email)).toEqual([invitedEmail]);
  });
});

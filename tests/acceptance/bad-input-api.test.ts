import fc from 'fast-check';
import type { ZodType } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteSpec } from '../../server/http/route-table.js';
import { In } from 'typeorm';
import { Audit } from '../../server/entities/index.js';
import { auditJobs, stopAuditJobs } from '../../server/jobs/runner.js';
import { apiRoutes } from '../../server/routes/index.js';
import { heatmapQuerySchema, routeQuerySchema, startAuditSchema } from '../../shared/api/audits.schema.js';
import { acceptInviteSchema, resetPasswordSchema, resetRequestSchema, signInSchema, signUpSchema } from '../../shared/api/auth.schema.js';
import { changeSeatsSchema, startSubscriptionSchema, updatePaymentMethodSchema } from '../../shared/api/billing.schema.js';
import { inviteSchema, updateMemberSchema } from '../../shared/api/people.schema.js';
import { createProjectSchema, listProjectsQuerySchema, updateProjectSchema } from '../../shared/api/projects.schema.js';
import { approveRoundSchema, createCommentSchema, requestSignOffSchema, returnRoundSchema } from '../../shared/api/review.schema.js';
import type { Role } from '../../shared/api/roles.js';
import { bodyFor, paramFor, queryFor } from '../support/schema-fuzz.js';
import { seedAuditedProject } from '../support/signoff-fixture.js';
import { anonymousClient, createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp, type Client } from '../support/test-app.js';

/**
 * Every route of the table, called by a role that may call it (with its CSRF token), with
 * generated malformed path parameters, queries and bodies — from the route's zod schema where it
 * declares one (RouteSpec.body/query) or where the shared schema is known here, else arbitrary
 * JSON — and in the wrong content types. No answer may be a 5xx; every 4xx carries an error code
 * and a message. fast-check prints its random seed and the smallest failing request when one fails.
 */
const KNOWN: Record<string, { body?: ZodType; query?: ZodType }> = {
  'POST /auth/sign-up': { body: signUpSchema },
  'POST /auth/sign-in': { body: signInSchema },
  'POST /auth/reset-request': { body: resetRequestSchema },
  'POST /auth/reset': { body: resetPasswordSchema },
  'POST /people/invitations': { body: inviteSchema },
  'PATCH /people/:membershipId': { body: updateMemberSchema },
  'POST /invitations/accept': { body: acceptInviteSchema },
  'GET /projects': { query: listProjectsQuerySchema },
  'POST /projects': { body: createProjectSchema },
  'PATCH /projects/:projectId': { body: updateProjectSchema },
  'POST /billing/subscription': { body: startSubscriptionSchema },
  'PATCH /billing/seats': { body: changeSeatsSchema },
  'POST /billing/payment-method': { body: updatePaymentMethodSchema },
  'POST /projects/:projectId/audits': { body: startAuditSchema },
  'GET /audits/:auditId/candidates/:candidateId/heatmap/:field.png': { query: heatmapQuerySchema },
  'GET /audits/:auditId/candidates/:candidateId/route': { query: routeQuerySchema },
  'POST /projects/:projectId/rounds': { body: requestSignOffSchema },
  'POST /rounds/:roundId/approve': { body: approveRoundSchema },
  'POST /rounds/:roundId/return': { body: returnRoundSchema },
  'POST /projects/:projectId/comments': { body: createCommentSchema },
};
const RUNS_PER_ROUTE = Number(process.env.WARPMETER_FUZZ_RUNS ?? 30);
/** Fixed by default so a run can be replayed; WARPMETER_FUZZ_SEED explores other inputs. */
const SEED = Number(process.env.WARPMETER_FUZZ_SEED ?? 20261202);
const ROLE_ORDER: Role[] = ['cartographer', 'editor', 'admin', 'client'];
const label = (s: RouteSpec) => `${s.method.toUpperCase()} ${s.path}`;
const CONTENT_TYPES = ['application/json', 'application/json', 'application/json', 'text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=zzz', 'application/xml', 'application/json; charset=latin1'];

let t: Awaited<ReturnType<typeof createTestApp>>;
let s: StudioFixture;
let ids: Record<string, string>;
let specs: RouteSpec[];
let requests = 0;
const statusCounts = new Map<number, number>();

// Audits the fuzz starts go to a queue of this file's own, and are closed in afterAll, so no
// other test's worker (which re-enqueues every unfinished audit of the database) ever runs them.
const basePrefix = process.env.WARPMETER_QUEUE_PREFIX;

beforeAll(async () => {
  process.env.WARPMETER_QUEUE_PREFIX = `${basePrefix}-fuzz-${Date.now().toString(36)}`;
  t = await createTestApp();
  s = await createStudioWithRoles(t, { seatCount: 6 });
  const p = await seedAuditedProject(t.deps, s);
  const round = await s.editor.post(`/api/projects/${p.projectId}/rounds`, {
    auditId: p.auditId, candidateIds: p.candidateIds.slice(0, 2), recommendation: 'Fuzz me.', reviewerEmails: [s.users.client.email],
  });
  expect(round.status, JSON.stringify(round.body)).toBe(201);
  ids = {
    projectId: String(p.projectId),
    auditId: String(p.auditId),
    candidateId: String(p.candidateIds[0]),
    regionId: String(p.regionId),
    roundId: String(round.body.id),
    membershipId: String(s.users.client.membershipId),
    field: 'areal-scale',
  };
  // Sign-out ends the caller's session: fuzz it last.
  specs = apiRoutes(t.deps).sort((a, b) => Number(a.path === '/auth/sign-out') - Number(b.path === '/auth/sign-out'));
}, 120_000);

afterAll(async () => {
  await t.deps.dataSource
    .getRepository(Audit)
    .update({ studioId: s.studioId, status: In(['queued', 'running']) }, { status: 'failed', error: 'Started by the bad-input test; never run.' });
  await auditJobs(t.deps).queue.obliterate({ force: true }).catch(() => {});
  await stopAuditJobs(t.deps);
  await t.close();
  process.env.WARPMETER_QUEUE_PREFIX = basePrefix;
});

function callerFor(spec: RouteSpec): Client | Promise<Client> {
  if (spec.access === 'public') return anonymousClient(t.app);
  if (spec.access === 'signed-in') return s.cartographer;
  return s[ROLE_ORDER.find((r) => (spec.access as readonly Role[]).includes(r))!];
}

function send(c: Client, spec: RouteSpec, url: string, body: unknown, contentType: string) {
  const req = c.agent[spec.method](url).set('x-csrf-token', c.csrf);
  if (spec.method === 'get' || spec.method === 'delete') return req;
  if (contentType.startsWith('application/json') && contentType !== 'application/json') {
    return req.set('content-type', contentType).send(JSON.stringify(body) ?? 'null');
  }
  if (contentType === 'application/json') return req.set('content-type', contentType).send(JSON.stringify(body) ?? 'null');
  return req.set('content-type', contentType).send(typeof body === 'string' ? body : JSON.stringify(body) ?? '');
}

describe('malformed API requests', () => {
  it('never get a 5xx, and every refusal explains itself, on every route of the table', async () => {
    const failures: string[] = [];
    for (const spec of specs) {
      const schemas = { body: spec.body ?? KNOWN[label(spec)]?.body, query: spec.query ?? KNOWN[label(spec)]?.query };
      const params = [...spec.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
      const paramsArb = fc.tuple(...params.map((n) => paramFor(ids[n])));
      const caller = await callerFor(spec);
      await fc.assert(
        fc.asyncProperty(paramsArb, queryFor(schemas.query), bodyFor(schemas.body), fc.constantFrom(...CONTENT_TYPES), async (values, query, body, type) => {
          let i = 0;
          const url = `/api${spec.path.replace(/:(\w+)/g, () => values[i++])}${query ? `?${query}` : ''}`;
          const res = await send(caller, spec, url, body, type);
          requests++;
          statusCounts.set(res.status, (statusCounts.get(res.status) ?? 0) + 1);
          const explained = res.status < 400 || (typeof res.body?.error?.code === 'string' && typeof res.body?.error?.message === 'string' && res.body.error.message.length > 5);
          if (res.status >= 500 || !explained) {
            failures.push(`${label(spec)} ${url.slice(0, 200)} ${type} ${JSON.stringify(body)?.slice(0, 200)} → ${res.status} ${res.text.slice(0, 200)}`);
            return false;
          }
          return true;
        }),
        { numRuns: RUNS_PER_ROUTE, endOnFailure: true, seed: SEED + specs.indexOf(spec) },
      ).catch((err: Error) => failures.push(`${label(spec)}: ${err.message.split('\n').slice(0, 6).join(' | ')}`));
    }
    console.info(`bad-input-api: seed ${SEED}, ${requests} requests over ${specs.length} routes; statuses ${JSON.stringify(Object.fromEntries([...statusCounts].sort()))}`);
    expect(failures).toEqual([]);
    expect(requests).toBeGreaterThanOrEqual(specs.length * RUNS_PER_ROUTE);
    expect([...statusCounts.keys()].some((code) => code >= 500)).toBe(false);
  }, 300_000);

  it('still serves a normal request afterwards (nothing wedged)', async () => {
    const c = await anonymousClient(t.app);
    expect((await c.get('/api/health')).status).toBe(200);
    expect((await s.editor.get(`/api/projects/${ids.projectId}`)).status).toBe(200);
  });
});

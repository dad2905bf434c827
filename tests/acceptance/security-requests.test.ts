import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { Writable } from 'node:stream';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { bootstrap } from '../../server/bootstrap.js';
import { loadConfig } from '../../server/config.js';
import { isStateChanging, type RouteSpec } from '../../server/http/route-table.js';
import { rateLimitScale } from '../../server/middleware/rate-limit.js';
import { apiRoutes } from '../../server/routes/index.js';
import { Region } from '../../server/entities/index.js';
import * as fx from '../fixtures/make-upload-fixtures.js';
import { anonymousClient, createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

/**
 * What the accounts tests leave out: CSRF with a token that is real but belongs to another
 * session (every state-changing route of the table), HSTS and Secure cookies behind TLS, the CSP
 * of the served page, 5xx and odd-request answers without internals, the invitation rate limit,
 * the password policy on every route that sets a password, and no secrets in any answer or log.
 */
const ROOT = path.resolve(import.meta.dirname, '../..');
const label = (s: RouteSpec) => `${s.method.toUpperCase()} ${s.path}`;
const concrete = (p: string) => `/api${p.replace(/:(\w+)/g, '1')}`;
/** Signs of an internal error leaking out: stack frames, source paths, driver names. */
const INTERNALS = /\n\s+at |\.ts:\d+|node_modules|\/srv\/app\/|server\/|ER_[A-Z_]+|TypeORM|QueryFailedError|SELECT |stack/;

let t: Awaited<ReturnType<typeof createTestApp>>;
let s: StudioFixture;
let specs: RouteSpec[];
beforeAll(async () => {
  t = await createTestApp();
  s = await createStudioWithRoles(t);
  specs = apiRoutes(t.deps);
});
afterAll(() => t.close());

describe('CSRF', () => {
  it('refuses every state-changing route when the token is another session’s, or sent in the body or query', async () => {
    const other = await anonymousClient(t.app);
    const foreign = other.csrf;
    const wrong: string[] = [];
    for (const spec of specs.filter((r) => isStateChanging(r.method) && r.csrf !== false)) {
      const role = spec.access === 'public' || spec.access === 'signed-in' ? 'admin' : spec.access[0];
      const c = spec.access === 'public' ? await anonymousClient(t.app) : s[role];
      const url = concrete(spec.path);
      const withForeign = await c.agent[spec.method](url).set('x-csrf-token', foreign).send({});
      // A cross-site form cannot set headers; a token in the body or the query does not count.
      const inBody = await c.agent[spec.method](`${url}?_csrf=${encodeURIComponent(c.csrf)}`).type('form').send({ _csrf: c.csrf, csrfToken: c.csrf });
      for (const [what, res] of [['another session’s token', withForeign], ['token in body/query', inBody]] as const) {
        if (res.status !== 403 || res.body?.error?.code !== 'csrf_failed') wrong.push(`${label(spec)} with ${what} → ${res.status}`);
      }
    }
    expect(wrong).toEqual([]);
  });
});

describe('headers', () => {
  it('sends HSTS and Secure cookies when served over TLS (WARPMETER_SECURE_COOKIES=1), and no HSTS over plain HTTP', async () => {
    const deps = await bootstrap({ ...loadConfig(), secureCookies: true }, pino({ level: 'silent' }));
    try {
      const app = createApp(deps);
      // Behind the TLS proxy on loopback (trust proxy = loopback), X-Forwarded-Proto says https.
      const res = await request(app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      const hsts = String(res.headers['strict-transport-security'] ?? '');
      expect(Number(/max-age=(\d+)/.exec(hsts)?.[1])).toBeGreaterThanOrEqual(15_552_000); // ≥ 180 days
      expect(hsts).toContain('includeSubDomains');
      const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('wm.sid='));
      expect(cookie).toMatch(/;\s*Secure/i);
      expect(cookie).toMatch(/;\s*HttpOnly/i);
      expect(cookie).toMatch(/;\s*SameSite=Lax/i);
      // Over plain HTTP a Secure cookie is never sent at all.
      const plain = await request(app).get('/api/auth/csrf');
      expect(([] as string[]).concat(plain.headers['set-cookie'] ?? []).some((c) => c.startsWith('wm.sid='))).toBe(false);
    } finally {
      await (deps.services.sessionStore as { close(): Promise<void> }).close();
      await deps.dataSource.destroy();
    }
    const res = await request(t.app).get('/api/health');
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });

  it('protects the API and the served page with a CSP without inline or eval scripts, framing refused', async () => {
    const urls = ['/api/health', '/api/no-such-route'];
    const hasClient = fs.existsSync(path.join(ROOT, 'dist/index.html'));
    if (hasClient) urls.push('/', '/projects', '/sign-in');
    for (const url of urls) {
      const res = await request(t.app).get(url);
      const csp = String(res.headers['content-security-policy'] ?? '');
      const directives = Object.fromEntries(csp.split(';').map((d) => d.trim().split(/\s+/)).map(([k, ...v]) => [k, v]));
      expect(directives['script-src'], url).toEqual(["'self'"]);
      expect(directives['default-src'], url).toEqual(["'self'"]);
      expect(directives['frame-ancestors'], url).toEqual(["'none'"]);
      expect(directives['object-src'], url).toEqual(["'none'"]);
      expect(directives['base-uri'], url).toEqual(["'self'"]);
      expect(res.headers['x-content-type-options'], url).toBe('nosniff');
      expect(res.headers['referrer-policy'], url).toBeTruthy();
      expect(res.headers['x-powered-by'], url).toBeUndefined();
    }
    if (hasClient) {
      // The page must work under that CSP: no inline scripts or inline event handlers in it.
      const html = fs.readFileSync(path.join(ROOT, 'dist/index.html'), 'utf8');
      const inline = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)].filter(([, attrs, body]) => !/\bsrc=/.test(attrs) && body.trim());
      expect(inline).toEqual([]);
      expect(html).not.toMatch(/\son[a-z]+=/i);
    }
  });
});

describe('answers without internals', () => {
  it('a failure inside a route is a 500 with our message only, and the details go to the log', async () => {
    const lines: string[] = [];
    const sink = new Writable({ write: (chunk, _e, done) => (lines.push(String(chunk)), done()) });
    const deps = await bootstrap(loadConfig(), pino({ level: 'info' }, sink));
    const app = createApp(deps);
    try {
      const c = await anonymousClient(app);
      const email = `boom.${randomBytes(4).toString('hex')}@errors.test`;
      const up = await c.post('/api/auth/sign-up', { studioName: 'Errors Inc', name: 'Eve', email, password: 'errors-password-1' });
      c.csrf = up.body.csrfToken;
      // A bug deep in a service: the repository throws with internal details in its message.
      const real = deps.dataSource.getRepository.bind(deps.dataSource);
      const secretDetail = `SELECT secret_column FROM internal_table /srv/app/server/x.ts:12 ${randomBytes(4).toString('hex')}`;
      (deps.dataSource as { getRepository: unknown }).getRepository = (e: unknown) => {
        if ((e as { name?: string }).name === 'MapProject') throw new TypeError(secretDetail);
        return real(e as never);
      };
      for (const res of [await c.get('/api/projects'), await c.post('/api/projects', { title: 'x', clientName: 'y', purpose: 'reference', scaleBand: 'city' })]) {
        expect(res.status).toBe(500);
        expect(res.body).toEqual({ error: { code: 'internal', message: expect.any(String) } });
        expect(res.text).not.toContain(secretDetail.slice(0, 20));
        expect(res.text).not.toMatch(INTERNALS);
      }
      await new Promise((r) => setTimeout(r, 50));
      const log = lines.join('');
      expect(log).toContain(secretDetail);
      expect(log).toContain('request failed');
    } finally {
      await (deps.services.sessionStore as { close(): Promise<void> }).close();
      await deps.dataSource.destroy();
    }
  });

  it('odd requests get a 4xx in our words: bad %-escapes, bad JSON, compressed or non-UTF-8 bodies, huge bodies', async () => {
    const c = s.cartographer;
    const cases: Array<[string, request.Test]> = [
      ['bad escape in an id', c.get('/api/projects/%E0%A4%A')],
      ['bad escape in a token', request(t.app).get('/api/invitations/%')],
      ['bad escape on a page path', request(t.app).get('/%E0%A4%A')],
      ['broken JSON', c.agent.post('/api/projects').set('x-csrf-token', c.csrf).type('json').send('{"title":')],
      ['brotli body', c.agent.post('/api/projects').set('x-csrf-token', c.csrf).type('json').set('content-encoding', 'br').send('{}')],
      ['UTF-16 body', c.agent.post('/api/projects').set('x-csrf-token', c.csrf).set('content-type', 'application/json; charset=utf-16').send('{}')],
      ['3 MB body', c.agent.post('/api/projects').set('x-csrf-token', c.csrf).type('json').send(JSON.stringify({ notes: 'x'.repeat(3_000_000) }))],
      ['array where a string goes', c.get('/api/projects?q=a&q=b&sort=title&sort=status')],
    ];
    for (const [what, pending] of cases) {
      const res = await pending;
      expect(res.status, `${what}: ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
      expect(res.status, `${what}: ${res.text.slice(0, 200)}`).toBeLessThan(500);
      expect(typeof res.body?.error?.message, what).toBe('string');
      expect(res.text, what).not.toMatch(INTERNALS);
    }
    // Express's simple query parser keeps bracketed keys flat: an unknown key is ignored.
    expect((await c.get(`/api/projects?q${'[a]'.repeat(40)}=1`)).status).toBe(200);
  });

  it('no answer carries a password hash, a secret of the configuration or a stack trace', async () => {
    const config = t.deps.config;
    const secrets = [config.sessionSecret, config.db.password, config.pay.apiKey, config.pay.webhookSecret, '$argon2'];
    const bodies: string[] = [];
    for (const spec of specs.filter((r) => r.method === 'get' && !r.path.includes(':'))) {
      for (const role of ['admin', 'cartographer', 'editor', 'client'] as const) bodies.push((await s[role].get(concrete(spec.path))).text);
    }
    bodies.push((await request(t.app).get('/api/auth/session')).text);
    expect(bodies.length).toBeGreaterThan(10);
    for (const b of bodies) {
      for (const secret of secrets) expect(b).not.toContain(secret);
      expect(b).not.toMatch(/\n\s+at /);
    }
  });
});

describe('upload paths', () => {
  it('refuses zip entries that climb out of their folder, and keeps an uploaded file name from naming a path', async () => {
    const project = (await s.cartographer.post('/api/projects', { title: 'Traversal', clientName: 'T', purpose: 'reference', scaleBand: 'country' })).body.id;
    const upload = (data: Buffer, name: string) =>
      s.cartographer.agent.post(`/api/projects/${project}/regions`).set('x-csrf-token', s.cartographer.csrf).attach('file', data, name);
    const parts = await fx.unzipFixture(fx.SHAPEFILE_FIXTURE);
    const target = path.join(os.tmpdir(), `wm-traversal-${randomBytes(4).toString('hex')}.shp`);
    for (const evil of ['../../etc/cron.d/evil.shp', `../../../../../..${target}`, '/etc/evil.shp', 'a/../../evil.shp', 'C:\\evil.shp', 'a\\..\\..\\evil.shp']) {
      const res = await upload(await fx.zipOf({ ...parts, [evil]: parts['michigan.shp'] }), 'region.zip');
      expect(res.status, evil).toBe(422);
      expect(res.body.error.message, evil).toMatch(/unsafe path/);
    }
    expect(fs.existsSync(target)).toBe(false);
    // The name a browser sends is only a label: stored without any directory part.
    const named = await upload(fx.fixture('great-lakes-states.geojson'), `../../..${target.replace(/\.shp$/, '.geojson')}`);
    expect(named.status, JSON.stringify(named.body)).toBe(201);
    expect(named.body.sourceFileName).not.toMatch(/[\\/]/);
    expect(fs.existsSync(target.replace(/\.shp$/, '.geojson'))).toBe(false);
    expect(await t.deps.dataSource.getRepository(Region).countBy({ projectId: project })).toBe(1);
  });
});

describe('limits and policies', () => {
  it('limits invitations to 30 an hour per studio (429 with when to retry), other studios unaffected', async () => {
    const a = await createStudioWithRoles(t);
    const limit = Math.round(30 * rateLimitScale());
    // Refused attempts count too (a spray of bad addresses is still a spray).
    for (let i = 0; i < limit; i++) {
      const res = await a.admin.post('/api/people/invitations', { email: `not-an-address-${i}`, role: 'client' });
      expect(res.status).toBe(422);
    }
    const next = await a.admin.post('/api/people/invitations', { email: `late.${randomBytes(3).toString('hex')}@limits.test`, role: 'client' });
    expect(next.status).toBe(429);
    expect(next.body.error.code).toBe('rate_limited');
    expect(next.body.error.message).toMatch(/invitations.*wait/i);
    const b = await createStudioWithRoles(t);
    const elsewhere = await b.admin.post('/api/people/invitations', { email: `fine.${randomBytes(3).toString('hex')}@limits.test`, role: 'client' });
    expect(elsewhere.status).toBe(201);
  });

  it('applies the password policy (10–200 characters) on sign-up, reset and invitation acceptance', async () => {
    const c = await anonymousClient(t.app);
    const token = 'x'.repeat(40);
    const email = () => `policy.${randomBytes(4).toString('hex')}@policy.test`;
    const attempts: Array<[string, () => Promise<request.Response>]> = [];
    for (const password of ['short', '123456789', 'y'.repeat(201)]) {
      attempts.push([`sign-up "${password.slice(0, 12)}"`, () => c.post('/api/auth/sign-up', { studioName: 'Policy', name: 'P', email: email(), password })]);
      attempts.push([`reset "${password.slice(0, 12)}"`, () => c.post('/api/auth/reset', { token, password })]);
      attempts.push([`accept "${password.slice(0, 12)}"`, () => c.post('/api/invitations/accept', { token, name: 'P', password })]);
    }
    for (const [what, run] of attempts) {
      const res = await run();
      expect(res.status, what).toBe(422);
      expect(res.body.error.fields.password, what).toMatch(/at (least 10|most 200) characters/);
    }
    const ok = await c.post('/api/auth/sign-up', { studioName: 'Policy', name: 'P', email: email(), password: '0123456789' });
    expect(ok.status).toBe(201);
  });
});

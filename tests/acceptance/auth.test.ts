import { randomBytes } from 'node:crypto';
import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionSchema } from '../../shared/api/auth.schema.js';
import { createApp } from '../../server/app.js';
import { bootstrap, createLogger } from '../../server/bootstrap.js';
import { loadConfig } from '../../server/config.js';
import { Membership, Studio, User } from '../../server/entities/index.js';
import { hashPassword } from '../../server/services/auth.service.js';
import { addMember } from '../../server/services/people.service.js';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SEAT_COUNT, DEMO_STUDIO_NAME } from '../../server/seed/demo-studio.js';
import { seedDemo } from '../../server/seed/index.js';
import { anonymousClient, createStudioWithRoles, signedInClient } from '../support/studio-fixture.js';
import { Client, createTestApp } from '../support/test-app.js';

const tag = () => randomBytes(4).toString('hex');
const newEmail = (what: string) => `${what}.${tag()}@auth-test.warpmeter.test`;
const sidOf = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('wm.sid='))?.split(';')[0];

describe('accounts and sessions', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  async function signUp(c: Client, email = newEmail('owner'), password = 'correct horse battery') {
    const res = await c.post('/api/auth/sign-up', { studioName: `Studio ${tag()}`, name: 'Ada Owner', email, password });
    if (res.status === 201) c.csrf = res.body.csrfToken;
    return res;
  }

  it('the fixture signs in one client per role', async () => {
    const s = await createStudioWithRoles(t);
    for (const role of ['admin', 'cartographer', 'editor', 'client'] as const) {
      const res = await s[role].get('/api/auth/session');
      expect(res.body.membership).toMatchObject({ role, studioId: s.studioId, studioName: s.studioName });
      expect(res.body.user.email).toBe(s.users[role].email);
    }
  });

  it('signs up: a studio with 3 seats, its admin, signed in', async () => {
    const c = await anonymousClient(t.app);
    const email = newEmail('owner');
    const res = await signUp(c, email);
    expect(res.status).toBe(201);
    const body = sessionSchema.parse(res.body);
    expect(body.user?.email).toBe(email);
    expect(body.membership?.role).toBe('admin');
    const studio = await t.deps.dataSource.getRepository(Studio).findOneByOrFail({ id: body.membership!.studioId });
    expect(studio.seatCount).toBe(3);
    const session = await c.get('/api/auth/session');
    expect(session.body.user.email).toBe(email);
  });

  it('refuses a second sign-up with the same e-mail (409) and leaves no extra studio', async () => {
    const email = newEmail('dup');
    expect((await signUp(await anonymousClient(t.app), email)).status).toBe(201);
    const studiosBefore = await t.deps.dataSource.getRepository(Studio).count();
    const again = await signUp(await anonymousClient(t.app), email.toUpperCase());
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already exists/);
    expect(await t.deps.dataSource.getRepository(Studio).count()).toBe(studiosBefore);
  });

  it('explains bad sign-up input field by field (422)', async () => {
    const c = await anonymousClient(t.app);
    const res = await c.post('/api/auth/sign-up', { studioName: 'X', name: '', email: 'not-an-email', password: 'short' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'password', 'studioName']);
    expect(res.body.error.fields.password).toBe('Use at least 10 characters.');
  });

  it('stores argon2id hashes with at least the OWASP minimum parameters', async () => {
    const email = newEmail('hash');
    await signUp(await anonymousClient(t.app), email);
    const user = await t.deps.dataSource.getRepository(User).findOneByOrFail({ email });
    // PHC string format: $argon2id$v=19$<params>$<salt>$<hash>, params `m=<KiB>,t=<passes>,p=<lanes>` in any order.
    const m = user.passwordHash!.match(/^\$argon2id\$v=19\$([a-z]=\d+(?:,[a-z]=\d+)*)\$[A-Za-z0-9+/]+\$[A-Za-z0-9+/]+$/);
    expect(m).not.toBeNull();
    const params = Object.fromEntries(m![1].split(',').map((kv) => [kv[0], Number(kv.slice(2))]));
    // OWASP Password Storage Cheat Sheet: argon2id with m >= 19456 KiB (19 MiB), t >= 2, p = 1.
    expect(params.m).toBeGreaterThanOrEqual(19456);
    expect(params.t).toBeGreaterThanOrEqual(2);
    expect(params.p).toBe(1);
    expect(user.passwordHash).not.toContain('correct horse');
  });

  it('signs in, and answers a wrong password and an unknown e-mail with the same 401', async () => {
    const email = newEmail('signin');
    await signUp(await anonymousClient(t.app), email, 'the right password');
    const ok = await (await anonymousClient(t.app)).post('/api/auth/sign-in', { email, password: 'the right password' });
    expect(ok.status).toBe(200);
    expect(sessionSchema.parse(ok.body).membership?.role).toBe('admin');

    const wrong = await (await anonymousClient(t.app)).post('/api/auth/sign-in', { email, password: 'the wrong password' });
    const unknown = await (await anonymousClient(t.app)).post('/api/auth/sign-in', { email: newEmail('nobody'), password: 'whatever it is' });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body.error.message).toBe('E-mail or password is wrong.');
    }
  });

  it('signs out: 204, then the session is anonymous and signed-in routes answer 401', async () => {
    const c = await anonymousClient(t.app);
    await signUp(c);
    expect((await c.post('/api/auth/sign-out')).status).toBe(204);
    const session = await c.get('/api/auth/session');
    expect(session.body.user).toBeNull();
    expect(session.body.membership).toBeNull();
    await c.refreshCsrf();
    expect((await c.post('/api/auth/sign-out')).status).toBe(401);
  });

  it('keeps sessions in MariaDB: a second app process accepts the same cookie', async () => {
    const c = await anonymousClient(t.app);
    const email = newEmail('restart');
    const res = await signUp(c, email);
    const cookie = sidOf(res)!;
    expect(cookie).toBeTruthy();
    const second = await createTestApp();
    try {
      const again = await request(second.app).get('/api/auth/session').set('Cookie', cookie);
      expect(again.body.user?.email).toBe(email);
    } finally {
      await second.close();
    }
  });

  it('gives a new session id at sign-in, and the id from before sign-in is worth nothing after it', async () => {
    const email = newEmail('fixation');
    await signUp(await anonymousClient(t.app), email, 'fixation password');
    const c = new Client(t.app);
    const before = await c.get('/api/auth/csrf');
    const oldSid = sidOf(before)!;
    c.csrf = before.body.csrfToken;
    const signIn = await c.post('/api/auth/sign-in', { email, password: 'fixation password' });
    expect(signIn.status).toBe(200);
    const newSid = sidOf(signIn)!;
    expect(newSid).toBeTruthy();
    expect(newSid).not.toBe(oldSid);
    expect(signIn.body.csrfToken).not.toBe(before.body.csrfToken);
    const planted = await request(t.app).get('/api/auth/session').set('Cookie', oldSid);
    expect(planted.body.user).toBeNull();
  });

  it('refuses state-changing calls without the CSRF token (403 csrf_failed)', async () => {
    const email = newEmail('csrf');
    await signUp(await anonymousClient(t.app), email, 'csrf password!');
    const noToken = await request(t.app).post('/api/auth/sign-in').send({ email, password: 'csrf password!' });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe('csrf_failed');
    const c = await signedInClient(t.app, email, 'csrf password!');
    const wrongToken = await c.agent.post('/api/auth/sign-out').set('x-csrf-token', 'x'.repeat(43));
    expect(wrongToken.status).toBe(403);
    expect(wrongToken.body.error.code).toBe('csrf_failed');
    expect((await c.get('/api/auth/session')).body.user.email).toBe(email);
  });
});

describe('the session read (session, membership and user in one query)', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('sees a role change, a renamed user and a deactivation on the very next request, and never stores the member row in the session', async () => {
    const s = await createStudioWithRoles(t);
    const ds = t.deps.dataSource;
    const me = async () => (await s.editor.get('/api/auth/session')).body;
    expect((await me()).membership).toMatchObject({ role: 'editor', studioId: s.studioId });
    const membership = await ds.getRepository(Membership).findOneByOrFail({ studioId: s.studioId, role: 'editor' });
    // Changed behind the app's back (as another app process would): nothing may be cached.
    await ds.getRepository(Membership).update(membership.id, { role: 'cartographer' });
    await ds.getRepository(User).update(membership.userId, { name: 'Renamed Editor' });
    const after = await me();
    expect(after.membership).toMatchObject({ role: 'cartographer' });
    expect(after.user).toMatchObject({ name: 'Renamed Editor' });
    expect((await s.editor.post('/api/projects', { title: 'Now allowed', clientName: 'C', purpose: 'reference', scaleBand: 'city' })).status).toBe(201);
    // The stored session holds the ids and the CSRF token only, never the joined member fields.
    const rows: { data: string }[] = await ds.query('SELECT data FROM sessions WHERE JSON_VALUE(data, "$.membershipId") = ?', [String(membership.id)]);
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) {
      expect(Object.keys(JSON.parse(r.data)).sort()).toEqual(['cookie', 'csrfToken', 'membershipId', 'userId']);
      expect(r.data).not.toContain('Renamed Editor');
    }
    await ds.getRepository(Membership).update(membership.id, { status: 'deactivated' });
    expect((await s.editor.get('/api/projects')).status).toBe(401);
  });
});

describe('people in several studios', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('signs in to the newest active membership, and to an older one when the newest is switched off', async () => {
    const older = await createStudioWithRoles(t);
    const newer = await createStudioWithRoles(t);
    const { email, password } = older.users.editor;
    const joined = await t.deps.dataSource.transaction((m) =>
      hashPassword('unused').then((passwordHash) => addMember(m, { studioId: newer.studioId, email, name: 'x', passwordHash, role: 'client' })),
    );
    const first = await (await anonymousClient(t.app)).post('/api/auth/sign-in', { email, password });
    expect(first.body.membership).toMatchObject({ studioId: newer.studioId, role: 'client' });
    await t.deps.dataSource.getRepository(Membership).update(joined.membershipId, { status: 'deactivated' });
    const second = await (await anonymousClient(t.app)).post('/api/auth/sign-in', { email, password });
    expect(second.body.membership).toMatchObject({ studioId: older.studioId, role: 'editor' });
  });
});

describe('request logs', () => {
  it('never contain passwords, session cookies, CSRF tokens or link tokens', async () => {
    const lines: string[] = [];
    const sink = new Writable({ write: (chunk, _enc, done) => (lines.push(chunk.toString()), done()) });
    const deps = await bootstrap(loadConfig(), createLogger('info', sink));
    const app = createApp(deps);
    try {
      const email = newEmail('logs');
      const password = `secret-${tag()}-password`;
      const c = await anonymousClient(app);
      const signUp = await c.post('/api/auth/sign-up', { studioName: 'Log Studio', name: 'Lou', email, password });
      c.csrf = signUp.body.csrfToken;
      const sid = sidOf(signUp)!.split('=')[1];
      await c.post('/api/auth/sign-in', { email, password });
      const linkToken = 'T'.repeat(30) + tag();
      await c.get(`/api/invitations/${linkToken}`);
      await c.get(`/reset-password?token=${linkToken}`);
      await new Promise((r) => setTimeout(r, 50));
      const log = lines.join('');
      expect(log).toContain('/api/auth/sign-in');
      expect(log).toContain('/api/invitations/[redacted]');
      expect(log).toContain('token=[redacted]');
      expect(log).toContain('"cookie":"[redacted]"');
      for (const secret of [password, sid, decodeURIComponent(sid), signUp.body.csrfToken, linkToken]) {
        expect(log).not.toContain(secret);
      }
    } finally {
      await (deps.services.sessionStore as { close(): Promise<void> }).close();
      await deps.dataSource.destroy();
    }
  });
});

describe('demo seed', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('creates the demo studio with one account per role, and running it again changes nothing', async () => {
    const first = await seedDemo(t.deps.dataSource);
    const second = await seedDemo(t.deps.dataSource);
    expect(second.studioId).toBe(first.studioId);
    expect(second.people).toEqual(first.people);
    const studio = await t.deps.dataSource.getRepository(Studio).findOneByOrFail({ id: first.studioId });
    expect(studio).toMatchObject({ name: DEMO_STUDIO_NAME, seatCount: DEMO_SEAT_COUNT });
    expect(await t.deps.dataSource.getRepository(Studio).countBy({ name: DEMO_STUDIO_NAME })).toBe(1);
    expect(await t.deps.dataSource.getRepository(Membership).countBy({ studioId: first.studioId })).toBe(4);
    expect(DEMO_PASSWORD.length).toBeGreaterThanOrEqual(10);
    for (const p of DEMO_PEOPLE) {
      const res = await (await anonymousClient(t.app)).post('/api/auth/sign-in', { email: p.email, password: DEMO_PASSWORD });
      expect(res.status).toBe(200);
      expect(res.body.membership).toMatchObject({ role: p.role, studioName: DEMO_STUDIO_NAME });
    }
  });
});

import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionSchema } from '../../shared/api/auth.schema.js';
import { peopleListSchema, pendingInvitationSchema } from '../../shared/api/people.schema.js';
import { createApp } from '../../server/app.js';
import type { AppDeps } from '../../server/deps.js';
import { Invitation, Membership, Studio, User } from '../../server/entities/index.js';
import { anonymousClient, createStudioWithRoles } from '../support/studio-fixture.js';
import { type Client, createTestApp, mailTo } from '../support/test-app.js';

const newEmail = (what: string) => `${what}.${randomBytes(4).toString('hex')}@people-test.warpmeter.test`;
const SEATS_FULL_3 = 'All 3 staff seats are in use. Add seats on the Billing page or deactivate someone first.';

function inviteToken(text: string): string {
  const m = text.match(/\/accept-invite\?token=([A-Za-z0-9_-]+)/);
  if (!m) throw new Error(`no invitation link in:\n${text}`);
  return m[1];
}

describe('people, invitations and seats', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const people = async (admin: Client) => peopleListSchema.parse((await admin.get('/api/people')).body);
  const signIn = async (email: string, password: string) => (await anonymousClient(t.app)).post('/api/auth/sign-in', { email, password });

  it('invite → e-mail → accept: the new member is signed in and can sign in again with the right role', async () => {
    const s = await createStudioWithRoles(t, { seatCount: 4 });
    const email = newEmail('newcarto');
    const res = await s.admin.post('/api/people/invitations', { email, role: 'cartographer' });
    expect(res.status).toBe(201);
    const pending = pendingInvitationSchema.parse(res.body);
    expect(pending).toMatchObject({ email, role: 'cartographer' });
    expect(new Date(pending.expiresAt).getTime() - Date.now()).toBeGreaterThan(6.9 * 86_400_000);
    let list = await people(s.admin);
    expect(list.invitations.map((i) => i.email)).toContain(email);
    expect(list.seats).toEqual({ used: 4, total: 4 });

    const mail = await mailTo(email);
    expect(mail.subject).toBe(`Join ${s.studioName} on Warpmeter`);
    expect(mail.text).toContain(`${t.deps.config.publicUrl}/accept-invite?token=`);
    const token = inviteToken(mail.text);

    const visitor = await anonymousClient(t.app);
    const preview = await visitor.get(`/api/invitations/${token}`);
    expect(preview.body).toMatchObject({ kind: 'invite', email, role: 'cartographer', studioName: s.studioName, hasAccount: false });

    const accepted = await visitor.post('/api/invitations/accept', { token, name: 'Nia Newcomer', password: 'her own password' });
    expect(accepted.status).toBe(200);
    const session = sessionSchema.parse(accepted.body);
    expect(session.membership).toMatchObject({ role: 'cartographer', studioId: s.studioId });
    visitor.csrf = session.csrfToken;
    expect((await visitor.get('/api/auth/session')).body.user.name).toBe('Nia Newcomer');

    const again = await signIn(email, 'her own password');
    expect(again.status).toBe(200);
    expect(again.body.membership.role).toBe('cartographer');

    list = await people(s.admin);
    expect(list.invitations.map((i) => i.email)).not.toContain(email);
    expect(list.members.find((m) => m.email === email)).toMatchObject({ role: 'cartographer', status: 'active', name: 'Nia Newcomer' });
    expect(list.seats).toEqual({ used: 4, total: 4 });

    const reuse = await (await anonymousClient(t.app)).post('/api/invitations/accept', { token, name: 'Someone', password: 'another password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invalid_token');
  });

  it('refuses a staff invitation beyond the seat count with a clear 409, and stores nothing', async () => {
    const s = await createStudioWithRoles(t);
    const email = newEmail('toomany');
    const res = await s.admin.post('/api/people/invitations', { email, role: 'editor' });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'seats_full', message: SEATS_FULL_3 });
    expect(await t.deps.dataSource.getRepository(Invitation).countBy({ email })).toBe(0);
  });

  it('lets client reviewers in without a seat', async () => {
    const s = await createStudioWithRoles(t);
    expect((await people(s.admin)).seats).toEqual({ used: 3, total: 3 });
    const email = newEmail('reviewer');
    expect((await s.admin.post('/api/people/invitations', { email, role: 'client' })).status).toBe(201);
    expect((await people(s.admin)).seats).toEqual({ used: 3, total: 3 });
    const token = inviteToken((await mailTo(email)).text);
    const accepted = await (await anonymousClient(t.app)).post('/api/invitations/accept', { token, name: 'Rev Iewer', password: 'reviewer password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.membership.role).toBe('client');
    expect((await people(s.admin)).seats).toEqual({ used: 3, total: 3 });
  });

  it('holds a seat for a pending staff invitation until it is revoked', async () => {
    const s = await createStudioWithRoles(t, { seatCount: 4 });
    const first = await s.admin.post('/api/people/invitations', { email: newEmail('held'), role: 'editor' });
    expect(first.status).toBe(201);
    expect((await s.admin.post('/api/people/invitations', { email: newEmail('second'), role: 'admin' })).status).toBe(409);
    expect((await s.admin.delete(`/api/people/invitations/${first.body.id}`)).status).toBe(204);
    expect((await people(s.admin)).seats).toEqual({ used: 3, total: 4 });
    expect((await s.admin.post('/api/people/invitations', { email: newEmail('second'), role: 'admin' })).status).toBe(201);
    expect((await s.admin.delete(`/api/people/invitations/${first.body.id}`)).status).toBe(404);
    expect((await s.admin.delete('/api/people/invitations/not-a-number')).status).toBe(404);
  });

  it('re-checks the seat when the invitation is accepted', async () => {
    const s = await createStudioWithRoles(t, { seatCount: 4 });
    const email = newEmail('late');
    await s.admin.post('/api/people/invitations', { email, role: 'cartographer' });
    const token = inviteToken((await mailTo(email)).text);
    // Seats went down in the meantime (as a billing change would do).
    await t.deps.dataSource.getRepository(Studio).update(s.studioId, { seatCount: 3 });
    const res = await (await anonymousClient(t.app)).post('/api/invitations/accept', { token, name: 'Late Comer', password: 'late password!' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(SEATS_FULL_3);
    expect(await t.deps.dataSource.getRepository(User).countBy({ email })).toBe(0);
    expect((await t.deps.dataSource.getRepository(Invitation).findOneByOrFail({ email })).usedAt).toBeNull();
  });

  it('serves two concurrent invitations for the last seat one after the other', async () => {
    const s = await createStudioWithRoles(t, { seatCount: 4 });
    const [a, b] = await Promise.all([
      s.admin.post('/api/people/invitations', { email: newEmail('race-a'), role: 'editor' }),
      s.admin.post('/api/people/invitations', { email: newEmail('race-b'), role: 'cartographer' }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect((await people(s.admin)).seats).toEqual({ used: 4, total: 4 });
  });

  it('stores no invitation when its e-mail cannot be sent', async () => {
    const deps: AppDeps = { ...t.deps, services: {}, mailer: { send: async () => Promise.reject(new Error('SMTP is down')) } };
    const app = createApp(deps);
    try {
      const s = await createStudioWithRoles({ app, deps });
      const email = newEmail('unsent');
      const res = await s.admin.post('/api/people/invitations', { email, role: 'client' });
      expect(res.status).toBe(502);
      expect(res.body.error.message).toMatch(/could not be sent, so no invitation was saved/);
      expect(await t.deps.dataSource.getRepository(Invitation).countBy({ email })).toBe(0);
    } finally {
      await (deps.services.sessionStore as { close(): Promise<void> }).close();
    }
  });

  it('refuses to invite someone who is already a member', async () => {
    const s = await createStudioWithRoles(t);
    const res = await s.admin.post('/api/people/invitations', { email: s.users.client.email, role: 'client' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`${s.users.client.email} is already a member of this studio.`);
  });

  it('replaces a pending invitation when the same address is invited again', async () => {
    const s = await createStudioWithRoles(t);
    const email = newEmail('twice');
    await s.admin.post('/api/people/invitations', { email, role: 'client' });
    const oldToken = inviteToken((await mailTo(email)).text);
    await s.admin.post('/api/people/invitations', { email, role: 'client' });
    const list = await people(s.admin);
    expect(list.invitations.filter((i) => i.email === email)).toHaveLength(1);
    expect((await (await anonymousClient(t.app)).get(`/api/invitations/${oldToken}`)).status).toBe(400);
  });

  it('joins an existing account to a second studio only with that account’s password', async () => {
    const home = await createStudioWithRoles(t);
    const other = await createStudioWithRoles(t);
    const { email, password } = home.users.editor;
    await other.admin.post('/api/people/invitations', { email, role: 'client' });
    const token = inviteToken((await mailTo(email)).text);
    const visitor = await anonymousClient(t.app);
    expect((await visitor.get(`/api/invitations/${token}`)).body.hasAccount).toBe(true);
    const wrong = await visitor.post('/api/invitations/accept', { token, name: 'Whoever', password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(await t.deps.dataSource.getRepository(Membership).countBy({ studioId: other.studioId, userId: home.users.editor.userId })).toBe(0);
    const right = await visitor.post('/api/invitations/accept', { token, name: 'Whoever', password });
    expect(right.status).toBe(200);
    expect(right.body.membership).toMatchObject({ studioId: other.studioId, role: 'client' });
    expect(right.body.user.name).toBe(home.users.editor.name);
  });

  it('refuses a client → staff role change beyond the seats, and allows it when a seat is free', async () => {
    const s = await createStudioWithRoles(t);
    const id = s.users.client.membershipId;
    const refused = await s.admin.patch(`/api/people/${id}`, { role: 'cartographer' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe(SEATS_FULL_3);
    expect((await t.deps.dataSource.getRepository(Membership).findOneByOrFail({ id })).role).toBe('client');
    // Staff to staff needs no new seat.
    expect((await s.admin.patch(`/api/people/${s.users.editor.membershipId}`, { role: 'cartographer' })).status).toBe(200);
    // Editor → client frees a seat, which the client can then take.
    expect((await s.admin.patch(`/api/people/${s.users.cartographer.membershipId}`, { role: 'client' })).status).toBe(200);
    const promoted = await s.admin.patch(`/api/people/${id}`, { role: 'editor' });
    expect(promoted.status).toBe(200);
    expect(promoted.body).toMatchObject({ membershipId: id, role: 'editor', status: 'active' });
    // load-actor reads the membership on every request: the change applies to the open session at once.
    expect((await s.client.get('/api/auth/session')).body.membership.role).toBe('editor');
  });

  it('deactivation ends open sessions and blocks sign-in; reactivation needs a free seat', async () => {
    const s = await createStudioWithRoles(t);
    const { email, password, membershipId } = s.users.editor;
    const off = await s.admin.patch(`/api/people/${membershipId}`, { status: 'deactivated' });
    expect(off.status).toBe(200);
    expect(off.body.status).toBe('deactivated');
    expect((await s.editor.get('/api/auth/session')).body.user).toBeNull();
    expect((await s.editor.post('/api/auth/sign-out')).status).toBe(401);
    const blocked = await signIn(email, password);
    expect(blocked.status).toBe(403);
    expect(blocked.body.error.message).toMatch(/switched off/);

    // The freed seat goes to someone else; reactivating the editor would exceed the seats.
    const invite = await s.admin.post('/api/people/invitations', { email: newEmail('replacement'), role: 'cartographer' });
    expect(invite.status).toBe(201);
    const again = await s.admin.patch(`/api/people/${membershipId}`, { status: 'active' });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe(SEATS_FULL_3);
    await s.admin.delete(`/api/people/invitations/${invite.body.id}`);
    expect((await s.admin.patch(`/api/people/${membershipId}`, { status: 'active' })).status).toBe(200);
    expect((await signIn(email, password)).status).toBe(200);
  });

  it('protects the last active admin', async () => {
    const s = await createStudioWithRoles(t);
    const self = s.users.admin.membershipId;
    for (const change of [{ role: 'editor' }, { status: 'deactivated' }]) {
      const res = await s.admin.patch(`/api/people/${self}`, change);
      expect(res.status).toBe(409);
      expect(res.body.error.message).toMatch(/last active admin/);
    }
    expect((await s.admin.patch(`/api/people/${s.users.cartographer.membershipId}`, { role: 'admin' })).status).toBe(200);
    expect((await s.admin.patch(`/api/people/${self}`, { role: 'editor' })).status).toBe(200);
    expect((await s.admin.get('/api/people')).status).toBe(403);
    expect((await s.cartographer.get('/api/people')).status).toBe(200);
  });

  it('explains bad input: unknown role, bad e-mail, empty change, missing member', async () => {
    const s = await createStudioWithRoles(t);
    const bad = await s.admin.post('/api/people/invitations', { email: 'nope', role: 'overlord' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['email', 'role']);
    const empty = await s.admin.patch(`/api/people/${s.users.editor.membershipId}`, {});
    expect(empty.status).toBe(422);
    expect(empty.body.error.message).toBeTruthy();
    expect((await s.admin.patch('/api/people/999999', { role: 'client' })).status).toBe(404);
    const badToken = await (await anonymousClient(t.app)).post('/api/invitations/accept', { token: 'x'.repeat(43), name: 'A', password: 'long enough pw' });
    expect(badToken.status).toBe(400);
  });
});

describe('invitation rate limit', () => {
  it('refuses the 31st invitation from one studio within an hour', async () => {
    const t = await createTestApp();
    try {
      const s = await createStudioWithRoles(t);
      for (let i = 0; i < 30; i++) {
        const res = await s.admin.post('/api/people/invitations', { email: newEmail(`bulk${i}`), role: 'client' });
        expect(res.status).toBe(201);
      }
      const res = await s.admin.post('/api/people/invitations', { email: newEmail('bulk-last'), role: 'client' });
      expect(res.status).toBe(429);
      expect(res.body.error.message).toMatch(/invitations sent from your studio.*wait/);
      // Another studio on the same app is not affected.
      const other = await createStudioWithRoles(t);
      expect((await other.admin.post('/api/people/invitations', { email: newEmail('other'), role: 'client' })).status).toBe(201);
    } finally {
      await t.close();
    }
  });
});

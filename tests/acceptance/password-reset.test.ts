import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Invitation } from '../../server/entities/index.js';
import { hashToken } from '../../server/services/auth.service.js';
import { anonymousClient, createStudioWithRoles } from '../support/studio-fixture.js';
import { caughtMail, createTestApp, mailTo } from '../support/test-app.js';

const newEmail = (what: string) => `${what}.${randomBytes(4).toString('hex')}@reset-test.warpmeter.test`;

describe('password reset', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const tokenFrom = (text: string) => {
    const m = text.match(/(https?:\/\/\S+\/reset-password\?token=([A-Za-z0-9_-]+))/);
    if (!m) throw new Error(`no reset link in:\n${text}`);
    return { link: m[1], token: decodeURIComponent(m[2]) };
  };

  it('mails a one-time link that sets a new password and signs out old sessions', async () => {
    const s = await createStudioWithRoles(t);
    const { email, password } = s.users.cartographer;
    const anon = await s.anonymous();
    const res = await anon.post('/api/auth/reset-request', { email });
    expect(res.status).toBe(202);

    const mail = await mailTo(email);
    expect(mail.subject).toMatch(/new Warpmeter password/);
    const { link, token } = tokenFrom(mail.text);
    expect(link.startsWith(`${t.deps.config.publicUrl}/reset-password?token=`)).toBe(true);
    // Only the SHA-256 of the token is stored.
    const stored = await t.deps.dataSource.getRepository(Invitation).findOneByOrFail({ tokenHash: hashToken(token) });
    expect(stored.kind).toBe('reset');
    expect(JSON.stringify(await t.deps.dataSource.getRepository(Invitation).find())).not.toContain(token);

    const preview = await anon.get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ kind: 'reset', email, role: null, studioName: null, hasAccount: true });

    const done = await anon.post('/api/auth/reset', { token, password: 'a brand new password' });
    expect(done.status).toBe(204);
    expect((await s.cartographer.get('/api/auth/session')).body.user).toBeNull();

    const oldPw = await (await s.anonymous()).post('/api/auth/sign-in', { email, password });
    expect(oldPw.status).toBe(401);
    const newPw = await (await s.anonymous()).post('/api/auth/sign-in', { email, password: 'a brand new password' });
    expect(newPw.status).toBe(200);
    expect(newPw.body.membership.role).toBe('cartographer');

    const reuse = await anon.post('/api/auth/reset', { token, password: 'yet another password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.message).toMatch(/not valid any more/);
  });

  it('answers 202 for an unknown address and sends nothing', async () => {
    const email = newEmail('ghost');
    const res = await (await anonymousClient(t.app)).post('/api/auth/reset-request', { email });
    expect(res.status).toBe(202);
    await new Promise((r) => setTimeout(r, 400));
    expect((await caughtMail()).some((m) => m.to.includes(email))).toBe(false);
  });

  it('refuses an expired or made-up token with 400 and changes nothing', async () => {
    const s = await createStudioWithRoles(t);
    const { email, password } = s.users.editor;
    const anon = await s.anonymous();
    await anon.post('/api/auth/reset-request', { email });
    const { token } = tokenFrom((await mailTo(email)).text);
    await t.deps.dataSource.getRepository(Invitation).update({ tokenHash: hashToken(token) }, { expiresAt: new Date(Date.now() - 1000) });
    const expired = await anon.post('/api/auth/reset', { token, password: 'never gets stored' });
    expect(expired.status).toBe(400);
    const madeUp = await anon.post('/api/auth/reset', { token: 'A'.repeat(43), password: 'never gets stored' });
    expect(madeUp.status).toBe(400);
    expect((await (await s.anonymous()).post('/api/auth/sign-in', { email, password })).status).toBe(200);
  });
});

import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createStudioWithRoles } from '../support/studio-fixture.js';
import { Client, createTestApp } from '../support/test-app.js';

const tag = () => randomBytes(4).toString('hex');
const newEmail = (what: string) => `${what}.${tag()}@limits-test.warpmeter.test`;
/** A made-up client address, so each case counts in its own buckets (the app trusts loopback proxies). */
const fakeIp = () => `10.${1 + Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${1 + Math.floor(Math.random() * 250)}`;

describe('rate limits', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  async function clientFrom(ip: string) {
    const c = new Client(t.app);
    c.agent.set('X-Forwarded-For', ip);
    await c.refreshCsrf();
    return c;
  }

  it('refuses the 11th failed sign-in for one e-mail within 15 minutes with 429 and when to retry', async () => {
    const s = await createStudioWithRoles(t);
    const c = await clientFrom(fakeIp());
    const email = s.users.editor.email;
    for (let i = 1; i <= 10; i++) {
      expect((await c.post('/api/auth/sign-in', { email, password: `wrong guess ${i}` })).status).toBe(401);
    }
    const eleventh = await c.post('/api/auth/sign-in', { email, password: s.users.editor.password });
    expect(eleventh.status).toBe(429);
    expect(eleventh.body.error.code).toBe('rate_limited');
    expect(eleventh.body.error.message).toMatch(/wait (1[0-5] minutes|\d+ seconds)/);
    // Other addresses and other e-mails are not held up.
    const elsewhere = await clientFrom(fakeIp());
    expect((await elsewhere.post('/api/auth/sign-in', { email, password: s.users.editor.password })).status).toBe(200);
  });

  it('does not count successful sign-ins', async () => {
    const s = await createStudioWithRoles(t);
    const ip = fakeIp();
    for (let i = 0; i < 12; i++) {
      const c = await clientFrom(ip);
      expect((await c.post('/api/auth/sign-in', { email: s.users.client.email, password: s.users.client.password })).status).toBe(200);
    }
  });

  it('refuses the 51st failed sign-in from one address, whatever the e-mail', async () => {
    const c = await clientFrom(fakeIp());
    const attempts = Array.from({ length: 50 }, (_, i) => c.post('/api/auth/sign-in', { email: `spray${i}.${tag()}@x.test`, password: 'guess-guess' }));
    const codes = (await Promise.all(attempts)).map((r) => r.status);
    expect(codes.every((code) => code === 401)).toBe(true);
    const next = await c.post('/api/auth/sign-in', { email: `spray-last.${tag()}@x.test`, password: 'guess-guess' });
    expect(next.status).toBe(429);
    expect(next.body.error.message).toMatch(/from your network/);
  });

  it('refuses the 6th reset request for one e-mail within an hour', async () => {
    const c = await clientFrom(fakeIp());
    const email = newEmail('reset-spam');
    for (let i = 0; i < 5; i++) expect((await c.post('/api/auth/reset-request', { email })).status).toBe(202);
    const sixth = await c.post('/api/auth/reset-request', { email });
    expect(sixth.status).toBe(429);
    expect(sixth.body.error.message).toMatch(/password-reset requests.*wait/);
  });
});

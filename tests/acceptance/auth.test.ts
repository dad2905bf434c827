import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createStudioWithRoles } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

describe('studio fixture', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('signs in one client per role', async () => {
    const s = await createStudioWithRoles(t);
    for (const role of ['admin', 'cartographer', 'editor', 'client'] as const) {
      const res = await s[role].get('/api/auth/session');
      expect(res.status).toBe(200);
      expect(res.body.membership).toMatchObject({ role, studioId: s.studioId });
      expect(res.body.user.email).toBe(s.users[role].email);
    }
  });
});

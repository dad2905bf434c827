import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import type { Role } from '../../shared/api/roles.js';
import type { AppDeps } from '../../server/deps.js';
import { Studio } from '../../server/entities/index.js';
import { hashPassword } from '../../server/services/auth.service.js';
import { addMember } from '../../server/services/people.service.js';
import { Client } from './test-app.js';

/**
 * A fresh studio with one signed-in Client per role, for any acceptance or e2e test:
 *
 *   const t = await createTestApp();
 *   const s = await createStudioWithRoles(t);
 *   await s.cartographer.post('/api/projects', {...});   // CSRF token already set
 *   s.users.editor.email, s.users.client.membershipId, s.studioId …
 *
 * The admin signs up through the API; the other three are added straight through the service
 * (no e-mail round trip) and then sign in through POST /api/auth/sign-in. E-mails carry a random
 * suffix, so any number of studios can live in one test database.
 */
export interface FixtureUser {
  email: string;
  password: string;
  name: string;
  userId: number;
  membershipId: number;
}

export interface StudioFixture {
  studioId: number;
  studioName: string;
  admin: Client;
  cartographer: Client;
  editor: Client;
  client: Client;
  users: Record<Role, FixtureUser>;
  /** A new signed-out Client with its CSRF token (for sign-in tests, public links, …). */
  anonymous(): Promise<Client>;
}

export interface StudioFixtureOptions {
  studioName?: string;
  /** Staff seats; at least 3 (admin, cartographer and editor hold one each). Default 3. */
  seatCount?: number;
  /** One password for all four people. */
  password?: string;
}

type TestApp = { app: Express; deps: AppDeps };

const ROLES_AFTER_ADMIN = ['cartographer', 'editor', 'client'] as const;

/** A Client with its CSRF token fetched, not signed in. */
export async function anonymousClient(app: Express): Promise<Client> {
  const c = new Client(app);
  await c.refreshCsrf();
  return c;
}

/** Signs a new Client in; throws with the server's answer when sign-in fails. */
export async function signedInClient(app: Express, email: string, password: string): Promise<Client> {
  const c = await anonymousClient(app);
  const res = await c.post('/api/auth/sign-in', { email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  c.csrf = res.body.csrfToken;
  return c;
}

export async function createStudioWithRoles(t: TestApp, opts: StudioFixtureOptions = {}): Promise<StudioFixture> {
  const tag = randomBytes(5).toString('hex');
  const password = opts.password ?? `pw-${tag}-long-enough`;
  const studioName = opts.studioName ?? `Test Studio ${tag}`;
  const seatCount = opts.seatCount ?? 3;
  if (seatCount < 3) throw new Error('createStudioWithRoles needs at least 3 seats (admin, cartographer, editor)');
  const emailOf = (role: Role) => `${role}.${tag}@fixture.warpmeter.test`;

  const admin = await anonymousClient(t.app);
  const signUp = await admin.post('/api/auth/sign-up', { studioName, name: `Admin ${tag}`, email: emailOf('admin'), password });
  if (signUp.status !== 201) throw new Error(`fixture sign-up failed: ${signUp.status} ${JSON.stringify(signUp.body)}`);
  admin.csrf = signUp.body.csrfToken;
  const studioId: number = signUp.body.membership.studioId;
  const users = {
    admin: { email: emailOf('admin'), password, name: `Admin ${tag}`, userId: signUp.body.user.id, membershipId: signUp.body.membership.id },
  } as Record<Role, FixtureUser>;

  const ds = t.deps.dataSource;
  if (seatCount !== 3) await ds.getRepository(Studio).update(studioId, { seatCount });
  const passwordHash = await hashPassword(password);
  await ds.transaction(async (m) => {
    for (const role of ROLES_AFTER_ADMIN) {
      const name = `${role[0].toUpperCase()}${role.slice(1)} ${tag}`;
      const ids = await addMember(m, { studioId, email: emailOf(role), name, passwordHash, role });
      users[role] = { email: emailOf(role), password, name, ...ids };
    }
  });

  const [cartographer, editor, client] = await Promise.all(
    ROLES_AFTER_ADMIN.map((role) => signedInClient(t.app, users[role].email, password)),
  );
  return {
    studioId,
    studioName,
    admin,
    cartographer,
    editor,
    client,
    users,
    anonymous: () => anonymousClient(t.app),
  };
}

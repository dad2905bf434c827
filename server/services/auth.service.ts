import { createHash, randomBytes } from 'node:crypto';
import argon2 from 'argon2';
import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { SessionInfo, SignInInput, SignUpInput } from '../../shared/api/auth.schema.js';
import type { AppDeps } from '../deps.js';
import { Invitation, Membership, Studio, User } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, forbidden, HttpError } from '../http/errors.js';
import { resetMail } from '../mail/templates.js';

/**
 * argon2id with OWASP's recommended minimum (Password Storage Cheat Sheet: m = 19 MiB,
 * t = 2, p = 1). The parameters are stored inside each hash (`$argon2id$v=19$m=19456,p=1,t=2$…`),
 * so raising them later only needs `needsRehash` at the next sign-in.
 */
export const ARGON2_OPTIONS = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export const hashPassword = (password: string) => argon2.hash(password, ARGON2_OPTIONS);

/** A hash of a throwaway password, verified against when the e-mail is unknown, so both cases take as long. */
let dummyHash: Promise<string> | undefined;
const getDummyHash = () => (dummyHash ??= hashPassword('no-such-account-just-spending-time'));
/** Computes the throwaway hash ahead of the first sign-in attempt. */
export const warmUpPasswordCheck = () => void getDummyHash();

/** True when `password` matches `hash`; with no hash, spends the same time and answers false. */
export async function verifyPassword(hash: string | null | undefined, password: string): Promise<boolean> {
  if (!hash) {
    await argon2.verify(await getDummyHash(), password).catch(() => false);
    return false;
  }
  return argon2.verify(hash, password).catch(() => false);
}

export const WRONG_CREDENTIALS = 'E-mail or password is wrong.';
export const DUPLICATE_EMAIL = 'An account with this e-mail already exists. Sign in instead, or reset the password.';

const isDuplicate = (err: unknown) => (err as { code?: string; driverError?: { code?: string } })?.driverError?.code === 'ER_DUP_ENTRY' || (err as { code?: string })?.code === 'ER_DUP_ENTRY';

/** Creates a studio, its first person and their admin membership, all or nothing. */
export async function signUp(ds: DataSource, input: SignUpInput): Promise<{ userId: number; membershipId: number }> {
  if (await ds.getRepository(User).existsBy({ email: input.email })) throw conflict(DUPLICATE_EMAIL);
  const passwordHash = await hashPassword(input.password);
  try {
    return await ds.transaction(async (m) => {
      const studio = await m.getRepository(Studio).save(m.getRepository(Studio).create({ name: input.studioName }));
      const user = await m.getRepository(User).save(m.getRepository(User).create({ email: input.email, name: input.name, passwordHash }));
      const membership = await m
        .getRepository(Membership)
        .save(m.getRepository(Membership).create({ userId: user.id, studioId: studio.id, role: 'admin', status: 'active' }));
      return { userId: user.id, membershipId: membership.id };
    });
  } catch (err) {
    // Two sign-ups with one e-mail at the same moment: the unique index decides.
    if (isDuplicate(err)) throw conflict(DUPLICATE_EMAIL);
    throw err;
  }
}

/** The membership a person signs in to: their most recently created active one. */
export function latestActiveMembership(m: EntityManager | DataSource, userId: number) {
  return m.getRepository(Membership).findOne({ where: { userId, status: 'active' }, order: { createdAt: 'DESC', id: 'DESC' } });
}

/**
 * Checks an e-mail and password. Unknown e-mail and wrong password give the same 401 after the
 * same argon2 work. A person in several studios signs in to the newest active membership.
 */
export async function authenticate(ds: DataSource, input: SignInInput): Promise<{ userId: number; membershipId: number }> {
  const user = await ds.getRepository(User).findOneBy({ email: input.email });
  const ok = await verifyPassword(user?.passwordHash, input.password);
  if (!user || !ok) throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
  const membership = await latestActiveMembership(ds, user.id);
  if (!membership) {
    throw forbidden('Your access to this studio has been switched off. Ask the studio admin to reactivate your account.');
  }
  if (argon2.needsRehash(user.passwordHash!, ARGON2_OPTIONS)) {
    await ds.getRepository(User).update(user.id, { passwordHash: await hashPassword(input.password) });
  }
  return { userId: user.id, membershipId: membership.id };
}

/** The body of `GET /api/auth/session` and of every call that signs someone in. */
export async function sessionInfo(ds: DataSource, actor: Actor | undefined, csrfToken: string): Promise<SessionInfo> {
  if (!actor) return { user: null, membership: null, csrfToken };
  const studio = await ds.getRepository(Studio).findOneBy({ id: actor.studioId });
  return {
    user: { id: actor.userId, email: actor.email, name: actor.name },
    membership: { id: actor.membershipId, role: actor.role, studioId: actor.studioId, studioName: studio?.name ?? '' },
    csrfToken,
  };
}

/** Loads the actor for a membership just signed in to (the request's own actor predates it). */
export async function actorFor(ds: DataSource, membershipId: number): Promise<Actor> {
  const m = await ds.getRepository(Membership).findOneOrFail({ where: { id: membershipId }, relations: { user: true } });
  return { userId: m.userId, studioId: m.studioId, membershipId: m.id, role: m.role, email: m.user.email, name: m.user.name };
}

/** A one-time token: 32 random bytes, base64url. Only its SHA-256 (hex) is ever stored. */
export const newToken = () => randomBytes(32).toString('base64url');
export const hashToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** `what` names the link: 'invitation link', 'password-reset link', 'link'. */
export const invalidLink = (what: string) =>
  new HttpError(400, 'invalid_token', `This ${what} is not valid any more: it was already used, it expired, or it was mistyped. Ask for a new one.`);

/** The invitation or reset behind a token if it is unused and unexpired (optionally locked FOR UPDATE). */
export async function findLiveToken(m: EntityManager | DataSource, token: string, lock = false): Promise<Invitation | null> {
  const qb = m.getRepository(Invitation).createQueryBuilder('i').where('i.tokenHash = :h', { h: hashToken(token) });
  if (lock) qb.setLock('pessimistic_write');
  const inv = await qb.getOne();
  if (!inv || inv.usedAt || inv.expiresAt.getTime() <= Date.now()) return null;
  return inv;
}

export const RESET_LIFETIME_MS = 60 * 60 * 1000;

/**
 * Starts a password reset. The caller always answers 202 whatever happens here, so nobody
 * learns whether an address has an account; the e-mail goes out in the background for the
 * same reason (a known address must not answer measurably slower).
 */
export async function requestPasswordReset(deps: AppDeps, email: string): Promise<void> {
  const user = await deps.dataSource.getRepository(User).findOneBy({ email });
  if (!user) return;
  const token = newToken();
  const expiresAt = new Date(Date.now() + RESET_LIFETIME_MS);
  await deps.dataSource.getRepository(Invitation).insert({
    kind: 'reset', studioId: null, email, role: null, tokenHash: hashToken(token), expiresAt, invitedById: null,
  });
  const link = `${deps.config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
  const mail = resetMail({ name: user.name, link, expiresAt });
  void deps.mailer
    .send({ to: email, ...mail, template: 'reset', studioId: null })
    .catch((err) => deps.logger.error({ err: (err as Error).message, template: 'reset' }, 'reset mail not sent'));
}

/**
 * Sets a new password from a reset link. The link works once; every other open reset link of
 * the person dies with it, and their sessions everywhere are signed out.
 */
export async function resetPassword(ds: DataSource, token: string, password: string): Promise<void> {
  const first = await findLiveToken(ds, token);
  if (!first || first.kind !== 'reset') throw invalidLink('password-reset link');
  const passwordHash = await hashPassword(password);
  await ds.transaction(async (m) => {
    const inv = await findLiveToken(m, token, true);
    if (!inv || inv.kind !== 'reset') throw invalidLink('password-reset link');
    const user = await m.getRepository(User).findOneBy({ email: inv.email });
    if (!user) throw invalidLink('password-reset link');
    await m.getRepository(User).update(user.id, { passwordHash });
    await m.getRepository(Invitation).update({ email: inv.email, kind: 'reset', usedAt: IsNull() }, { usedAt: new Date() });
    // express-mysql-session keeps each session as JSON text in `sessions.data`.
    await m.query("DELETE FROM `sessions` WHERE JSON_VALUE(`data`, '$.userId') = ?", [String(user.id)]);
  });
}

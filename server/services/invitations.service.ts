import { IsNull, type DataSource } from 'typeorm';
import type { InvitationPreview } from '../../shared/api/auth.schema.js';
import type { InviteInput, PendingInvitation } from '../../shared/api/people.schema.js';
import { isStaffRole } from '../../shared/api/roles.js';
import type { AppDeps } from '../deps.js';
import { Invitation, Membership, Studio, User } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, HttpError, notFound } from '../http/errors.js';
import { inviteMail } from '../mail/templates.js';
import { findLiveToken, hashPassword, hashToken, invalidLink, newToken, verifyPassword } from './auth.service.js';
import { assertStaffSeatAvailable, lockStudio } from './seats.service.js';
import { grantReviewAccessOnJoin } from '../signoff/reviewers.js';

const DAY_MS = 24 * 60 * 60 * 1000;
export const INVITE_LIFETIME_MS = 7 * DAY_MS;

const toPending = (i: Invitation): PendingInvitation => ({
  id: i.id,
  email: i.email,
  role: i.role!,
  expiresAt: i.expiresAt.toISOString(),
  createdAt: (i.createdAt ?? new Date()).toISOString(),
});

function alreadyMember(email: string, membership: Membership) {
  return conflict(
    membership.status === 'active'
      ? `${email} is already a member of this studio.`
      : `${email} is already a member of this studio, but deactivated. Reactivate them on the People page instead.`,
  );
}

/**
 * Invites someone by e-mail (admin). A fresh invitation to the same address replaces the
 * pending one. Staff roles need a free seat. The e-mail is sent inside the transaction, so a
 * failed send leaves nothing stored.
 */
export async function createInvitation(deps: AppDeps, actor: Actor, input: InviteInput): Promise<PendingInvitation> {
  const token = newToken();
  return deps.dataSource.transaction(async (m) => {
    const studio = await lockStudio(m, actor.studioId);
    const user = await m.getRepository(User).findOneBy({ email: input.email });
    const existing = user && (await m.getRepository(Membership).findOneBy({ userId: user.id, studioId: studio.id }));
    if (existing) throw alreadyMember(input.email, existing);
    await m.getRepository(Invitation).delete({ studioId: studio.id, email: input.email, kind: 'invite', usedAt: IsNull() });
    if (isStaffRole(input.role)) await assertStaffSeatAvailable(m, studio.id, 1);
    const repo = m.getRepository(Invitation);
    const expiresAt = new Date(Date.now() + INVITE_LIFETIME_MS);
    const inv = await repo.save(
      repo.create({ kind: 'invite', studioId: studio.id, email: input.email, role: input.role, tokenHash: hashToken(token), expiresAt, invitedById: actor.userId }),
    );
    const link = `${deps.config.publicUrl}/accept-invite?token=${encodeURIComponent(token)}`;
    const mail = inviteMail({ studioName: studio.name, inviterName: actor.name, role: input.role, link, expiresAt });
    try {
      await deps.mailer.send({ to: input.email, ...mail, template: 'invite', studioId: studio.id });
    } catch {
      throw new HttpError(502, 'mail_failed', `The invitation e-mail to ${input.email} could not be sent, so no invitation was saved. Please try again.`);
    }
    return toPending(inv);
  });
}

/** Withdraws a pending invitation of the actor's studio (404 for anything else). */
export async function revokeInvitation(ds: DataSource, actor: Actor, invitationId: number): Promise<void> {
  const res = await ds
    .getRepository(Invitation)
    .delete({ id: invitationId, studioId: actor.studioId, kind: 'invite', usedAt: IsNull() });
  if (!res.affected) throw notFound('That invitation');
}

/** What a link is for, shown before the person acts on it. */
export async function previewInvitation(ds: DataSource, token: string): Promise<InvitationPreview> {
  const inv = await findLiveToken(ds, token);
  if (!inv) throw invalidLink('link');
  const studio = inv.studioId ? await ds.getRepository(Studio).findOneBy({ id: inv.studioId }) : null;
  const user = await ds.getRepository(User).findOneBy({ email: inv.email });
  return {
    kind: inv.kind,
    email: inv.email,
    role: inv.role,
    studioName: studio?.name ?? null,
    expiresAt: inv.expiresAt.toISOString(),
    hasAccount: Boolean(user?.passwordHash),
  };
}

/**
 * Accepts an invitation: creates the person's account (or, when the e-mail already has one,
 * checks that account's password), adds the membership and uses up the token. Staff roles
 * re-check the seat count now, since seats may have changed since the invitation was sent.
 */
export async function acceptInvitation(
  ds: DataSource,
  input: { token: string; name: string; password: string },
): Promise<{ userId: number; membershipId: number }> {
  const first = await findLiveToken(ds, input.token);
  if (!first || first.kind !== 'invite' || !first.studioId || !first.role) throw invalidLink('invitation link');
  const known = await ds.getRepository(User).findOneBy({ email: first.email });
  let newHash: string | null = null;
  if (known?.passwordHash) {
    if (!(await verifyPassword(known.passwordHash, input.password))) {
      throw new HttpError(401, 'wrong_credentials', `${first.email} already has a Warpmeter account. Enter that account's password to join the studio.`);
    }
  } else {
    newHash = await hashPassword(input.password);
  }
  return ds.transaction(async (m) => {
    // Lock order everywhere: studio row first, then invitation rows.
    await lockStudio(m, first.studioId!);
    const inv = await findLiveToken(m, input.token, true);
    if (!inv || inv.id !== first.id) throw invalidLink('invitation link');
    if (isStaffRole(inv.role!)) await assertStaffSeatAvailable(m, inv.studioId!, 1, { excludeInvitationId: inv.id });
    const users = m.getRepository(User);
    let user = await users.findOneBy({ email: inv.email });
    if (!user) user = await users.save(users.create({ email: inv.email, name: input.name, passwordHash: newHash }));
    else if (!user.passwordHash && newHash) await users.update(user.id, { passwordHash: newHash, name: input.name });
    else if (newHash && !(await verifyPassword(user.passwordHash, input.password))) {
      // The account appeared after the first check (a sign-up at the same moment).
      throw new HttpError(401, 'wrong_credentials', `${inv.email} already has a Warpmeter account. Enter that account's password to join the studio.`);
    } else if (!user.name.trim()) await users.update(user.id, { name: input.name });
    const memberships = m.getRepository(Membership);
    const existing = await memberships.findOneBy({ userId: user.id, studioId: inv.studioId! });
    if (existing) throw alreadyMember(inv.email, existing);
    const membership = await memberships.save(memberships.create({ userId: user.id, studioId: inv.studioId!, role: inv.role!, status: 'active' }));
    await m.getRepository(Invitation).update(inv.id, { usedAt: new Date() });
    // A client reviewer invited with a shortlist sees the projects sent to their address at once.
    if (inv.role === 'client') await grantReviewAccessOnJoin(m, { studioId: inv.studioId!, userId: user.id, email: inv.email });
    return { userId: user.id, membershipId: membership.id };
  });
}

import { IsNull, type EntityManager } from 'typeorm';
import { isStaffRole } from '../../shared/api/roles.js';
import { Invitation, Membership, ProjectAccess, ReviewRecipient, User } from '../entities/index.js';
import { conflict, validationFailed } from '../http/errors.js';
import { hashToken, newToken } from '../services/auth.service.js';
import { INVITE_LIFETIME_MS } from '../services/invitations.service.js';

/** How a reviewer is reached: a plain request (already a client of the studio) or an invitation. */
export type ReviewerContact =
  | { email: string; kind: 'request'; userId: number }
  | { email: string; kind: 'invite'; userId: number | null; token: string; expiresAt: Date; hasAccount: boolean };

/**
 * Checks every address before anything is written: studio staff cannot be reviewers (a decision
 * must come from the client), a deactivated reviewer must be reactivated by an admin, and a
 * pending staff invitation to the same address is not silently replaced.
 */
async function classify(m: EntityManager, studioId: number, email: string) {
  const user = await m.getRepository(User).findOneBy({ email });
  const membership = user && (await m.getRepository(Membership).findOneBy({ userId: user.id, studioId }));
  if (membership && isStaffRole(membership.role)) {
    throw validationFailed(`${email} belongs to studio staff; a sign-off must come from a client reviewer.`, {
      reviewerEmails: `${email} is a member of your studio’s staff, not a client reviewer.`,
    });
  }
  if (membership && membership.status !== 'active') {
    throw validationFailed(`${email} is a deactivated reviewer. An admin can reactivate them on the People page.`, {
      reviewerEmails: `${email} is deactivated.`,
    });
  }
  if (!membership) {
    const pendingStaff = await m
      .getRepository(Invitation)
      .findOne({ where: { studioId, email, kind: 'invite', usedAt: IsNull() } });
    if (pendingStaff?.role && isStaffRole(pendingStaff.role)) {
      throw conflict(`${email} has a pending invitation to join as ${pendingStaff.role}. Withdraw it on the People page before asking them to review.`);
    }
  }
  return { user, membership };
}

/**
 * Gives each reviewer read access to the project and writes their recipient row. A reviewer with
 * no membership in the studio gets a fresh one-time invitation (role client, no seat); when they
 * accept it, grantReviewAccessOnJoin gives them the project. Runs inside the round's transaction.
 */
export async function addReviewers(
  m: EntityManager,
  opts: { studioId: number; projectId: number; roundId: number; grantedById: number; emails: string[] },
): Promise<ReviewerContact[]> {
  const found = [];
  for (const email of opts.emails) found.push({ email, ...(await classify(m, opts.studioId, email)) });

  const contacts: ReviewerContact[] = [];
  for (const { email, user, membership } of found) {
    if (user) await grantAccess(m, opts.studioId, opts.projectId, user.id, opts.grantedById);
    if (membership) {
      contacts.push({ email, kind: 'request', userId: user!.id });
    } else {
      // A newer invitation replaces a pending client invitation: only the latest link works.
      const invitations = m.getRepository(Invitation);
      await invitations.delete({ studioId: opts.studioId, email, kind: 'invite', usedAt: IsNull() });
      const token = newToken();
      const expiresAt = new Date(Date.now() + INVITE_LIFETIME_MS);
      await invitations.insert({
        kind: 'invite', studioId: opts.studioId, email, role: 'client', tokenHash: hashToken(token), expiresAt, invitedById: opts.grantedById,
      });
      contacts.push({ email, kind: 'invite', userId: user?.id ?? null, token, expiresAt, hasAccount: Boolean(user?.passwordHash) });
    }
    await m.getRepository(ReviewRecipient).insert({
      roundId: opts.roundId,
      projectId: opts.projectId,
      studioId: opts.studioId,
      email,
      userId: user?.id ?? null,
      invited: !membership,
    });
  }
  return contacts;
}

async function grantAccess(m: EntityManager, studioId: number, projectId: number, userId: number, grantedById: number | null) {
  const repo = m.getRepository(ProjectAccess);
  if (await repo.existsBy({ projectId, userId })) return;
  await repo.insert({ projectId, studioId, userId, grantedById });
}

/**
 * Called when someone joins a studio through an invitation: every project whose review was sent
 * to their address becomes visible to them, and their recipient rows learn their user id.
 */
export async function grantReviewAccessOnJoin(m: EntityManager, opts: { studioId: number; userId: number; email: string }) {
  const rows = await m.getRepository(ReviewRecipient).findBy({ studioId: opts.studioId, email: opts.email });
  for (const row of rows) {
    await grantAccess(m, opts.studioId, row.projectId, opts.userId, null);
    if (row.userId !== opts.userId) await m.getRepository(ReviewRecipient).update(row.id, { userId: opts.userId });
  }
}

import { In, IsNull, MoreThan, Not, type EntityManager } from 'typeorm';
import { STAFF_ROLES } from '../../shared/api/roles.js';
import { Invitation, Membership, Studio } from '../entities/index.js';
import { HttpError, notFound } from '../http/errors.js';
import { assertBillingAllowsNewStaff } from '../billing/billing-guard.js';

/**
 * Staff seats (admin, cartographer, editor) are what a studio pays for; client reviewers take
 * none. A seat is used by every active staff membership and every pending (unused, unexpired)
 * staff invitation, so an invitation holds its seat until it is accepted, revoked or expires.
 *
 * Every check that can add a staff seat goes through `assertStaffSeatAvailable`, inside the
 * caller's transaction, after `lockStudio` has taken the studio row FOR UPDATE: two admins
 * inviting at the same moment are served one after the other and cannot exceed the count.
 */

/** Takes the studio row's write lock for the rest of the transaction (SELECT … FOR UPDATE). */
export async function lockStudio(manager: EntityManager, studioId: number): Promise<Studio> {
  const studio = await manager
    .getRepository(Studio)
    .createQueryBuilder('s')
    .setLock('pessimistic_write')
    .where('s.id = :studioId', { studioId })
    .getOne();
  if (!studio) throw notFound('That studio');
  return studio;
}

export interface SeatCountOptions {
  /** Leave this pending invitation out (it is being accepted and turns into a membership). */
  excludeInvitationId?: number;
}

/** Active staff memberships plus pending staff invitations of the studio. */
export async function countStaffSeatsUsed(manager: EntityManager, studioId: number, opts: SeatCountOptions = {}): Promise<number> {
  const members = await manager
    .getRepository(Membership)
    .countBy({ studioId, status: 'active', role: In([...STAFF_ROLES]) });
  const invitations = await manager.getRepository(Invitation).countBy({
    studioId,
    kind: 'invite',
    role: In([...STAFF_ROLES]),
    usedAt: IsNull(),
    expiresAt: MoreThan(new Date()),
    ...(opts.excludeInvitationId ? { id: Not(opts.excludeInvitationId) } : {}),
  });
  return members + invitations;
}

export const seatsFullMessage = (total: number) =>
  `All ${total} staff seat${total === 1 ? ' is' : 's are'} in use. Add seats on the Billing page or deactivate someone first.`;

/**
 * Refuses (409 `seats_full`) when `extra` more staff seats would exceed the studio's seat count,
 * and (402 `billing_hold`) once a failed payment's grace period is over or the subscription ended.
 * Locks the studio row itself, so call it inside a transaction; returns the counts it saw.
 */
export async function assertStaffSeatAvailable(
  manager: EntityManager,
  studioId: number,
  extra = 1,
  opts: SeatCountOptions = {},
): Promise<{ used: number; total: number }> {
  const studio = await lockStudio(manager, studioId);
  if (extra > 0) await assertBillingAllowsNewStaff(manager, studioId);
  const used = await countStaffSeatsUsed(manager, studioId, opts);
  if (used + extra > studio.seatCount) throw new HttpError(409, 'seats_full', seatsFullMessage(studio.seatCount));
  return { used, total: studio.seatCount };
}

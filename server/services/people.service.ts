import { IsNull, MoreThan, type DataSource, type EntityManager } from 'typeorm';
import type { Member, PeopleList, UpdateMemberInput } from '../../shared/api/people.schema.js';
import { isStaffRole, type Role } from '../../shared/api/roles.js';
import { Invitation, Membership, Studio, User } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, notFound } from '../http/errors.js';
import { assertStaffSeatAvailable, countStaffSeatsUsed, lockStudio } from './seats.service.js';

const toMember = (m: Membership): Member => ({
  membershipId: m.id,
  userId: m.userId,
  name: m.user.name,
  email: m.user.email,
  role: m.role,
  status: m.status,
  createdAt: m.createdAt.toISOString(),
});

/** The studio's members, its pending invitations and its seat use (`GET /api/people`). */
export async function listPeople(ds: DataSource, studioId: number): Promise<PeopleList> {
  const m = ds.manager;
  const studio = await m.getRepository(Studio).findOneBy({ id: studioId });
  if (!studio) throw notFound('That studio');
  const members = await m.getRepository(Membership).find({ where: { studioId }, relations: { user: true }, order: { id: 'ASC' } });
  const invitations = await m.getRepository(Invitation).find({
    where: { studioId, kind: 'invite', usedAt: IsNull(), expiresAt: MoreThan(new Date()) },
    order: { id: 'ASC' },
  });
  return {
    members: members.map(toMember),
    invitations: invitations.map((i) => ({
      id: i.id,
      email: i.email,
      role: i.role!,
      expiresAt: i.expiresAt.toISOString(),
      createdAt: i.createdAt.toISOString(),
    })),
    seats: { used: await countStaffSeatsUsed(m, studioId), total: studio.seatCount },
  };
}

const holdsSeat = (role: Role, status: Membership['status']) => isStaffRole(role) && status === 'active';

/**
 * Changes a member's role and/or status. Taking a staff seat (client → staff, or reactivating
 * staff) needs a free seat; the last active admin cannot be demoted or deactivated.
 */
export async function updateMember(ds: DataSource, actor: Actor, membershipId: number, input: UpdateMemberInput): Promise<Member> {
  return ds.transaction(async (m) => {
    await lockStudio(m, actor.studioId);
    const repo = m.getRepository(Membership);
    const member = await repo.findOne({ where: { id: membershipId, studioId: actor.studioId }, relations: { user: true } });
    if (!member) throw notFound('That member');
    const role = input.role ?? member.role;
    const status = input.status ?? member.status;
    if (holdsSeat(role, status) && !holdsSeat(member.role, member.status)) {
      await assertStaffSeatAvailable(m, actor.studioId, 1);
    }
    const wasActiveAdmin = member.role === 'admin' && member.status === 'active';
    if (wasActiveAdmin && !(role === 'admin' && status === 'active')) {
      const admins = await repo.countBy({ studioId: actor.studioId, role: 'admin', status: 'active' });
      if (admins <= 1) {
        throw conflict(
          member.id === actor.membershipId
            ? 'You are the last active admin. Make someone else an admin before changing your own role or status.'
            : 'This is the last active admin. Make someone else an admin first.',
        );
      }
    }
    await repo.update(member.id, { role, status });
    return toMember({ ...member, role, status } as Membership);
  });
}

/**
 * Adds a person to a studio directly (demo seed, test fixtures): creates the user when the
 * e-mail is new, then the membership. Seats are the caller's business here.
 */
export async function addMember(
  m: EntityManager,
  input: { studioId: number; email: string; name: string; passwordHash: string; role: Role },
): Promise<{ userId: number; membershipId: number }> {
  const users = m.getRepository(User);
  let user = await users.findOneBy({ email: input.email });
  if (!user) user = await users.save(users.create({ email: input.email, name: input.name, passwordHash: input.passwordHash }));
  const memberships = m.getRepository(Membership);
  let membership = await memberships.findOneBy({ userId: user.id, studioId: input.studioId });
  if (!membership) {
    membership = await memberships.save(memberships.create({ userId: user.id, studioId: input.studioId, role: input.role, status: 'active' }));
  }
  return { userId: user.id, membershipId: membership.id };
}

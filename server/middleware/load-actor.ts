import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { Membership, User } from '../entities/index.js';
import { sessionMemberOf, type SessionMemberRow } from '../http/session-store.js';

/** The actor's membership and user in one indexed join; table names from the entities' metadata. */
function actorSql(ds: DataSource): string {
  const q = (name: string) => ds.driver.escape(name);
  const memberships = q(ds.getMetadata(Membership).tablePath);
  const users = q(ds.getMetadata(User).tablePath);
  return `SELECT m.id, m.userId, m.studioId, m.role, m.status, u.email, u.name FROM ${memberships} m JOIN ${users} u ON u.id = m.userId WHERE m.id = ?`;
}

/**
 * Reads the signed-in user's active membership on every request, so a role change or a
 * deactivation takes effect at once rather than at the next sign-in. The session store reads it
 * in the same query as the session (see session-store.ts); the separate query here is for a
 * session that did not come from that store.
 */
export function loadActor(ds: DataSource): RequestHandler {
  let sql: string | undefined;
  return async (req, _res, next) => {
    try {
      const membershipId = req.session?.membershipId;
      if (!membershipId) return next();
      let m = sessionMemberOf(req);
      if (m === undefined) [m] = (await ds.query((sql ??= actorSql(ds)), [membershipId])) as SessionMemberRow[];
      if (!m || m.id !== membershipId || m.status !== 'active' || m.userId !== req.session.userId) {
        delete req.session.userId;
        delete req.session.membershipId;
        return next();
      }
      req.actor = {
        userId: m.userId,
        studioId: m.studioId,
        membershipId: m.id,
        role: m.role,
        email: m.email,
        name: m.name,
      };
      next();
    } catch (err) {
      next(err);
    }
  };
}

import type { RequestHandler } from 'express';
import { sessionMemberOf } from '../http/session-store.js';

/**
 * Sets the signed-in actor from the membership and user the session store read together with
 * the session (see session-store.ts), fresh on every request, so a role change or a deactivation
 * takes effect at once rather than at the next sign-in. A session whose membership is missing,
 * switched off or belongs to someone else is signed out.
 */
export const loadActor: RequestHandler = (req, _res, next) => {
  const membershipId = req.session?.membershipId;
  if (!membershipId) return next();
  const m = sessionMemberOf(req);
  if (!m || m.id !== membershipId || m.status !== 'active' || m.userId !== req.session.userId) {
    delete req.session.userId;
    delete req.session.membershipId;
    return next();
  }
  req.actor = { userId: m.userId, studioId: m.studioId, membershipId: m.id, role: m.role, email: m.email, name: m.name };
  next();
};

import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { Membership } from '../entities/index.js';

/**
 * Reads the signed-in user's active membership on every request, so a role change or a
 * deactivation takes effect at once rather than at the next sign-in.
 */
export function loadActor(ds: DataSource): RequestHandler {
  return async (req, _res, next) => {
    try {
      const membershipId = req.session?.membershipId;
      if (!membershipId) return next();
      const m = await ds.getRepository(Membership).findOne({ where: { id: membershipId }, relations: { user: true } });
      if (!m || m.status !== 'active' || m.userId !== req.session.userId) {
        delete req.session.userId;
        delete req.session.membershipId;
        return next();
      }
      req.actor = {
        userId: m.userId,
        studioId: m.studioId,
        membershipId: m.id,
        role: m.role,
        email: m.user.email,
        name: m.user.name,
      };
      next();
    } catch (err) {
      next(err);
    }
  };
}

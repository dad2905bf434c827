import type { Response } from 'express';
import { inviteSchema, updateMemberSchema } from '../../shared/api/people.schema.js';
import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { inviteLimiters } from '../middleware/rate-limit.js';
import { createInvitation, revokeInvitation } from '../services/invitations.service.js';
import { listPeople, updateMember } from '../services/people.service.js';
import { idParam } from '../services/project-guard.js';

/** The studio's people, seats and invitations (admins only). */
export function peopleRoutes(deps: AppDeps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/people',
      access: ['admin'],
      summary: "The studio's members, pending invitations and seat use",
      handler: (req) => listPeople(deps.dataSource, req.actor!.studioId),
    },
    {
      method: 'post',
      path: '/people/invitations',
      access: ['admin'],
      before: inviteLimiters(),
      summary: 'Invite someone by e-mail',
      handler: async (req, res: Response) => {
        const invitation = await createInvitation(deps, req.actor!, inviteSchema.parse(req.body));
        res.status(201);
        return invitation;
      },
    },
    {
      method: 'delete',
      path: '/people/invitations/:invitationId',
      access: ['admin'],
      summary: 'Withdraw a pending invitation',
      handler: async (req, res: Response) => {
        await revokeInvitation(deps.dataSource, req.actor!, idParam(req.params.invitationId, 'That invitation'));
        res.status(204);
      },
    },
    {
      method: 'patch',
      path: '/people/:membershipId',
      access: ['admin'],
      summary: "Change a member's role or status",
      handler: (req) =>
        updateMember(deps.dataSource, req.actor!, idParam(req.params.membershipId, 'That member'), updateMemberSchema.parse(req.body)),
    },
  ];
}

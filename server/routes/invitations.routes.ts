import { acceptInviteSchema } from '../../shared/api/auth.schema.js';
import type { AppDeps } from '../deps.js';
import { badRequest } from '../http/errors.js';
import type { RouteSpec } from '../http/route-table.js';
import { acceptInvitation, previewInvitation } from '../services/invitations.service.js';
import { startSession } from './auth.routes.js';

/** The public side of an invitation link: look at it, then accept it. */
export function invitationRoutes(deps: AppDeps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/invitations/:token',
      access: 'public',
      summary: 'What an invitation or reset link is for',
      handler: (req) => {
        const token = String(req.params.token ?? '');
        if (token.length < 20 || token.length > 200) throw badRequest('This link is incomplete. Open it again from the e-mail.');
        return previewInvitation(deps.dataSource, token);
      },
    },
    {
      method: 'post',
      path: '/invitations/accept',
      access: 'public',
      summary: 'Accept an invitation: create or confirm the account, join the studio, sign in',
      handler: async (req) => {
        const ids = await acceptInvitation(deps.dataSource, acceptInviteSchema.parse(req.body));
        return startSession(deps, req, ids);
      },
    },
  ];
}

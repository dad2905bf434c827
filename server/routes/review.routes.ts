import {
  approveRoundSchema,
  createCommentSchema,
  requestSignOffSchema,
  returnRoundSchema,
} from '../../shared/api/review.schema.js';
import type { AppDeps } from '../deps.js';
import { HttpError } from '../http/errors.js';
import { ALL_ROLES, type RouteSpec } from '../http/route-table.js';
import { byStudio, createLimiter } from '../middleware/rate-limit.js';
import { listActivity } from '../services/activity.service.js';
import { addComment, listComments } from '../services/comments.service.js';
import { idParam, loadProjectFor } from '../services/project-guard.js';
import { createRound, getRound, listReviewRequests, listRounds } from '../services/review.service.js';
import { approveRound, getProjectSignOff, getSignOff, returnRound, signOffSheet, verifySignOff } from '../services/signoff.service.js';

const STAFF = ['admin', 'cartographer', 'editor'] as const;

/** A sign-off cannot be edited or withdrawn by anyone; these routes exist so the answer is explicit. */
const immutable = (method: 'put' | 'patch' | 'delete'): RouteSpec => ({
  method,
  path: '/signoffs/:signOffId',
  access: 'signed-in',
  csrf: false,
  summary: 'Refused: sign-off records cannot be changed or deleted',
  handler: (_req, res) => {
    res.set('Allow', 'GET');
    throw new HttpError(405, 'immutable', 'A sign-off record is permanent: it cannot be changed or deleted. If the decision must be revisited, start a new project.');
  },
});

/** Shortlists and sign-off rounds, the client's decision, the sign-off record, comments and history. */
export function reviewRoutes(deps: AppDeps): RouteSpec[] {
  const ds = deps.dataSource;
  // Each round may send invitations, so it shares the invitation budget's size: 30 an hour per studio.
  const roundLimit = createLimiter({ what: 'sign-off requests from your studio', limit: 30, windowMs: 60 * 60_000, key: byStudio });
  return [
    {
      method: 'post',
      path: '/projects/:projectId/rounds',
      access: ['admin', 'editor'],
      before: [roundLimit],
      summary: 'Send a shortlist (1–4 candidates of a finished audit) and a recommendation to client reviewers',
      handler: async (req, res) => {
        const round = await createRound(deps, req.actor!, idParam(req.params.projectId, 'That project'), requestSignOffSchema.parse(req.body));
        res.status(201);
        return round;
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId/rounds',
      access: ALL_ROLES,
      summary: 'Every review round of the project (reviewers: the rounds sent to them)',
      handler: (req) => listRounds(ds, req.actor!, idParam(req.params.projectId, 'That project')),
    },
    {
      method: 'get',
      path: '/rounds/:roundId',
      access: ALL_ROLES,
      summary: 'One review round with its shortlisted scorecards',
      handler: (req) => getRound(ds, req.actor!, idParam(req.params.roundId, 'That review round')),
    },
    {
      method: 'get',
      path: '/review/requests',
      access: ['client'],
      summary: 'The review rounds sent to the signed-in reviewer',
      handler: (req) => listReviewRequests(ds, req.actor!),
    },
    {
      method: 'post',
      path: '/rounds/:roundId/approve',
      access: ['client'],
      summary: 'The reviewer approves one shortlisted candidate, signing with their name',
      handler: async (req, res) => {
        const signOff = await approveRound(deps, req.actor!, idParam(req.params.roundId, 'That review round'), approveRoundSchema.parse(req.body));
        res.status(201);
        return signOff;
      },
    },
    {
      method: 'post',
      path: '/rounds/:roundId/return',
      access: ['client'],
      summary: 'The reviewer returns the shortlist with a comment',
      handler: (req) => returnRound(deps, req.actor!, idParam(req.params.roundId, 'That review round'), returnRoundSchema.parse(req.body)),
    },
    {
      method: 'get',
      path: '/projects/:projectId/signoff',
      access: ALL_ROLES,
      summary: 'The project’s sign-off record',
      handler: (req) => getProjectSignOff(ds, req.actor!, idParam(req.params.projectId, 'That project')),
    },
    {
      method: 'get',
      path: '/signoffs/:signOffId',
      access: ALL_ROLES,
      summary: 'One sign-off record',
      handler: (req) => getSignOff(ds, req.actor!, idParam(req.params.signOffId, 'That sign-off record')),
    },
    immutable('put'),
    immutable('patch'),
    immutable('delete'),
    {
      method: 'post',
      path: '/signoffs/:signOffId/verify',
      access: ALL_ROLES,
      summary: 'Re-run the approved audit from the stored inputs and compare the numbers and the hash',
      handler: (req) => verifySignOff(deps, req.actor!, idParam(req.params.signOffId, 'That sign-off record')),
    },
    {
      method: 'get',
      path: '/signoffs/:signOffId/sheet.pdf',
      access: ALL_ROLES,
      summary: 'The sign-off sheet as a PDF',
      handler: async (req, res) => {
        const { pdf, fileName } = await signOffSheet(deps, req.actor!, idParam(req.params.signOffId, 'That sign-off record'));
        res.set({ 'content-type': 'application/pdf', 'content-disposition': `inline; filename="${fileName}"`, 'cache-control': 'private, no-store' });
        res.send(pdf);
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId/comments',
      access: ALL_ROLES,
      summary: 'The project’s comment thread',
      handler: async (req) => ({ comments: await listComments(ds, req.actor!, idParam(req.params.projectId, 'That project')) }),
    },
    {
      method: 'post',
      path: '/projects/:projectId/comments',
      access: ALL_ROLES,
      summary: 'Add a comment to the project’s thread',
      handler: async (req, res) => {
        const comment = await addComment(ds, req.actor!, idParam(req.params.projectId, 'That project'), createCommentSchema.parse(req.body));
        res.status(201);
        return comment;
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId/activity',
      access: STAFF,
      summary: 'The project’s history: uploads, candidates, audits, shortlists and decisions',
      handler: async (req) => {
        const projectId = idParam(req.params.projectId, 'That project');
        await loadProjectFor(ds, req.actor!, projectId, 'read');
        return { events: await listActivity(ds, req.actor!.studioId, projectId) };
      },
    },
  ];
}

import { z } from 'zod';
import { emailSchema } from './auth.schema.js';
import { scorecardSchema } from './audits.schema.js';
import { ROLES } from './roles.js';

export const SHORTLIST_MAX = 4;
export const REVIEWERS_MAX = 10;
export const RECOMMENDATION_MAX = 10_000;
export const COMMENT_MAX = 4_000;

export const ROUND_STATUSES = ['open', 'approved', 'returned'] as const;
export type RoundStatusName = (typeof ROUND_STATUSES)[number];
export const ROUND_STATUS_LABELS: Record<RoundStatusName, string> = {
  open: 'Awaiting the client',
  approved: 'Approved',
  returned: 'Returned for more work',
};

const noDuplicates = <T>(list: T[]) => new Set(list).size === list.length;

/** `POST /api/projects/:projectId/rounds` (editor, admin): shortlist, recommendation and who decides. */
export const requestSignOffSchema = z.object({
  auditId: z.number({ error: 'Choose the audit the shortlist comes from.' }).int().positive(),
  candidateIds: z
    .array(z.number().int().positive(), { error: 'Shortlist 1 to 4 candidates.' })
    .min(1, 'Shortlist at least one candidate.')
    .max(SHORTLIST_MAX, `Shortlist at most ${SHORTLIST_MAX} candidates.`)
    .refine(noDuplicates, 'A candidate is on the shortlist twice.'),
  recommendation: z
    .string({ error: 'Write a recommendation for the client.' })
    .trim()
    .min(1, 'Write a recommendation for the client.')
    .max(RECOMMENDATION_MAX, `Keep the recommendation under ${RECOMMENDATION_MAX} characters.`),
  reviewerEmails: z
    .array(emailSchema, { error: 'Add at least one reviewer’s e-mail address.' })
    .min(1, 'Add at least one reviewer’s e-mail address.')
    .max(REVIEWERS_MAX, `Send to at most ${REVIEWERS_MAX} reviewers at once.`)
    .refine(noDuplicates, 'An e-mail address is listed twice.'),
});
export type RequestSignOffInput = z.infer<typeof requestSignOffSchema>;

/** `POST /api/rounds/:roundId/approve` (the client reviewer the round was sent to). */
export const approveRoundSchema = z.object({
  candidateId: z.number({ error: 'Choose the candidate you approve.' }).int().positive(),
  signature: z
    .string({ error: 'Type your name as your signature.' })
    .trim()
    .min(1, 'Type your name as your signature.')
    .max(120, 'A signature is at most 120 characters.'),
  comment: z.string().trim().max(COMMENT_MAX, `Keep the comment under ${COMMENT_MAX} characters.`).optional(),
});
export type ApproveRoundInput = z.infer<typeof approveRoundSchema>;

/** `POST /api/rounds/:roundId/return`: a comment saying what to change is required. */
export const returnRoundSchema = z.object({
  comment: z
    .string({ error: 'Say what should change before the shortlist comes back.' })
    .trim()
    .min(1, 'Say what should change before the shortlist comes back.')
    .max(COMMENT_MAX, `Keep the comment under ${COMMENT_MAX} characters.`),
});
export type ReturnRoundInput = z.infer<typeof returnRoundSchema>;

const personRef = z.object({ id: z.number(), name: z.string() });

export const recipientSchema = z.object({
  email: z.string(),
  name: z.string().nullable(),
  /** False while an invited reviewer has not yet set their password. */
  hasAccount: z.boolean(),
});

export const roundSchema = z.object({
  id: z.number(),
  projectId: z.number(),
  roundNumber: z.number(),
  auditId: z.number(),
  status: z.enum(ROUND_STATUSES),
  candidateIds: z.array(z.number()),
  recommendation: z.string(),
  requestedBy: personRef,
  createdAt: z.string(),
  recipients: z.array(recipientSchema),
  /** The shortlisted candidates' scorecards from the round's audit, in shortlist order. */
  shortlist: z.array(scorecardSchema),
  decidedBy: personRef.nullable(),
  decidedAt: z.string().nullable(),
  decisionComment: z.string().nullable(),
  chosenCandidateId: z.number().nullable(),
  signOffId: z.number().nullable(),
});
export type RoundView = z.infer<typeof roundSchema>;

/** `GET /api/projects/:projectId/rounds`: every round, newest first, and what the viewer may do. */
export const roundListSchema = z.object({
  project: z.object({ id: z.number(), title: z.string(), clientName: z.string(), purpose: z.string(), status: z.string() }),
  rounds: z.array(roundSchema),
  /** The open round the signed-in reviewer can decide, if any. */
  decidableRoundId: z.number().nullable(),
  signOffId: z.number().nullable(),
});
export type RoundList = z.infer<typeof roundListSchema>;

/** `GET /api/review/requests` (client reviewers): rounds sent to me. */
export const reviewRequestSchema = z.object({
  roundId: z.number(),
  projectId: z.number(),
  projectTitle: z.string(),
  clientName: z.string(),
  roundNumber: z.number(),
  status: z.enum(ROUND_STATUSES),
  requestedByName: z.string(),
  createdAt: z.string(),
});
export const reviewRequestListSchema = z.object({ requests: z.array(reviewRequestSchema) });
export type ReviewRequestList = z.infer<typeof reviewRequestListSchema>;

export const signOffSchema = z.object({
  id: z.number(),
  projectId: z.number(),
  roundId: z.number(),
  auditId: z.number(),
  candidateId: z.number(),
  recordHash: z.string(),
  /** The canonical JSON exactly as hashed (its SHA-256 is recordHash). */
  recordJson: z.string(),
  reviewerName: z.string(),
  reviewerEmail: z.string(),
  signature: z.string(),
  comment: z.string().nullable(),
  approvedAt: z.string(),
  candidate: z.object({ label: z.string(), definition: z.string(), resolved: z.string(), family: z.string() }),
});
export type SignOffView = z.infer<typeof signOffSchema>;

export const metricDifferenceSchema = z.object({
  metric: z.string(),
  stored: z.unknown(),
  recomputed: z.unknown(),
});

/** `POST /api/signoffs/:id/verify`: the audit re-run from the stored inputs. */
export const verifyResultSchema = z.object({
  signOffId: z.number(),
  storedHash: z.string(),
  /** SHA-256 of the record rebuilt with the re-computed scorecard. */
  recomputedHash: z.string(),
  /** The stored JSON still hashes to the stored hash. */
  recordIntact: z.boolean(),
  /** The stored region geometry still hashes to the region hash in the record. */
  regionHashMatches: z.boolean(),
  /** Every metric re-computed equals the stored one exactly. */
  metricsMatch: z.boolean(),
  hashMatches: z.boolean(),
  engineVersion: z.object({ stored: z.string(), current: z.string() }),
  differences: z.array(metricDifferenceSchema),
  elapsedMs: z.number(),
  checkedAt: z.string(),
});
export type VerifyResult = z.infer<typeof verifyResultSchema>;

/** `POST /api/projects/:projectId/comments`. */
export const createCommentSchema = z.object({
  body: z
    .string({ error: 'Write a comment first.' })
    .trim()
    .min(1, 'Write a comment first.')
    .max(COMMENT_MAX, `Keep a comment under ${COMMENT_MAX} characters.`),
});
export type CreateCommentInput = z.infer<typeof createCommentSchema>;

export const commentSchema = z.object({
  id: z.number(),
  authorId: z.number(),
  authorName: z.string(),
  authorRole: z.enum(ROLES),
  body: z.string(),
  createdAt: z.string(),
});
export type CommentView = z.infer<typeof commentSchema>;
export const commentListSchema = z.object({ comments: z.array(commentSchema) });

export const activitySchema = z.object({
  id: z.number(),
  kind: z.string(),
  summary: z.string(),
  actorName: z.string(),
  actorRole: z.string(),
  details: z.unknown().nullable(),
  createdAt: z.string(),
});
export type ActivityView = z.infer<typeof activitySchema>;
export const activityListSchema = z.object({ events: z.array(activitySchema) });

import { z } from 'zod';

export const AUDIT_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type AuditStatusName = (typeof AUDIT_STATUSES)[number];

/** Per-sample fields a heatmap can show. */
export const HEATMAP_FIELDS = ['areal-scale', 'angular-deformation', 'scale-error'] as const;
export type HeatmapField = (typeof HEATMAP_FIELDS)[number];

export const SAMPLES_DEFAULT = 20_000;
export const SAMPLES_MIN = 1_000;
export const SAMPLES_MAX = 1_000_000;

/** `POST /api/projects/:projectId/audits` — every candidate of the project when candidateIds is left out. */
export const startAuditSchema = z.object({
  candidateIds: z.array(z.number().int().positive()).min(1, 'Choose at least one candidate.').max(50).optional(),
  samples: z
    .number()
    .int('The sample count must be a whole number.')
    .min(SAMPLES_MIN, `Use at least ${SAMPLES_MIN} samples.`)
    .max(SAMPLES_MAX, `Use at most ${SAMPLES_MAX} samples.`)
    .optional(),
  seed: z.number().int().min(0).max(2 ** 31 - 1).optional(),
});
export type StartAuditInput = z.infer<typeof startAuditSchema>;

/** One candidate's metrics; the names follow the engine's scorecard. */
export const scorecardMetricsSchema = z.record(z.string(), z.unknown());

export const scorecardSchema = z.object({
  candidateId: z.number(),
  label: z.string(),
  family: z.string(),
  definition: z.string(),
  resolved: z.string(),
  metrics: scorecardMetricsSchema,
});
export type ScorecardView = z.infer<typeof scorecardSchema>;

export const auditSettingsSchema = z.object({
  samples: z.number(),
  seed: z.number(),
});

export const auditSummarySchema = z.object({
  id: z.number(),
  projectId: z.number(),
  regionId: z.number(),
  candidateIds: z.array(z.number()),
  status: z.enum(AUDIT_STATUSES),
  progress: z.number(),
  error: z.string().nullable(),
  settings: auditSettingsSchema,
  engineVersion: z.string(),
  inputHash: z.string(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type AuditSummary = z.infer<typeof auditSummarySchema>;

/** `GET /api/audits/:auditId`. */
export const auditDetailSchema = auditSummarySchema.extend({
  purpose: z.string(),
  scorecards: z.array(scorecardSchema),
});
export type AuditDetail = z.infer<typeof auditDetailSchema>;

export const auditListSchema = z.object({ audits: z.array(auditSummarySchema) });
export type AuditList = z.infer<typeof auditListSchema>;

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

/** `GET …/heatmap/:field.png` query. */
export const heatmapQuerySchema = z.object({
  size: z.coerce
    .number()
    .int('The image size must be a whole number of pixels.')
    .min(64, 'The image must be at least 64 pixels wide.')
    .max(2048, 'The image can be at most 2048 pixels wide.')
    .default(512),
});

export const heatmapFieldSchema = z.enum(HEATMAP_FIELDS, {
  error: () => `Choose one of the fields: ${HEATMAP_FIELDS.join(', ')}.`,
});

/** `GET …/heatmap/:field/legend`. */
export const legendSchema = z.object({
  field: z.enum(HEATMAP_FIELDS),
  label: z.string(),
  units: z.string(),
  explanation: z.string(),
  scale: z.enum(['log', 'linear']),
  domain: z.tuple([z.number(), z.number()]),
  stops: z.array(z.object({ t: z.number(), color: z.string(), value: z.number(), text: z.string() })),
});
export type LegendView = z.infer<typeof legendSchema>;

/** A polyline in overlay units: the square frame shared with the heatmap, 0–1000 on both axes, y down. */
const polyline = z.array(z.tuple([z.number(), z.number()]));

/** `GET /api/audits/:auditId/candidates/:candidateId/overlay`. */
export const overlaySchema = z.object({
  candidateId: z.number(),
  /** Projected metres of the frame: u = (x − cx)/span + ½, v = ½ − (y − cy)/span, × 1000 for the SVG. */
  frame: z.object({ cx: z.number(), cy: z.number(), span: z.number() }),
  viewBoxSize: z.number(),
  outline: z.array(polyline),
  graticule: z.object({
    intervalDeg: z.number(),
    lines: z.array(z.object({ kind: z.enum(['meridian', 'parallel']), valueDeg: z.number(), parts: z.array(polyline) })),
  }),
  tissot: z.array(
    z.object({
      lonDeg: z.number(),
      latDeg: z.number(),
      cx: z.number(),
      cy: z.number(),
      rx: z.number(),
      ry: z.number(),
      /** Rotation of the major axis for SVG (degrees, clockwise from +x on screen). */
      rotateDeg: z.number(),
      a: z.number(),
      b: z.number(),
      s: z.number(),
      omegaDeg: z.number(),
    }),
  ),
  worst: z.array(
    z.object({
      kind: z.enum(['areal-scale', 'angular-deformation', 'scale-error']),
      lonDeg: z.number(),
      latDeg: z.number(),
      x: z.number(),
      y: z.number(),
      value: z.number(),
      text: z.string(),
    }),
  ),
});
export type OverlayView = z.infer<typeof overlaySchema>;

const lonLatText = z
  .string({ error: 'Give the place as "longitude,latitude" in degrees.' })
  .transform((v, ctx) => {
    const parts = v.split(',').map((p) => Number(p.trim()));
    if (parts.length !== 2 || parts.some((p) => !Number.isFinite(p))) {
      ctx.addIssue({ code: 'custom', message: 'Give the place as "longitude,latitude" in degrees, e.g. -70.6,-33.4.' });
      return z.NEVER;
    }
    const [lon, lat] = parts;
    if (lon < -180 || lon > 180) ctx.addIssue({ code: 'custom', message: `Longitude ${lon} is outside −180…180°.` });
    if (lat < -90 || lat > 90) ctx.addIssue({ code: 'custom', message: `Latitude ${lat} is outside −90…90°.` });
    return [lon, lat] as [number, number];
  });

/** `GET …/route?from=lon,lat&to=lon,lat`. */
export const routeQuerySchema = z.object({ from: lonLatText, to: lonLatText });

export const routeLineSchema = z.object({
  kind: z.enum(['great-circle', 'rhumb']),
  /** Length on the WGS84 ellipsoid (GeographicLib): the geodesic for the great circle, the summed rhumb line for the rhumb. */
  groundLengthM: z.number(),
  /** Length of the drawn line on the map in projected metres. */
  projectedLengthM: z.number(),
  /** projectedLengthM × the candidate's best uniform scale for the region. */
  scaledLengthM: z.number(),
  /** scaledLengthM / groundLengthM − 1. */
  relativeError: z.number(),
  /** False when the line crosses a break of the projection (its length then sums the pieces). */
  continuous: z.boolean(),
  pointsLonLat: polyline,
  pointsM: polyline,
  parts: z.array(polyline),
});
export type RouteLineView = z.infer<typeof routeLineSchema>;

export const routeSchema = z.object({
  candidateId: z.number(),
  from: z.tuple([z.number(), z.number()]),
  to: z.tuple([z.number(), z.number()]),
  bestScale: z.number(),
  lines: z.array(routeLineSchema),
});
export type RouteView = z.infer<typeof routeSchema>;

import { z } from 'zod';

/** What the map is for; drives which ranking of candidates fits. */
export const MAP_PURPOSES = ['equal-area', 'conformal', 'reference', 'equidistant'] as const;
export type MapPurposeName = (typeof MAP_PURPOSES)[number];
export const PURPOSE_LABELS: Record<MapPurposeName, string> = {
  'equal-area': 'Equal-area thematic',
  conformal: 'Conformal / navigation',
  reference: 'General reference',
  equidistant: 'Distance from a centre',
};

/** The output scale band of the finished map. */
export const SCALE_BANDS = ['world', 'continent', 'country', 'province', 'city'] as const;
export type ScaleBandName = (typeof SCALE_BANDS)[number];
export const SCALE_BAND_LABELS: Record<ScaleBandName, string> = {
  world: 'World',
  continent: 'Continent',
  country: 'Country',
  province: 'Province / state',
  city: 'City',
};

export const PROJECT_STATUSES = ['draft', 'auditing', 'in-review', 'returned', 'signed-off'] as const;
export type ProjectStatusName = (typeof PROJECT_STATUSES)[number];
export const STATUS_LABELS: Record<ProjectStatusName, string> = {
  draft: 'Draft',
  auditing: 'Auditing',
  'in-review': 'In review',
  returned: 'Returned',
  'signed-off': 'Signed off',
};

export const PROJECT_SORTS = ['updated', 'title', 'status'] as const;
export type ProjectSort = (typeof PROJECT_SORTS)[number];

const text = (what: string, max: number) =>
  z
    .string({ error: `${what} is required.` })
    .trim()
    .min(1, `${what} is required.`)
    .max(max, `${what} is at most ${max} characters.`);

/** `POST /api/projects`. */
export const createProjectSchema = z.object({
  title: text('A title', 160),
  clientName: text('The client’s name', 160),
  purpose: z.enum(MAP_PURPOSES, { error: 'Choose the map’s purpose.' }),
  scaleBand: z.enum(SCALE_BANDS, { error: 'Choose the output scale band.' }),
  notes: z.string().trim().max(5000, 'Notes are at most 5000 characters.').nullish(),
});
export type CreateProjectInput = z.infer<typeof createProjectSchema>;

/** `PATCH /api/projects/:projectId` — any subset of the fields. */
export const updateProjectSchema = createProjectSchema
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change.' });
export type UpdateProjectInput = z.infer<typeof updateProjectSchema>;

/** Query of `GET /api/projects`. */
export const listProjectsQuerySchema = z.object({
  q: z.string().trim().max(100, 'Search for at most 100 characters.').optional(),
  status: z.enum(PROJECT_STATUSES, { error: 'Unknown status filter.' }).optional(),
  purpose: z.enum(MAP_PURPOSES, { error: 'Unknown purpose filter.' }).optional(),
  sort: z.enum(PROJECT_SORTS, { error: 'Sort by updated, title or status.' }).default('updated'),
  dir: z.enum(['asc', 'desc'], { error: 'Direction is asc or desc.' }).optional(),
});
export type ListProjectsQuery = z.input<typeof listProjectsQuerySchema>;

export const projectSchema = z.object({
  id: z.number(),
  title: z.string(),
  clientName: z.string(),
  purpose: z.enum(MAP_PURPOSES),
  scaleBand: z.enum(SCALE_BANDS),
  status: z.enum(PROJECT_STATUSES),
  notes: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** The region audits use now, in brief. */
  region: z.object({ id: z.number(), name: z.string(), areaKm2: z.number() }).nullable(),
  candidateCount: z.number(),
  auditCount: z.number(),
});
export type ProjectView = z.infer<typeof projectSchema>;

export const projectListSchema = z.object({ projects: z.array(projectSchema) });
export type ProjectList = z.infer<typeof projectListSchema>;

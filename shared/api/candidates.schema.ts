import { z } from 'zod';

export const CANDIDATE_ORIGINS = ['proposed', 'optimised', 'entered'] as const;
export type CandidateOrigin = (typeof CANDIDATE_ORIGINS)[number];

/** Families whose parameters the optimiser searches (kept equal to the engine's list by a unit test). */
export const OPTIMISABLE_FAMILIES = ['lcc', 'aea', 'eqdc', 'laea', 'aeqd', 'stere', 'tmerc', 'merc', 'cea', 'eqc'] as const;
export type OptimisableFamily = (typeof OPTIMISABLE_FAMILIES)[number];
export const OPTIMISABLE_FAMILY_LABELS: Record<OptimisableFamily, string> = {
  lcc: 'Lambert conformal conic — standard parallels',
  aea: 'Albers equal-area conic — standard parallels',
  eqdc: 'Equidistant conic — standard parallels',
  laea: 'Lambert azimuthal equal-area — centre',
  aeqd: 'Azimuthal equidistant — centre',
  stere: 'Stereographic — centre and scale factor',
  tmerc: 'Transverse Mercator — central meridian and scale factor',
  merc: 'Mercator — latitude of true scale',
  cea: 'Cylindrical equal-area — standard parallel',
  eqc: 'Equirectangular — standard parallel',
};

/** What the optimiser minimises (kept equal to the engine's list by a unit test). */
export const OPTIMISE_CRITERIA = ['airy-kavrayskiy', 'areal', 'angular', 'distance'] as const;
export type OptimiseCriterion = (typeof OPTIMISE_CRITERIA)[number];
export const CRITERION_LABELS: Record<OptimiseCriterion, { label: string; unit: string; explain: string }> = {
  'airy-kavrayskiy': {
    label: 'Overall distortion (Airy–Kavrayskiy)',
    unit: '',
    explain: 'Root mean square of the logarithms of the largest and smallest scale at each point: areas and angles together.',
  },
  areal: { label: 'Area distortion', unit: '', explain: 'Root mean square of the logarithm of the areal scale: how far areas are from true.' },
  angular: { label: 'Angular deformation', unit: '°', explain: 'Mean largest angle error at a point, in degrees: how much local shapes are bent.' },
  distance: {
    label: 'Distance error',
    unit: '',
    explain: 'Mean relative error of straight-line map distances against the true (geodesic) ones, after the best uniform rescale.',
  },
};

const definitionText = z
  .string({ error: 'Enter an EPSG code, a PROJ string or WKT.' })
  .trim()
  .min(1, 'Enter an EPSG code, a PROJ string or WKT.')
  .max(20_000, 'A definition is at most 20 000 characters.');

/** `POST /api/definitions/resolve`. */
export const resolveDefinitionSchema = z.object({ definition: definitionText });

export const resolvedDefinitionSchema = z.object({
  kind: z.enum(['proj', 'epsg', 'wkt']),
  label: z.string(),
  /** A PROJ string equivalent to the definition. */
  resolved: z.string(),
  family: z.object({ id: z.string(), title: z.string(), class: z.string(), property: z.string() }),
  ellipsoid: z.object({ semiMajorAxisM: z.number(), inverseFlattening: z.number().nullable() }),
  params: z.record(z.string(), z.number().optional()),
});
export type ResolvedDefinitionView = z.infer<typeof resolvedDefinitionSchema>;

/** `POST /api/projects/:projectId/candidates`. */
export const createCandidateSchema = z.object({
  definition: definitionText,
  label: z.string().trim().max(160, 'A label is at most 160 characters.').optional(),
  origin: z.enum(CANDIDATE_ORIGINS, { error: 'Origin is proposed, optimised or entered.' }).default('entered'),
  reason: z.string().trim().max(500, 'A reason is at most 500 characters.').optional(),
  params: z.record(z.string(), z.number()).optional(),
});
export type CreateCandidateInput = z.input<typeof createCandidateSchema>;

/** `PATCH /api/projects/:projectId/candidates/:candidateId`. */
export const updateCandidateSchema = z.object({
  label: z.string({ error: 'Enter a label.' }).trim().min(1, 'Enter a label.').max(160, 'A label is at most 160 characters.'),
});
export type UpdateCandidateInput = z.infer<typeof updateCandidateSchema>;

export const candidateSchema = z.object({
  id: z.number(),
  projectId: z.number(),
  label: z.string(),
  definition: z.string(),
  resolved: z.string(),
  family: z.string(),
  familyTitle: z.string(),
  origin: z.enum(CANDIDATE_ORIGINS),
  reason: z.string().nullable(),
  params: z.record(z.string(), z.unknown()).nullable(),
  createdAt: z.string(),
});
export type CandidateView = z.infer<typeof candidateSchema>;
export const candidateListSchema = z.object({ candidates: z.array(candidateSchema) });
export type CandidateList = z.infer<typeof candidateListSchema>;

/** `GET /api/projects/:projectId/proposals` — empty with regionId null before a region is uploaded. */
export const proposalListSchema = z.object({
  regionId: z.number().nullable(),
  purpose: z.string(),
  proposals: z.array(
    z.object({
      label: z.string(),
      definition: z.string(),
      family: z.string(),
      reason: z.string(),
      /** The id of the project's candidate with the same resolved definition, if it was added. */
      candidateId: z.number().nullable(),
    }),
  ),
});
export type ProposalList = z.infer<typeof proposalListSchema>;

/** `POST /api/projects/:projectId/optimise`. */
export const optimiseSchema = z.object({
  family: z.enum(OPTIMISABLE_FAMILIES, { error: `Choose a family the optimiser can tune (${OPTIMISABLE_FAMILIES.join(', ')}).` }),
  criterion: z.enum(OPTIMISE_CRITERIA, { error: `Choose what to minimise (${OPTIMISE_CRITERIA.join(', ')}).` }),
});
export type OptimiseInput = z.infer<typeof optimiseSchema>;

export const optimiseResultSchema = z.object({
  family: z.string(),
  criterion: z.enum(OPTIMISE_CRITERIA),
  /** The tuned definition: add it with POST candidates and origin "optimised". */
  definition: z.string(),
  label: z.string(),
  params: z.record(z.string(), z.number()),
  metric: z.number(),
  baseline: z.object({ definition: z.string(), params: z.record(z.string(), z.number()), metric: z.number() }),
  /** 100 · (baseline − optimum) / baseline. */
  gainPct: z.number(),
  evaluations: z.number(),
  samples: z.number(),
  regionId: z.number(),
});
export type OptimiseResultView = z.infer<typeof optimiseResultSchema>;

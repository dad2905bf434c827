import { z } from 'zod';

export const REGION_FORMATS = ['shapefile', 'geojson', 'topojson'] as const;
export type RegionFormat = (typeof REGION_FORMATS)[number];

/** Upload bounds the client checks before sending (the server enforces them too). */
export const REGION_UPLOAD_MAX_BYTES = 25 * 1024 * 1024;
export const REGION_FILE_ACCEPT = '.zip,.geojson,.json,.topojson';

/** One feature of an uploaded file, for the picker. */
export const regionFeatureSummarySchema = z.object({
  index: z.number(),
  name: z.string(),
  partCount: z.number(),
  vertexCount: z.number(),
  areaKm2: z.number(),
});
export type RegionFeatureSummary = z.infer<typeof regionFeatureSummarySchema>;

/** What validation found and fixed in the picked features (merged). */
export const regionReportSchema = z.object({
  format: z.enum(REGION_FORMATS),
  featureCount: z.number(),
  pickedFeatures: z.array(z.number()),
  partCount: z.number(),
  holeCount: z.number(),
  vertexCount: z.number(),
  /** Geodesic area on WGS84. */
  areaKm2: z.number(),
  /** [west, south, east, north]; west > east across the antimeridian. */
  bbox: z.tuple([z.number(), z.number(), z.number(), z.number()]),
  crossesAntimeridian: z.boolean(),
  poles: z.array(z.enum(['north', 'south'])),
  ringsRewound: z.number(),
  ringsClosed: z.number(),
  duplicatePointsRemoved: z.number(),
  degenerateRingsDropped: z.number(),
  /** Rings cut along ±180° (RFC 7946 §3.1.9). */
  ringsSplitAtAntimeridian: z.number(),
  /** Rings going round a pole, closed along ±180° and the pole line as the cap's border. */
  polarRingsClosed: z.number(),
  selfIntersections: z.object({ count: z.number(), sample: z.array(z.tuple([z.number(), z.number()])) }),
  notes: z.array(z.string()),
});
export type RegionReport = z.infer<typeof regionReportSchema>;

/** `POST /api/projects/:projectId/regions/inspect` — stores nothing. */
export const regionInspectionSchema = z.object({
  fileName: z.string(),
  format: z.enum(REGION_FORMATS),
  sourceCrs: z.string(),
  features: z.array(regionFeatureSummarySchema),
  /** The report for all features together. */
  report: regionReportSchema,
});
export type RegionInspection = z.infer<typeof regionInspectionSchema>;

/**
 * The `features` form field of `POST /api/projects/:projectId/regions`: "all", or the indexes
 * (from the inspection) of the features to merge into the region, comma-separated.
 */
export const featurePickSchema = z
  .string()
  .trim()
  .default('all')
  .transform((v, ctx): 'all' | number[] => {
    if (v === '' || v.toLowerCase() === 'all') return 'all';
    const parts = v.split(',').map((x) => x.trim());
    if (parts.some((x) => !/^\d{1,7}$/.test(x))) {
      ctx.addIssue({ code: 'custom', message: 'Pick features as "all" or a list of numbers such as "0,2,5".' });
      return z.NEVER;
    }
    return [...new Set(parts.map(Number))].sort((a, b) => a - b);
  });
export type FeaturePick = z.output<typeof featurePickSchema>;

/** The non-file form fields of the store upload. */
export const storeRegionFieldsSchema = z.object({
  features: featurePickSchema,
  /** A name for the region; by default the picked features' names. */
  name: z.string().trim().max(200, 'A region name is at most 200 characters.').optional(),
});

export const regionSchema = z.object({
  id: z.number(),
  projectId: z.number(),
  name: z.string(),
  sourceFileName: z.string(),
  sourceFormat: z.enum(REGION_FORMATS),
  sourceCrs: z.string(),
  sha256: z.string(),
  areaKm2: z.number(),
  bbox: z.tuple([z.number(), z.number(), z.number(), z.number()]),
  vertexCount: z.number(),
  partCount: z.number(),
  holeCount: z.number(),
  report: regionReportSchema,
  isCurrent: z.boolean(),
  createdAt: z.string(),
});
export type RegionView = z.infer<typeof regionSchema>;

/** The current region with its geometry (GeoJSON Polygon or MultiPolygon, RFC 7946 winding). */
export const regionWithGeometrySchema = regionSchema.extend({
  geometry: z.object({
    type: z.enum(['Polygon', 'MultiPolygon']),
    coordinates: z.array(z.any()),
  }),
});
export type RegionWithGeometry = z.infer<typeof regionWithGeometrySchema>;

export const regionListSchema = z.object({ regions: z.array(regionSchema) });
export type RegionList = z.infer<typeof regionListSchema>;

/** `GET /api/projects/:projectId/region` — null before the first upload. */
export const currentRegionSchema = z.object({ region: regionWithGeometrySchema.nullable() });
export type CurrentRegion = z.infer<typeof currentRegionSchema>;

/**
 * Warpmeter's distortion engine: pure functions of numbers and GeoJSON, no I/O, usable in the
 * server, worker threads, the CLI and the browser. Radians inside, degrees at this edge.
 *
 * Definitions
 *   resolveDefinition(def: string): ResolvedDefinition        PROJ string | "EPSG:n" | WKT → family, ellipsoid, params, label
 *   resolveDefinitionWith(def, lookupEpsg?)                   the same without loading the 8 MB EPSG index
 * Factors (Tissot indicatrix, Snyder 1987 eqs. 4-9 to 4-12)
 *   factorsAt(resolved, lonDeg, latDeg): PointFactors | { defined: false }
 *   createFactorEvaluator(resolved): FactorEvaluator          compiled; factorsBatchDeg(lon[], lat[], out) for many points
 *   projectPoints(resolved, lonLat[][]): [x, y][]              forward transform, metres
 * Regions and sampling
 *   regionSummary(geojson): RegionSummary                      area, bbox, parts, holes, antimeridian, pole, centre
 *   prepareRegion(geojson): PreparedRegion                     rings on one longitude frame (reuse across calls)
 *   sampleRegion(geojson | prepared, { count, seed }): RegionSamples   equal-area samples + pairs
 *   createRegionTest(prepared): (lonDeg, latDeg) => boolean    point in region (even–odd)
 * Scorecards, fields, proposals, optimiser
 *   scoreCandidate(resolved, samples, prepared?, { factors? }): CandidateMetrics
 *   computeSampleFields(resolved, samples, factors?): SampleFields   s, ω, scale error per sample (heatmaps)
 *   suggestCandidates(summary | geojson, purpose): Proposal[]  6–12 candidates with reasons
 *   optimise(geojson | prepared, family, criterion, options?): OptimiseResult
 * Routes
 *   geodesicPoints(a, b, stepKm), rhumbPoints(a, b, count), rhumbBearingDeg(a, b)
 *
 * Example:
 *   const region = prepareRegion(geojson);
 *   const samples = sampleRegion(region, { count: 20000, seed: 1 });
 *   const metrics = scoreCandidate(resolveDefinition('EPSG:3035'), samples, region);
 */
export { ENGINE_VERSION } from './version';
export { resolveDefinition, resolveDefinitionWith, type ResolvedDefinition, type ProjectionParams, type DefinitionKind, type EpsgLookup } from './definition';
export { lookupEpsg, type EpsgEntry } from './epsg';
export { FAMILIES, type FamilyInfo } from './families';
export type { Ellipsoid } from './ellipsoid';
export { factorsAt, type PointFactors, type UndefinedFactors } from './factors';
export { createFactorEvaluator, allocFactorArrays, type FactorArrays, type FactorEvaluator } from './evaluator';
export { projectPoints } from './project';
export { prepareRegion, type PreparedRegion } from './region/prepare';
export { createRegionTest } from './region/contains';
export { regionAreaM2 } from './region/area';
export { regionSummary, type RegionSummary } from './region/summary';
export type { RegionInput } from './region/geojson';
export { sampleRegion, DEFAULT_SAMPLE_COUNT, MAX_SAMPLE_COUNT, type RegionSamples, type SampleOptions } from './sampling';
export { scoreCandidate, metricsFromFields, type CandidateMetrics, type PointLocation } from './scorecard';
export { computeSampleFields, type SampleFields } from './fields';
export { suggestCandidates, MAP_PURPOSES, type MapPurpose, type Proposal } from './suggest';
export { optimise, criterionValue, CRITERIA, type Criterion, type OptimiseResult, type OptimiseOptions } from './optimise';
export { geodesicPoints, rhumbPoints, rhumbBearingDeg } from './routes';

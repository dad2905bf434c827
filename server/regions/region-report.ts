import type { Feature, MultiPolygon, Polygon } from 'geojson';
import type { RegionFeatureSummary, RegionReport } from '../../shared/api/regions.schema.js';
import { polygonsAreaKm2 } from './geodesic-area.js';
import { emptyTally, featurePolygons, vertexCountOf, type CleanTally, type PolygonRings } from './polygon-rings.js';
import type { ParsedRegionFile } from './read-upload.js';
import { invalidRegion, UPLOAD_LIMITS } from './region-errors.js';
import { regionExtent } from './region-extent.js';
import { findSelfIntersections } from './self-intersections.js';

/** A feature of the file after cleaning, ready to be picked. */
export interface CleanFeature {
  index: number;
  name: string;
  polygons: PolygonRings[];
  /** What cleaning changed in this feature. */
  tally: CleanTally;
}

const sumTallies = (tallies: CleanTally[]): CleanTally => {
  const out = emptyTally();
  for (const t of tallies) for (const k of Object.keys(out) as (keyof CleanTally)[]) out[k] += t[k];
  return out;
};

const NAME_KEYS = ['name', 'NAME', 'Name', 'NAME_EN', 'name_en', 'ADMIN', 'admin', 'NAME_LONG', 'title', 'label', 'NAMELSAD', 'STATE_NAME'];

/** A person-readable name from common attribute names, else "Feature n". */
export function featureName(f: Feature, index: number): string {
  const props = (f.properties ?? {}) as Record<string, unknown>;
  for (const k of NAME_KEYS) {
    const v = props[k];
    if (typeof v === 'string' && v.trim()) return v.trim().slice(0, 120);
  }
  if (f.id !== undefined && String(f.id).trim()) return `Feature ${String(f.id).slice(0, 40)}`;
  return `Feature ${index + 1}`;
}

/** Cleans every feature; refuses a file with no polygons at all, saying what it held instead. */
export function cleanFeatures(file: ParsedRegionFile, fileName: string): { features: CleanFeature[]; tally: CleanTally } {
  const tallies: CleanTally[] = [];
  const features: CleanFeature[] = [];
  file.features.forEach((f, index) => {
    const name = featureName(f, index);
    const tally = emptyTally();
    tallies.push(tally);
    const polygons = featurePolygons(f, `Feature ${index + 1} ("${name}")`, tally);
    if (polygons.length) features.push({ index, name, polygons, tally });
  });
  const tally = sumTallies(tallies);
  if (!features.length) {
    const kinds = [...new Set(file.features.map((f) => f.geometry?.type ?? 'empty'))].join(', ') || 'no features';
    throw invalidRegion(`${fileName} has no polygons (it holds: ${kinds}); a region must be a Polygon or MultiPolygon.`);
  }
  const vertices = features.reduce((n, f) => n + vertexCountOf(f.polygons), 0);
  if (vertices > UPLOAD_LIMITS.vertices) {
    throw invalidRegion(`${fileName} has ${vertices} vertices; simplify it to at most ${UPLOAD_LIMITS.vertices} first.`);
  }
  return { features, tally };
}

export function summariseFeature(f: CleanFeature): RegionFeatureSummary {
  return {
    index: f.index,
    name: f.name,
    partCount: f.polygons.length,
    vertexCount: vertexCountOf(f.polygons),
    areaKm2: polygonsAreaKm2(f.polygons),
  };
}

/** The stored geometry: one Polygon, or a MultiPolygon of every part picked. */
export function toGeometry(polygons: PolygonRings[]): Polygon | MultiPolygon {
  return polygons.length === 1
    ? { type: 'Polygon', coordinates: polygons[0] }
    : { type: 'MultiPolygon', coordinates: polygons };
}

/** The validation report of the picked features, merged; fixes counted in those features only. */
export function buildReport(
  file: ParsedRegionFile,
  picked: CleanFeature[],
  totalFeatures: number,
  fileTally: CleanTally,
): RegionReport {
  const tally = { ...sumTallies(picked.map((f) => f.tally)), otherGeometriesIgnored: fileTally.otherGeometriesIgnored };
  const polygons = picked.flatMap((f) => f.polygons);
  const extent = regionExtent(polygons);
  const crossings = findSelfIntersections(polygons);
  const notes = [...file.notes];
  if (file.format === 'shapefile' && tally.ringsRewound) {
    notes.push('Shapefiles list outer rings clockwise; rings were turned to GeoJSON’s counter-clockwise order.');
  }
  if (crossings.count) {
    notes.push(`${crossings.count} self-intersection(s) found; areas and samples near them may be off. Fix the boundary in a GIS if you can.`);
  }
  if (tally.ringsSplitAtAntimeridian) notes.push(`${tally.ringsSplitAtAntimeridian} ring(s) crossing ±180° were split there, as RFC 7946 asks.`);
  if (tally.polarRingsClosed) notes.push(`${tally.polarRingsClosed} ring(s) going round a pole were read as the border of the polar cap and closed through the pole.`);
  if (tally.ringsLeftAsIs) notes.push(`${tally.ringsLeftAsIs} ring(s) cross ±180° in a way we could not untangle; areas near ±180° may be off.`);
  if (tally.otherGeometriesIgnored) notes.push(`${tally.otherGeometriesIgnored} non-polygon geometr(ies) were ignored.`);
  return {
    format: file.format,
    featureCount: totalFeatures,
    pickedFeatures: picked.map((f) => f.index),
    partCount: polygons.length,
    holeCount: polygons.reduce((n, rings) => n + rings.length - 1, 0),
    vertexCount: vertexCountOf(polygons),
    areaKm2: polygonsAreaKm2(polygons),
    bbox: extent.bbox,
    crossesAntimeridian: extent.crossesAntimeridian,
    poles: extent.poles,
    ringsRewound: tally.ringsRewound,
    ringsClosed: tally.ringsClosed,
    duplicatePointsRemoved: tally.duplicatePointsRemoved,
    degenerateRingsDropped: tally.degenerateRingsDropped,
    ringsSplitAtAntimeridian: tally.ringsSplitAtAntimeridian,
    polarRingsClosed: tally.polarRingsClosed,
    selfIntersections: crossings,
    notes,
  };
}

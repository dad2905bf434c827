import type { MultiPolygon, Polygon } from 'geojson';
import type { FeaturePick, RegionFormat, RegionInspection, RegionReport } from '../../shared/api/regions.schema.js';
import { optimise, type Criterion, type OptimiseResult } from '../../shared/engine/optimise.js';
import { prepareRegion } from '../../shared/engine/region/prepare.js';
import { regionSummary } from '../../shared/engine/region/summary.js';
import { suggestCandidates, type MapPurpose, type Proposal } from '../../shared/engine/suggest.js';
import { checkRegionFile, inspection, pickedReport, pickFeatures, regionName } from '../regions/inspect-file.js';
import { toGeometry } from '../regions/region-report.js';

/**
 * CPU-heavy work kept off the request thread: reading and checking an uploaded region (parsing,
 * geodesic areas, crossing search: up to seconds for a detailed country), proposals
 * (regionSummary samples the region) and optimisation (~50 scorings).
 */
export type EngineTask =
  | { kind: 'inspect-region'; file: Uint8Array; fileName: string }
  | { kind: 'read-region'; file: Uint8Array; fileName: string; pick: FeaturePick }
  | { kind: 'suggest'; geometry: Polygon | MultiPolygon; purpose: MapPurpose }
  | { kind: 'optimise'; geometry: Polygon | MultiPolygon; family: string; criterion: Criterion; samples: number; seed: number };

/** A region read for storing: everything the Region row needs apart from ids. */
export interface ReadRegion {
  name: string;
  format: RegionFormat;
  sourceCrs: string;
  geometry: Polygon | MultiPolygon;
  report: RegionReport;
}

export type EngineTaskResult =
  | { kind: 'inspect-region'; inspection: RegionInspection }
  | { kind: 'read-region'; region: ReadRegion }
  | { kind: 'suggest'; proposals: Proposal[] }
  | { kind: 'optimise'; result: OptimiseResult };

/** Runs one task; pure apart from CPU time, so it runs the same in a worker thread or inline. */
export async function runEngineTask(task: EngineTask): Promise<EngineTaskResult> {
  switch (task.kind) {
    case 'inspect-region': {
      const checked = await checkRegionFile(Buffer.from(task.file.buffer, task.file.byteOffset, task.file.byteLength), task.fileName);
      return { kind: 'inspect-region', inspection: inspection(checked) };
    }
    case 'read-region': {
      const checked = await checkRegionFile(Buffer.from(task.file.buffer, task.file.byteOffset, task.file.byteLength), task.fileName);
      const picked = pickFeatures(checked, task.pick);
      const region: ReadRegion = {
        name: regionName(picked),
        format: checked.file.format,
        sourceCrs: checked.file.sourceCrs,
        geometry: toGeometry(picked.flatMap((f) => f.polygons)),
        report: pickedReport(checked, picked),
      };
      return { kind: 'read-region', region };
    }
    case 'suggest':
      return { kind: 'suggest', proposals: suggestCandidates(regionSummary(prepareRegion(task.geometry)), task.purpose) };
    case 'optimise':
      return {
        kind: 'optimise',
        result: optimise(prepareRegion(task.geometry), task.family, task.criterion, { samples: task.samples, seed: task.seed }),
      };
  }
}

/** What services ask to run tasks: the worker thread in the app, inline in the demo seeding and the CLI. */
export interface EngineRunner {
  run<K extends EngineTask['kind']>(task: Extract<EngineTask, { kind: K }>): Promise<Extract<EngineTaskResult, { kind: K }>>;
}

export const inlineRunner: EngineRunner = {
  run: (task) => runEngineTask(task) as never,
};

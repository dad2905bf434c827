import type { MultiPolygon, Polygon } from 'geojson';
import { optimise, prepareRegion, regionSummary, suggestCandidates, type Criterion, type MapPurpose, type OptimiseResult, type Proposal } from '../../shared/engine/index.js';

/** Engine work too slow for the request thread (regionSummary samples the region; optimise runs ~50 scorings). */
export type EngineTask =
  | { kind: 'suggest'; geometry: Polygon | MultiPolygon; purpose: MapPurpose }
  | { kind: 'optimise'; geometry: Polygon | MultiPolygon; family: string; criterion: Criterion; samples: number; seed: number };

export type EngineTaskResult = { kind: 'suggest'; proposals: Proposal[] } | { kind: 'optimise'; result: OptimiseResult };

/** Runs one task; pure apart from CPU time, so it can run in a worker thread or inline. */
export function runEngineTask(task: EngineTask): EngineTaskResult {
  const region = prepareRegion(task.geometry);
  if (task.kind === 'suggest') return { kind: 'suggest', proposals: suggestCandidates(regionSummary(region), task.purpose) };
  return {
    kind: 'optimise',
    result: optimise(region, task.family, task.criterion, { samples: task.samples, seed: task.seed }),
  };
}

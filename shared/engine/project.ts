import { DEG_TO_RAD } from './constants';
import type { ResolvedDefinition } from './definition';
import { createFactorEvaluator, type FactorEvaluator } from './evaluator';

/**
 * Projects [lon, lat] points (degrees) to [x, y] metres (false origin included) with the
 * definition's forward transform; [NaN, NaN] where it is undefined.
 * Example: projectPoints(resolveDefinition('+proj=merc +R=1'), [[0, 0]]) → [[0, 0]].
 */
export function projectPoints(resolved: ResolvedDefinition | FactorEvaluator, lonLat: readonly (readonly number[])[]): [number, number][] {
  const ev = 'forward' in resolved ? resolved : createFactorEvaluator(resolved);
  const xy = new Float64Array(2);
  return lonLat.map(([lon, lat]) => {
    ev.forward(lon * DEG_TO_RAD, lat * DEG_TO_RAD, xy);
    return Number.isFinite(xy[0]) && Number.isFinite(xy[1]) ? [xy[0], xy[1]] : [NaN, NaN];
  });
}

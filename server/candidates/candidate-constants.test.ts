import { describe, expect, it } from 'vitest';
import { OPTIMISABLE_FAMILIES, OPTIMISE_CRITERIA } from '../../shared/api/candidates.schema.js';
import { CRITERIA, FAMILIES, optimise, prepareRegion, regionSummary, resolveDefinition, suggestCandidates, MAP_PURPOSES } from '../../shared/engine/index.js';
import { MAP_PURPOSES as API_PURPOSES } from '../../shared/api/projects.schema.js';
import { checkDefinitionSanity } from './definition-checks.js';

const square = (w: number, s: number, e: number, n: number) => ({
  type: 'Polygon' as const,
  coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]],
});

describe('the API lists agree with the engine', () => {
  it('criteria and purposes', () => {
    expect([...OPTIMISE_CRITERIA].sort()).toEqual([...CRITERIA].sort());
    expect([...API_PURPOSES].sort()).toEqual([...MAP_PURPOSES].sort());
  });

  it('every family offered for optimisation is one the optimiser searches, and others are refused', () => {
    const region = prepareRegion(square(-95, 40, -80, 48));
    for (const family of OPTIMISABLE_FAMILIES) {
      expect(FAMILIES[family], family).toBeDefined();
      expect(() => optimise(region, family, 'angular', { samples: 200, maxEvaluations: 2 }), family).not.toThrow();
    }
    expect(() => optimise(region, 'robin', 'angular', { samples: 200, maxEvaluations: 2 })).toThrow(/no parameter search/);
  });

  it('every proposal passes our definition checks, for regions of several shapes', () => {
    const regions = [square(-95, 40, -80, 48), square(-80, -55, -65, 10), square(-180, 70, 180, 90), square(-170, -60, 170, 75), square(5, -2, 8, 2)];
    for (const g of regions) {
      const summary = regionSummary(g);
      for (const purpose of MAP_PURPOSES) {
        for (const p of suggestCandidates(summary, purpose)) {
          expect(() => checkDefinitionSanity(resolveDefinition(p.definition)), p.definition).not.toThrow();
        }
      }
    }
  });
});

describe('definition checks', () => {
  it('refuse numbers proj4 lets through', () => {
    const check = (d: string) => () => checkDefinitionSanity(resolveDefinition(d));
    expect(check('+proj=merc +lat_ts=abc')).toThrow(/\+lat_ts=abc is not a number/);
    expect(check('+proj=lcc +lat_1=33 +lat_2=95')).toThrow(/\+lat_2=95 is not a latitude/);
    expect(check('+proj=stere +lat_0=90 +k_0=-1')).toThrow(/must be positive/);
    expect(check('EPSG:32633')).not.toThrow();
    expect(check('+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96')).not.toThrow();
  });
});

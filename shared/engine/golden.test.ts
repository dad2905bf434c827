/**
 * Golden scorecards: fixtures/regions/engine-*.geojson in, fixtures/golden/engine-*.json out.
 * Rewrite the expected files only on purpose, with UPDATE_GOLDEN=1, and review the diff.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resolveDefinition } from './definition';
import type { RegionFeature } from './region/geojson';
import { prepareRegion } from './region/prepare';
import { regionSummary } from './region/summary';
import { sampleRegion } from './sampling';
import { scoreCandidate } from './scorecard';
import { suggestCandidates } from './suggest';
import { ENGINE_VERSION } from './version';

const root = new URL('../../fixtures/', import.meta.url);
const CASES: [string, string[]][] = [
  ['italy', ['EPSG:3035', '+proj=tmerc +lon_0=12 +k_0=0.9996', '+proj=lcc +lat_1=38.5 +lat_2=45 +lon_0=12']],
  ['fiji', ['+proj=utm +zone=60 +south', '+proj=merc +lon_0=178']],
  ['antarctica', ['EPSG:3031', '+proj=laea +lat_0=-90']],
];

function compute(name: string, defs: string[]) {
  const geojson = JSON.parse(readFileSync(new URL(`regions/engine-${name}.geojson`, root), 'utf8')) as RegionFeature;
  const region = prepareRegion(geojson);
  const samples = sampleRegion(region, { count: 5000, seed: 1, pairs: 500 });
  const summary = regionSummary(region);
  return {
    engineVersion: ENGINE_VERSION,
    region: { ...summary, samples: samples.count },
    proposals: suggestCandidates(summary, 'reference').map((p) => p.definition),
    candidates: defs.map((d) => ({ definition: d, metrics: scoreCandidate(resolveDefinition(d), samples, region) })),
  };
}

/** Compares numbers to 1e-9 relative, everything else exactly. */
function close(actual: unknown, expected: unknown, path = ''): void {
  if (typeof expected === 'number' && typeof actual === 'number') {
    if (Number.isNaN(expected)) return expect(actual, path).toBeNaN();
    expect(Math.abs(actual - expected), path).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
  } else if (expected && typeof expected === 'object') {
    expect(Object.keys(actual as object).sort(), path).toEqual(Object.keys(expected).sort());
    for (const k of Object.keys(expected)) close((actual as Record<string, unknown>)[k], (expected as Record<string, unknown>)[k], `${path}.${k}`);
  } else expect(actual, path).toEqual(expected);
}

describe('golden scorecards', () => {
  it.each(CASES)('%s', (name, defs) => {
    const file = new URL(`golden/engine-${name}.json`, root);
    const actual = JSON.parse(JSON.stringify(compute(name, defs)));
    if (process.env.UPDATE_GOLDEN === '1' || !existsSync(file)) {
      if (process.env.UPDATE_GOLDEN !== '1') throw new Error(`missing ${file.pathname}: run with UPDATE_GOLDEN=1 and review`);
      mkdirSync(new URL('golden/', root), { recursive: true });
      writeFileSync(file, `${JSON.stringify(actual, null, 2)}\n`);
      return;
    }
    close(actual, JSON.parse(readFileSync(file, 'utf8')));
  });
});

/** The worker pool gives exactly the in-process factors, in input order, and is reusable. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resolveDefinition } from '../../shared/engine/definition';
import { allocFactorArrays, createFactorEvaluator } from '../../shared/engine/evaluator';
import { prepareRegion } from '../../shared/engine/region/prepare';
import { sampleRegion } from '../../shared/engine/sampling';
import { scoreCandidate } from '../../shared/engine/scorecard';
import { FactorPool } from './pool';

let pool: FactorPool;
beforeAll(async () => {
  pool = await FactorPool.start(2);
}, 60_000);
afterAll(() => pool?.close());

describe('FactorPool', () => {
  it('matches in-process factors bit for bit, over several jobs', async () => {
    const n = 30_000;
    const lon = Float64Array.from({ length: n }, (_, i) => ((i * 0.618034) % 1) * 60 - 10);
    const lat = Float64Array.from({ length: n }, (_, i) => ((i * 0.754878) % 1) * 40 + 30);
    for (const def of ['EPSG:3035', '+proj=tmerc +lon_0=10', '+proj=merc']) {
      const r = resolveDefinition(def);
      const expected = allocFactorArrays(n);
      createFactorEvaluator(r).factorsBatchDeg(lon, lat, expected);
      const got = await pool.factors(r, lon, lat);
      expect(Array.from(got.s)).toEqual(Array.from(expected.s));
      expect(Array.from(got.omegaDeg)).toEqual(Array.from(expected.omegaDeg));
    }
  });
  it('scores a candidate in a worker exactly as in process', async () => {
    const region = prepareRegion({ type: 'Polygon', coordinates: [[[-10, 35], [30, 35], [30, 60], [-10, 60], [-10, 35]]] });
    const samples = sampleRegion(region, { count: 3000, seed: 2, pairs: 300 });
    const r = resolveDefinition('+proj=lcc +lat_1=40 +lat_2=55 +lon_0=10');
    expect(await pool.score(r, samples, region)).toEqual(scoreCandidate(r, samples, region));
  });
  it('processes text lines and reports bad ones with their line numbers', async () => {
    const r = await pool.factorLines(resolveDefinition('+proj=merc +R=1'), '10 0\nnot a point\n0 90\n');
    expect(new TextDecoder().decode(r.out)).toBe('1\t1\t1\t0\t1\t1\nnan\tnan\tnan\tnan\tnan\tnan\n');
    expect(r.errors).toEqual([{ line: 2, message: expect.stringContaining('not a number') }]);
    expect(r.lines).toBe(3);
  });
});

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
  it('samples an audit region in every worker and scores its candidates there exactly as in process, with block progress', async () => {
    const geometry = { type: 'Polygon' as const, coordinates: [[[-10, 35], [30, 35], [30, 60], [-10, 60], [-10, 35]]] };
    const region = prepareRegion(geometry);
    const expectedSamples = sampleRegion(region, { count: 60_000, seed: 4 });
    const { audit, count } = await pool.sampleAudit(geometry, 60_000, 4);
    expect(count).toBe(expectedSamples.count);
    // Five candidates on two workers: both workers score some, each from its own sampling.
    const defs = ['+proj=lcc +lat_1=40 +lat_2=55 +lon_0=10', 'EPSG:3035', '+proj=merc +lon_0=10', '+proj=tmerc +lon_0=10', '+proj=aea +lat_1=40 +lat_2=55 +lon_0=10'];
    const progress = defs.map(() => [] as number[]);
    const results = await Promise.all(
      defs.map((d, i) => pool.auditCandidate(resolveDefinition(d), d, audit, 20_000, (done) => progress[i].push(done))),
    );
    defs.forEach((d, i) => {
      expect(results[i].metrics).toEqual(JSON.parse(JSON.stringify(scoreCandidate(resolveDefinition(d), expectedSamples, region))));
      // 60 000 samples in blocks of 25 000; every third sample kept for a cap of 20 000.
      expect(progress[i]).toEqual([25_000, 50_000, 60_000]);
      expect(results[i].fields.s.length).toBe(20_000);
      expect(results[i].fields.lonDeg[1]).toBe(expectedSamples.lonDeg[3]);
    });
  });
  it('prepares an audit region again in a worker that no longer holds it', async () => {
    const geometry = { type: 'Polygon' as const, coordinates: [[[0, 0], [10, 0], [10, 10], [0, 10], [0, 0]]] };
    const { audit } = await pool.sampleAudit(geometry, 3000, 9);
    // Push it out of every worker's few kept datasets, then score against it.
    for (let k = 0; k < 5; k++) await pool.sampleAudit(geometry, 1000 + k, k);
    const def = '+proj=laea +lat_0=5 +lon_0=5';
    const region = prepareRegion(geometry);
    const got = await pool.auditCandidate(resolveDefinition(def), def, audit, 3000);
    expect(got.metrics).toEqual(JSON.parse(JSON.stringify(scoreCandidate(resolveDefinition(def), sampleRegion(region, { count: 3000, seed: 9 }), region))));
  });
  it('refuses an audit candidate that is undefined over the whole region, naming it', async () => {
    const { audit } = await pool.sampleAudit({ type: 'Polygon', coordinates: [[[100, -10], [120, -10], [120, 10], [100, 10], [100, -10]]] }, 2000, 1);
    // Orthographic centred on the far side of the Earth: nothing of the region is visible.
    await expect(pool.auditCandidate(resolveDefinition('+proj=ortho +lat_0=0 +lon_0=-70 +R=6371000'), 'Far-side orthographic', audit, 1000)).rejects.toThrow(
      /Far-side orthographic is undefined over the whole region/,
    );
  });
  it('processes text lines and reports bad ones with their line numbers', async () => {
    const r = await pool.factorLines(resolveDefinition('+proj=merc +R=1'), '10 0\nnot a point\n0 90\n');
    expect(new TextDecoder().decode(r.out)).toBe('1\t1\t1\t0\t1\t1\nnan\tnan\tnan\tnan\tnan\tnan\n');
    expect(r.errors).toEqual([{ line: 2, message: expect.stringContaining('not a number') }]);
    expect(r.lines).toBe(3);
  });
});

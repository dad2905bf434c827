/** Meridian convergence γ against PROJ's proj_factors() (Debian libproj-dev, PROJ 9.1, via tests/proj-harness/factors.c). */
import { beforeAll, describe, expect, it } from 'vitest';
import { resolveDefinition } from '../../shared/engine/definition';
import { factorsAt } from '../../shared/engine/factors';
import { ensureProjHarness, parseRows, runWithInput } from '../../tests/proj-harness/tools';

let harness = '';
beforeAll(() => {
  harness = ensureProjHarness();
}, 300_000);

const POINTS = [[10, 35], [-3, 52], [25, -20], [14.9, 70], [40, 10]];

describe('meridian convergence vs proj_factors()', () => {
  it.each([
    '+proj=utm +zone=33 +ellps=WGS84',
    '+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=10 +ellps=clrk66',
    '+proj=laea +lat_0=52 +lon_0=10 +ellps=GRS80',
    '+proj=stere +lat_0=90 +lon_0=0 +k_0=0.994 +ellps=WGS84',
    '+proj=eqearth +ellps=WGS84',
    '+proj=sinu +R=6371000',
  ])('%s: within 1e-7°', async (def) => {
    const proj = parseRows((await runWithInput(harness, [def], POINTS.map((p) => p.join(' ')).join('\n') + '\n')).stdout);
    POINTS.forEach(([lon, lat], i) => {
      const f = factorsAt(resolveDefinition(def), lon, lat);
      if (!f.defined) throw new Error('undefined');
      expect(Math.abs(f.convergenceDeg - proj[i][6])).toBeLessThan(1e-7);
    });
  });
});

/** GeographicLib (geographiclib-geodesic) against Debian's `geod` (proj-bin) on random pairs. */
import { beforeAll, describe, expect, it } from 'vitest';
import { geodesicFor } from '../../shared/engine/geodesic';
import { createRng } from '../../shared/engine/rng';
import { ensureProjHarness, parseRows, runWithInput } from '../../tests/proj-harness/tools';

beforeAll(() => {
  ensureProjHarness();
}, 300_000);

describe('inverse geodesics vs `geod -I`', () => {
  it.each([
    ['WGS84', 6378137, 298.257223563],
    ['intl', 6378388, 297],
  ] as const)('%s: distances within 1e-6 m, azimuths within 1e-8°', async (ellps, a, rf) => {
    const rng = createRng(7);
    const pairs: number[][] = [];
    for (let i = 0; i < 500; i++) pairs.push([rng() * 180 - 90, rng() * 360 - 180, rng() * 180 - 90, rng() * 360 - 180]);
    pairs.push([0, 0, 0.5, 179.7], [89.9, 10, -89.9, -170], [10, 20, 10.000001, 20.000001]);
    const { stdout } = await runWithInput('geod', [`+ellps=${ellps}`, '-I', '-f', '%.12f', '-F', '%.9f'], pairs.map((p) => p.join(' ')).join('\n') + '\n');
    const rows = parseRows(stdout);
    const g = geodesicFor({ aM: a, es: (1 / rf) * (2 - 1 / rf) });
    rows.forEach(([az1, backAz2, dist], i) => {
      const [lat1, lon1, lat2, lon2] = pairs[i];
      const r = g.Inverse(lat1, lon1, lat2, lon2);
      expect(Math.abs((r.s12 as number) - dist)).toBeLessThan(1e-6);
      const dAz = (x: number, y: number) => Math.abs(((x - y + 540) % 360) - 180);
      if (dist > 1) {
        expect(dAz(r.azi1 as number, az1)).toBeLessThan(1e-8);
        // geod prints the back azimuth at the second point; GeographicLib the forward azimuth there.
        expect(dAz((r.azi2 as number) + 180, backAz2)).toBeLessThan(1e-8);
      }
    });
  });
});

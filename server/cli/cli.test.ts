/** The warpmeter command as a process: streaming, errors and exit codes, the --json shape. */
import { describe, expect, it } from 'vitest';
import { parseRows, repoRoot, runWarpmeter } from '../../tests/proj-harness/tools';

const region = (name: string) => `${repoRoot}fixtures/regions/${name}`;

describe('warpmeter factors', () => {
  it('writes h k s omega a b per point, nan where undefined, and reports malformed lines by number', async () => {
    const r = await runWarpmeter(['factors', '--proj', '+proj=merc +R=1'], '0 0\n# a comment\n\n10 abc\n5\n0 90\n200 95\n30 45 100\n');
    expect(r.status).toBe(1);
    const lines = r.stdout.trim().split('\n');
    expect(lines).toHaveLength(3);
    expect(lines[0]).toBe('1\t1\t1\t0\t1\t1');
    expect(lines[1]).toBe('nan\tnan\tnan\tnan\tnan\tnan');
    expect(parseRows(lines[2])[0][0]).toBeCloseTo(Math.SQRT2, 14);
    expect(r.stderr).toContain('line 4: not a number: "abc"');
    expect(r.stderr).toContain('line 5: expected "lon lat"');
    expect(r.stderr).toContain('line 7: latitude 95 is outside');
  });

  it('streams large inputs through the worker pool in order', async () => {
    const n = 150_000;
    let input = '';
    for (let i = 0; i < n; i++) input += `${(((i * 0.618034) % 1) * 300 - 150).toFixed(5)} ${(((i * 0.754878) % 1) * 170 - 85).toFixed(5)}\n`;
    const [pooled, single] = await Promise.all([
      runWarpmeter(['factors', '--proj', 'EPSG:3035'], input),
      runWarpmeter(['factors', '--threads', '1', '--proj', 'EPSG:3035'], input),
    ]);
    expect(pooled.status).toBe(0);
    expect(pooled.stdout.split('\n').length - 1).toBe(n);
    expect(pooled.stdout === single.stdout).toBe(true);
  }, 60_000);

  it('exits 2 with a message for bad arguments', async () => {
    const noProj = await runWarpmeter(['factors'], '');
    expect(noProj.status).toBe(2);
    expect(noProj.stderr).toContain('factors needs --proj');
    const bad = await runWarpmeter(['factors', '--proj', 'EPSG:4326'], '0 0\n');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('not a projected CRS');
    expect((await runWarpmeter(['factors', '--proj', 'x', '--frobnicate'])).stderr).toContain('unknown option --frobnicate');
    expect((await runWarpmeter(['nonsense'])).status).toBe(2);
  });
});

describe('warpmeter audit', () => {
  it('prints the documented --json shape', async () => {
    const r = await runWarpmeter(['audit', region('engine-italy.geojson'), '--proj', 'EPSG:3035', '--proj', '+proj=merc +k_0=2', '--samples', '3000', '--seed', '4', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(typeof j.engineVersion).toBe('string');
    expect(j.region.samples).toBe(3000);
    expect(j.region.bbox).toHaveLength(4);
    expect(j.region.areaKm2).toBeGreaterThan(290_000);
    expect(j.region.areaKm2).toBeLessThan(320_000);
    expect(j.candidates).toHaveLength(2);
    for (const c of j.candidates) {
      expect(Object.keys(c)).toEqual(expect.arrayContaining(['label', 'definition', 'resolved', 'metrics']));
      const m = c.metrics;
      for (const k of ['min', 'max', 'mean', 'p5', 'p95', 'ratio']) expect(typeof m.arealScale[k]).toBe('number');
      for (const k of ['mean', 'p95', 'max']) expect(typeof m.angularDeformationDeg[k]).toBe('number');
      for (const k of ['mean', 'max']) expect(typeof m.scaleError[k]).toBe('number');
      expect(typeof m.airyKavrayskiy).toBe('number');
      for (const k of ['mean', 'p95']) expect(typeof m.distanceError[k]).toBe('number');
      expect(Object.keys(m.withinTolerance).length).toBeGreaterThanOrEqual(6);
    }
    // arealScale is the raw s of the definition as given: k₀ = 2 multiplies it by 4.
    expect(j.candidates[1].metrics.arealScale.min).toBeGreaterThan(4 * 1.5);
    expect(j.candidates[1].metrics.airyKavrayskiy).toBeGreaterThan(0);
  });

  it('reads TopoJSON and zipped shapefiles (honouring .prj)', async () => {
    const topo = await runWarpmeter(['audit', region('fiji-antarctica.topojson'), '--proj', '+proj=laea +lat_0=-90', '--samples', '2000', '--json']);
    expect(topo.status, topo.stderr).toBe(0);
    expect(JSON.parse(topo.stdout).region.containsPole).toBe('south');
    const zip = await runWarpmeter(['audit', region('michigan-epsg5070.zip'), '--proj', 'EPSG:5070', '--samples', '2000', '--json']);
    expect(zip.status, zip.stderr).toBe(0);
    const [w, s, e, n] = JSON.parse(zip.stdout).region.bbox;
    expect(w).toBeGreaterThan(-91);
    expect(e).toBeLessThan(-82);
    expect(s).toBeGreaterThan(41);
    expect(n).toBeLessThan(49);
  });

  it('prints a readable scorecard without --json', async () => {
    const r = await runWarpmeter(['audit', region('engine-colorado.geojson'), '--proj', '+proj=utm +zone=13', '--samples', '1000']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Airy–Kavrayskiy');
    expect(r.stdout).toContain('angular deformation');
  });

  it('exits 2 with a message for unreadable files and bad options', async () => {
    const missing = await runWarpmeter(['audit', 'no/such/file.geojson', '--proj', 'EPSG:3035']);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain('no such file');
    const notJson = await runWarpmeter(['audit', `${repoRoot}package.json`, '--proj', 'EPSG:3035']);
    expect(notJson.status).toBe(2);
    expect(notJson.stderr).toMatch(/neither GeoJSON nor TopoJSON|holds no polygons|no "type"/);
    const samples = await runWarpmeter(['audit', region('engine-italy.geojson'), '--proj', 'EPSG:3035', '--samples', '0']);
    expect(samples.status).toBe(2);
    expect(samples.stderr).toContain('--samples must be an integer');
    const def = await runWarpmeter(['audit', region('engine-italy.geojson'), '--proj', '+proj=wat']);
    expect(def.stderr).toContain("--proj '+proj=wat'");
  });
});

describe('warpmeter suggest', () => {
  it('prints 6–12 proposals with definitions and reasons', async () => {
    const r = await runWarpmeter(['suggest', region('engine-chile.geojson'), '--purpose', 'conformal', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.candidates.length).toBeGreaterThanOrEqual(6);
    expect(j.candidates.length).toBeLessThanOrEqual(12);
    expect(j.candidates[0]).toEqual(expect.objectContaining({ label: expect.any(String), definition: expect.stringMatching(/^\+proj=/), reason: expect.any(String) }));
    const text = await runWarpmeter(['suggest', region('engine-chile.geojson')]);
    expect(text.stdout).toMatch(/1\. .+\n {3}\+proj=/);
    expect((await runWarpmeter(['suggest', region('engine-chile.geojson'), '--purpose', 'pretty'])).status).toBe(2);
  });
});

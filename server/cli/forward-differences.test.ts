/**
 * Where proj4's forward projection differs from PROJ's (Debian proj-bin `proj`, PROJ 9.1), shown
 * here, and the family checked by closed forms instead of against proj_factors().
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { resolveDefinition } from '../../shared/engine/definition';
import { factorsAt } from '../../shared/engine/factors';
import { geodesicFor } from '../../shared/engine/geodesic';
import { projectPoints } from '../../shared/engine/project';
import { ensureProjHarness, parseRows, runWithInput } from '../../tests/proj-harness/tools';

let harness = '';
beforeAll(() => {
  harness = ensureProjHarness();
}, 300_000);

const projForward = async (def: string, pts: number[][]) =>
  parseRows((await runWithInput('proj', ['-f', '%.6f', ...def.split(' ')], pts.map((p) => p.join(' ')).join('\n') + '\n')).stdout);
const gap = (a: number[][], b: number[][]) => Math.max(...a.map((p, i) => Math.hypot(p[0] - b[i][0], p[1] - b[i][1])));

describe('forward differences between proj4 and PROJ', () => {
  it('Robinson: the two tables differ by metres (so Robinson is checked at its table nodes, closed-forms.test.ts)', async () => {
    const def = '+proj=robin +ellps=WGS84';
    const pts = [[-75, 35], [10, 60], [120, 5]];
    const d = gap(projectPoints(resolveDefinition(def), pts), await projForward(def, pts));
    expect(d).toBeGreaterThan(0.5);
    expect(d).toBeLessThan(10);
  });

  it('orthographic on an ellipsoid: PROJ is ellipsoidal, proj4 spherical (checked on the sphere: h = cos c, k = 1)', async () => {
    const def = '+proj=ortho +lat_0=40 +lon_0=-100 +ellps=WGS84';
    const pts = [[-75, 35], [10, 60]];
    expect(gap(projectPoints(resolveDefinition(def), pts), await projForward(def, pts))).toBeGreaterThan(1000);
    const sphere = '+proj=ortho +lat_0=40 +lon_0=-100 +R=6378137';
    expect(gap(projectPoints(resolveDefinition(sphere), pts), await projForward(sphere, pts))).toBeLessThan(1e-5);
  });

  it('Mollweide near the poles: both libraries stop their Newton iterations early; our factors solve θ fully (s = 1)', async () => {
    const def = '+proj=moll +ellps=WGS84';
    const pts = [[60, 89.9]];
    const proj = parseRows((await runWithInput(harness, [def], '60 89.9\n')).stdout);
    expect(Math.abs(proj[0][2] - 1)).toBeGreaterThan(1e-6); // PROJ's own s drifts from 1 there
    const ours = factorsAt(resolveDefinition(def), pts[0][0], pts[0][1]);
    expect(ours.defined && Math.abs(ours.s - 1)).toBeLessThan(1e-12);
  });

  it('spherical transverse Mercator: both form y through acos, which loses half the digits at the equator; our factors are analytic', async () => {
    const def = '+proj=tmerc +lon_0=-75 +k_0=0.9999 +R=6371000';
    const proj = parseRows((await runWithInput(harness, [def], '-62.5 0\n')).stdout)[0];
    const exact = 0.9999 / Math.sqrt(1 - Math.sin((12.5 * Math.PI) / 180) ** 2);
    expect(Math.abs(proj[0] / exact - 1)).toBeGreaterThan(1e-8); // PROJ's h there
    const ours = factorsAt(resolveDefinition(def), -62.5, 0);
    expect(ours.defined && Math.abs(ours.h / exact - 1)).toBeLessThan(1e-12);
  });

  it('American polyconic: the forward cancels near the equator, so the engine differences it with a wider step; PROJ\'s h there is ~3e-7 off', async () => {
    const def = '+proj=poly +lon_0=-96 +ellps=clrk66';
    const proj = parseRows((await runWithInput(harness, [def], '-106 0\n-106 1\n')).stdout);
    const atEquator = factorsAt(resolveDefinition(def), -106, 0);
    const nearby = factorsAt(resolveDefinition(def), -106, 0.001);
    if (!atEquator.defined || !nearby.defined) throw new Error('undefined');
    expect(Math.abs(atEquator.h / nearby.h - 1)).toBeLessThan(1e-8); // continuous across the equator
    expect(Math.abs(proj[0][0] / atEquator.h - 1)).toBeGreaterThan(1e-7);
    const at1 = factorsAt(resolveDefinition(def), -106, 1);
    expect(at1.defined && Math.abs(at1.h / proj[1][0] - 1)).toBeLessThan(1e-8); // away from it both agree
  });

  it('ellipsoidal azimuthal equidistant: proj4 iterates Vincenty, PROJ uses GeographicLib, as the engine\'s factors do (checked against s₁₂/m₁₂)', async () => {
    const def = '+proj=aeqd +lat_0=40 +lon_0=-100 +ellps=WGS84';
    const pts = [[-75, 35], [-100, -12.5], [20, 10]];
    const d = gap(projectPoints(resolveDefinition(def), pts), await projForward(def, pts));
    expect(d).toBeGreaterThan(1e-5);
    expect(d).toBeLessThan(0.01);
    // The scale across the radius is s₁₂/m₁₂ (reduced length m₁₂, Karney 2013); along it, 1.
    const g = geodesicFor(resolveDefinition(def).ellipsoid);
    for (const [lon, lat] of pts) {
      const r = g.Inverse(40, -100, lat, lon, 1 | 2 | 4 | 8 | 1024 | 4096);
      const across = (r.s12 as number) / (r.m12 as number);
      const f = factorsAt(resolveDefinition(def), lon, lat);
      if (!f.defined) throw new Error('undefined');
      expect(Math.abs(f.a / across - 1)).toBeLessThan(1e-12);
      expect(Math.abs(f.b - 1)).toBeLessThan(1e-12);
    }
  });
});

/**
 * `warpmeter factors` against PROJ's proj_factors() (Debian libproj-dev, PROJ 9.1, through
 * tests/proj-harness/factors.c printing %.17g): 17+ families, the sphere and six ellipsoids,
 * false origins and scale factors, grids reaching near the poles, the edges and the antimeridian.
 *
 * Two tiers, because PROJ's own factors are finite differences (pj_deriv: a diagonal stencil with
 * h = 1e-5 rad) whose truncation error grows like h²·a²: where the indicatrix is moderate
 * (PROJ's a ≤ 2, b ≥ 1/2 and ω ≤ 60°, |φ| ≤ 89°: nearer the poles PROJ's λ-step covers only h·cos φ
 * on the ground and rounding dominates) we require relative 1e-8 on h, k, s, a, b and 1e-6° on ω; in the
 * strongly distorted rest (near singular poles, far sides of azimuthals) 1e-4, and our values
 * there are checked against closed forms in closed-forms.test.ts.
 * PROJ's a, b, ω fields come from √(h² + k² − 2s), which cancels where h ≈ k; the harness also
 * prints them recomputed stably from PROJ's own derivatives, and the strict tier uses those.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureProjHarness, parseRows, runWarpmeter, runWithInput } from '../../tests/proj-harness/tools';

const results = new Map<string, { input: string; ours: Awaited<ReturnType<typeof runWarpmeter>>; proj: string }>();

type Domain = 'global' | 'north' | 'south' | 'azimuthal' | 'hemisphere' | 'tm';

/** Grid points for a domain, around the definition's centre (lon0, lat0). */
function grid(domain: Domain, lon0: number, lat0: number): string {
  const pts: [number, number][] = [];
  const lons = [-179.99, -179.5, -150, -97.3, -60, -33.3, -10, -0.5, 0, 0.7, 12.5, 45, 89.5, 120, 161.1, 179.5, 179.99];
  const lats = [-89.9, -89, -75, -60, -45, -30, -12.5, -1, 0, 3.3, 20, 35, 52.5, 67, 80, 88, 89.9];
  for (const dl of lons) {
    for (const lat of lats) {
      const lon = lon0 + dl;
      const wrapped = lon > 180 ? lon - 360 : lon < -180 ? lon + 360 : lon;
      if (domain === 'north' && lat < -20) continue;
      if (domain === 'south' && lat > 20) continue;
      if (domain === 'tm' && Math.abs(dl) > 60) continue;
      if (domain === 'azimuthal' || domain === 'hemisphere') {
        const r = Math.PI / 180;
        const cosC = Math.sin(lat0 * r) * Math.sin(lat * r) + Math.cos(lat0 * r) * Math.cos(lat * r) * Math.cos(dl * r);
        const c = Math.acos(Math.max(-1, Math.min(1, cosC))) / r;
        if (domain === 'azimuthal' && c > 170) continue;
        if (domain === 'hemisphere' && c > 85) continue;
      }
      pts.push([wrapped, lat]);
    }
  }
  return pts.map((p) => `${p[0]} ${p[1]}`).join('\n') + '\n';
}

interface Case {
  def: string;
  domain: Domain;
  lon0?: number;
  lat0?: number;
}

const CASES: Case[] = [
  { def: '+proj=merc +ellps=WGS84 +x_0=1000000 +y_0=-500000', domain: 'global' },
  { def: '+proj=merc +R=6371000 +lon_0=150', domain: 'global', lon0: 150 },
  { def: '+proj=merc +lat_ts=30 +ellps=intl', domain: 'global' },
  { def: '+proj=tmerc +lon_0=9 +k_0=0.9996 +x_0=500000 +ellps=GRS80', domain: 'tm', lon0: 9 },
  { def: '+proj=utm +zone=33 +ellps=WGS84', domain: 'tm', lon0: 15 },
  { def: '+proj=utm +zone=19 +south +ellps=intl', domain: 'tm', lon0: -69 },
  { def: '+proj=tmerc +lat_0=49 +lon_0=-2 +k_0=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy', domain: 'tm', lon0: -2 },
  { def: '+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96 +ellps=clrk66', domain: 'north', lon0: -96 },
  { def: '+proj=lcc +lat_1=46.8 +lat_0=46.8 +lon_0=2.337 +k_0=0.99987742 +x_0=600000 +y_0=2200000 +ellps=airy', domain: 'north', lon0: 2.337 },
  { def: '+proj=lcc +lat_1=-30 +lat_2=-10 +lat_0=-20 +lon_0=130 +R=6371000', domain: 'south', lon0: 130 },
  { def: '+proj=aea +lat_1=29.5 +lat_2=45.5 +lat_0=23 +lon_0=-96 +ellps=clrk66', domain: 'north', lon0: -96 },
  { def: '+proj=aea +lat_1=50 +lat_2=70 +lat_0=56 +lon_0=100 +x_0=1000000 +ellps=krass', domain: 'north', lon0: 100 },
  { def: '+proj=aea +lat_1=-18 +lat_2=-36 +lon_0=132 +R=6371000', domain: 'south', lon0: 132 },
  { def: '+proj=laea +lat_0=52 +lon_0=10 +x_0=4321000 +y_0=3210000 +ellps=GRS80', domain: 'azimuthal', lon0: 10, lat0: 52 },
  { def: '+proj=laea +lat_0=90 +lon_0=-150 +ellps=WGS84', domain: 'azimuthal', lon0: -150, lat0: 90 },
  { def: '+proj=laea +lat_0=-30 +lon_0=25 +R=6371000', domain: 'azimuthal', lon0: 25, lat0: -30 },
  { def: '+proj=stere +lat_0=40 +lon_0=-100 +k_0=0.9999 +ellps=clrk66', domain: 'azimuthal', lon0: -100, lat0: 40 },
  { def: '+proj=stere +lat_0=40 +lon_0=-100 +R=6371000', domain: 'azimuthal', lon0: -100, lat0: 40 },
  { def: '+proj=stere +lat_0=-90 +lat_ts=-71 +lon_0=-100 +ellps=intl', domain: 'azimuthal', lon0: -100, lat0: -90 },
  { def: '+proj=stere +lat_0=90 +lon_0=0 +k_0=0.994 +x_0=2000000 +y_0=2000000 +ellps=WGS84', domain: 'azimuthal', lat0: 90 },
  { def: '+proj=eqdc +lat_1=20 +lat_2=60 +lat_0=40 +lon_0=0 +ellps=krass', domain: 'north' },
  { def: '+proj=eqdc +lat_1=-10 +lat_2=-40 +lon_0=-60 +R=6371000', domain: 'south', lon0: -60 },
  // proj4 forms this one with Vincenty's iteration, ~1e-4 m from PROJ's GeographicLib; the engine's
  // factors come from GeographicLib too (see forward-differences.test.ts).
  { def: '+proj=aeqd +lat_0=40 +lon_0=-100 +ellps=WGS84', domain: 'azimuthal', lon0: -100, lat0: 40 },
  { def: '+proj=aeqd +lat_0=-60 +lon_0=30 +R=6371000', domain: 'azimuthal', lon0: 30, lat0: -60 },
  { def: '+proj=aeqd +lat_0=90 +ellps=GRS80', domain: 'azimuthal', lat0: 90 },
  { def: '+proj=cea +lat_ts=30 +ellps=WGS84 +x_0=100000', domain: 'global' },
  { def: '+proj=cea +lat_ts=45 +R=6371000', domain: 'global' },
  { def: '+proj=eqc +lat_ts=30 +ellps=WGS84', domain: 'global' },
  { def: '+proj=eqc +R=6371000 +lon_0=-30', domain: 'global', lon0: -30 },
  { def: '+proj=moll +ellps=WGS84', domain: 'global' },
  { def: '+proj=moll +R=6371000 +lon_0=11', domain: 'global', lon0: 11 },
  { def: '+proj=sinu +ellps=WGS84', domain: 'global' },
  { def: '+proj=sinu +R=6371000 +lon_0=-90', domain: 'global', lon0: -90 },
  { def: '+proj=eqearth +ellps=WGS84', domain: 'global' },
  { def: '+proj=eqearth +R=6371000 +lon_0=150', domain: 'global', lon0: 150 },
  { def: '+proj=ortho +lat_0=40 +lon_0=-100 +R=6371000', domain: 'hemisphere', lon0: -100, lat0: 40 },
  { def: '+proj=gnom +lat_0=40 +lon_0=-100 +R=6371000', domain: 'hemisphere', lon0: -100, lat0: 40 },
  { def: '+proj=gnom +lat_0=-90 +ellps=WGS84', domain: 'hemisphere', lat0: -90 },
  { def: '+proj=mill +R=6371000', domain: 'global' },
  { def: '+proj=eck6 +R=6371000', domain: 'global' },
  { def: '+proj=bonne +lat_1=45 +ellps=WGS84', domain: 'north' },
];

const REL_TOL = 1e-8;
const LOOSE_REL_TOL = 1e-4;

/**
 * Worst differences between our rows (h k s ω a b) and the harness's rows (PROJ's h k s ω a b γ θ′,
 * then a b ω recomputed without cancellation from PROJ's own derivatives). Points undefined on
 * either side are skipped (their count is checked by the caller).
 */
function compareRows(ours: number[][], proj: number[][], latDeg: number[]) {
  const w = { rel: 0, omegaDeg: 0, rawRel: 0, rawOmegaDeg: 0, compared: 0, strict: 0, looseRel: 0, where: -1, whereOmega: -1 };
  const rel = (x: number, y: number) => Math.abs(x - y) / Math.abs(y);
  for (let i = 0; i < ours.length; i++) {
    const o = ours[i];
    const p = proj[i];
    if (o.some(Number.isNaN) || p.some(Number.isNaN)) continue;
    w.compared++;
    const loose = Math.max(rel(o[0], p[0]), rel(o[1], p[1]), rel(o[2], p[2]), rel(o[4], p[8]), rel(o[5], p[9]));
    w.looseRel = Math.max(w.looseRel, loose);
    if (!(p[8] <= 2 && p[9] >= 0.5 && p[10] <= 60 && Math.abs(latDeg[i]) <= 89)) continue;
    w.strict++;
    const r = Math.max(rel(o[0], p[0]), rel(o[1], p[1]), rel(o[2], p[2]), rel(o[4], p[8]), rel(o[5], p[9]));
    if (r > w.rel) [w.rel, w.where] = [r, i];
    const dw = Math.abs(o[3] - p[10]);
    if (dw > w.omegaDeg) [w.omegaDeg, w.whereOmega] = [dw, i];
    w.rawRel = Math.max(w.rawRel, rel(o[4], p[4]), rel(o[5], p[5]));
    w.rawOmegaDeg = Math.max(w.rawOmegaDeg, Math.abs(o[3] - p[3]));
  }
  return w;
}
const OMEGA_TOL_DEG = 1e-6;

describe('warpmeter factors vs PROJ proj_factors()', () => {
  beforeAll(async () => {
    const harness = ensureProjHarness();
    const queue = [...CASES];
    const run = async () => {
      for (let c = queue.shift(); c; c = queue.shift()) {
        const input = grid(c.domain, c.lon0 ?? 0, c.lat0 ?? 0);
        const [ours, proj] = await Promise.all([
          runWarpmeter(['factors', '--threads', '1', '--proj', c.def], input),
          runWithInput(harness, [c.def], input),
        ]);
        results.set(c.def, { input, ours, proj: proj.stdout });
      }
    };
    await Promise.all([run(), run(), run()]);
  }, 300_000);

  it.each(CASES)('$def', ({ def }) => {
    const { input, ours, proj } = results.get(def)!;
    expect(ours.status, ours.stderr).toBe(0);
    const a = parseRows(ours.stdout);
    const b = parseRows(proj);
    expect(a.length).toBe(b.length);
    const w = compareRows(a, b, parseRows(input).map((r) => r[1]));
    expect(w.compared).toBeGreaterThan(a.length * 0.8);
    expect(w.strict).toBeGreaterThan(w.compared * 0.3);
    expect(w.looseRel).toBeLessThan(LOOSE_REL_TOL);
    const at = (i: number) => `${input.split('\n')[i]}: ours ${a[i]?.join(' ')} | PROJ ${b[i]?.join(' ')}`;
    expect(w.rel, `worst at ${at(w.where)}`).toBeLessThan(REL_TOL);
    expect(w.omegaDeg, `worst at ${at(w.whereOmega)}`).toBeLessThan(OMEGA_TOL_DEG);
    // PROJ's own a, b, ω fields come from √(h² + k² − 2s), which cancels where h ≈ k: they
    // agree with the stable values only to about √(8ε) ≈ 4e-8 relative (≈ 5e-6° in ω).
    expect(w.rawRel).toBeLessThan(REL_TOL + 5e-8);
    expect(w.rawOmegaDeg).toBeLessThan(OMEGA_TOL_DEG + 6e-6);
  });
});

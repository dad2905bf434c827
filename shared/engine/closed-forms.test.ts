/**
 * Factors against closed forms on the sphere (Snyder 1987, Map Projections: A Working Manual,
 * USGS PP 1395, ch. 4 and each projection's chapter), and the classical stereographic identity.
 */
import { describe, expect, it } from 'vitest';
import { resolveDefinition } from './definition';
import { createFactorEvaluator } from './evaluator';
import { factorsAt } from './factors';
import { projectPoints } from './project';

const D = Math.PI / 180;
const rel = (x: number, y: number) => Math.abs(x - y) / Math.abs(y);
const at = (def: string, lon: number, lat: number) => {
  const f = factorsAt(resolveDefinition(def), lon, lat);
  if (!f.defined) throw new Error(`undefined at ${lon} ${lat}`);
  return f;
};
/** Angular distance (radians) between two points given in degrees. */
const centralAngle = (lon0: number, lat0: number, lon: number, lat: number) =>
  Math.acos(Math.min(1, Math.sin(lat0 * D) * Math.sin(lat * D) + Math.cos(lat0 * D) * Math.cos(lat * D) * Math.cos((lon - lon0) * D)));
const LATS = [-89.9, -80, -60, -33.3, -5, 0, 12.5, 45, 67, 85, 89.9];
const LONS = [-179.999, -120, -45, 0, 30.5, 90, 179.999];

describe('Mercator (Snyder 1987, eqs. 7-3 and 7-2 with ch. 4)', () => {
  it('h = k = sec φ and s = sec² φ on the sphere, right up to 89.9°', () => {
    for (const lat of LATS) {
      const f = at('+proj=merc +R=1', 10, lat);
      const sec = 1 / Math.cos(lat * D);
      expect(rel(f.h, sec)).toBeLessThan(1e-12);
      expect(rel(f.k, sec)).toBeLessThan(1e-12);
      expect(rel(f.s, sec * sec)).toBeLessThan(1e-12);
      expect(f.omegaDeg).toBeLessThan(1e-9);
    }
  });
  it('k = √(1 − e² sin²φ)/cos φ on the ellipsoid (Snyder 1987, eq. 7-8)', () => {
    const es = 0.0066943799901413165;
    for (const lat of LATS) {
      const f = at('+proj=merc +ellps=WGS84', 0, lat);
      expect(rel(f.k, Math.sqrt(1 - es * Math.sin(lat * D) ** 2) / Math.cos(lat * D))).toBeLessThan(1e-12);
    }
  });
  it('is undefined at the poles, never a number', () => {
    expect(factorsAt(resolveDefinition('+proj=merc'), 0, 90).defined).toBe(false);
    expect(factorsAt(resolveDefinition('+proj=merc'), 0, -90).defined).toBe(false);
  });
});

describe('equal-area families have s = 1 (Snyder 1987, ch. 4)', () => {
  const defs = [
    '+proj=aea +lat_1=29.5 +lat_2=45.5 +lat_0=23 +lon_0=-96 +R=1',
    '+proj=laea +lat_0=52 +lon_0=10 +R=1',
    '+proj=laea +lat_0=-90 +R=1',
    '+proj=cea +lat_ts=30 +R=1',
    '+proj=moll +R=1',
    '+proj=sinu +R=1',
    '+proj=eqearth +R=1',
    '+proj=eck6 +R=1',
    '+proj=bonne +lat_1=45 +R=1',
    '+proj=laea +lat_0=52 +lon_0=10 +ellps=GRS80',
    '+proj=aea +lat_1=50 +lat_2=70 +ellps=krass',
    '+proj=cea +lat_ts=30 +ellps=WGS84',
    '+proj=eqearth +ellps=WGS84',
  ];
  it.each(defs)('%s', (def) => {
    const ev = createFactorEvaluator(resolveDefinition(def));
    const out = new Float64Array(8);
    let worst = 0;
    for (const lat of LATS.filter((l) => Math.abs(l) <= 85)) {
      for (const lon of LONS) {
        if (!ev.factorsRad(lon * D, lat * D, out)) continue;
        // Far sides of the azimuthal and the pseudocylinders' edges are strongly sheared: allow
        // the finite-difference truncation there (h²·a², see the comparison with PROJ).
        const tol = out[4] < 3 ? 1e-8 : 1e-6;
        worst = Math.max(worst, Math.abs(out[2] - 1) / tol);
      }
    }
    expect(worst).toBeLessThan(1);
  });
});

describe('conformal families have ω = 0 and h = k (Snyder 1987, ch. 4)', () => {
  const defs = [
    '+proj=merc +R=1',
    '+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96 +R=1',
    '+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96 +ellps=clrk66',
    '+proj=stere +lat_0=40 +lon_0=-100 +R=1',
    '+proj=stere +lat_0=-90 +lat_ts=-71 +ellps=intl',
    '+proj=tmerc +lon_0=-75 +R=1',
    '+proj=tmerc +lon_0=9 +ellps=GRS80',
    '+proj=utm +zone=33',
  ];
  it.each(defs)('%s: ω below 1e-8° wherever the map is moderate', (def) => {
    const ev = createFactorEvaluator(resolveDefinition(def));
    const out = new Float64Array(8);
    for (const lat of [-60, -30, 0, 20, 40, 60, 80]) {
      for (const dl of [-40, -10, 0, 5, 30]) {
        const lon = (resolveDefinition(def).params.lon0Deg ?? 0) + dl;
        if (!ev.factorsRad(lon * D, lat * D, out) || out[4] > 3) continue;
        expect(out[3]).toBeLessThan(1e-8);
        expect(rel(out[0], out[1])).toBeLessThan(1e-9);
      }
    }
  });
});

describe('azimuthal closed forms (Snyder 1987, chs. 21, 24, 25, 22, 20)', () => {
  it('stereographic: k = 2k₀/(1 + cos c)', () => {
    for (const [lon, lat] of [[-75, 30], [-100, 40], [20, -10], [170, 60], [-100, -45]]) {
      const c = centralAngle(-100, 40, lon, lat);
      const f = at('+proj=stere +lat_0=40 +lon_0=-100 +k_0=0.9999 +R=1', lon, lat);
      expect(rel(f.k, (2 * 0.9999) / (1 + Math.cos(c)))).toBeLessThan(1e-9);
    }
  });
  it('Lambert azimuthal equal-area: a = sec(c/2), b = cos(c/2); ω = 16.426° at c = 60°', () => {
    for (const [lon, lat] of [[10, 52], [30, 40], [-20, 10], [100, 70], [10, -8]]) {
      const c = centralAngle(10, 52, lon, lat);
      const f = at('+proj=laea +lat_0=52 +lon_0=10 +R=1', lon, lat);
      expect(rel(f.a, 1 / Math.cos(c / 2))).toBeLessThan(1e-9);
      expect(rel(f.b, Math.cos(c / 2))).toBeLessThan(1e-9);
    }
    expect(at('+proj=laea +lat_0=90 +R=1', 0, 30).omegaDeg).toBeCloseTo(16.426, 3);
  });
  it('azimuthal equidistant on the sphere: radial scale 1, the other c/sin c', () => {
    for (const [lon, lat] of [[-75, 35], [0, 0], [120, -30]]) {
      const c = centralAngle(-100, 40, lon, lat);
      const f = at('+proj=aeqd +lat_0=40 +lon_0=-100 +R=1', lon, lat);
      expect(rel(f.b, 1)).toBeLessThan(1e-9);
      expect(rel(f.a, c / Math.sin(c))).toBeLessThan(1e-9);
    }
  });
  it('orthographic: radial scale cos c, the other 1; undefined beyond 90° from the centre', () => {
    for (const [lon, lat] of [[-75, 35], [-100, 0], [-150, 60]]) {
      const c = centralAngle(-100, 40, lon, lat);
      const f = at('+proj=ortho +lat_0=40 +lon_0=-100 +R=1', lon, lat);
      expect(rel(f.a, 1)).toBeLessThan(1e-9);
      expect(rel(f.b, Math.cos(c))).toBeLessThan(1e-8);
    }
    expect(factorsAt(resolveDefinition('+proj=ortho +lat_0=40 +lon_0=-100 +R=1'), 80, -40).defined).toBe(false);
  });
  it('gnomonic: radial scale sec² c, the other sec c; masked beyond 90° where proj4 returns finite garbage', () => {
    for (const [lon, lat] of [[-75, 35], [-100, 0], [-150, 60]]) {
      const c = centralAngle(-100, 40, lon, lat);
      const f = at('+proj=gnom +lat_0=40 +lon_0=-100 +R=1', lon, lat);
      expect(rel(f.a, 1 / Math.cos(c) ** 2)).toBeLessThan(1e-8);
      expect(rel(f.b, 1 / Math.cos(c))).toBeLessThan(1e-8);
    }
    const ev = createFactorEvaluator(resolveDefinition('+proj=gnom +lat_0=40 +lon_0=-100 +R=1'));
    const xy = new Float64Array(2);
    ev.forward(80 * D, -40 * D, xy);
    expect(Number.isFinite(xy[0])).toBe(true); // proj4's forward answers on the far side…
    expect(factorsAt(resolveDefinition('+proj=gnom +lat_0=40 +lon_0=-100 +R=1'), 80, -40).defined).toBe(false); // …the engine does not
  });
});

describe('cylindrical and transverse closed forms', () => {
  it('equirectangular: h = 1, k = sec φ (ω = 11.411° at 35°, 38.942° at 60°)', () => {
    for (const lat of [-60, 0, 35, 60, 85]) {
      const f = at('+proj=eqc +R=1', 20, lat);
      expect(rel(f.h, 1)).toBeLessThan(1e-12);
      expect(rel(f.k, 1 / Math.cos(lat * D))).toBeLessThan(1e-12);
    }
    expect(at('+proj=eqc +R=1', 0, 35).omegaDeg).toBeCloseTo(11.411, 3);
    expect(at('+proj=eqc +R=1', 0, 60).omegaDeg).toBeCloseTo(38.942, 3);
  });
  it('transverse Mercator: k = k₀/√(1 − B²), B = cos φ sin Δλ (Snyder 1987, eq. 8-1)', () => {
    for (const [dl, lat] of [[0, 0], [12.5, 0], [41.7, 0], [30, 40], [-60, 10], [5, 89.9]]) {
      const B = Math.cos(lat * D) * Math.sin(dl * D);
      const f = at('+proj=tmerc +lon_0=-75 +k_0=0.9999 +R=1', -75 + dl, lat);
      expect(rel(f.k, 0.9999 / Math.sqrt(1 - B * B))).toBeLessThan(1e-12);
      expect(rel(f.h, 0.9999 / Math.sqrt(1 - B * B))).toBeLessThan(1e-12);
    }
  });
  it('Mollweide keeps s = 1 up to 89.9°, where proj4 and PROJ differ (both stop their Newton iterations early there)', () => {
    for (const lat of [-89.9, -89, 88, 89.9]) expect(Math.abs(at('+proj=moll +R=1', 100, lat).s - 1)).toBeLessThan(1e-12);
  });
  it('Robinson: at its table nodes k = 0.8487·X(φ)/cos φ, to the table\'s 4 decimals (Robinson 1974 table, from memory)', () => {
    const X: [number, number][] = [[0, 1], [20, 0.9822], [40, 0.9216], [60, 0.7986], [80, 0.6213]];
    for (const [lat, x] of X) expect(rel(at('+proj=robin +R=1', 30, lat).k, (0.8487 * x) / Math.cos(lat * D))).toBeLessThan(1e-7);
  });
});

describe('stereographic projection as a Möbius map (classical identity)', () => {
  it('south-polar aspect, R = 1, k₀ = ½ sends (X, Y, Z) to (X + iY)/(1 − Z) up to the axes', () => {
    const [def] = ['+proj=stere +lat_0=-90 +lon_0=0 +k_0=0.5 +R=1'];
    for (const [lon, lat] of [[0, -60], [45, -30], [-120, 10], [170, 70], [-30, -89]]) {
      const X = Math.cos(lat * D) * Math.cos(lon * D);
      const Y = Math.cos(lat * D) * Math.sin(lon * D);
      const Z = Math.sin(lat * D);
      const [[x, y]] = projectPoints(resolveDefinition(def), [[lon, lat]]);
      // Projecting from the north pole: |ζ| = cos φ/(1 − sin φ); proj4's south-polar axes put λ = 0 along +y.
      const zr = X / (1 - Z);
      const zi = Y / (1 - Z);
      expect(Math.hypot(x, y)).toBeCloseTo(Math.hypot(zr, zi), 12);
      expect(x).toBeCloseTo(zi, 12);
      expect(y).toBeCloseTo(zr, 12);
    }
  });
});

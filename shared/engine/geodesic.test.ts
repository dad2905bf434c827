/**
 * Geodesic helpers (GeographicLib, Karney 2013) against Vincenty (1975, Survey Review 23(176))
 * test lines (from memory; GeographicLib's GeodSolve reproduces them to 1 mm), and against two
 * classical facts of the sphere: a geodesic circle of radius r has circumference 2πR sin(r/R)
 * (≈ 2πr − Kπr³/3 with K = 1/R²), and a geodesic triangle's angle excess is its area / R² (Girard).
 */
import { describe, expect, it } from 'vitest';
import { ellipsoidFromFlattening } from './ellipsoid';
import { geodesicDistanceM, geodesicFor, ringGeodesicAreaM2 } from './geodesic';
import { geodesicPoints, rhumbBearingDeg, rhumbPoints } from './routes';

const dms = (d: number, m: number, s: number) => Math.sign(d || 1) * (Math.abs(d) + m / 60 + s / 3600);

describe('Vincenty (1975) test lines', () => {
  const bessel = geodesicFor(ellipsoidFromFlattening(6377397.155, 299.1528128));
  const intl = geodesicFor(ellipsoidFromFlattening(6378388, 297));
  it.each([
    ['(a) Bessel 1841', bessel, dms(55, 45, 0), -dms(33, 26, 0), dms(108, 13, 0), 14110526.17],
    ['(b) International', intl, dms(37, 19, 54.95367), dms(26, 7, 42.83946), dms(41, 28, 35.50729), 4085966.703],
    ['(c) International', intl, dms(35, 16, 11.24862), dms(67, 22, 14.77638), dms(137, 47, 28.31435), 8084823.839],
  ] as const)('%s', (_name, g, lat1, lat2, dlon, expected) => {
    expect(Math.abs(geodesicDistanceM(g, 0, lat1, dlon, lat2) - expected)).toBeLessThan(0.002);
  });
});

describe('on the sphere', () => {
  const R = 6371000;
  const sphere = geodesicFor({ aM: R, es: 0 });
  it('a geodesic circle of radius r has circumference 2πR sin(r/R)', () => {
    for (const rKm of [10, 500, 3000, 9000]) {
      const r = rKm * 1000;
      const n = 3600;
      const pts: number[][] = [];
      for (let i = 0; i < n; i++) {
        const p = sphere.Direct(30, 10, (360 * i) / n, r);
        pts.push([p.lon2 as number, p.lat2 as number]);
      }
      let perimeter = 0;
      for (let i = 0; i < n; i++) perimeter += geodesicDistanceM(sphere, pts[i][0], pts[i][1], pts[(i + 1) % n][0], pts[(i + 1) % n][1]);
      const exact = 2 * Math.PI * R * Math.sin(r / R);
      expect(Math.abs(perimeter / exact - 1)).toBeLessThan(2e-7); // chords of a 0.1° polygon
      if (rKm <= 500) {
        const series = 2 * Math.PI * r - (Math.PI * r ** 3) / (3 * R * R);
        expect(Math.abs(perimeter / series - 1)).toBeLessThan(1e-6);
      }
    }
  });
  it('a geodesic triangle\'s angle excess equals its area / R² (Girard), with edges from geodesicPoints', () => {
    const triangles = [
      [[0, 0], [90, 0], [0, 90]],
      [[-10, 5], [40, 30], [5, 60]],
      [[100, -20], [140, -35], [120, 10]],
    ];
    for (const tri of triangles) {
      const ring: number[][] = [];
      for (let i = 0; i < 3; i++) ring.push(...geodesicPoints(tri[i], tri[(i + 1) % 3], 200, { aM: R, es: 0 }).slice(0, -1));
      ring.push(ring[0]);
      const area = Math.abs(ringGeodesicAreaM2(sphere, ring));
      let angles = 0;
      for (let i = 0; i < 3; i++) {
        const [p, q, s] = [tri[i], tri[(i + 1) % 3], tri[(i + 2) % 3]];
        const a1 = sphere.Inverse(p[1], p[0], q[1], q[0]).azi1 as number;
        const a2 = sphere.Inverse(p[1], p[0], s[1], s[0]).azi1 as number;
        let d = Math.abs(a1 - a2) % 360;
        if (d > 180) d = 360 - d;
        angles += (d * Math.PI) / 180;
      }
      expect(Math.abs(area / (R * R) - (angles - Math.PI))).toBeLessThan(1e-9);
    }
    // The octant: three right angles, area 4πR²/8.
    expect(Math.abs(ringGeodesicAreaM2(sphere, [[0, 0], [90, 0], [0, 90], [0, 0]]) / (R * R) - Math.PI / 2)).toBeLessThan(1e-12);
  });
});

describe('route densification', () => {
  it('geodesicPoints spaces points evenly along the geodesic, ends included', () => {
    const g = geodesicFor(ellipsoidFromFlattening(6378137, 298.257223563));
    const pts = geodesicPoints([-74, 40.7], [139.7, 35.7], 100);
    expect(pts[0][0]).toBeCloseTo(-74, 9);
    expect(pts[0][1]).toBeCloseTo(40.7, 9);
    expect(pts[pts.length - 1][0]).toBeCloseTo(139.7, 9);
    const total = geodesicDistanceM(g, -74, 40.7, 139.7, 35.7);
    let sum = 0;
    for (let i = 1; i < pts.length; i++) sum += geodesicDistanceM(g, pts[i - 1][0], pts[i - 1][1], pts[i][0], pts[i][1]);
    expect(Math.abs(sum - total)).toBeLessThan(1e-3);
    expect(total / (pts.length - 1)).toBeLessThanOrEqual(100_000);
  });
  it('rhumbPoints keep one bearing all the way (a straight line on Mercator)', () => {
    const a = [-5, 48];
    const b = [-74, 40.7];
    const pts = rhumbPoints(a, b, 50);
    const bearing = rhumbBearingDeg(a, b);
    for (let i = 1; i < pts.length; i++) expect(rhumbBearingDeg(pts[i - 1], pts[i])).toBeCloseTo(bearing, 8);
    expect(pts[pts.length - 1][0]).toBeCloseTo(-74, 9);
    expect(pts[pts.length - 1][1]).toBeCloseTo(40.7, 9);
  });
});

/** Scorecards: closed-form area means, equal-area and conformal invariants, tolerances, worst points. */
import { describe, expect, it } from 'vitest';
import { resolveDefinition } from './definition';
import { computeSampleFields } from './fields';
import { prepareRegion } from './region/prepare';
import type { RegionInput } from './region/geojson';
import { sampleRegion } from './sampling';
import { scoreCandidate } from './scorecard';

const band = (s: number, n: number): RegionInput => ({ type: 'Polygon', coordinates: [[[-180, s], [0, s], [180, s], [180, n], [0, n], [-180, n], [-180, s]]] });

describe('scoreCandidate', () => {
  it('Mercator on the sphere over a latitude band: mean s = (atanh sin φ₂ − atanh sin φ₁)/(sin φ₂ − sin φ₁) within 0.2 %', () => {
    // ∫ sec²φ cos φ dφ / ∫ cos φ dφ over [φ₁, φ₂] on the sphere (Snyder 1987, eq. 7-2 with ch. 4).
    for (const [p1, p2] of [[10, 30], [40, 70], [-60, -20]]) {
      const region = band(p1, p2);
      const samples = sampleRegion(region, { count: 20_000, seed: 1, ellipsoid: { aM: 6371000, es: 0 }, pairs: 200 });
      const m = scoreCandidate(resolveDefinition('+proj=merc +R=6371000'), samples);
      const r = Math.PI / 180;
      const expected = (Math.atanh(Math.sin(p2 * r)) - Math.atanh(Math.sin(p1 * r))) / (Math.sin(p2 * r) - Math.sin(p1 * r));
      expect(Math.abs(m.arealScale.mean / expected - 1)).toBeLessThan(0.002);
      expect(m.angularDeformationDeg.max).toBeLessThan(1e-8);
      expect(m.arealScale.min).toBeGreaterThanOrEqual(1 / Math.cos(Math.min(Math.abs(p1), Math.abs(p2)) * r) ** 2 - 1e-9);
    }
  });

  it('reports an equal-area map as s = 1 everywhere, and its areas agree', () => {
    const region: RegionInput = { type: 'Polygon', coordinates: [[[-10, 35], [30, 35], [30, 60], [-10, 60], [-10, 35]]] };
    const prepared = prepareRegion(region);
    const samples = sampleRegion(prepared, { count: 5000, seed: 1 });
    const m = scoreCandidate(resolveDefinition('EPSG:3035'), samples, prepared);
    expect(Math.abs(m.arealScale.min - 1)).toBeLessThan(1e-9);
    expect(Math.abs(m.arealScale.max - 1)).toBeLessThan(1e-9);
    expect(m.withinTolerance.arealScale1Pct).toBe(1);
    expect(m.angularDeformationDeg.max).toBeGreaterThan(1);
    expect(m.undefinedShare).toBe(0);
    expect(Math.abs((m.projectedVsGeodesicArea.ratio ?? 0) - 1)).toBeLessThan(1e-4);
    expect(Math.abs(m.projectedVsGeodesicArea.integratedAreaKm2 / samples.areaKm2 - 1)).toBeLessThan(1e-9);
    // The worst angular deformation sits at a corner far from the centre (52°N, 10°E).
    expect(Math.abs(m.worstPoints.maxAngularDeformation.latDeg - 52) + Math.abs(m.worstPoints.maxAngularDeformation.lonDeg - 10)).toBeGreaterThan(20);
  });

  it('removes the best uniform scale in closed form: ln c = −½ mean(ln a + ln b)', () => {
    const region = band(20, 40);
    const samples = sampleRegion(region, { count: 4000, seed: 2, pairs: 100 });
    const resolved = resolveDefinition('+proj=merc +k_0=3');
    const f = computeSampleFields(resolved, samples);
    let sum = 0;
    for (let i = 0; i < samples.count; i++) sum += Math.log(f.a[i]) + Math.log(f.b[i]);
    expect(Math.log(f.bestScale)).toBeCloseTo(-0.5 * (sum / samples.count), 12);
    // A uniform scale changes neither the Airy–Kavrayskiy measure nor the distance error.
    const m1 = scoreCandidate(resolveDefinition('+proj=merc'), samples);
    const m3 = scoreCandidate(resolved, samples);
    expect(m3.airyKavrayskiy).toBeCloseTo(m1.airyKavrayskiy, 12);
    expect(m3.distanceError.mean).toBeCloseTo(m1.distanceError.mean, 9);
    expect(m3.arealScale.mean / m1.arealScale.mean).toBeCloseTo(9, 9);
  });

  it('excludes undefined points from statistics and reports their share', () => {
    const region = band(-80, 80);
    const samples = sampleRegion(region, { count: 4000, seed: 1, pairs: 300 });
    const m = scoreCandidate(resolveDefinition('+proj=ortho +lat_0=0 +lon_0=0 +R=6371000'), samples);
    expect(m.undefinedShare).toBeGreaterThan(0.45);
    expect(m.undefinedShare).toBeLessThan(0.55);
    for (const v of [m.arealScale.mean, m.angularDeformationDeg.p95, m.airyKavrayskiy, m.distanceError.mean]) expect(Number.isFinite(v)).toBe(true);
  });
});

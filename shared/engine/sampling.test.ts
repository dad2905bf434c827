/**
 * Equal-area sampling. Sample shares are checked against GeographicLib polygon areas (Karney
 * 2013) of Natural Earth (world-atlas) and US Census (us-atlas) boundaries at different latitudes;
 * Fiji crosses the antimeridian and Antarctica encloses a pole.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { authalicQ } from './ellipsoid';
import { regionAreaM2 } from './region/area';
import { createRegionTest } from './region/contains';
import type { RegionFeature, RegionInput } from './region/geojson';
import { prepareRegion } from './region/prepare';
import { regionSummary } from './region/summary';
import { sampleRegion } from './sampling';

const fixture = (name: string) => JSON.parse(readFileSync(new URL(`../../fixtures/regions/engine-${name}.geojson`, import.meta.url), 'utf8')) as RegionFeature;
const box = (w: number, s: number, e: number, n: number): RegionInput => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });

describe('sampleRegion', () => {
  it('is deterministic for a seed and count, and changes with another seed', () => {
    const a = sampleRegion(fixture('italy'), { count: 3000, seed: 5 });
    const b = sampleRegion(fixture('italy'), { count: 3000, seed: 5 });
    const c = sampleRegion(fixture('italy'), { count: 3000, seed: 6 });
    expect(Array.from(a.lonDeg)).toEqual(Array.from(b.lonDeg));
    expect(Array.from(a.pairI)).toEqual(Array.from(b.pairI));
    expect(Array.from(a.lonDeg)).not.toEqual(Array.from(c.lonDeg));
    expect(a.lonDeg.length).toBe(3000);
    expect(a.weightKm2.reduce((x, y) => x + y, 0)).toBeCloseTo(a.areaKm2, 3);
  });

  it('gives regions at different latitudes sample counts proportional to their geodesic areas (within 1 %)', () => {
    const names = ['iceland', 'madagascar', 'italy', 'japan', 'colorado', 'texas', 'michigan', 'chile'];
    const parts = names.map(fixture);
    const union: RegionInput = { type: 'FeatureCollection', features: parts };
    const n = 200_000;
    const samples = sampleRegion(union, { count: n, seed: 11, pairs: 0 });
    const areas = parts.map((p) => regionAreaM2(prepareRegion(p)));
    const total = areas.reduce((x, y) => x + y, 0);
    expect(samples.areaKm2 * 1e6).toBeCloseTo(total, -3);
    parts.forEach((p, k) => {
      const inside = createRegionTest(prepareRegion(p));
      let count = 0;
      for (let i = 0; i < n; i++) if (inside(samples.lonDeg[i], samples.latDeg[i])) count++;
      const share = count / n;
      expect(Math.abs(share / (areas[k] / total) - 1), names[k]).toBeLessThan(0.01);
    });
  });

  it('samples Fiji across the antimeridian: both sides, all inside, the right area', () => {
    const fiji = fixture('fiji');
    const region = prepareRegion(fiji);
    const summary = regionSummary(region);
    expect(summary.crossesAntimeridian).toBe(true);
    expect(summary.bbox[0]).toBeGreaterThan(summary.bbox[2]); // RFC 7946 §5.2: west > east
    const s = sampleRegion(region, { count: 5000, seed: 2 });
    const inside = createRegionTest(region);
    let east = 0;
    let west = 0;
    for (let i = 0; i < s.count; i++) {
      expect(inside(s.lonDeg[i], s.latDeg[i])).toBe(true);
      expect(Math.abs(s.lonDeg[i])).toBeGreaterThan(170);
      if (s.lonDeg[i] > 0) east++;
      else west++;
    }
    expect(east).toBeGreaterThan(0);
    expect(west).toBeGreaterThan(0);
    expect(s.areaKm2).toBeGreaterThan(17_000);
    expect(s.areaKm2).toBeLessThan(20_000);
  });

  it('samples Antarctica around the south pole, down to the pole itself', () => {
    const region = prepareRegion(fixture('antarctica'));
    expect(region.containsPole).toBe(-1);
    const s = sampleRegion(region, { count: 20_000, seed: 3 });
    expect(s.areaKm2).toBeGreaterThan(12.0e6);
    expect(s.areaKm2).toBeLessThan(14.5e6);
    let nearPole = 0;
    let north = -90;
    for (let i = 0; i < s.count; i++) {
      if (s.latDeg[i] < -89) nearPole++;
      north = Math.max(north, s.latDeg[i]);
    }
    // The cap beyond 89°S is 0.3 % of Antarctica: about 60 of 20 000 samples.
    expect(nearPole).toBeGreaterThan(30);
    expect(nearPole).toBeLessThan(100);
    expect(north).toBeLessThan(-60);
  });

  it('reads a wrongly wound ring as the same region, never the rest of the world', () => {
    const ccw = box(10, 40, 20, 50);
    const cw: RegionInput = { type: 'Polygon', coordinates: [[[10, 40], [10, 50], [20, 50], [20, 40], [10, 40]]] };
    const a = sampleRegion(ccw, { count: 2000, seed: 1 });
    const b = sampleRegion(cw, { count: 2000, seed: 1 });
    expect(Array.from(b.latDeg)).toEqual(Array.from(a.latDeg));
    expect(b.areaKm2).toBeCloseTo(a.areaKm2, 6);
    expect(a.areaKm2).toBeLessThan(1e6);
  });

  it('leaves holes empty and subtracts them from the area', () => {
    const holed: RegionInput = {
      type: 'Polygon',
      coordinates: [
        [[0, 0], [10, 0], [10, 10], [0, 10], [0, 0]],
        [[3, 3], [3, 7], [7, 7], [7, 3], [3, 3]],
      ],
    };
    const s = sampleRegion(holed, { count: 4000, seed: 1 });
    for (let i = 0; i < s.count; i++) expect(s.lonDeg[i] > 3 && s.lonDeg[i] < 7 && s.latDeg[i] > 3 && s.latDeg[i] < 7).toBe(false);
    const outer = regionAreaM2(prepareRegion(box(0, 0, 10, 10)));
    const inner = regionAreaM2(prepareRegion(box(3, 3, 7, 7)));
    expect(s.areaKm2 * 1e6).toBeCloseTo(outer - inner, -4);
  });

  it('keeps an unsplit ring across the antimeridian together', () => {
    const s = sampleRegion({ type: 'Polygon', coordinates: [[[170, -10], [-170, -10], [-170, 10], [170, 10], [170, -10]]] }, { count: 2000, seed: 1 });
    for (let i = 0; i < s.count; i++) expect(Math.abs(s.lonDeg[i])).toBeGreaterThanOrEqual(170);
    const half = regionAreaM2(prepareRegion(box(170, -10, 180, 10)));
    expect(s.areaKm2 * 1e6).toBeCloseTo(2 * half, -5);
  });

  it('reads a ring around a pole (without polar edges, either winding) as the polar cap', () => {
    const ring = Array.from({ length: 37 }, (_, i) => [-180 + 10 * i, -70]);
    ring[36] = ring[0];
    const east = prepareRegion({ type: 'Polygon', coordinates: [ring] });
    const westward = prepareRegion({ type: 'Polygon', coordinates: [[...ring].reverse()] });
    expect(east.containsPole).toBe(-1);
    expect(westward.containsPole).toBe(-1);
    // Cap beyond 70°S on WGS84: π a² (q_p − q(70°)) (Snyder 1987, eq. 3-12).
    const a = 6378137;
    const es = 0.0066943799901413165;
    const cap = Math.PI * a * a * (authalicQ(es, 1) - authalicQ(es, Math.sin((70 * Math.PI) / 180)));
    expect(Math.abs(regionAreaM2(east) / cap - 1)).toBeLessThan(1e-4);
    const s = sampleRegion(westward, { count: 1000, seed: 1 });
    for (let i = 0; i < s.count; i++) expect(s.latDeg[i]).toBeLessThan(-70);
  });

  it('rejects malformed regions with a message naming the problem', () => {
    expect(() => sampleRegion({ type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1]]] })).toThrow(/not closed/);
    expect(() => sampleRegion({ type: 'Polygon', coordinates: [[[0, 0], [1, 0], [0, 95], [0, 0]]] })).toThrow(/out of range/);
    expect(() => sampleRegion({ type: 'FeatureCollection', features: [] })).toThrow(/no Polygon/);
    expect(() => sampleRegion(box(0, 0, 1, 1), { count: 2_000_000 })).toThrow(/sample count/);
  });
});

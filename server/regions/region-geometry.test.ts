import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import type { Feature } from 'geojson';
import { polygonsAreaKm2, ringAreaM2 } from './geodesic-area.js';
import { emptyTally, featurePolygons } from './polygon-rings.js';
import { regionExtent } from './region-extent.js';
import type { Ring } from './ring-shape.js';
import { ringShape } from './ring-shape.js';
import { findSelfIntersections } from './self-intersections.js';

const poly = (coordinates: number[][][]): Feature => ({ type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates } });

/** Area straight from GeographicLib (Karney 2013), unclosed ring, no cleaning of ours in between. */
function referenceAreaKm2(ring: number[][]): number {
  const p = geodesic.Geodesic.WGS84.Polygon(false);
  for (const [lon, lat] of ring) p.AddPoint(lat, lon);
  return Math.abs(p.Compute(false, true).area ?? NaN) / 1e6;
}

describe('ring shape', () => {
  it('measures planar signed area, counter-clockwise positive', () => {
    expect(ringShape([[0, 0], [10, 0], [10, 10], [0, 0]]).area2).toBe(100);
    expect(ringShape([[0, 0], [10, 10], [10, 0], [0, 0]]).area2).toBe(-100);
  });
  it('unwraps an edge across ±180° and reports the crossing', () => {
    const s = ringShape([[179, 0], [-179, 0], [-179, 1], [179, 1], [179, 0]]);
    expect(s.crossesAntimeridian).toBe(true);
    expect(s.area2).toBeCloseTo(4, 9); // 2° × 1°, twice
  });
});

describe('cleaning polygons', () => {
  it('closes open rings, drops repeated points and turns rings to RFC 7946 order', () => {
    const t = emptyTally();
    // Clockwise outer ring, open, with a repeated point; counter-clockwise hole.
    const [rings] = featurePolygons(poly([
      [[0, 0], [0, 10], [0, 10], [10, 10], [10, 0]],
      [[2, 2], [4, 2], [4, 4], [2, 4], [2, 2]],
    ]), 'F', t);
    expect(t).toMatchObject({ ringsClosed: 1, duplicatePointsRemoved: 1, ringsRewound: 2 });
    expect(ringShape(rings[0]).area2).toBeGreaterThan(0);
    expect(ringShape(rings[1]).area2).toBeLessThan(0);
    expect(rings[0][0]).toEqual(rings[0][rings[0].length - 1]);
  });

  it('refuses an out-of-range coordinate, naming it and where it is', () => {
    expect(() => featurePolygons(poly([[[0, 0], [1, 0], [1, 95], [0, 0]]]), 'Feature 3 ("X")', emptyTally())).toThrow(
      /Feature 3 \("X"\), polygon 1, ring 1 has the coordinate \[1, 95\]/,
    );
    expect(() => featurePolygons(poly([[[0, 0], [1, 0], [1, 'a' as never], [0, 0]]]), 'F', emptyTally())).toThrow(/not a pair of numbers/);
  });

  it('drops a degenerate outer ring with its holes', () => {
    const t = emptyTally();
    expect(featurePolygons(poly([[[0, 0], [1, 1], [0, 0]], [[0.2, 0.2], [0.4, 0.2], [0.4, 0.4], [0.2, 0.2]]]), 'F', t)).toEqual([]);
    expect(t.degenerateRingsDropped).toBe(1);
  });

  it('splits a ring crossing the antimeridian into two parts with the same geodesic area', () => {
    const ring = [[178, -17], [-178, -17], [-178, -15], [178, -15], [178, -17]];
    const t = emptyTally();
    const parts = featurePolygons(poly([ring]), 'F', t);
    expect(t.ringsSplitAtAntimeridian).toBe(1);
    expect(parts).toHaveLength(2);
    for (const p of parts) for (const [lon] of p[0]) expect(Math.abs(lon)).toBeLessThanOrEqual(180);
    // GeographicLib follows the original ring's short edges across ±180° itself.
    // Equal up to the 1e-9° rounding of the cut points.
    const ref = referenceAreaKm2(ring.slice(0, -1));
    expect(Math.abs(polygonsAreaKm2(parts) - ref) / ref).toBeLessThan(1e-9);
    const extent = regionExtent(parts);
    const [west, south, east, north] = extent.bbox;
    expect([west, east, north]).toEqual([178, -178, -15]);
    // The cut point lies on the edge's geodesic, which bows poleward of −17° at 180°.
    expect(south).toBeLessThan(-17);
    expect(south).toBeGreaterThan(-17.05);
    expect(extent.crossesAntimeridian).toBe(true);
  });

  it('closes a ring going round the North Pole through the pole, keeping its geodesic area', () => {
    const ring: number[][] = [];
    for (let lon = -170; lon <= 180; lon += 10) ring.push([lon === 180 ? -180 : lon, 75]);
    ring.push([-170, 75]);
    const t = emptyTally();
    const parts = featurePolygons(poly([ring.slice(1)]), 'F', t);
    expect(t.polarRingsClosed).toBe(1);
    expect(parts).toHaveLength(1);
    expect(parts[0][0].some(([, lat]) => lat === 90)).toBe(true);
    // GeographicLib handles a ring encircling a pole without help (Karney 2013, §6).
    const ref = referenceAreaKm2(ring.slice(1));
    expect(Math.abs(polygonsAreaKm2(parts) - ref) / ref).toBeLessThan(1e-9);
    expect(regionExtent(parts)).toMatchObject({ bbox: [-180, 75, 180, 90], poles: ['north'] });
  });

  it('keeps a ring that runs along the South Pole line (Natural Earth style) as drawn', () => {
    const coast: Ring = [];
    for (let lon = -180; lon <= 180; lon += 15) coast.push([lon, -70 - (lon % 30 === 0 ? 2 : 0)]);
    const ring: Ring = [...coast, [180, -90], [-180, -90], coast[0]];
    const parts = featurePolygons(poly([ring.slice().reverse()]), 'F', emptyTally());
    expect(ringShape(parts[0][0]).area2).toBeGreaterThan(0);
    expect(ringAreaM2(parts[0][0])).toBeGreaterThan(0);
    expect(regionExtent(parts).poles).toEqual(['south']);
  });
});

describe('self-intersections', () => {
  it('finds the crossing of a bow-tie and of two rings, not touches or shared vertices', () => {
    expect(findSelfIntersections([[[[0, 0], [2, 2], [2, 0], [0, 2], [0, 0]]]])).toEqual({ count: 1, sample: [[1, 1]] });
    // A hole poking out through the outer ring crosses it twice.
    const outer: Ring = [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]];
    const hole: Ring = [[3, 1], [3, 3], [5, 3], [5, 1], [3, 1]];
    const found = findSelfIntersections([[outer, hole]]);
    expect(found.count).toBe(2);
    expect(found.sample.map(([x, y]) => [x, y].map((v) => Math.round(v * 1e9) / 1e9))).toEqual(expect.arrayContaining([[4, 1], [4, 3]]));
    // A clean square, and a ring touching itself at one vertex: no crossings.
    expect(findSelfIntersections([[outer]]).count).toBe(0);
    expect(findSelfIntersections([[[[0, 0], [2, 0], [1, 1], [2, 2], [0, 2], [1, 1], [0, 0]]]]).count).toBe(0);
  });

  it('agrees with a brute-force all-pairs check on a jagged ring of 2 000 random vertices', () => {
    // A star-shaped ring with random radii crosses itself nowhere; reversing a stretch of it makes crossings.
    let seed = 7;
    const rand = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const ring: Ring = [];
    for (let i = 0; i < 2000; i++) {
      const t = (2 * Math.PI * i) / 2000;
      const r = 1 + rand();
      ring.push([10 + r * Math.cos(t), 10 + r * Math.sin(t)]);
    }
    ring.splice(500, 200, ...ring.slice(500, 700).reverse());
    ring.push(ring[0]);
    let brute = 0;
    const n = ring.length - 1;
    const o = (a: number[], b: number[], c: number[]) => (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
    for (let i = 0; i < n; i++) {
      for (let j = i + 2; j < n; j++) {
        if (i === 0 && j === n - 1) continue;
        const [a, b, c, d] = [ring[i], ring[i + 1], ring[j], ring[j + 1]];
        if (o(a, b, c) * o(a, b, d) < 0 && o(c, d, a) * o(c, d, b) < 0) brute++;
      }
    }
    expect(brute).toBeGreaterThan(0);
    expect(findSelfIntersections([[ring]]).count).toBe(brute);
  });
});

import { describe, expect, it } from 'vitest';
import { rasterMask } from './raster-mask.js';

const ring = (pts: number[][]) => Float64Array.from(pts.flat());

/** Even–odd test of a point against rings, the slow way, as the reference. */
function inside(rings: Float64Array[], x: number, y: number): boolean {
  let odd = false;
  for (const r of rings) {
    const n = r.length / 2;
    for (let i = 0, j = n - 1; i < n; j = i++) {
      const xi = r[2 * i], yi = r[2 * i + 1], xj = r[2 * j], yj = r[2 * j + 1];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) odd = !odd;
    }
  }
  return odd;
}

describe('rasterMask', () => {
  it('fills exactly the pixels whose centres lie inside a square with a hole', () => {
    const outer = ring([[2, 2], [12, 2], [12, 12], [2, 12]]);
    const hole = ring([[5, 5], [5, 9], [9, 9], [9, 5]]);
    const mask = rasterMask([outer, hole], 16, 16);
    expect(mask.reduce((a, b) => a + b, 0)).toBe(100 - 16);
    expect(mask[6 * 16 + 6]).toBe(0);
    expect(mask[3 * 16 + 3]).toBe(1);
  });

  it('agrees pixel for pixel with a point-in-polygon test on an irregular star', () => {
    const pts: number[][] = [];
    for (let k = 0; k < 23; k++) {
      const a = (k / 23) * 2 * Math.PI, r = k % 2 ? 20 : 55 + 10 * Math.sin(3 * a);
      pts.push([64 + r * Math.cos(a) + 0.37, 64 + r * Math.sin(a) + 0.21]);
    }
    const rings = [ring(pts)];
    const mask = rasterMask(rings, 128, 128);
    let filled = 0;
    for (let y = 0; y < 128; y++) for (let x = 0; x < 128; x++) {
      expect(mask[y * 128 + x], `${x},${y}`).toBe(inside(rings, x + 0.5, y + 0.5) ? 1 : 0);
      filled += mask[y * 128 + x];
    }
    expect(filled).toBeGreaterThan(2000);
  });
});

import type { FlatRing } from './frame.js';

/**
 * Which pixels of a width × height image have their centre inside the rings, by the even–odd
 * rule (so holes and several parts need no special case): for each pixel row, the x where ring
 * edges cross the row's centre line are sorted and the spans between pairs filled. Each edge is
 * visited once per row it spans, so the cost is O(rows crossed + pixels), not O(pixels × edges).
 * Returns 1 for inside, 0 for outside.
 */
export function rasterMask(rings: FlatRing[], width: number, height: number): Uint8Array {
  const crossings: number[][] = Array.from({ length: height }, () => []);
  for (const r of rings) {
    const n = r.length / 2;
    for (let i = 0; i < n; i++) {
      const j = (i + 1) % n;
      const x0 = r[2 * i], y0 = r[2 * i + 1], x1 = r[2 * j], y1 = r[2 * j + 1];
      if (y0 === y1 || !Number.isFinite(x0 + y0 + x1 + y1)) continue;
      const yLo = Math.min(y0, y1), yHi = Math.max(y0, y1);
      // Rows whose centre c = row + ½ satisfies yLo ≤ c < yHi (half-open, so shared vertices count once).
      const first = Math.max(0, Math.ceil(yLo - 0.5));
      const last = Math.min(height - 1, Math.ceil(yHi - 0.5) - 1);
      const slope = (x1 - x0) / (y1 - y0);
      for (let row = first; row <= last; row++) crossings[row].push(x0 + (row + 0.5 - y0) * slope);
    }
  }
  const mask = new Uint8Array(width * height);
  for (let row = 0; row < height; row++) {
    const xs = crossings[row];
    if (xs.length < 2) continue;
    xs.sort((a, b) => a - b);
    for (let k = 0; k + 1 < xs.length; k += 2) {
      // Pixel columns whose centre col + ½ lies in [xs[k], xs[k+1]).
      const from = Math.max(0, Math.ceil(xs[k] - 0.5));
      const to = Math.min(width - 1, Math.ceil(xs[k + 1] - 0.5) - 1);
      mask.fill(1, row * width + from, row * width + to + 1);
    }
  }
  return mask;
}

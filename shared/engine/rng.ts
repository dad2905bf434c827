/**
 * Deterministic pseudo-random numbers for sampling: SplitMix32-style mixing of a 32-bit seed
 * (Steele, Lea & Flood 2014, "Fast splittable pseudorandom number generators", OOPSLA).
 * Returns a function yielding floats in [0, 1). Example: createRng(42)() is the same on every run.
 */
export function createRng(seed: number): () => number {
  let state = (seed >>> 0) ^ 0x9e3779b9;
  return () => {
    state = (state + 0x9e3779b9) | 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    z ^= z >>> 16;
    return (z >>> 0) / 4294967296;
  };
}

/**
 * The R2 low-discrepancy sequence (Roberts 2018, "The unreasonable effectiveness of quasirandom
 * sequences"): point i is frac(offset + i·(1/g, 1/g²)), g the plastic number. Better spread than
 * random points, so sample counts track areas closely.
 * Example: r2Point(0, 0.5, 0.5) === [0.5, 0.5].
 */
export const PLASTIC = 1.324717957244746;
const A1 = 1 / PLASTIC;
const A2 = 1 / (PLASTIC * PLASTIC);

export function r2Point(i: number, offset1: number, offset2: number): [number, number] {
  const u = offset1 + i * A1;
  const v = offset2 + i * A2;
  return [u - Math.floor(u), v - Math.floor(v)];
}

import { describe, expect, it } from 'vitest';
import { RAMPS, srgbToLab } from './ramps.js';

const rgb = (lut: Uint8Array, i: number) => [lut[i * 3], lut[i * 3 + 1], lut[i * 3 + 2]];
const lightness = (lut: Uint8Array, i: number) => srgbToLab(rgb(lut, i).map((c) => c / 255))[0];

describe('colour ramps', () => {
  it('reproduces Moreland’s cool-to-warm map: its ends and its grey midpoint', () => {
    // Moreland 2009, "Diverging Color Maps for Scientific Visualization", table of the cool-to-warm
    // map: ends (59, 76, 192) and (180, 4, 38), midpoint (221, 221, 221).
    const d = RAMPS.diverging;
    expect(rgb(d, 0)).toEqual([59, 76, 192]);
    expect(rgb(d, 255)).toEqual([180, 4, 38]);
    for (const c of [...rgb(d, 127), ...rgb(d, 128)]) expect(Math.abs(c - 221)).toBeLessThanOrEqual(2);
  });

  it('makes the diverging map’s lightness rise to the middle and fall after it, evenly on both arms', () => {
    const d = RAMPS.diverging;
    // Allow 0.2 L* for 8-bit rounding near the flat top (a just-noticeable difference is about 1).
    for (let i = 1; i <= 127; i++) expect(lightness(d, i)).toBeGreaterThan(lightness(d, i - 1) - 0.2);
    for (let i = 129; i <= 255; i++) expect(lightness(d, i)).toBeLessThan(lightness(d, i - 1) + 0.2);
    expect(lightness(d, 127)).toBeGreaterThan(lightness(d, 64) + 10);
    expect(lightness(d, 128)).toBeGreaterThan(lightness(d, 192) + 10);
    // The two ends are about equally dark, so neither side of s = 1 looks more important.
    expect(Math.abs(lightness(d, 0) - lightness(d, 255))).toBeLessThan(8);
  });

  it('keeps viridis’s published ends and a rising lightness', () => {
    // matplotlib's _viridis_data: first entry (0.267004, 0.004874, 0.329415), last (0.993248, 0.906157, 0.143936).
    const v = RAMPS.sequential;
    expect(rgb(v, 0)).toEqual([68, 1, 84]);
    expect(rgb(v, 255)).toEqual([253, 231, 37]);
    // Never visibly darker than the entry before (8-bit rounding moves L* by hundredths), and rising over every 4 entries.
    for (let i = 1; i < 256; i++) expect(lightness(v, i)).toBeGreaterThan(lightness(v, i - 1) - 0.1);
    for (let i = 4; i < 256; i++) expect(lightness(v, i)).toBeGreaterThan(lightness(v, i - 4));
  });
});

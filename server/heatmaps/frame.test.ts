import { describe, expect, it } from 'vitest';
import { frameFor, projectRings, toUnit } from './frame.js';

// An equirectangular stand-in centred on 180°: x = (lon − 180) wrapped, y = lat (degrees as metres).
const forward = (lon: number, lat: number): [number, number] => [((lon % 360) + 360) % 360 - 180, lat];

describe('projected outlines', () => {
  it('takes a ring edge between +180° and −180° the short way round', () => {
    const ring = [[179, -16], [-180, -16.5], [-179, -17], [179, -17], [179, -16]];
    const [projected] = projectRings([ring], forward);
    const xs = Array.from(projected).filter((_, i) => i % 2 === 0);
    expect(Math.max(...xs) - Math.min(...xs)).toBeLessThan(3);
  });

  it('frames every ring in a square with a margin, y pointing down', () => {
    const [r] = projectRings([[[0, 0], [10, 0], [10, 5], [0, 5], [0, 0]]], (lon, lat) => [lon, lat]);
    const f = frameFor([r]);
    expect(f.span).toBeCloseTo(10 * 1.06, 12);
    const [u0, v0] = toUnit(f, 0, 5);
    const [u1, v1] = toUnit(f, 10, 0);
    expect(u0).toBeCloseTo(0.03 / 1.06, 12);
    expect(u1).toBeCloseTo(1 - 0.03 / 1.06, 12);
    expect(v0).toBeLessThan(v1);
  });
});

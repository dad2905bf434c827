import { describe, expect, it } from 'vitest';
import { checkRouteEnds, isometricLatitude, latitudeFromIsometric, rhumbPoints } from './route-lines.js';

const WGS84_ES = 0.0066943799901413165;

describe('rhumb lines on the ellipsoid', () => {
  it('inverts the isometric latitude to rounding level', () => {
    for (const deg of [-80, -45, -1, 0, 12.5, 60, 85]) {
      const phi = (deg * Math.PI) / 180;
      expect(latitudeFromIsometric(isometricLatitude(phi, WGS84_ES), WGS84_ES)).toBeCloseTo(phi, 14);
    }
  });

  it('keeps ψ linear in λ (constant bearing) and goes the short way across ±180°', () => {
    const pts = rhumbPoints([170, -10], [-170, 20], WGS84_ES, 8);
    expect(pts[0][0]).toBe(170);
    expect(pts[0][1]).toBeCloseTo(-10, 12);
    expect(pts[8][0]).toBeCloseTo(190, 12);
    expect(pts[8][1]).toBeCloseTo(20, 12);
    const psi = pts.map(([, lat]) => isometricLatitude((lat * Math.PI) / 180, WGS84_ES));
    for (let i = 1; i < pts.length; i++) expect((psi[i] - psi[i - 1]) / (pts[i][0] - pts[i - 1][0])).toBeCloseTo((psi[1] - psi[0]) / (pts[1][0] - pts[0][0]), 12);
  });

  it('refuses antipodes and identical places', () => {
    expect(() => checkRouteEnds([0, 10], [180, -10])).toThrow(/antipodal/);
    expect(() => checkRouteEnds([5, 5], [5, 5])).toThrow(/same point/);
    expect(() => checkRouteEnds([0, 0], [10, 10])).not.toThrow();
  });
});

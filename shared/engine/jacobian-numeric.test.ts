/**
 * The finite-difference step: DERIVATIVE_STEP_RAD = 1e-5 rad balances truncation (∝ step²) and
 * rounding (∝ 1/step). Checked against the closed form of the oblique stereographic projection on
 * the sphere (k = 2k₀/(1 + cos c), Snyder 1987, eq. 21-4), evaluated through proj4 by finite
 * differences only.
 */
import { describe, expect, it } from 'vitest';
import { DERIVATIVE_STEP_RAD } from './constants';
import { resolveDefinition } from './definition';
import { createProj4Projection } from './proj4-object';
import { numericJacobian } from './jacobian-numeric';
import { tissotFromJacobian } from './tissot';

const D = Math.PI / 180;

function worstError(stepRad: number): number {
  const resolved = resolveDefinition('+proj=stere +lat_0=40 +lon_0=-100 +R=6371000');
  const p = createProj4Projection(resolved.proj4);
  const pt = { x: 0, y: 0 };
  const fwd = (l: number, f: number, xy: Float64Array) => {
    pt.x = l;
    pt.y = f;
    const r = p.forward(pt)!;
    xy[0] = r.x;
    xy[1] = r.y;
  };
  const jac = numericJacobian(fwd, -100 * D, stepRad);
  const j = new Float64Array(4);
  const out = new Float64Array(8);
  let worst = 0;
  for (const [lon, lat] of [[-75, 30], [-100, 40], [-60, 70], [-140, 10], [-100, -20], [20, 80]]) {
    jac(lon * D, lat * D, j);
    tissotFromJacobian(j[0], j[1], j[2], j[3], 6371000, 6371000 * Math.cos(lat * D), out);
    const cosC = Math.sin(40 * D) * Math.sin(lat * D) + Math.cos(40 * D) * Math.cos(lat * D) * Math.cos((lon + 100) * D);
    worst = Math.max(worst, Math.abs(out[1] / (2 / (1 + cosC)) - 1));
  }
  return worst;
}

describe('numericJacobian step', () => {
  it('reaches ~1e-10 at the documented step, and is worse both well above and well below it', () => {
    const atStep = worstError(DERIVATIVE_STEP_RAD);
    expect(DERIVATIVE_STEP_RAD).toBe(1e-5);
    expect(atStep).toBeLessThan(5e-10);
    expect(worstError(1e-3)).toBeGreaterThan(10 * atStep); // truncation
    expect(worstError(1e-9)).toBeGreaterThan(10 * atStep); // rounding
  });
  it('looks away from the cut at lon₀ ± 180° instead of differencing across it', () => {
    const resolved = resolveDefinition('+proj=eqearth +R=1');
    const p = createProj4Projection(resolved.proj4);
    const pt = { x: 0, y: 0 };
    const jac = numericJacobian((l, f, xy) => {
      pt.x = l;
      pt.y = f;
      const r = p.forward(pt)!;
      xy[0] = r.x;
      xy[1] = r.y;
    }, 0);
    const near = new Float64Array(4);
    const inside = new Float64Array(4);
    jac(Math.PI - 1e-6, 0.5, near); // within a step of the cut
    jac(Math.PI - 1e-3, 0.5, inside);
    expect(Math.abs(near[0] / inside[0] - 1)).toBeLessThan(1e-6);
  });
});

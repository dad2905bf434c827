import { DERIVATIVE_STEP_RAD, HALF_PI } from './constants';

/** Raw forward projection: radians in, metres out written to xy[0], xy[1] (NaN where undefined). */
export type ForwardRad = (lamRad: number, phiRad: number, xy: Float64Array) => void;

/** Fills out[0..3] with ∂x/∂λ, ∂y/∂λ, ∂x/∂φ, ∂y/∂φ; returns false where the projection is undefined. */
export type JacobianRad = (lamRad: number, phiRad: number, out: Float64Array) => boolean;

/**
 * Jacobian of a forward projection by second-order finite differences with step stepRad
 * (default DERIVATIVE_STEP_RAD). lamRad must lie within [lon0 − π, lon0 + π]; within one step of
 * that cut (where x jumps by the map's width) or of a pole, the one-sided second-order formula
 * f′ ≈ (∓3f(x) ± 4f(x ± h) ∓ f(x ± 2h))/(2h) looks away from it (Fornberg 1988 weights).
 *
 * Where the coordinates are large beside their rate of change (|f|/|f′| = R radians ≫ 1, e.g. the
 * λ-derivative of a transverse Mercator near the pole, y ≈ 10⁷ m against N cos φ ≈ 10⁴ m), rounding
 * (ε·R/step) would swamp truncation (step²/6), so that derivative is taken again with the step
 * that balances them, (3εR)^{1/3}, capped at 1e-3 rad.
 * Example: numericJacobian((l, p, xy) => { xy[0] = l; xy[1] = p; }, 0)(0.1, 0.2, out) gives 1, 0, 0, 1.
 */
export function numericJacobian(forward: ForwardRad, lon0Rad: number, stepRad = DERIVATIVE_STEP_RAD): JacobianRad {
  const xy = new Float64Array(2);
  const h = stepRad;
  const edge = Math.PI - 1.01 * h;
  const poleEdge = HALF_PI - 1.01 * h;
  const inv2h = 1 / (2 * h);
  return (lam, phi, out) => {
    const dl = lam - lon0Rad;
    let x1, y1, x2, y2, x0 = NaN, y0 = NaN;
    if (dl > edge || dl < -edge || phi > poleEdge || phi < -poleEdge) {
      forward(lam, phi, xy);
      x0 = xy[0];
      y0 = xy[1];
      if (!(x0 === x0 && y0 === y0)) return false;
    }
    if (dl <= edge && dl >= -edge) {
      forward(lam + h, phi, xy);
      x1 = xy[0]; y1 = xy[1];
      forward(lam - h, phi, xy);
      x2 = xy[0]; y2 = xy[1];
      out[0] = (x1 - x2) * inv2h;
      out[1] = (y1 - y2) * inv2h;
      const step = balancedStep(x1, y1, x2, y2, out[0], out[1], h);
      if (step > 0 && dl + step < Math.PI && dl - step > -Math.PI) {
        forward(lam + step, phi, xy);
        x1 = xy[0]; y1 = xy[1];
        forward(lam - step, phi, xy);
        out[0] = (x1 - xy[0]) / (2 * step);
        out[1] = (y1 - xy[1]) / (2 * step);
      }
    } else {
      const d = dl > 0 ? -h : h;
      forward(lam + d, phi, xy);
      x1 = xy[0]; y1 = xy[1];
      forward(lam + 2 * d, phi, xy);
      x2 = xy[0]; y2 = xy[1];
      out[0] = ((-3 * x0 + 4 * x1 - x2) * 0.5) / d;
      out[1] = ((-3 * y0 + 4 * y1 - y2) * 0.5) / d;
    }
    if (phi <= poleEdge && phi >= -poleEdge) {
      forward(lam, phi + h, xy);
      x1 = xy[0]; y1 = xy[1];
      forward(lam, phi - h, xy);
      x2 = xy[0]; y2 = xy[1];
      out[2] = (x1 - x2) * inv2h;
      out[3] = (y1 - y2) * inv2h;
      const step = balancedStep(x1, y1, x2, y2, out[2], out[3], h);
      if (step > 0 && phi + step < HALF_PI && phi - step > -HALF_PI) {
        forward(lam, phi + step, xy);
        x1 = xy[0]; y1 = xy[1];
        forward(lam, phi - step, xy);
        out[2] = (x1 - xy[0]) / (2 * step);
        out[3] = (y1 - xy[1]) / (2 * step);
      }
    } else {
      const d = phi > 0 ? -h : h;
      forward(lam, phi + d, xy);
      x1 = xy[0]; y1 = xy[1];
      forward(lam, phi + 2 * d, xy);
      x2 = xy[0]; y2 = xy[1];
      out[2] = ((-3 * x0 + 4 * x1 - x2) * 0.5) / d;
      out[3] = ((-3 * y0 + 4 * y1 - y2) * 0.5) / d;
    }
    const sum = out[0] + out[1] + out[2] + out[3];
    return sum === sum && sum !== Infinity && sum !== -Infinity;
  };
}

const EPS = 2.220446049250313e-16;

/** The step balancing rounding and truncation when it is well above h, else 0 (keep h). */
function balancedStep(x1: number, y1: number, x2: number, y2: number, dx: number, dy: number, h: number): number {
  const size = 0.5 * (Math.abs(x1 + x2) + Math.abs(y1 + y2));
  const rate = Math.abs(dx) + Math.abs(dy);
  if (!(size > 8 * rate)) return 0;
  const step = Math.cbrt(3 * EPS * (size / rate));
  return step > 1.5 * h ? Math.min(step, 1e-3) : 0;
}

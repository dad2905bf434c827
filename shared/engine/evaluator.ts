import { DEG_TO_RAD, HALF_PI, POLE_GUARD_RAD, TWO_PI } from './constants';
import type { ResolvedDefinition } from './definition';
import { analyticJacobian } from './jacobian-analytic';
import { numericJacobian, type ForwardRad, type JacobianRad } from './jacobian-numeric';
import { createProj4Projection } from './proj4-object';
import { tissotFromJacobian } from './tissot';

/** Per-point factor fields, one entry per point; NaN marks a point where the projection is undefined. */
export interface FactorArrays {
  h: Float64Array;
  k: Float64Array;
  s: Float64Array;
  omegaDeg: Float64Array;
  a: Float64Array;
  b: Float64Array;
  convergenceDeg: Float64Array;
}

/** Allocates FactorArrays for n points. */
export function allocFactorArrays(n: number): FactorArrays {
  return {
    h: new Float64Array(n),
    k: new Float64Array(n),
    s: new Float64Array(n),
    omegaDeg: new Float64Array(n),
    a: new Float64Array(n),
    b: new Float64Array(n),
    convergenceDeg: new Float64Array(n),
  };
}

/** A compiled projection: forward in radians/metres (false origin removed) and factors in bulk. */
export interface FactorEvaluator {
  readonly method: 'analytic' | 'numeric';
  /** Projected x, y in metres including the false origin, or NaN where undefined. */
  forward(lamRad: number, phiRad: number, xy: Float64Array): void;
  /**
   * Writes h, k, s, ω°, a, b, γ° into out[0..6] (and θ′° into out[7] with withTheta); returns
   * false where the projection is undefined, out's contents then being unspecified.
   */
  factorsRad(lamRad: number, phiRad: number, out: Float64Array, withTheta?: boolean): boolean;
  /** Factors for points start..end-1 of lon/lat arrays in degrees, written at the same indices of out. */
  factorsBatchDeg(lonDeg: ArrayLike<number>, latDeg: ArrayLike<number>, out: FactorArrays, start?: number, end?: number): void;
}

/**
 * Compiles a resolved definition for repeated evaluation. Derivatives are analytic for Mercator,
 * transverse Mercator (and UTM), Lambert azimuthal equal-area, stereographic, azimuthal
 * equidistant on the ellipsoid (from GeographicLib geodesics), Equal Earth, cylindrical equal-area,
 * equirectangular, Lambert conformal conic, Albers and Mollweide, and central
 * differences of proj4's forward (step DERIVATIVE_STEP_RAD) for the others; M and N come from
 * the surface the projection really uses (resolved.factorEllipsoid).
 * Example: createFactorEvaluator(resolveDefinition('+proj=merc +R=1')).factorsRad(0, π/3, out) gives h = k = 2.
 */
export function createFactorEvaluator(resolved: ResolvedDefinition, options: { numericOnly?: boolean } = {}): FactorEvaluator {
  const projection = createProj4Projection(resolved.proj4);
  const x0 = projection.x0 ?? 0;
  const y0 = projection.y0 ?? 0;
  projection.x0 = 0;
  projection.y0 = 0;
  const point = { x: 0, y: 0 };
  const rawForward: ForwardRad = (lam, phi, xy) => {
    point.x = lam;
    point.y = phi;
    const r = projection.forward(point);
    if (r) {
      xy[0] = r.x;
      xy[1] = r.y;
    } else {
      xy[0] = NaN;
      xy[1] = NaN;
    }
  };
  const lon0 = projection.long0 ?? 0;
  const numeric = () => numericJacobian(rawForward, lon0, resolved.family.stepRad);
  const analytic = options.numericOnly ? undefined : analyticJacobian(resolved.family.id, projection, numeric);
  const jacobian: JacobianRad = analytic ?? numeric();
  const aM = resolved.factorEllipsoid.aM;
  const es = resolved.factorEllipsoid.es;
  const poleSingular = resolved.family.poleSingular;
  const maxC = resolved.family.maxCentreDistanceRad;
  const cosMaxC = maxC === undefined ? -2 : Math.cos(maxC);
  const lat0 = projection.lat0 ?? 0;
  const sinLat0 = Math.sin(lat0);
  const cosLat0 = Math.cos(lat0);
  const jac = new Float64Array(4);
  const poleLimit = HALF_PI - POLE_GUARD_RAD;

  const factorsRad = (lamIn: number, phiIn: number, out: Float64Array, withTheta = false): boolean => {
    let phi = phiIn;
    if (!(phi >= -HALF_PI && phi <= HALF_PI)) return false;
    if (phi > poleLimit || phi < -poleLimit) {
      if (poleSingular) return false;
      phi = phi > 0 ? poleLimit : -poleLimit;
    }
    let dl = lamIn - lon0;
    if (dl > Math.PI || dl < -Math.PI) dl -= TWO_PI * Math.floor((dl + Math.PI) / TWO_PI);
    const cosPhi = Math.cos(phi);
    if (maxC !== undefined) {
      const cosC = sinLat0 * Math.sin(phi) + cosLat0 * cosPhi * Math.cos(dl);
      if (!(cosC > cosMaxC)) return false;
    }
    if (!jacobian(lon0 + dl, phi, jac)) return false;
    const sinPhi = Math.sin(phi);
    const w = 1 - es * sinPhi * sinPhi;
    const sw = Math.sqrt(w);
    const mM = (aM * (1 - es)) / (w * sw);
    const nM = aM / sw;
    tissotFromJacobian(jac[0], jac[1], jac[2], jac[3], mM, nM * cosPhi, out, withTheta);
    const a = out[4];
    return out[2] > 0 && a === a && a !== Infinity;
  };

  return {
    method: analytic ? 'analytic' : 'numeric',
    forward(lam, phi, xy) {
      rawForward(lam, phi, xy);
      xy[0] += x0;
      xy[1] += y0;
    },
    factorsRad,
    factorsBatchDeg(lonDeg, latDeg, out, start = 0, end = lonDeg.length) {
      const f = new Float64Array(8);
      const { h, k, s, omegaDeg, a, b, convergenceDeg } = out;
      for (let i = start; i < end; i++) {
        if (factorsRad(lonDeg[i] * DEG_TO_RAD, latDeg[i] * DEG_TO_RAD, f)) {
          h[i] = f[0];
          k[i] = f[1];
          s[i] = f[2];
          omegaDeg[i] = f[3];
          a[i] = f[4];
          b[i] = f[5];
          convergenceDeg[i] = f[6];
        } else {
          h[i] = k[i] = s[i] = omegaDeg[i] = a[i] = b[i] = convergenceDeg[i] = NaN;
        }
      }
    },
  };
}

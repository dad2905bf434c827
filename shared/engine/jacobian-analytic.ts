import type { JacobianRad } from './jacobian-numeric';
import type { Proj4Projection } from './proj4-object';
import { aeqdJacobian } from './jacobian-aeqd';
import { laeaJacobian } from './jacobian-laea';
import { stereJacobian } from './jacobian-stere';
import { tmercJacobian } from './jacobian-tmerc';

/**
 * Closed-form Jacobians (∂x/∂λ, ∂y/∂λ, ∂x/∂φ, ∂y/∂φ, metres per radian) for families whose forward
 * equations differentiate simply, built from the constants proj4 derived for the definition so
 * that they describe exactly the map proj4 draws. Returns undefined for other families.
 *
 * Mercator: x = a k₀ λ, y = a k₀ ψ(φ), dψ/dφ = (1 − e²)/((1 − e² sin²φ) cos φ) (Snyder 1987, eqs. 7-2, 7-7).
 * Cylindrical equal-area: x = a k₀ λ, y = a q/(2k₀), dq/dφ = 2(1 − e²) cos φ/(1 − e² sin²φ)² (eqs. 10-15, 3-12).
 * Equirectangular: x = a λ cos φ_ts, y = a φ (eq. 12-1).
 * Lambert conformal conic: ρ = a F tⁿ, dρ/dφ = −n ρ (1 − e²)/((1 − e² sin²φ) cos φ) (eqs. 15-7, 15-9).
 * Albers: ρ = a √(C − n q)/n, dρ/dφ = −a (dq/dφ)/(2√(C − n q)) (eq. 14-12).
 * For the conics θ = nΔλ, x = k₀ρ sin θ, y = k₀(ρ₀ − ρ cos θ).
 * Transverse Mercator on the sphere: B = cos φ sin Δλ, x = a k₀ atanh B, y = a k₀ atan2(tan φ, cos Δλ)
 * (eqs. 8-1, 8-3); differentiated directly, since proj4 forms y through an acos that loses half
 * the digits near the equator.
 * Mollweide (sphere): x = (2√2/π) R Δλ cos θ, y = √2 R sin θ, 2θ + sin 2θ = π sin φ (eqs. 31-1 to
 * 31-3), dθ/dφ = π cos φ/(4 cos² θ); θ solved here to rounding level (proj4's and PROJ's own
 * iterations stop early near the poles, where s then drifts from 1 by up to 1e-6).
 * Equal Earth (Šavrič, Patterson & Jenny 2018, Int. J. Geogr. Inf. Sci. 33(3), eqs. 1–2, with the
 * authalic latitude β and radius R_q on the ellipsoid as PROJ does): sin θ = (√3/2) sin β,
 * x = R_q λ cos θ/((√3/2) P′(θ)), y = R_q P(θ), P = A₁θ + A₂θ³ + A₃θ⁷ + A₄θ⁹;
 * dθ/dφ = (√3/2) q′/(q_p cos θ).
 * Example: for +proj=merc +R=1, ∂y/∂φ at φ = 60° is sec 60° = 2.
 */
export function analyticJacobian(family: string, p: Proj4Projection, numeric: () => JacobianRad): JacobianRad | undefined {
  const a = p.a;
  const lon0 = p.long0 ?? 0;
  const wrap = (dl: number) => (dl > Math.PI ? dl - 2 * Math.PI : dl < -Math.PI ? dl + 2 * Math.PI : dl);
  switch (family) {
    case 'merc': {
      const es = p.sphere ? 0 : p.es;
      const ak = a * (p.k0 ?? 1);
      return (_lam, phi, out) => {
        const sinPhi = Math.sin(phi);
        out[0] = ak;
        out[1] = 0;
        out[2] = 0;
        out[3] = (ak * (1 - es)) / ((1 - es * sinPhi * sinPhi) * Math.cos(phi));
        return true;
      };
    }
    case 'cea': {
      const latTs = p.lat_ts ?? 0;
      if (p.sphere) {
        const c = Math.cos(latTs);
        return (_lam, phi, out) => {
          out[0] = a * c;
          out[1] = 0;
          out[2] = 0;
          out[3] = (a * Math.cos(phi)) / c;
          return true;
        };
      }
      const es = p.es;
      const k0 = p.k0 ?? 1;
      return (_lam, phi, out) => {
        const sinPhi = Math.sin(phi);
        const w = 1 - es * sinPhi * sinPhi;
        out[0] = a * k0;
        out[1] = 0;
        out[2] = 0;
        out[3] = (a * (1 - es) * Math.cos(phi)) / (w * w * k0);
        return true;
      };
    }
    case 'eqc': {
      const rc = Math.cos(p.lat_ts ?? 0);
      return (_lam, _phi, out) => {
        out[0] = a * rc;
        out[1] = 0;
        out[2] = 0;
        out[3] = a;
        return true;
      };
    }
    case 'lcc': {
      const n = p.ns as number;
      const f0 = p.f0 as number;
      const e = Math.sqrt(p.es);
      const es = p.es;
      const k0 = p.k0 ?? 1;
      if (!Number.isFinite(n) || !Number.isFinite(f0) || n === 0) return undefined;
      return (lam, phi, out) => {
        const sinPhi = Math.sin(phi);
        const cosPhi = Math.cos(phi);
        const esp = e * sinPhi;
        const t = Math.tan(0.5 * (Math.PI / 2 - phi)) / Math.pow((1 - esp) / (1 + esp), 0.5 * e);
        const rho = a * f0 * Math.pow(t, n);
        const dRho = (-n * rho * (1 - es)) / ((1 - es * sinPhi * sinPhi) * cosPhi);
        return conicJacobian(k0 * rho, k0 * dRho, n, n * wrap(lam - lon0), out);
      };
    }
    case 'aea': {
      const n = p.ns0 as number;
      const c = p.c as number;
      const e = Math.sqrt(p.es);
      const es = p.es;
      if (!Number.isFinite(n) || !Number.isFinite(c) || n === 0) return undefined;
      return (lam, phi, out) => {
        const sinPhi = Math.sin(phi);
        const cosPhi = Math.cos(phi);
        let q: number;
        if (e > 1e-7) {
          const esp = e * sinPhi;
          q = (1 - es) * (sinPhi / (1 - esp * esp) - (0.5 / e) * Math.log((1 - esp) / (1 + esp)));
        } else q = 2 * sinPhi;
        const w = 1 - es * sinPhi * sinPhi;
        const dq = (2 * (1 - es) * cosPhi) / (w * w);
        const root = Math.sqrt(c - n * q);
        const rho = (a * root) / n;
        const dRho = (-a * dq) / (2 * root);
        return conicJacobian(rho, dRho, n, n * wrap(lam - lon0), out);
      };
    }
    case 'utm':
      return tmercJacobian(p);
    case 'laea':
      return laeaJacobian(p, numeric());
    case 'stere':
      return stereJacobian(p);
    case 'aeqd':
      return aeqdJacobian(p);
    case 'tmerc': {
      if (p.es !== 0) return tmercJacobian(p);
      const ak = a * (p.k0 ?? 1);
      return (lam, phi, out) => {
        const dl = wrap(lam - lon0);
        const sinPhi = Math.sin(phi);
        const cosPhi = Math.cos(phi);
        const sinDl = Math.sin(dl);
        const cosDl = Math.cos(dl);
        const b = cosPhi * sinDl;
        const inv = ak / (1 - b * b);
        out[0] = inv * cosPhi * cosDl;
        out[1] = inv * sinPhi * cosPhi * sinDl;
        out[2] = -inv * sinPhi * sinDl;
        out[3] = inv * cosDl;
        return b * b < 1;
      };
    }
    case 'moll': {
      const cx = (2 * Math.SQRT2) / Math.PI;
      return (lam, phi, out) => {
        const theta = mollweideTheta(phi);
        const cosT = Math.cos(theta);
        const dTheta = (Math.PI * Math.cos(phi)) / (4 * cosT * cosT);
        const dl = wrap(lam - lon0);
        out[0] = a * cx * cosT;
        out[1] = 0;
        out[2] = -a * cx * dl * Math.sin(theta) * dTheta;
        out[3] = a * Math.SQRT2 * cosT * dTheta;
        return cosT > 0;
      };
    }
    case 'eqearth': {
      const [A1, A2, A3, A4] = [1.340264, -0.081106, 0.000893, 0.003796];
      const m = Math.sqrt(3) / 2;
      const es = p.es;
      const e = Math.sqrt(es);
      const qp = es > 0 ? (1 - es) * (1 / (1 - es) - (0.5 / e) * Math.log((1 - e) / (1 + e))) : 2;
      const r = a * Math.sqrt(0.5 * qp);
      return (lam, phi, out) => {
        const sinPhi = Math.sin(phi);
        let q: number;
        if (es > 0) {
          const esp = e * sinPhi;
          q = (1 - es) * (sinPhi / (1 - esp * esp) - (0.5 / e) * Math.log((1 - esp) / (1 + esp)));
        } else q = 2 * sinPhi;
        const w = 1 - es * sinPhi * sinPhi;
        const dq = (2 * (1 - es) * Math.cos(phi)) / (w * w);
        const th = Math.asin(m * Math.min(1, Math.max(-1, q / qp)));
        const t2 = th * th;
        const t6 = t2 * t2 * t2;
        const d1 = A1 + 3 * A2 * t2 + t6 * (7 * A3 + 9 * A4 * t2); // P′(θ)
        const d2 = th * (6 * A2 + t2 * t2 * (42 * A3 + 72 * A4 * t2)); // P″(θ)
        const cosT = Math.cos(th);
        const thPhi = (m * dq) / (qp * cosT);
        const dl = wrap(lam - lon0);
        out[0] = (r * cosT) / (m * d1);
        out[1] = 0;
        out[2] = ((r * dl) / m) * ((-Math.sin(th) * d1 - cosT * d2) / (d1 * d1)) * thPhi;
        out[3] = r * d1 * thPhi;
        return true;
      };
    }
    default:
      return undefined;
  }
}

/** Auxiliary angle θ of Mollweide, 2θ + sin 2θ = π sin φ, by Newton from a start that is exact to O(t⁵) near the poles. */
export function mollweideTheta(phi: number): number {
  const s = Math.abs(Math.sin(phi));
  const target = Math.PI * s;
  let theta: number;
  if (s > 0.9) {
    // Near the pole, with t = π/2 − θ: π(1 − sin φ) = 2t − sin 2t ≈ (4/3)t³.
    const oneMinus = (Math.cos(phi) * Math.cos(phi)) / (1 + s);
    theta = Math.PI / 2 - Math.cbrt(0.75 * Math.PI * oneMinus);
  } else theta = Math.abs(phi);
  for (let i = 0; i < 30; i++) {
    const c = Math.cos(theta);
    const d = 4 * c * c;
    if (d < 1e-300) break;
    const step = (2 * theta + Math.sin(2 * theta) - target) / d;
    theta -= step;
    if (Math.abs(step) < 1e-16) break;
  }
  return phi < 0 ? -theta : theta;
}

/** Jacobian of x = ρ sin θ, y = ρ₀ − ρ cos θ with θ = nΔλ (Snyder 1987, eqs. 14-1, 14-2). */
function conicJacobian(rho: number, dRho: number, n: number, theta: number, out: Float64Array): boolean {
  const sinT = Math.sin(theta);
  const cosT = Math.cos(theta);
  out[0] = rho * n * cosT;
  out[1] = rho * n * sinT;
  out[2] = dRho * sinT;
  out[3] = -dRho * cosT;
  return Number.isFinite(rho) && Number.isFinite(dRho);
}

import type { JacobianRad } from './jacobian-numeric';
import type { Proj4Projection } from './proj4-object';

/**
 * Closed-form Jacobian of the stereographic projection as proj4 and PROJ's "stere" draw it
 * (Snyder 1987, eqs. 21-2 to 21-4 on the sphere, 21-24 to 21-27 on the ellipsoid with the
 * conformal latitude χ, 21-33 to 21-37 polar). Oblique and equatorial, with
 * S = 1 + sin χ₀ sin χ + cos χ₀ cos χ cos Δλ and A = C/S (C = 2ak₀m₁/cos χ₀; 2ak₀ on the sphere):
 *   x = A cos χ sin Δλ,  y = A (cos χ₀ sin χ − sin χ₀ cos χ cos Δλ),
 * polar on the ellipsoid ρ = 2ak₀t/√((1 + e)^{1+e}(1 − e)^{1−e}), x = ρ sin Δλ, y = ∓ρ cos Δλ,
 * with dχ/dφ = cos χ (1 − e²)/((1 − e² sin²φ) cos φ) and d ln t/dφ = −(1 − e²)/((1 − e² sin²φ) cos φ).
 * cos χ = 2u/(1 + u²), u = tan(π/4 + χ/2), keeps full precision near the poles.
 * Example: at the centre of +proj=stere +k_0=0.9999 +R=1, h = k = 0.9999.
 */
export function stereJacobian(p: Proj4Projection): JacobianRad | undefined {
  const a = p.a;
  const k0 = p.k0 ?? 1;
  const lon0 = p.long0 ?? 0;
  const lat0 = p.lat0 ?? 0;
  const sphere = !!p.sphere;
  const es = sphere ? 0 : p.es;
  const e = Math.sqrt(es);
  const polar = !sphere && Math.abs(Math.cos(lat0)) <= 1e-10 ? (lat0 > 0 ? 1 : -1) : 0;
  const cons = p.cons as number | undefined;
  let c: number, sX0: number, cX0: number;
  if (sphere) {
    c = 2 * a * k0;
    sX0 = Math.sin(lat0);
    cX0 = Math.cos(lat0);
  } else {
    sX0 = p.sinX0 as number;
    cX0 = p.cosX0 as number;
    const ms1 = p.ms1 as number;
    c = Math.abs(Math.sin(lat0)) < 1e-10 ? 2 * a * k0 : (2 * a * k0 * ms1) / cX0;
    if (!Number.isFinite(sX0) || !Number.isFinite(cX0) || (!polar && !Number.isFinite(c))) return undefined;
  }
  if (polar && !(cons! > 0)) return undefined;
  return (lam, phi, out) => {
    let dl = lam - lon0;
    if (dl > Math.PI) dl -= 2 * Math.PI;
    else if (dl < -Math.PI) dl += 2 * Math.PI;
    const sinPhi = Math.sin(phi);
    const cosPhi = Math.cos(phi);
    const sl = Math.sin(dl);
    const cl = Math.cos(dl);
    const w = 1 - es * sinPhi * sinPhi;
    const dLnT = -(1 - es) / (w * cosPhi);
    if (polar) {
      // t of the pole's own hemisphere (Snyder 1987, eq. 15-9 with φ → con·φ).
      const ps = polar * sinPhi;
      const t = Math.tan(0.5 * (Math.PI / 2 - polar * phi)) / Math.pow((1 - e * ps) / (1 + e * ps), 0.5 * e);
      const rho = (2 * a * k0 * t) / cons!;
      const dRho = rho * dLnT * polar;
      out[0] = rho * cl;
      out[1] = polar * rho * sl;
      out[2] = dRho * sl;
      out[3] = -polar * dRho * cl;
      return Number.isFinite(rho);
    }
    const esp = e * sinPhi;
    const u = Math.tan(0.5 * (Math.PI / 2 + phi)) * (e > 0 ? Math.pow((1 - esp) / (1 + esp), 0.5 * e) : 1);
    const u2 = u * u;
    const sChi = Number.isFinite(u2) ? (u2 - 1) / (u2 + 1) : 1;
    const cChi = Number.isFinite(u2) ? (2 * u) / (u2 + 1) : 0;
    const chiPhi = -cChi * dLnT;
    const s = 1 + sX0 * sChi + cX0 * cChi * cl;
    if (!(s > 1e-15)) return false;
    const A = c / s;
    const aL = (-A / s) * (-cX0 * cChi * sl);
    const aC = (-A / s) * (sX0 * cChi - cX0 * sChi * cl);
    const t = cX0 * sChi - sX0 * cChi * cl;
    out[0] = aL * cChi * sl + A * cChi * cl;
    out[1] = aL * t + A * sX0 * cChi * sl;
    out[2] = (aC * cChi * sl - A * sChi * sl) * chiPhi;
    out[3] = (aC * t + A * (cX0 * cChi + sX0 * sChi * cl)) * chiPhi;
    return true;
  };
}

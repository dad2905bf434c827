import type { JacobianRad } from './jacobian-numeric';
import type { Proj4Projection } from './proj4-object';

/**
 * Closed-form Jacobian of the Lambert azimuthal equal-area projection on the ellipsoid or sphere
 * (Snyder 1987, eqs. 24-16 to 24-19 oblique/equatorial with authalic latitude β, 24-25 polar):
 * oblique, with S = 1 + sin β₁ sin β + cos β₁ cos β cos Δλ and B = √(2/S),
 *   x = a·x_m·B cos β sin Δλ,  y = a·y_m·B (cos β₁ sin β − sin β₁ cos β cos Δλ);
 * polar, ρ = a√(q_p ∓ q), x = ρ sin Δλ, y = ∓ρ cos Δλ; and dβ/dφ = q′/(q_p cos β) with
 * q′ = 2(1 − e²) cos φ/(1 − e² sin²φ)² (eq. 3-12 differentiated). Near the poles q_p − q is
 * formed without cancellation (qpMinusQ), so cos β and ρ keep full precision there; the
 * fallback is kept for arguments outside the formulas' reach.
 * Example: at the centre of +proj=laea +R=1 the Jacobian is the identity (h = k = 1).
 */
export function laeaJacobian(p: Proj4Projection, fallback: JacobianRad): JacobianRad {
  const es = p.es;
  const e = Math.sqrt(es);
  const a = p.a;
  const lon0 = p.long0 ?? 0;
  const lat0 = p.lat0 ?? 0;
  const q = (sinPhi: number) => {
    if (e < 1e-10) return 2 * sinPhi;
    const esp = e * sinPhi;
    return (1 - es) * (sinPhi / (1 - esp * esp) - (0.5 / e) * Math.log((1 - esp) / (1 + esp)));
  };
  const qp = q(1);
  const polar = Math.abs(Math.abs(lat0) - Math.PI / 2) < 1e-10 ? Math.sign(lat0) : 0;
  const rq = Math.sqrt(0.5 * qp);
  const sin0 = Math.sin(lat0);
  const sinb1 = polar ? 0 : q(sin0) / qp;
  const cosb1 = Math.sqrt(1 - sinb1 * sinb1);
  const dd = polar ? 1 : Math.cos(lat0) / (Math.sqrt(1 - es * sin0 * sin0) * rq * cosb1);
  const xm = a * rq * dd;
  const ym = (a * rq) / dd;
  const guard = Math.PI / 2 - 1e-10;
  return (lam, phi, out) => {
    if (phi > guard || phi < -guard) return fallback(lam, phi, out);
    let dl = lam - lon0;
    if (dl > Math.PI) dl -= 2 * Math.PI;
    else if (dl < -Math.PI) dl += 2 * Math.PI;
    const sinPhi = Math.sin(phi);
    const cosPhi = Math.cos(phi);
    const w = 1 - es * sinPhi * sinPhi;
    const dq = (2 * (1 - es) * cosPhi) / (w * w);
    const qq = q(sinPhi);
    // q_p − q(|sin φ|), accurate near the poles.
    const far = qpMinusQ(e, es, Math.abs(sinPhi), (cosPhi * cosPhi) / (1 + Math.abs(sinPhi)));
    const sl = Math.sin(dl);
    const cl = Math.cos(dl);
    if (polar !== 0) {
      const r2 = polar * sinPhi >= 0 ? far : qp + Math.abs(qq);
      if (!(r2 > 0)) return false;
      const root = Math.sqrt(r2);
      const rho = a * root;
      const dRho = (-polar * a * dq) / (2 * root);
      out[0] = rho * cl;
      out[1] = polar * rho * sl;
      out[2] = dRho * sl;
      out[3] = -polar * dRho * cl;
      return true;
    }
    const sb = qq / qp;
    const cb = Math.sqrt((far / qp) * (1 + Math.abs(sb)));
    const s = 1 + sinb1 * sb + cosb1 * cb * cl;
    if (!(s > 1e-12)) return false;
    const b = Math.sqrt(2 / s);
    const k = -b / (2 * s);
    const bL = k * (-cosb1 * cb * sl);
    const bB = k * (sinb1 * cb - cosb1 * sb * cl);
    const t = cosb1 * sb - sinb1 * cb * cl;
    const tL = sinb1 * cb * sl;
    const tB = cosb1 * cb + sinb1 * sb * cl;
    const betaPhi = dq / (qp * cb);
    out[0] = xm * (bL * cb * sl + b * cb * cl);
    out[1] = ym * (bL * t + b * tL);
    out[2] = xm * (bB * cb * sl - b * sb * sl) * betaPhi;
    out[3] = ym * (bB * t + b * tB) * betaPhi;
    return true;
  };
}

/**
 * q_p − q(s) for s = |sin φ| ∈ [0, 1], with d = 1 − s given accurately (cos²φ/(1 + sin φ)):
 * (1 − e²)[d(1 + e²s)/((1 − e²)(1 − e²s²)) + (log1p(ed/(1 − e)) − log1p(−ed/(1 + e)))/(2e)],
 * two positive terms (eq. 3-12 rearranged), so nothing cancels as φ → 90°. Sphere: 2d.
 */
export function qpMinusQ(e: number, es: number, s: number, d: number): number {
  if (e < 1e-10) return 2 * d;
  const a = (d * (1 + es * s)) / ((1 - es) * (1 - es * s * s));
  const b = (Math.log1p((e * d) / (1 - e)) - Math.log1p((-e * d) / (1 + e))) / (2 * e);
  return (1 - es) * (a + b);
}

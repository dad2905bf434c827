import type { JacobianRad } from './jacobian-numeric';
import type { Proj4Projection } from './proj4-object';

/**
 * Closed-form Jacobian of the exact transverse Mercator on the ellipsoid, in the form PROJ and
 * proj4 compute it (Poder & Engsager; Karney 2011, J. Geodesy 85, §3): geodetic φ → conformal
 * latitude χ (series cbg), the spherical Gauss–Schreiber map ζ′ = ξ′ + iη′ with
 * ξ′ = atan2(sin χ, cos χ cos λ), η′ = atanh(cos χ sin λ), then ζ = ζ′ + Σ gtu_j sin 2jζ′, and
 * x = a·Qn·η, y = a·(Qn·ξ + Zb). The chain rule uses dζ/dζ′ = 1 + Σ 2j·gtu_j cos 2jζ′ (a complex
 * number D, with the Cauchy–Riemann equations), dχ/dφ = cos χ (1 − e²)/((1 − e² sin²φ) cos φ)
 * (Snyder 1987, eq. 3-1 differentiated) and the Gauss–Schreiber partials of Snyder 1987, eq. 8-1.
 * Uses the series proj4 derived for the definition (gtu, cbg, Qn), so it describes the map proj4
 * draws. Example: on the central meridian at the equator, ∂x/∂λ = a·Qn·(1 + Σ 2j·gtu_j).
 */
export function tmercJacobian(p: Proj4Projection): JacobianRad | undefined {
  const gtu = p.gtu as number[] | undefined;
  const cbg = p.cbg as number[] | undefined;
  const qn = p.Qn as number | undefined;
  if (!gtu || !cbg || !qn || p.approx) return undefined;
  const aq = p.a * qn;
  const es = p.es;
  const lon0 = p.long0 ?? 0;
  return (lam, phi, out) => {
    let dl = lam - lon0;
    if (dl > Math.PI) dl -= 2 * Math.PI;
    else if (dl < -Math.PI) dl += 2 * Math.PI;
    // Conformal latitude χ = φ + Σ cbg_j sin 2jφ (Clenshaw summation, as proj4's gatg).
    const cos2 = 2 * Math.cos(2 * phi);
    let h1 = cbg[cbg.length - 1];
    let h2 = 0;
    let h = h1;
    for (let i = cbg.length - 2; i >= 0; i--) {
      h = -h2 + cos2 * h1 + cbg[i];
      h2 = h1;
      h1 = h;
    }
    const chi = phi + h * Math.sin(2 * phi);
    const sinChi = Math.sin(chi);
    const cosChi = Math.cos(chi);
    const sinL = Math.sin(dl);
    const cosL = Math.cos(dl);
    const b = cosChi * sinL;
    if (!(b * b < 1)) return false;
    const inv = 1 / (1 - b * b);
    const xiP = Math.atan2(sinChi, cosChi * cosL);
    const etaP = Math.atanh(b);
    if (Math.abs(etaP) > 2.623395162778) return false; // where proj4's forward stops
    // D = 1 + Σ 2j gtu_j cos(2jζ′), cos 2jζ′ by the Chebyshev recurrence on complex numbers.
    const c1r = Math.cos(2 * xiP) * Math.cosh(2 * etaP);
    const c1i = -Math.sin(2 * xiP) * Math.sinh(2 * etaP);
    let pr = 1, pi = 0; // cos(0·2ζ′)
    let cr = c1r, ci = c1i; // cos(1·2ζ′)
    let dr = 1, di = 0;
    for (let j = 1; j <= gtu.length; j++) {
      dr += 2 * j * gtu[j - 1] * cr;
      di += 2 * j * gtu[j - 1] * ci;
      const nr = 2 * (c1r * cr - c1i * ci) - pr;
      const ni = 2 * (c1r * ci + c1i * cr) - pi;
      pr = cr; pi = ci; cr = nr; ci = ni;
    }
    const xiL = sinChi * cosChi * sinL * inv;
    const etaL = cosChi * cosL * inv;
    const sinPhi = Math.sin(phi);
    const chiPhi = (cosChi * (1 - es)) / ((1 - es * sinPhi * sinPhi) * Math.cos(phi));
    const xiC = cosL * inv * chiPhi;
    const etaC = -sinChi * sinL * inv * chiPhi;
    out[0] = aq * (di * xiL + dr * etaL);
    out[1] = aq * (dr * xiL - di * etaL);
    out[2] = aq * (di * xiC + dr * etaC);
    out[3] = aq * (dr * xiC - di * etaC);
    return true;
  };
}

import { RAD_TO_DEG } from './constants';
import { geodesicFor } from './geodesic';
import type { JacobianRad } from './jacobian-numeric';
import type { Proj4Projection } from './proj4-object';

/**
 * Jacobian of the ellipsoidal azimuthal equidistant projection from GeographicLib's inverse
 * geodesic (Karney 2013), as PROJ computes the projection: a point at geodesic distance s₁₂ and
 * azimuth α₁ from the centre maps to (s₁₂ sin α₁, s₁₂ cos α₁). Moving the point by (dE, dN) on the
 * ground changes s₁₂ by dE sin α₂ + dN cos α₂ and α₁ by (dE cos α₂ − dN sin α₂)/m₁₂ (m₁₂ the
 * reduced length, α₂ the azimuth at the point), with dE = N cos φ dλ and dN = M dφ.
 * proj4's own forward iterates Vincenty's formulae, ~1e-4 m from GeographicLib.
 * Example: along the radius the scale is 1, across it s₁₂/m₁₂.
 */
export function aeqdJacobian(p: Proj4Projection): JacobianRad | undefined {
  if (!(p.es > 0)) return undefined;
  const g = geodesicFor({ aM: p.a, es: p.es });
  const lat0 = (p.lat0 ?? 0) * RAD_TO_DEG;
  const lon0 = (p.long0 ?? 0) * RAD_TO_DEG;
  const es = p.es;
  const a = p.a;
  // DISTANCE | AZIMUTH | REDUCEDLENGTH (GeographicLib output masks).
  const mask = 1025 | 512 | 4101;
  return (lam, phi, out) => {
    const sinPhi = Math.sin(phi);
    const w = 1 - es * sinPhi * sinPhi;
    const nM = a / Math.sqrt(w);
    const mM = (a * (1 - es)) / (w * Math.sqrt(w));
    const east = nM * Math.cos(phi);
    const r = g.Inverse(lat0, lon0, phi * RAD_TO_DEG, lam * RAD_TO_DEG, mask);
    const s = r.s12 as number;
    if (!(s > 1e-3)) {
      out[0] = east;
      out[1] = 0;
      out[2] = 0;
      out[3] = mM;
      return true;
    }
    const m12 = r.m12 as number;
    if (!(m12 > 0)) return false;
    const a1 = (r.azi1 as number) / RAD_TO_DEG;
    const a2 = (r.azi2 as number) / RAD_TO_DEG;
    const s1 = Math.sin(a1), c1 = Math.cos(a1), s2 = Math.sin(a2), c2 = Math.cos(a2);
    const dsL = east * s2;
    const daL = (east * c2) / m12;
    const dsP = mM * c2;
    const daP = (-mM * s2) / m12;
    out[0] = dsL * s1 + s * c1 * daL;
    out[1] = dsL * c1 - s * s1 * daL;
    out[2] = dsP * s1 + s * c1 * daP;
    out[3] = dsP * c1 - s * s1 * daP;
    return true;
  };
}

import type { ResolvedDefinition } from '../../shared/engine/definition-core.js';
import { factorsAt } from '../../shared/engine/factors.js';

/**
 * Checks the engine's resolver leaves to proj4, which reads "+lat_ts=abc" as NaN and accepts a
 * latitude of 100° or a scale factor of 0 without complaint: numeric PROJ parameters must be
 * numbers in range, and the projection must give finite Tissot factors at its own centre.
 * Throws an Error whose message names the offending parameter.
 */
const LATITUDES = ['lat_0', 'lat_1', 'lat_2', 'lat_ts'];
const LONGITUDES = ['lon_0', 'lonc'];
const NUMERIC = [...LATITUDES, ...LONGITUDES, 'k_0', 'k', 'x_0', 'y_0', 'a', 'b', 'rf', 'R', 'zone', 'alpha', 'gamma', 'h'];

export function checkDefinitionSanity(r: ResolvedDefinition): void {
  const tokens = r.resolved.split(/\s+/).filter((t) => t.startsWith('+') && t.includes('='));
  for (const token of tokens) {
    const [key, raw] = token.slice(1).split('=', 2);
    if (!NUMERIC.includes(key)) continue;
    const v = Number(raw);
    if (!Number.isFinite(v)) throw new Error(`+${key}=${raw} is not a number`);
    if (LATITUDES.includes(key) && Math.abs(v) > 90) throw new Error(`+${key}=${raw} is not a latitude (−90…90)`);
    if (LONGITUDES.includes(key) && Math.abs(v) > 540) throw new Error(`+${key}=${raw} is not a longitude`);
    if ((key === 'k_0' || key === 'k') && !(v > 0)) throw new Error(`the scale factor +${key}=${raw} must be positive`);
    if (key === 'zone' && !(Number.isInteger(v) && v >= 1 && v <= 60)) throw new Error(`+zone=${raw} is not a UTM zone (1…60)`);
    if ((key === 'a' || key === 'R' || key === 'b') && !(v > 0)) throw new Error(`+${key}=${raw} must be a positive length in metres`);
  }
  // Near (not at) the centre: conics and cylinders are singular at a pole they may be centred on.
  const lat = Math.max(-89, Math.min(89, r.params.lat0Deg));
  const lon = r.family.id === 'utm' ? lonOfUtm(r) : r.params.lon0Deg;
  const f = factorsAt(r, lon + 0.01, lat === 0 ? 0.01 : lat - Math.sign(lat) * 0.01);
  if (!f.defined || ![f.h, f.k, f.s, f.omegaDeg].every(Number.isFinite) || !(f.s > 0)) {
    throw new Error('the projection gives no finite scale at its own centre; check its parameters');
  }
}

function lonOfUtm(r: ResolvedDefinition): number {
  const zone = Number(/\+zone=(\d+)/.exec(r.resolved)?.[1] ?? 31);
  return -183 + 6 * zone;
}

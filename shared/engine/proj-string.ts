/**
 * Parsing and normalising PROJ strings ("+proj=lcc +lat_1=33 ...") so that proj4 evaluates
 * them as PROJ does (proj4 returns NaN for several families unless some defaults are explicit).
 */

export type ProjParams = Map<string, string | true>;

/** Splits a PROJ string into its parameters. Example: parseProjString('+proj=merc +over').get('over') === true. */
export function parseProjString(text: string): ProjParams {
  const params: ProjParams = new Map();
  for (const token of text.trim().split(/\s+/)) {
    if (!token) continue;
    const body = token.startsWith('+') ? token.slice(1) : token;
    if (!body) continue;
    const eq = body.indexOf('=');
    if (eq < 0) params.set(body, true);
    else params.set(body.slice(0, eq), body.slice(eq + 1));
  }
  return params;
}

/** Writes parameters back as a PROJ string, +proj first. */
export function formatProjString(params: ProjParams): string {
  const parts: string[] = [];
  const proj = params.get('proj');
  if (proj !== undefined) parts.push(`+proj=${proj}`);
  for (const [key, value] of params) {
    if (key === 'proj') continue;
    parts.push(value === true ? `+${key}` : `+${key}=${value}`);
  }
  return parts.join(' ');
}

/** Keys that describe a CRS wrapper or a datum shift, irrelevant to the projection's distortion. */
const DROPPED_KEYS = ['type', 'no_defs', 'wktext', 'towgs84', 'nadgrids', 'geoidgrids', 'vunits', 'axis'];

const hasEllipsoid = (p: ProjParams) =>
  p.has('ellps') || p.has('datum') || p.has('a') || p.has('R') || p.has('b') || p.has('rf') || p.has('f');

/** True when the parameters describe a sphere (PROJ's +R, or +a alone, or +a = +b, or +es=0). */
export function isSphereParams(p: ProjParams): boolean {
  if (p.has('R')) return true;
  if (p.has('ellps') || p.has('datum')) return p.get('ellps') === 'sphere';
  if (p.has('a') && !p.has('b') && !p.has('rf') && !p.has('f') && !p.has('es') && !p.has('e')) return true;
  if (p.has('a') && p.has('b')) return Number(p.get('a')) === Number(p.get('b'));
  return p.get('es') === '0';
}

/**
 * Fills in the defaults PROJ assumes but proj4 needs spelled out: +x_0/+y_0/+lat_0/+lon_0 = 0,
 * WGS84 when no ellipsoid is given, a spherical +a alone written as +R, and +approx for a
 * transverse Mercator on a sphere (proj4's exact algorithm refuses a sphere; the spherical
 * formulae are exact there anyway).
 */
export function normaliseProjParams(input: ProjParams): ProjParams {
  const p: ProjParams = new Map(input);
  for (const key of DROPPED_KEYS) p.delete(key);
  if (!hasEllipsoid(p)) p.set('ellps', 'WGS84');
  if (p.has('a') && isSphereParams(p) && !p.has('R')) {
    p.set('R', p.get('a') as string);
    p.delete('a');
    p.delete('b');
  }
  const proj = p.get('proj');
  // UTM takes its origin from +zone (and +south); PROJ ignores the four keys there.
  if (proj !== 'utm') for (const key of ['lat_0', 'lon_0', 'x_0', 'y_0']) if (!p.has(key)) p.set(key, '0');
  if (proj === 'tmerc' && isSphereParams(p)) p.set('approx', true);
  if (proj === 'lcc' && !p.has('lat_1')) p.set('lat_1', p.get('lat_0') as string);
  return p;
}

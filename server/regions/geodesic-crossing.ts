import geodesic from 'geographiclib-geodesic';

const G = geodesic.Geodesic;
const WGS84 = G.WGS84;

/**
 * Latitude where the geodesic from a to b crosses the meridian `lonDeg`, found by bisection
 * along the line with GeographicLib (Karney 2013). `lonDeg` and the points' longitudes are in
 * one unwrapped frame (b may be given as 181° when it lies just east of ±180°). Cutting an edge
 * there keeps both halves on the original geodesic, so the polygon's geodesic area is unchanged;
 * a straight lon/lat interpolation would not be.
 */
export function meridianCrossingLatDeg(a: [number, number], b: [number, number], lonDeg: number): number {
  const line = WGS84.InverseLine(a[1], a[0], b[1], b[0], G.LATITUDE | G.LONGITUDE | G.DISTANCE_IN | G.LONG_UNROLL);
  const s12 = line.s13;
  if (!(s12 > 0)) return a[1];
  const target = lonDeg - a[0];
  const lonAt = (s: number) => {
    const p = line.Position(s, G.LATITUDE | G.LONGITUDE | G.LONG_UNROLL);
    return { dLon: (p.lon2 ?? 0) - a[0], lat: p.lat2 ?? 0 };
  };
  const sign = Math.sign(b[0] - a[0]) || 1;
  let lo = 0;
  let hi = s12;
  for (let i = 0; i < 64 && hi - lo > 1e-6; i++) {
    const mid = (lo + hi) / 2;
    if (sign * (lonAt(mid).dLon - target) < 0) lo = mid;
    else hi = mid;
  }
  return lonAt((lo + hi) / 2).lat;
}

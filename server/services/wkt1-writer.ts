import type { ResolvedDefinition } from '../../shared/engine/definition.js';

/**
 * A WKT1 text (OGC 01-009, "Coordinate Transformation Services", §7, as GDAL and the .prj of a
 * shapefile use it) for a resolved definition of the families below. Projection and parameter
 * names are OGC's; the ellipsoid is written as given (WGS 84 by name when it is WGS84).
 * Returns null for families WKT1 has no agreed form for here (oblique Mercator variants).
 */
const DEG = Math.PI / 180;
type Writer = (r: ResolvedDefinition) => { name: string; params: [string, number][] };

const P = (r: ResolvedDefinition) => r.params;
const falseOrigin = (r: ResolvedDefinition): [string, number][] => [
  ['false_easting', P(r).x0M],
  ['false_northing', P(r).y0M],
];
const centre = (lat: string, lon: string) => (r: ResolvedDefinition): [string, number][] => [
  [lat, P(r).lat0Deg],
  [lon, P(r).lon0Deg],
];
const simple = (name: string, lat = 'latitude_of_origin', lon = 'central_meridian'): Writer => (r) => ({
  name,
  params: [...centre(lat, lon)(r), ...falseOrigin(r)],
});
const conic = (name: string, lat: string, lon: string): Writer => (r) => ({
  name,
  params: [
    ['standard_parallel_1', P(r).lat1Deg ?? P(r).lat0Deg],
    ['standard_parallel_2', P(r).lat2Deg ?? P(r).lat1Deg ?? P(r).lat0Deg],
    ...centre(lat, lon)(r),
    ...falseOrigin(r),
  ],
});
const withScale = (name: string): Writer => (r) => ({
  name,
  params: [...centre('latitude_of_origin', 'central_meridian')(r), ['scale_factor', P(r).k0], ...falseOrigin(r)],
});

const WRITERS: Record<string, Writer> = {
  // Mercator with a latitude of true scale is Mercator_1SP with k0 = cos φts / √(1 − e² sin² φts)
  // (Snyder 1987, eq. 7-8 with k = 1 at φts), which every WKT reader knows.
  merc: (r) => {
    const ts = P(r).latTsDeg;
    const k0 = ts === undefined ? P(r).k0 : Math.cos(ts * DEG) / Math.sqrt(1 - r.ellipsoid.es * Math.sin(ts * DEG) ** 2);
    return { name: 'Mercator_1SP', params: [['central_meridian', P(r).lon0Deg], ['scale_factor', k0], ...falseOrigin(r)] };
  },
  tmerc: withScale('Transverse_Mercator'),
  utm: withScale('Transverse_Mercator'),
  lcc: conic('Lambert_Conformal_Conic_2SP', 'latitude_of_origin', 'central_meridian'),
  aea: conic('Albers_Conic_Equal_Area', 'latitude_of_center', 'longitude_of_center'),
  eqdc: conic('Equidistant_Conic', 'latitude_of_center', 'longitude_of_center'),
  laea: simple('Lambert_Azimuthal_Equal_Area', 'latitude_of_center', 'longitude_of_center'),
  stere: (r) =>
    Math.abs(P(r).lat0Deg) === 90
      ? {
          name: 'Polar_Stereographic',
          params: [['latitude_of_origin', P(r).latTsDeg ?? P(r).lat0Deg], ['central_meridian', P(r).lon0Deg], ['scale_factor', P(r).k0], ...falseOrigin(r)],
        }
      : withScale('Stereographic')(r),
  sterea: withScale('Oblique_Stereographic'),
  aeqd: simple('Azimuthal_Equidistant', 'latitude_of_center', 'longitude_of_center'),
  ortho: simple('Orthographic'),
  gnom: simple('Gnomonic'),
  cea: (r) => ({ name: 'Cylindrical_Equal_Area', params: [['standard_parallel_1', P(r).latTsDeg ?? 0], ['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  eqc: (r) => ({ name: 'Equirectangular', params: [['standard_parallel_1', P(r).latTsDeg ?? 0], ['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  mill: (r) => ({ name: 'Miller_Cylindrical', params: [['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  moll: (r) => ({ name: 'Mollweide', params: [['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  sinu: (r) => ({ name: 'Sinusoidal', params: [['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  robin: (r) => ({ name: 'Robinson', params: [['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  eck6: (r) => ({ name: 'Eckert_VI', params: [['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  vandg: (r) => ({ name: 'VanDerGrinten', params: [['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
  poly: simple('Polyconic'),
  bonne: (r) => ({ name: 'Bonne', params: [['standard_parallel_1', P(r).lat1Deg ?? P(r).lat0Deg], ['central_meridian', P(r).lon0Deg], ...falseOrigin(r)] }),
};

const q = (s: string) => `"${s.replace(/"/g, "'")}"`;
const num = (v: number) => String(Number(v.toPrecision(15)));

export function wkt1For(r: ResolvedDefinition, name: string): string | null {
  const writer = WRITERS[r.family.id];
  if (!writer) return null;
  const { aM, es } = r.ellipsoid;
  const f = es === 0 ? 0 : 1 - Math.sqrt(1 - es);
  const rf = f === 0 ? 0 : 1 / f;
  const isWgs84 = aM === 6378137 && Math.abs(rf - 298.257223563) < 1e-6;
  const spheroid = isWgs84 ? 'SPHEROID["WGS 84",6378137,298.257223563]' : `SPHEROID[${q(es === 0 ? 'Sphere' : 'Unnamed ellipsoid')},${num(aM)},${num(rf)}]`;
  const geog = isWgs84
    ? `GEOGCS["WGS 84",DATUM["WGS_1984",${spheroid}],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]]`
    : `GEOGCS["Unknown datum based on ${es === 0 ? 'a sphere' : 'an ellipsoid'}",DATUM["unknown",${spheroid}],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]]`;
  const { name: projName, params } = writer(r);
  const paramText = params.map(([k, v]) => `PARAMETER[${q(k)},${num(v)}]`).join(',');
  return `PROJCS[${q(name)},${geog},PROJECTION[${q(projName)}],${paramText},UNIT["metre",1]]`;
}

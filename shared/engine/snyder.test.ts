/**
 * Snyder 1987, Map Projections: A Working Manual (USGS Professional Paper 1395), Appendix A
 * numerical examples — values from memory, each reproduced with Debian's PROJ 9.1 (`proj`,
 * `cs2cs`) to the digits shown. Tolerances: 1e-7 on the sphere; 0.1 m and 1e-7 in k on the
 * ellipsoid (Snyder rounds e², Clarke 1866 a = 6378206.4 m, e² = 0.00676866).
 */
import { describe, expect, it } from 'vitest';
import { resolveDefinition } from './definition';
import { factorsAt } from './factors';
import { projectPoints } from './project';

interface Example {
  name: string;
  def: string;
  lonLat: [number, number];
  x: number;
  y: number;
  h?: number;
  k?: number;
  omegaDeg?: number;
  sphere: boolean;
}

const CLARKE = '+ellps=clrk66';
const EXAMPLES: Example[] = [
  { name: 'Mercator, sphere', def: '+proj=merc +R=1 +lon_0=-180', lonLat: [-75, 35], x: 1.8325957, y: 0.6528366, h: 1.2207746, k: 1.2207746, sphere: true },
  { name: 'Mercator, Clarke 1866', def: `+proj=merc +lon_0=-180 ${CLARKE}`, lonLat: [-75, 35], x: 11688673.7, y: 4139145.6, k: 1.2194146, sphere: false },
  { name: 'Transverse Mercator, sphere', def: '+proj=tmerc +R=1 +k_0=1 +lon_0=-75', lonLat: [-73.5, 40.5], x: 0.0199077, y: 0.7070276, k: 1.0001982, sphere: true },
  { name: 'Transverse Mercator, Clarke 1866', def: `+proj=tmerc +k_0=0.9996 +lon_0=-75 ${CLARKE}`, lonLat: [-73.5, 40.5], x: 127106.5, y: 4484124.4, k: 0.9997989, sphere: false },
  { name: 'Lambert conformal conic, sphere', def: '+proj=lcc +R=1 +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96', lonLat: [-75, 35], x: 0.2966785, y: 0.2462112, k: 0.997004, sphere: true },
  { name: 'Lambert conformal conic, Clarke 1866', def: `+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96 ${CLARKE}`, lonLat: [-75, 35], x: 1894410.9, y: 1564649.5, k: 0.9970171, sphere: false },
  { name: 'Albers equal-area, sphere', def: '+proj=aea +R=1 +lat_1=29.5 +lat_2=45.5 +lat_0=23 +lon_0=-96', lonLat: [-75, 35], x: 0.295272, y: 0.2416774, h: 1.0085547, k: 0.9915178, omegaDeg: 0.9761, sphere: true },
  { name: 'Albers equal-area, Clarke 1866', def: `+proj=aea +lat_1=29.5 +lat_2=45.5 +lat_0=23 +lon_0=-96 ${CLARKE}`, lonLat: [-75, 35], x: 1885472.7, y: 1535925.0, h: 1.0085173, k: 0.9915546, sphere: false },
  { name: 'Lambert azimuthal equal-area, sphere', def: '+proj=laea +R=3 +lat_0=40 +lon_0=-100', lonLat: [100, -20], x: -4.2339303, y: 4.0257775, sphere: true },
  { name: 'Lambert azimuthal equal-area, Clarke 1866', def: `+proj=laea +lat_0=40 +lon_0=-100 ${CLARKE}`, lonLat: [-110, 30], x: -965932.1, y: -1056814.9, sphere: false },
  { name: 'Stereographic, sphere', def: '+proj=stere +R=1 +k_0=1 +lat_0=40 +lon_0=-100', lonLat: [-75, 30], x: 0.3807224, y: -0.1263802, k: 1.0402304, sphere: true },
  { name: 'Stereographic, Clarke 1866', def: `+proj=stere +k_0=0.9999 +lat_0=40 +lon_0=-100 ${CLARKE}`, lonLat: [-90, 30], x: 971630.8, y: -1063049.3, k: 1.0121248, sphere: false },
  { name: 'Polar stereographic, International', def: '+proj=stere +lat_0=-90 +lat_ts=-71 +lon_0=-100 +ellps=intl', lonLat: [150, -75], x: -1540033.6, y: -560526.4, k: 0.9896256, sphere: false },
];

describe('Snyder 1987 Appendix A worked examples (from memory, reproduced with PROJ)', () => {
  it.each(EXAMPLES)('$name', (ex) => {
    const resolved = resolveDefinition(ex.def);
    const [[x, y]] = projectPoints(resolved, [ex.lonLat]);
    const xyTol = ex.sphere ? 1e-7 : 0.1;
    expect(Math.abs(x - ex.x)).toBeLessThan(xyTol);
    expect(Math.abs(y - ex.y)).toBeLessThan(xyTol);
    const f = factorsAt(resolved, ex.lonLat[0], ex.lonLat[1]);
    if (!f.defined) throw new Error('undefined');
    if (ex.h !== undefined) expect(Math.abs(f.h - ex.h)).toBeLessThan(1e-7);
    if (ex.k !== undefined) expect(Math.abs(f.k - ex.k)).toBeLessThan(1e-7);
    if (ex.omegaDeg !== undefined) expect(Math.abs(f.omegaDeg - ex.omegaDeg)).toBeLessThan(1e-4);
  });
});

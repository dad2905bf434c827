import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { resolveDefinition } from '../../shared/engine/definition.js';
import { wkt1For } from './wkt1-writer.js';

const CASES = [
  '+proj=tmerc +lat_0=0 +lon_0=-71 +k_0=0.9996 +x_0=500000 +y_0=10000000 +ellps=WGS84',
  '+proj=utm +zone=33 +ellps=WGS84',
  '+proj=lcc +lat_1=33 +lat_2=45 +lat_0=23 +lon_0=-96 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=aea +lat_1=29.5 +lat_2=45.5 +lat_0=23 +lon_0=-96 +x_0=0 +y_0=0 +ellps=GRS80',
  '+proj=laea +lat_0=52 +lon_0=10 +x_0=4321000 +y_0=3210000 +ellps=GRS80',
  '+proj=merc +lat_ts=20 +lon_0=5 +ellps=WGS84',
  '+proj=stere +lat_0=90 +lat_ts=71 +lon_0=-45 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=eqdc +lat_0=40 +lon_0=-96 +lat_1=20 +lat_2=60 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=moll +lon_0=0 +R=6371000',
];

describe('WKT1 writer', () => {
  it.each(CASES)('writes WKT that proj4 reads back to the same projection: %s', (def) => {
    const r = resolveDefinition(def);
    const wkt = wkt1For(r, r.label)!;
    expect(wkt).toMatch(/^PROJCS\["/);
    const a = proj4(r.proj4), b = proj4(wkt);
    for (const p of [[-80, 35], [12, 50], [-40, 75], [5, 15]]) {
      const [x1, y1] = a.forward(p), [x2, y2] = b.forward(p);
      expect(Math.hypot(x1 - x2, y1 - y2), `${p}`).toBeLessThan(1e-3);
    }
  });
});

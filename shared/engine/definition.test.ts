/** Definitions: PROJ strings, EPSG codes from the bundled epsg-index, WKT, and clear errors. */
import { describe, expect, it } from 'vitest';
import { resolveDefinition } from './definition';
import { factorsAt } from './factors';
import { projectPoints } from './project';

describe('resolveDefinition', () => {
  it('reads PROJ strings, filling the defaults proj4 needs (+x_0 +y_0 +lat_0 +lon_0)', () => {
    const r = resolveDefinition('+proj=laea +lat_0=52 +lon_0=10 +ellps=GRS80');
    expect(r.family.id).toBe('laea');
    expect(r.resolved).toContain('+x_0=0');
    expect(r.ellipsoid.aM).toBe(6378137);
    expect(r.ellipsoid.es).toBeCloseTo(0.00669438002290, 12);
    expect(factorsAt(r, 10, 52).defined).toBe(true);
    expect(resolveDefinition('proj=merc').family.id).toBe('merc');
  });
  it('makes the families proj4 leaves NaN without explicit defaults work as PROJ does', () => {
    for (const def of ['+proj=aea +lat_1=29.5 +lat_2=45.5', '+proj=laea', '+proj=gnom +R=1', '+proj=cea', '+proj=eqdc +lat_1=20 +lat_2=60', '+proj=mill +R=1', '+proj=poly']) {
      const f = factorsAt(resolveDefinition(def), 5, 10);
      expect(f.defined, def).toBe(true);
    }
  });
  it('keeps false eastings and northings in projected coordinates (as `proj` prints them)', () => {
    expect(projectPoints(resolveDefinition('+proj=utm +zone=33 +south'), [[15, 0]])[0]).toEqual([500000, 10000000]);
    expect(projectPoints(resolveDefinition('EPSG:3035'), [[10, 52]])[0]).toEqual([4321000, 3210000]);
  });
  it('treats +R, and +a alone, as a sphere', () => {
    expect(resolveDefinition('+proj=merc +R=6371000').ellipsoid).toEqual({ aM: 6371000, es: 0 });
    expect(resolveDefinition('+proj=merc +a=6371000').ellipsoid.es).toBe(0);
    expect(resolveDefinition('+proj=tmerc +R=1').resolved).toContain('+approx');
  });
  it('computes spherical-only families on a sphere of radius a, whatever the ellipsoid', () => {
    const r = resolveDefinition('+proj=robin +ellps=WGS84');
    expect(r.factorEllipsoid).toEqual({ aM: 6378137, es: 0 });
    expect(resolveDefinition('+proj=lcc +lat_1=30 +lat_2=50 +ellps=WGS84').factorEllipsoid.es).toBeGreaterThan(0);
  });
  it('looks EPSG codes up offline', () => {
    const r = resolveDefinition('EPSG:5070');
    expect(r.family.id).toBe('aea');
    expect(r.label).toBe('EPSG:5070 NAD83 / Conus Albers');
    expect(r.params.lat1Deg).toBe(29.5);
    expect(resolveDefinition('epsg:32633').family.id).toBe('utm');
    expect(resolveDefinition('EPSG:3031').params.latTsDeg).toBe(-71);
  });
  it('reads WKT1 and WKT2', () => {
    const wkt1 = 'PROJCS["NAD83 / Conus Albers",GEOGCS["NAD83",DATUM["North_American_Datum_1983",SPHEROID["GRS 1980",6378137,298.257222101]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Albers_Conic_Equal_Area"],PARAMETER["latitude_of_center",23],PARAMETER["longitude_of_center",-96],PARAMETER["standard_parallel_1",29.5],PARAMETER["standard_parallel_2",45.5],PARAMETER["false_easting",0],PARAMETER["false_northing",0],UNIT["metre",1]]';
    const r = resolveDefinition(wkt1);
    expect(r.kind).toBe('wkt');
    expect(r.family.id).toBe('aea');
    expect(r.resolved).toBe('+proj=aea +lat_0=23 +lon_0=-96 +lat_1=29.5 +lat_2=45.5 +x_0=0 +y_0=0 +a=6378137 +rf=298.257222101 +units=m');
    const fromWkt = factorsAt(r, -75, 35);
    const fromProj = factorsAt(resolveDefinition(r.resolved), -75, 35);
    expect(fromWkt).toEqual(fromProj);
    const wkt2 = 'PROJCRS["WGS 84 / UTM zone 33N",BASEGEOGCRS["WGS 84",DATUM["World Geodetic System 1984",ELLIPSOID["WGS 84",6378137,298.257223563,LENGTHUNIT["metre",1]]],PRIMEM["Greenwich",0,ANGLEUNIT["degree",0.0174532925199433]]],CONVERSION["UTM zone 33N",METHOD["Transverse Mercator",ID["EPSG",9807]],PARAMETER["Latitude of natural origin",0,ANGLEUNIT["degree",0.0174532925199433]],PARAMETER["Longitude of natural origin",15,ANGLEUNIT["degree",0.0174532925199433]],PARAMETER["Scale factor at natural origin",0.9996,SCALEUNIT["unity",1]],PARAMETER["False easting",500000,LENGTHUNIT["metre",1]],PARAMETER["False northing",0,LENGTHUNIT["metre",1]]],CS[Cartesian,2],AXIS["easting",east,ORDER[1],LENGTHUNIT["metre",1]],AXIS["northing",north,ORDER[2],LENGTHUNIT["metre",1]],ID["EPSG",32633]]';
    const u = resolveDefinition(wkt2);
    expect(u.family.id).toBe('tmerc');
    expect(u.params.lon0Deg).toBe(15);
    expect(u.params.k0).toBe(0.9996);
  });
  it('names what is wrong', () => {
    expect(() => resolveDefinition('')).toThrow(/empty definition/);
    expect(() => resolveDefinition('mercator please')).toThrow(/unrecognised definition/);
    expect(() => resolveDefinition('EPSG:999999')).toThrow(/unknown EPSG code 999999/);
    expect(() => resolveDefinition('EPSG:4326')).toThrow(/not a projected CRS/);
    expect(() => resolveDefinition('+proj=longlat')).toThrow(/not a map projection/);
    expect(() => resolveDefinition('+proj=krovak')).toThrow(/\+proj=krovak is not supported/);
    expect(() => resolveDefinition('+proj=nosuch')).toThrow(/not supported/);
    expect(() => resolveDefinition('+lat_0=3')).toThrow(/without a \+proj/);
    expect(() => resolveDefinition('PROJCS["x",GEOGCS["y"]]')).toThrow();
  });
});

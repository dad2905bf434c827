import geodesic from 'geographiclib-geodesic';
import type { MultiPolygon, Polygon, Position } from 'geojson';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ProjectAccess, Region } from '../../server/entities/index.js';
import { canonicalSha256 } from '../../server/regions/canonical-json.js';
import * as fx from '../fixtures/make-upload-fixtures.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp, type Client } from '../support/test-app.js';

type TestApp = Awaited<ReturnType<typeof createTestApp>>;
let t: TestApp;
let s: StudioFixture;
let other: StudioFixture;
let projectId: number;

beforeAll(async () => {
  t = await createTestApp();
  [s, other] = await Promise.all([createStudioWithRoles(t), createStudioWithRoles(t)]);
  const res = await s.cartographer.post('/api/projects', { title: 'Upload tests', clientName: 'Lakes Press', purpose: 'equal-area', scaleBand: 'province' });
  projectId = res.body.id;
});
afterAll(async () => t?.close());

const upload = (c: Client, path: string, file: Buffer, name: string, fields: Record<string, string> = {}) => {
  const req = c.agent.post(`/api/projects/${projectId}${path}`).set('x-csrf-token', c.csrf);
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req.attach('file', file, name);
};
const regionRows = () => t.deps.dataSource.getRepository(Region).countBy({ projectId });

const polygonsOf = (g: Polygon | MultiPolygon): Position[][][] => (g.type === 'Polygon' ? [g.coordinates] : g.coordinates);

/** Geodesic area of lon/lat polygons straight from GeographicLib (Karney 2013), whatever their winding. */
function referenceAreaKm2(g: Polygon | MultiPolygon): number {
  let m2 = 0;
  for (const rings of polygonsOf(g)) {
    rings.forEach((ring, i) => {
      const p = geodesic.Geodesic.WGS84.Polygon(false);
      for (const [lon, lat] of ring.slice(0, -1)) p.AddPoint(lat, lon);
      const a = Math.abs(p.Compute(false, true).area ?? NaN);
      m2 += i === 0 ? a : -a;
    });
  }
  return m2 / 1e6;
}

function bboxOf(g: Polygon | MultiPolygon): number[] {
  const pts = polygonsOf(g).flat(2);
  return [Math.min(...pts.map((p) => p[0])), Math.min(...pts.map((p) => p[1])), Math.max(...pts.map((p) => p[0])), Math.max(...pts.map((p) => p[1]))];
}

/** Largest distance (degrees) from a stored vertex to the nearest source vertex. */
function worstVertexGapDeg(stored: Polygon | MultiPolygon, source: Polygon | MultiPolygon): number {
  const src = polygonsOf(source).flat(2);
  let worst = 0;
  for (const [x, y] of polygonsOf(stored).flat(2)) {
    let best = Infinity;
    for (const [u, v] of src) best = Math.min(best, Math.hypot(x - u, y - v));
    worst = Math.max(worst, best);
  }
  return worst;
}

describe('accepted formats', () => {
  it('a zipped shapefile in EPSG:5070 with .prj is reprojected to lon/lat and stored with its hash', async () => {
    const res = await upload(s.cartographer, '/regions', fx.fixture(fx.SHAPEFILE_FIXTURE), fx.SHAPEFILE_FIXTURE);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const [source] = fx.usStates(['Michigan']);
    expect(res.body).toMatchObject({ name: 'Michigan', sourceFormat: 'shapefile', partCount: 12, holeCount: 0, isCurrent: true });
    expect(res.body.sourceCrs).toMatch(/^PROJCS\["NAD83 \/ Conus Albers"/);
    // The fixture's metres came from PROJ's cs2cs (printed to 1 µm); proj4's inverse must land on the source vertices.
    const ref = referenceAreaKm2(source.geometry);
    expect(Math.abs(res.body.areaKm2 - ref) / ref).toBeLessThan(1e-7);
    res.body.bbox.forEach((v: number, i: number) => expect(v).toBeCloseTo(bboxOf(source.geometry)[i], 6));

    const current = await s.editor.get(`/api/projects/${projectId}/region`);
    expect(current.status).toBe(200);
    const geometry = current.body.region.geometry;
    expect(worstVertexGapDeg(geometry, source.geometry)).toBeLessThan(1e-7);
    expect(current.body.region.sha256).toBe(canonicalSha256(geometry));
    expect(current.body.region.report.notes.join(' ')).toMatch(/clockwise/);
  });

  it('a shapefile in UTM zone 30N with a .cpg of 1252 keeps its accented attribute text', async () => {
    const res = await upload(s.cartographer, '/regions', fx.fixture('cote-divoire-utm30n-cp1252.zip'), 'cote-divoire.zip');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.name).toBe("Côte d'Ivoire");
    expect(res.body.sourceCrs).toMatch(/UTM zone 30N/);
    const [source] = fx.countries(["Côte d'Ivoire"]);
    const ref = referenceAreaKm2(source.geometry);
    expect(Math.abs(res.body.areaKm2 - ref) / ref).toBeLessThan(1e-7);
  });

  it('GeoJSON: the picker lists every feature; the picked ones are merged; earlier regions stop being current', async () => {
    const file = fx.fixture('great-lakes-states.geojson');
    const seen = await upload(s.cartographer, '/regions/inspect', file, 'lakes.geojson');
    expect(seen.status, JSON.stringify(seen.body)).toBe(200);
    expect(seen.body.features.map((f: { name: string }) => f.name)).toEqual(['Michigan', 'Ohio', 'Wisconsin', 'Minnesota', 'Illinois', 'Indiana']);
    const sources = fx.usStates(['Michigan', 'Ohio', 'Wisconsin', 'Minnesota', 'Illinois', 'Indiana']);
    seen.body.features.forEach((f: { areaKm2: number }, i: number) => {
      const ref = referenceAreaKm2(sources[i].geometry);
      expect(Math.abs(f.areaKm2 - ref) / ref).toBeLessThan(1e-9);
    });
    expect(seen.body.report.featureCount).toBe(6);

    const before = await regionRows();
    const res = await upload(s.cartographer, '/regions', file, 'lakes.geojson', { features: '2,0' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.name).toBe('Michigan + Wisconsin');
    expect(res.body.report.pickedFeatures).toEqual([0, 2]);
    // us-atlas rings come in d3's clockwise order: every picked ring (no holes here) was turned, and only those.
    expect(res.body.report.ringsRewound).toBe(res.body.partCount);
    expect(res.body.partCount).toBe(seen.body.features[0].partCount + seen.body.features[2].partCount);
    expect(res.body.areaKm2).toBeCloseTo(seen.body.features[0].areaKm2 + seen.body.features[2].areaKm2, 6);
    expect(await regionRows()).toBe(before + 1);

    const history = await s.editor.get(`/api/projects/${projectId}/regions`);
    expect(history.body.regions[0]).toMatchObject({ id: res.body.id, isCurrent: true });
    expect(history.body.regions.filter((r: { isCurrent: boolean }) => r.isCurrent)).toHaveLength(1);
    const project = await s.editor.get(`/api/projects/${projectId}`);
    expect(project.body.region).toMatchObject({ id: res.body.id, name: 'Michigan + Wisconsin' });
  });

  it('TopoJSON: Fiji is split at the antimeridian, Antarctica goes round the South Pole', async () => {
    const file = fx.fixture('fiji-antarctica.topojson');
    const fiji = await upload(s.cartographer, '/regions', file, 'pacific.topojson', { features: '0' });
    expect(fiji.status, JSON.stringify(fiji.body)).toBe(201);
    expect(fiji.body.name).toBe('Fiji');
    const [west, , east] = fiji.body.bbox;
    expect(west).toBeGreaterThan(170);
    expect(east).toBeLessThan(-170);
    expect(fiji.body.report.crossesAntimeridian).toBe(true);
    const [fijiSource] = fx.countries(['Fiji']);
    // GeographicLib follows the source's edges across ±180° itself; our split must not change the area.
    expect(Math.abs(fiji.body.areaKm2 - referenceAreaKm2(fijiSource.geometry)) / fiji.body.areaKm2).toBeLessThan(1e-8);

    const ant = await upload(s.cartographer, '/regions', file, 'pacific.topojson', { features: '1' });
    expect(ant.status, JSON.stringify(ant.body)).toBe(201);
    expect(ant.body.report.poles).toEqual(['south']);
    expect(ant.body.bbox[1]).toBe(-90);
    expect(ant.body.areaKm2).toBeGreaterThan(11e6);
    expect(ant.body.areaKm2).toBeLessThan(14.5e6);
  });
});

describe('concurrent uploads', () => {
  it('three uploads at once leave exactly one current region', async () => {
    const file = fx.fixture('cote-divoire-utm30n-cp1252.zip');
    const results = await Promise.all([1, 2, 3].map(() => upload(s.cartographer, '/regions', file, 'civ.zip')));
    expect(results.map((r) => r.status)).toEqual([201, 201, 201]);
    const current = await t.deps.dataSource.getRepository(Region).countBy({ projectId, isCurrent: true });
    expect(current).toBe(1);
  });
});

describe('malformed files: a clear 4xx and nothing stored', () => {
  const cases: [string, () => Promise<Buffer> | Buffer, string, number, RegExp][] = [
    ['truncated .shp', fx.truncatedShp, 'michigan.zip', 422, /michigan\.shp is truncated/],
    ['missing .dbf', fx.missingDbf, 'michigan.zip', 422, /has michigan\.shp but no michigan\.dbf/],
    ['unreadable .prj', fx.unreadablePrj, 'michigan.zip', 422, /michigan\.prj could not be read as a coordinate reference system/],
    ['projected coordinates without .prj', fx.projectedWithoutPrj, 'michigan.zip', 422, /outside longitude −180…180.*needs its \.prj/],
    ['random bytes named .zip', () => fx.randomFile(), 'region.zip', 422, /not a readable zip archive/],
    ['random bytes of no known kind', () => fx.randomFile(), 'region.bin', 422, /not a format we read/],
    ['zip with a path-traversal name', fx.pathTraversalZip, 'evil.zip', 422, /unsafe path \("\.\.\/\.\.\/etc\/cron\.d\/evil\.shp"\)/],
    ['zip bomb (absurd ratio)', fx.ratioBombZip, 'bomb.zip', 422, /would expand \d+×.*decompression bombs/],
    ['zip bomb (huge declared size)', fx.declaredHugeZip, 'huge.zip', 413, /would unpack to more than 200 MB/],
    ['zip whose headers understate the size', fx.forgedSmallSizeZip, 'forged.zip', 422, /unpacks to more than the .* its zip header declares/],
    ['zip entry with a bad checksum', fx.corruptedEntryZip, 'damaged.zip', 422, /"michigan\.shp" is damaged: its checksum \(CRC-32\)/],
    ['GeoJSON with no polygons', fx.noPolygonsGeoJson, 'pins.geojson', 422, /has no polygons \(it holds: Point, LineString\)/],
    ['point shapefile', fx.pointShapefileZip, 'pins.zip', 422, /pins\.shp holds points, not polygons/],
    ['out-of-range coordinates', fx.outOfRangeGeoJson, 'off.geojson', 422, /Feature 1 \("Off the map"\), polygon 1, ring 1 has the coordinate \[200\.5, 10\]/],
    ['invalid JSON', () => Buffer.from('{"type": "FeatureCollection", "features": [ '), 'broken.geojson', 422, /not valid JSON/],
    ['GeoJSON polygon without coordinates', () => Buffer.from('{"type":"Polygon"}'), 'bare.geojson', 422, /Polygon without a "coordinates" array/],
  ];
  for (const [what, make, name, status, message] of cases) {
    it(what, async () => {
      const before = await regionRows();
      const file = await make();
      for (const path of ['/regions/inspect', '/regions']) {
        const res = await upload(s.cartographer, path, file, name);
        expect(res.status, JSON.stringify(res.body)).toBe(status);
        expect(res.body.error.message).toMatch(message);
        expect(res.body.error.fields.file).toBe(res.body.error.message);
      }
      expect(await regionRows()).toBe(before);
    });
  }

  it('a file over 25 MB is refused with 413 before it is read', async () => {
    const before = await regionRows();
    const res = await upload(s.cartographer, '/regions', Buffer.alloc(25 * 1024 * 1024 + 10, 32), 'big.geojson');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/larger than 25 MB/);
    expect(await regionRows()).toBe(before);
  });

  it('no file, two files, or a bad feature pick are refused', async () => {
    const before = await regionRows();
    const none = await s.cartographer.post(`/api/projects/${projectId}/regions`, {});
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/Choose a region file/);
    const two = await s.cartographer.agent
      .post(`/api/projects/${projectId}/regions`)
      .set('x-csrf-token', s.cartographer.csrf)
      .attach('file', fx.noPolygonsGeoJson(), 'a.geojson')
      .attach('file', fx.noPolygonsGeoJson(), 'b.geojson');
    expect(two.status).toBe(400);
    const lakes = fx.fixture('great-lakes-states.geojson');
    const bad = await upload(s.cartographer, '/regions', lakes, 'lakes.geojson', { features: '1,x' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.features).toMatch(/"all" or a list of numbers/);
    const missing = await upload(s.cartographer, '/regions', lakes, 'lakes.geojson', { features: '1,99' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.message).toMatch(/Feature 99 is not a polygon feature of lakes\.geojson \(its polygon features are 0, 1, 2, 3, 4, 5\)/);
    expect(await regionRows()).toBe(before);
  });
});

describe('region routes: roles and tenancy', () => {
  const small = () => fx.fixture('cote-divoire-utm30n-cp1252.zip');

  it('editors and unshared clients cannot upload; editors read', async () => {
    expect((await upload(s.editor, '/regions', small(), 'a.zip')).status).toBe(403);
    expect((await upload(s.editor, '/regions/inspect', small(), 'a.zip')).status).toBe(403);
    expect((await upload(s.client, '/regions', small(), 'a.zip')).status).toBe(403);
    expect((await upload(s.admin, '/regions/inspect', small(), 'a.zip')).status).toBe(200);
    expect((await s.editor.get(`/api/projects/${projectId}/regions`)).status).toBe(200);
    expect((await s.editor.get(`/api/projects/${projectId}/region`)).status).toBe(200);
    const anon = await s.anonymous();
    expect((await anon.get(`/api/projects/${projectId}/region`)).status).toBe(401);
  });

  it('a client reads the region of a project shared with them only', async () => {
    const fresh = await s.cartographer.post('/api/projects', { title: 'For the client', clientName: 'C', purpose: 'reference', scaleBand: 'country' });
    const id = fresh.body.id;
    expect((await s.client.get(`/api/projects/${id}/region`)).status).toBe(404);
    expect((await s.client.get(`/api/projects/${id}/regions`)).status).toBe(404);
    await t.deps.dataSource.getRepository(ProjectAccess).insert({ projectId: id, studioId: s.studioId, userId: s.users.client.userId, grantedById: null });
    const res = await s.client.get(`/api/projects/${id}/region`);
    expect(res.status).toBe(200);
    expect(res.body.region).toBeNull();
    expect((await s.client.get(`/api/projects/${id}/regions`)).body.regions).toEqual([]);
  });

  it('another studio gets 404 on every region route and stores nothing', async () => {
    const before = await regionRows();
    for (const path of ['/regions', '/regions/inspect']) {
      expect((await upload(other.cartographer, path, small(), 'a.zip')).status).toBe(404);
    }
    expect((await other.editor.get(`/api/projects/${projectId}/regions`)).status).toBe(404);
    expect((await other.admin.get(`/api/projects/${projectId}/region`)).status).toBe(404);
    expect(await regionRows()).toBe(before);
  });
});

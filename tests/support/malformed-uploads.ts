import JSZip from 'jszip';
import * as fx from '../fixtures/make-upload-fixtures.js';

/**
 * A deterministic generator of malformed region uploads, built from the committed fixtures
 * (fixtures/regions/): random bytes, truncated and bit-flipped copies of the shapefile zips,
 * GeoJSON and TopoJSON, shapefile parts with broken headers re-zipped, absurd coordinates, huge
 * vertex counts, deeply nested JSON, zip-structure attacks, and wrong multipart shapes. Each case
 * says how it is sent; a fixed random seed makes a failing case reproducible.
 */
export interface UploadCase {
  kind: string;
  /** File content and name for a normal multipart upload in field "file". */
  file?: { data: Buffer; name: string; contentType?: string };
  /** Anything that is not a one-file multipart upload: sent as the raw body with this content type. */
  raw?: { data: Buffer; contentType: string };
  /** Multipart with the file in another field, or two files. */
  field?: string;
  twice?: boolean;
  /** Text fields sent beside the file. */
  fields?: Record<string, string>;
}

/** mulberry32: a tiny seeded PRNG (public domain), so every run can be replayed from its seed. */
export function prng(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return { next, int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)), pick: <T>(xs: readonly T[]) => xs[Math.floor(next() * xs.length)] };
}
type Rng = ReturnType<typeof prng>;

const SOURCES = ['michigan-epsg5070.zip', 'cote-divoire-utm30n-cp1252.zip', 'great-lakes-states.geojson', 'fiji-antarctica.topojson'];
const NAMES = ['region.zip', 'region.geojson', 'region.topojson', 'region.json', 'region.shp', 'region.txt', 'region', 'REGION.ZIP', 'r.kml'];

function randomBytes(r: Rng, n: number): Buffer {
  const b = Buffer.alloc(n);
  for (let i = 0; i < n; i++) b[i] = r.int(0, 255);
  return b;
}

function flipBits(r: Rng, data: Buffer, flips: number): Buffer {
  const out = Buffer.from(data);
  for (let i = 0; i < flips; i++) out[r.int(0, out.length - 1)] ^= 1 << r.int(0, 7);
  return out;
}

const ring = (pts: unknown[]) => ({ type: 'Feature', properties: { name: 'x' }, geometry: { type: 'Polygon', coordinates: [pts] } });
const json = (v: unknown) => Buffer.from(JSON.stringify(v));

/** Coordinates no region can have: every one of these must be refused. */
function absurdGeoJson(r: Rng): Buffer {
  const notNumbers = ['ten', null, true, [], {}, 1e308, -1e308, 1e20];
  const bad = r.pick<unknown>([...notNumbers, 181, -180.5, 90.0001, -91]);
  const badLon = r.pick<unknown>([...notNumbers, 181, -180.5, 540]);
  const badLat = r.pick<unknown>([...notNumbers, 90.0001, -91, 180]);
  const variants: unknown[] = [
    ring([[0, 0], [badLon, 0], [1, 1], [0, 0]]),
    ring([[0, 0], [0, badLat], [1, 1], [0, 0]]),
    ring([[0, 0], [1, 0]]),
    ring([]),
    ring([[0], [1], [2], [0]]),
    ring([[0, 0], [0, 0], [0, 0], [0, 0]]),
    { type: 'Feature', geometry: { type: 'Polygon', coordinates: bad } },
    { type: 'Feature', geometry: { type: 'MultiPolygon', coordinates: [[[[0, 0], [1, 0], [badLon, badLat], [0, 0]]]] } },
    { type: 'FeatureCollection', features: bad },
    { type: 'FeatureCollection', features: [null, 1, 'x', { type: 'Feature' }] },
    { type: 'Topology', objects: { a: { type: 'Polygon', arcs: [[0]] } }, arcs: [[[0, 0], [badLon, 1], [1, 1], [0, 0]]] },
    { type: 'Topology', objects: { a: { type: 'Polygon', arcs: [[99]] } }, arcs: [] },
    { type: 'GeometryCollection', geometries: [{ type: 'Polygon', coordinates: [[[0, 0], [1, 0], [badLon, 1], [0, 0]]] }, bad] },
    { type: bad, coordinates: [] },
  ];
  return json(r.pick(variants));
}

/** Odd but readable shapes (unclosed ring, extra dimensions, a bow-tie, deep properties): a clear answer, either way. */
function oddShape(r: Rng): Buffer {
  const variants: unknown[] = [
    ring([[0, 0], [1, 0], [1, 1]]),
    ring([[0, 0, 0, 0, 0], [1, 0, 0, 0, 0], [1, 1, 0, 0, 0], [0, 0, 0, 0, 0]]),
    ring([[0, 0], [5e-324, 0], [1, 1], [0, 0]]),
    { type: 'Feature', geometry: { type: 'Polygon', coordinates: [[[0, 0], [10, 10], [10, 0], [0, 10], [0, 0]]] } },
    { type: 'Topology', transform: { scale: [r.pick([0, -1, 1e-300, 1e300]), 1], translate: [0, 0] }, objects: { a: { type: 'Polygon', arcs: [[0]] } }, arcs: [[[0, 0], [1, 0], [0, 1], [-1, -1]]] },
  ];
  if (r.next() < 0.3) {
    const depth = r.pick([1000, 100_000]);
    return Buffer.from(`{"type":"Feature","properties":${'{"a":'.repeat(depth)}1${'}'.repeat(depth)},"geometry":{"type":"Polygon","coordinates":[[[0,0],[1,0],[1,1],[0,0]]]}}`);
  }
  return json(r.pick(variants));
}

/** Nesting deep enough to break recursive readers (and JSON.parse itself at the top end). */
function deeplyNested(r: Rng): Buffer {
  const depth = r.pick([1000, 10_000, 100_000, 1_000_000]);
  const style = r.int(0, 2);
  if (style === 0) return Buffer.from(`{"type":"Feature","geometry":{"type":"Polygon","coordinates":${'['.repeat(depth)}0${']'.repeat(depth)}}}`);
  if (style === 1) return Buffer.from(`${'{"type":"GeometryCollection","geometries":['.repeat(Math.min(depth, 200_000))}${']}'.repeat(Math.min(depth, 200_000))}`);
  return Buffer.from(`{"type":"FeatureCollection","features":[{"type":"Feature","properties":${'{"a":'.repeat(depth)}1${'}'.repeat(depth)},"geometry":null}]}`);
}

/** TopoJSON with more vertices than a region may hold (2 000 000), compact through delta-encoded arcs. */
export function hugeVertexTopoJson(vertices: number): Buffer {
  const steps = '[1,0],'.repeat(vertices - 3);
  const arc = `[[0,0],${steps}[0,1],[-${vertices - 3},-1]]`;
  return Buffer.from(`{"type":"Topology","transform":{"scale":[0.00001,0.00001],"translate":[0,0]},"objects":{"a":{"type":"Polygon","arcs":[[0]]}},"arcs":[${arc}]}`);
}

/** The shapefile fixture with one header field of .shp/.shx/.dbf set to nonsense, re-zipped. */
async function brokenShapefileHeader(r: Rng, parts: Record<string, Buffer>): Promise<Buffer> {
  const e: Record<string, Buffer> = Object.fromEntries(Object.entries(parts).map(([k, v]) => [k, Buffer.from(v)]));
  const shp = Object.keys(e).find((k) => k.endsWith('.shp'))!;
  const shx = Object.keys(e).find((k) => k.endsWith('.shx'))!;
  const dbf = Object.keys(e).find((k) => k.endsWith('.dbf'))!;
  const prj = Object.keys(e).find((k) => k.endsWith('.prj'));
  // ESRI Shapefile Technical Description (1998): file code at 0 (BE), length at 24 (BE words),
  // shape type at 32 (LE), bounding box doubles at 36–68 (LE); records from byte 100.
  switch (r.int(0, 9)) {
    case 0: e[shp].writeInt32BE(r.int(-1, 99999), 0); break;
    case 1: e[shp].writeInt32BE(r.pick([0, 1, 0x7fffffff, -5]), 24); break;
    case 2: e[shp].writeInt32LE(r.pick([0, 1, 3, 8, 31, 99, -1]), 32); break;
    case 3: e[shp].writeDoubleLE(r.pick([NaN, Infinity, -1e308]), 36); break;
    case 4: e[shp].writeInt32BE(r.pick([0x7fffffff, -1, 1]), 104); break; // first record's length
    case 5: e[shx].writeInt32BE(r.pick([0x7fffffff, 0, -8]), 100); break; // first record's offset
    case 6: e[dbf].writeUInt32LE(r.pick([0xffffffff, 0, 99999]), 4); break; // record count
    case 7: e[dbf].writeUInt16LE(r.pick([0, 1, 0xffff]), 8); break; // header length
    case 8: if (prj) e[prj] = randomBytes(r, r.int(0, 300)); break;
    default: e['region.cpg'] = Buffer.from(r.pick(['UTF-99', '\u0000', 'x'.repeat(5000), 'ISO-8859-1\n'])); break;
  }
  return fx.zipOf(e);
}

/** Zip structures that are dangerous rather than just broken. */
async function hostileZip(r: Rng, parts: Record<string, Buffer>): Promise<Buffer> {
  switch (r.int(0, 8)) {
    case 0: return fx.pathTraversalZip();
    case 1: return fx.ratioBombZip();
    case 2: return fx.declaredHugeZip();
    case 3: return fx.forgedSmallSizeZip();
    case 4: return fx.corruptedEntryZip();
    case 5: return fx.zipOf({ ...parts, [r.pick(['/etc/passwd.shp', 'C:\\x.shp', 'a\\..\\b.shp', 'nul\u0000.shp'])]: Buffer.from('x') });
    case 6: return fx.zipOf(Object.fromEntries(Array.from({ length: 150 }, (_, i) => [`f${i}.txt`, 'x'])));
    case 7: return fx.zipOf({ 'inner.zip': await fx.zipOf(parts) });
    default: {
      const zip = new JSZip();
      for (const [k, v] of Object.entries(parts)) zip.file(k, v);
      zip.file('link.shp', '/etc/passwd', { unixPermissions: 0o120777 }); // a symlink entry
      return zip.generateAsync({ type: 'nodebuffer', platform: 'UNIX' });
    }
  }
}

/** `count` malformed upload cases from `seed`, spread over every kind above. */
export async function malformedUploads(seed: number, count: number): Promise<UploadCase[]> {
  const r = prng(seed);
  const sources = Object.fromEntries(SOURCES.map((s) => [s, fx.fixture(s)]));
  const shpParts = await fx.unzipFixture(fx.SHAPEFILE_FIXTURE);
  const geojson = sources['great-lakes-states.geojson'];
  const out: UploadCase[] = [];
  const fixed: Array<() => Promise<UploadCase>> = [
    async () => ({ kind: 'missing .dbf', file: { data: await fx.missingDbf(), name: 'm.zip' } }),
    async () => ({ kind: 'truncated .shp', file: { data: await fx.truncatedShp(), name: 'm.zip' } }),
    async () => ({ kind: 'unreadable .prj', file: { data: await fx.unreadablePrj(), name: 'm.zip' } }),
    async () => ({ kind: 'projected without .prj', file: { data: await fx.projectedWithoutPrj(), name: 'm.zip' } }),
    async () => ({ kind: 'points only', file: { data: await fx.pointShapefileZip(), name: 'pins.zip' } }),
    async () => ({ kind: 'no polygons', file: { data: fx.noPolygonsGeoJson(), name: 'n.geojson' } }),
    async () => ({ kind: 'out of range', file: { data: fx.outOfRangeGeoJson(), name: 'o.geojson' } }),
    async () => ({ kind: 'empty file', file: { data: Buffer.alloc(0), name: 'e.geojson' } }),
    async () => ({ kind: 'empty zip', file: { data: Buffer.from('504b0506000000000000000000000000000000000000', 'hex'), name: 'e.zip' } }),
    async () => ({ kind: 'huge vertex count', file: { data: hugeVertexTopoJson(2_100_000), name: 'huge.topojson' } }),
    async () => ({ kind: 'over the size limit', file: { data: Buffer.concat([Buffer.from('{"type":"FeatureCollection","features":[]'), Buffer.alloc(26 * 1024 * 1024, 0x20), Buffer.from('}')]), name: 'big.geojson' } }),
  ];
  for (const make of fixed) out.push(await make());
  const makers: Array<() => Promise<UploadCase>> = [
    async () => ({ kind: 'random bytes', file: { data: randomBytes(r, r.pick([1, 3, 4, 22, 100, 4096, 65_536])), name: r.pick(NAMES) } }),
    async () => ({ kind: 'random bytes behind a zip signature', file: { data: Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), randomBytes(r, r.int(0, 5000))]), name: 'z.zip' } }),
    async () => {
      const src = r.pick(SOURCES);
      const data = sources[src];
      return { kind: `truncated ${src}`, file: { data: data.subarray(0, r.int(0, data.length - 2)), name: src } };
    },
    async () => {
      const src = r.pick(SOURCES);
      return { kind: `bit-flipped ${src}`, file: { data: flipBits(r, sources[src], r.pick([1, 2, 8, 64, 512])), name: src } };
    },
    async () => ({ kind: 'broken shapefile header', file: { data: await brokenShapefileHeader(r, shpParts), name: 's.zip' } }),
    async () => ({ kind: 'hostile zip', file: { data: await hostileZip(r, shpParts), name: 'h.zip' } }),
    async () => ({ kind: 'absurd coordinates', file: { data: absurdGeoJson(r), name: r.pick(['a.geojson', 'a.topojson', 'a.json']) } }),
    async () => ({ kind: 'odd shape', file: { data: oddShape(r), name: r.pick(['o.geojson', 'o.topojson']) } }),
    async () => ({ kind: 'deeply nested JSON', file: { data: deeplyNested(r), name: 'deep.geojson' } }),
    async () => ({ kind: 'JSON that is not GeoJSON', file: { data: json(r.pick<unknown>([null, 1, 'x', [], [1, 2], { type: 'Feature' }, { features: {} }, { type: 'Topology' }])), name: 'j.json' } }),
    async () => ({ kind: 'file as a raw JSON body', raw: { data: geojson, contentType: r.pick(['application/json', 'application/geo+json', 'text/plain']) } }),
    async () => ({ kind: 'file as a raw octet body', raw: { data: sources['michigan-epsg5070.zip'], contentType: 'application/zip' } }),
    async () => ({ kind: 'multipart with a broken boundary', raw: { data: Buffer.concat([Buffer.from('--zzz\r\nContent-Disposition: form-data; name="file"; filename="a.geojson"\r\n\r\n'), geojson.subarray(0, 500)]), contentType: 'multipart/form-data; boundary=zzz' } }),
    async () => ({ kind: 'multipart without a boundary', raw: { data: geojson.subarray(0, 2000), contentType: 'multipart/form-data' } }),
    async () => ({ kind: 'file in the wrong field', file: { data: geojson, name: 'g.geojson' }, field: r.pick(['upload', 'files', 'file[]', 'FILE']) }),
    async () => ({ kind: 'two files', file: { data: geojson, name: 'g.geojson' }, twice: true }),
    // multer's own security advice: bound field-name length, nesting (a[b][c]) and array indexes (a[999999]).
    async () => ({
      kind: 'multipart with hostile field names',
      file: { data: geojson, name: 'g.geojson' },
      fields: r.pick<Record<string, string>>([{ 'features[0]': 'all' }, { 'features[a][b][c]': 'all' }, { 'x[999999]': '1' }, { ['f'.repeat(r.int(101, 5000))]: 'all' }]),
    }),
    async () => ({ kind: 'an image sent as a region', file: { data: Buffer.concat([Buffer.from('89504e470d0a1a0a', 'hex'), randomBytes(r, 800)]), name: r.pick(['map.png', 'map.geojson']), contentType: 'image/png' } }),
  ];
  while (out.length < count) out.push(await r.pick(makers)());
  return out;
}

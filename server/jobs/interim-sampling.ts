import { authalicLatitude, geodeticFromAuthalic } from '../../shared/engine/ellipsoid.js';
import type { Ellipsoid } from '../../shared/engine/ellipsoid.js';

/*
 * Interim equal-area sampling for audits, used until the engine exposes its own sampler (see
 * engine-instance.ts). Stratified: the region's bounding box is cut into cells of equal area on
 * the authalic sphere — equal steps of λ and of sin β, β the authalic latitude (Snyder 1987,
 * eqs. 3-11 to 3-18) — one point drawn at random in each cell from a seeded generator (see
 * lattice), and the points inside the region kept. Every kept point stands for the same ground area, so plain
 * means over them are area-weighted means.
 */

const WGS84: Ellipsoid = { aM: 6378137, es: 0.0066943799901413165 };
const DEG = Math.PI / 180;

/** mulberry32: a small, fast 32-bit generator; the same seed gives the same sequence everywhere. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Ring = number[][];

/**
 * The longitudes where the rings cross a parallel, sorted, for the even–odd rule: a point of that
 * latitude is inside when an odd number of crossings lie west of it. Edges are bucketed by latitude
 * band once, so each parallel only visits the edges near it.
 */
function crossingsIndex(rings: Ring[], south: number, north: number, bands: number) {
  const h = (north - south) / bands || 1;
  const buckets: number[][] = Array.from({ length: bands }, () => []);
  const edges: number[] = [];
  for (const r of rings) {
    for (let i = 0; i + 1 < r.length; i++) {
      const [x0, y0] = r[i], [x1, y1] = r[i + 1];
      if (y0 === y1) continue;
      const id = edges.length / 4;
      edges.push(x0, y0, x1, y1);
      const b0 = Math.max(0, Math.floor((Math.min(y0, y1) - south) / h));
      const b1 = Math.min(bands - 1, Math.floor((Math.max(y0, y1) - south) / h));
      for (let b = b0; b <= b1; b++) buckets[b].push(id);
    }
  }
  return (lat: number): Float64Array => {
    const bucket = buckets[Math.min(bands - 1, Math.max(0, Math.floor((lat - south) / h)))];
    const xs: number[] = [];
    for (const id of bucket) {
      const x0 = edges[4 * id], y0 = edges[4 * id + 1], x1 = edges[4 * id + 2], y1 = edges[4 * id + 3];
      if (y0 > lat !== y1 > lat) xs.push(x0 + ((lat - y0) * (x1 - x0)) / (y1 - y0));
    }
    return Float64Array.from(xs).sort();
  };
}

function boxOf(rings: Ring[]) {
  let w = Infinity, s = Infinity, e = -Infinity, n = -Infinity;
  for (const r of rings) for (const [x, y] of r) {
    if (x < w) w = x;
    if (x > e) e = x;
    if (y < s) s = y;
    if (y > n) n = y;
  }
  return { w, s, e, n };
}

/**
 * One point per equal-area cell, kept when inside. Within a row of cells the latitude is drawn
 * once (uniform in sin β over the row) and each cell's longitude uniformly within the cell, so
 * every cell still holds one point uniformly distributed over the row × column stratum, and the
 * inside test is a walk along the row's sorted crossings.
 */
function lattice(rings: Ring[], cells: number, seed: number, box: ReturnType<typeof boxOf>) {
  const uS = Math.sin(authalicLatitude(WGS84, box.s * DEG)), uN = Math.sin(authalicLatitude(WGS84, box.n * DEG));
  const dLam = (box.e - box.w) * DEG, dU = uN - uS;
  const cosMid = Math.cos(((box.s + box.n) / 2) * DEG);
  // Near-square cells on the ground: Δu = cos²β · Δλ per cell.
  const rows = Math.max(1, Math.round(Math.sqrt((cells * dU) / (Math.max(cosMid * cosMid, 1e-6) * Math.max(dLam, 1e-9)))));
  const cols = Math.max(1, Math.round(cells / rows));
  const crossings = crossingsIndex(rings, box.s, box.n, Math.min(rows, 65_536));
  const rand = seededRandom(seed);
  const lon: number[] = [], lat: number[] = [];
  for (let r = 0; r < rows; r++) {
    const u = uS + ((r + rand()) / rows) * dU;
    const y = geodeticFromAuthalic(WGS84, Math.asin(Math.max(-1, Math.min(1, u)))) / DEG;
    const xs = crossings(y);
    let k = 0;
    for (let c = 0; c < cols; c++) {
      const x = box.w + ((c + rand()) / cols) * (box.e - box.w);
      while (k < xs.length && xs[k] <= x) k++;
      if (k % 2 === 1) {
        lon.push(x);
        lat.push(y);
      }
    }
  }
  return { lon, lat, cells: rows * cols };
}

/**
 * About `samples` equal-area points inside the region (rings of [lon, lat] degrees, all polygons'
 * rings together), deterministic for a seed. A first pass measures what share of the box the
 * region fills; the second is sized so that about `samples` points fall inside.
 */
export function sampleRegionInterim(rings: Ring[], samples: number, seed: number): { lonDeg: Float64Array; latDeg: Float64Array } {
  const box = boxOf(rings);
  const probe = lattice(rings, Math.min(samples, 20_000), seed ^ 0x9e3779b9, box);
  const share = Math.max(probe.lon.length, 1) / probe.cells;
  const final = lattice(rings, Math.ceil(samples / share), seed, box);
  if (!final.lon.length) throw new Error('no sample point fell inside the region; it may be too small for this sample count');
  return { lonDeg: Float64Array.from(final.lon), latDeg: Float64Array.from(final.lat) };
}

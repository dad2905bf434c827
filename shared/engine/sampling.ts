import { DEG_TO_RAD, RAD_TO_DEG, WGS84_A_M, WGS84_F } from './constants';
import { authalicLatitude, ellipsoidFromFlattening, geodeticFromAuthalic, type Ellipsoid } from './ellipsoid';
import { regionAreaM2 } from './region/area';
import type { RegionInput } from './region/geojson';
import { buildPointIndex } from './region/point-index';
import { prepareRegion, type PreparedRegion } from './region/prepare';
import { createRng, r2Point } from './rng';

export const DEFAULT_SAMPLE_COUNT = 20_000;
export const MAX_SAMPLE_COUNT = 1_000_000;
export const DEFAULT_PAIR_COUNT = 2_000;

/** Equal-area samples of a region; every sample stands for weightKm2 of ground. */
export interface RegionSamples {
  count: number;
  seed: number;
  lonDeg: Float64Array;
  latDeg: Float64Array;
  /** Ground area per sample (all equal), km²; sums to the region's geodesic area. */
  weightKm2: Float64Array;
  /** Sample pairs (indices) for finite-distance errors, drawn uniformly by area. */
  pairI: Uint32Array;
  pairJ: Uint32Array;
  areaKm2: number;
  /** Candidate points drawn to accept count (a measure of how well the frame fits the region). */
  attempts: number;
}

export interface SampleOptions {
  count?: number;
  seed?: number;
  pairs?: number;
  /** Ellipsoid of the sampling (default WGS84). */
  ellipsoid?: Ellipsoid;
}

/**
 * Samples a region (GeoJSON Polygon/MultiPolygon, lon/lat degrees) with equal ground area per
 * sample on the ellipsoid. The region's frame is gridded in (λ, sin β) — β the authalic latitude,
 * so all cells have equal area (Snyder 1987, eq. 3-11 and ch. 10); points of the R2 sequence,
 * offset by the sampling seed, are spread uniformly over the cells that touch the region (the first
 * coordinate picks the cell and its position across, the second the position up), and those
 * inside the region kept until count are found.
 * Deterministic for a given region, count and seed.
 * Example: sampleRegion(square, { count: 1000, seed: 1 }).lonDeg.length === 1000.
 */
export function sampleRegion(input: RegionInput | PreparedRegion, options: SampleOptions = {}): RegionSamples {
  const count = options.count ?? DEFAULT_SAMPLE_COUNT;
  if (!Number.isInteger(count) || count < 1 || count > MAX_SAMPLE_COUNT) {
    throw new Error(`sample count must be an integer from 1 to ${MAX_SAMPLE_COUNT}, got ${count}`);
  }
  const seed = options.seed ?? 1;
  const ell = options.ellipsoid ?? ellipsoidFromFlattening(WGS84_A_M, 1 / WGS84_F);
  const region = 'rings' in input ? input : prepareRegion(input);
  const east = region.westDeg + region.widthDeg;
  const uSouth = Math.sin(authalicLatitude(ell, region.southDeg * DEG_TO_RAD));
  const uNorth = Math.sin(authalicLatitude(ell, region.northDeg * DEG_TO_RAD));
  const { nx, ny } = gridSize(region, uSouth, uNorth);
  const du = (uNorth - uSouth) / ny;
  const rowLat = new Float64Array(ny + 1);
  for (let r = 0; r <= ny; r++) rowLat[r] = r === ny ? region.northDeg : r === 0 ? region.southDeg : geodeticFromAuthalic(ell, Math.asin(uSouth + r * du)) * RAD_TO_DEG;
  const index = buildPointIndex(region.rings, region.westDeg, east, nx, rowLat);
  const cells = index.occupied;
  const cw = region.widthDeg / nx;
  const rng = createRng(seed);
  const o1 = rng();
  const o2 = rng();
  const lon = new Float64Array(count);
  const lat = new Float64Array(count);
  const areaM2 = regionAreaM2(region, ell);
  const frameShare = areaM2 / ((frameAreaM2(ell, region.widthDeg, uSouth, uNorth) * cells.length) / (nx * ny));
  const maxAttempts = Math.ceil((count / Math.max(frameShare, 1e-9)) * 4 + 10_000);
  let found = 0;
  let i = 0;
  for (; found < count; i++) {
    if (i > maxAttempts) throw new Error('sampling found too few points inside the region (is it degenerate?)');
    const [a, b] = r2Point(i, o1, o2);
    const pick = a * cells.length;
    const slot = Math.min(cells.length - 1, Math.floor(pick));
    const cell = cells[slot];
    const col = cell % nx;
    const row = (cell - col) / nx;
    const x = region.westDeg + (col + (pick - slot)) * cw;
    const u = uSouth + (row + b) * du;
    const y = geodeticFromAuthalic(ell, Math.asin(u > 1 ? 1 : u < -1 ? -1 : u)) * RAD_TO_DEG;
    if (!index.containsInCell(x, y, cell)) continue;
    lon[found] = x > 180 ? x - 360 : x < -180 ? x + 360 : x;
    lat[found] = y;
    found++;
  }
  const pairs = Math.min(options.pairs ?? DEFAULT_PAIR_COUNT, count > 1 ? count * 4 : 0);
  const pairI = new Uint32Array(pairs);
  const pairJ = new Uint32Array(pairs);
  for (let p = 0; p < pairs; p++) {
    const a = Math.floor(rng() * count);
    let b = Math.floor(rng() * (count - 1));
    if (b >= a) b++;
    pairI[p] = a;
    pairJ[p] = b;
  }
  const areaKm2 = areaM2 / 1e6;
  return {
    count,
    seed,
    lonDeg: lon,
    latDeg: lat,
    weightKm2: new Float64Array(count).fill(areaKm2 / count),
    pairI,
    pairJ,
    areaKm2,
    attempts: i,
  };
}

/** A grid with about four cells per edge (within 4k–1M cells), cells near square on the ground. */
function gridSize(region: PreparedRegion, uSouth: number, uNorth: number): { nx: number; ny: number } {
  let edges = 0;
  for (const r of region.rings) edges += r.lon.length;
  const cells = Math.min(1 << 20, Math.max(4096, edges * 4));
  const aspect = (region.widthDeg * DEG_TO_RAD) / Math.max(uNorth - uSouth, 1e-12);
  const nx = Math.max(8, Math.min(8192, Math.round(Math.sqrt(cells * aspect))));
  const ny = Math.max(8, Math.min(8192, Math.round(cells / nx)));
  return { nx, ny };
}

/** Area of the frame rectangle, R_q²·Δλ·Δ(sin β). */
function frameAreaM2(ell: Ellipsoid, widthDeg: number, uSouth: number, uNorth: number): number {
  const qp = ell.es < 1e-15 ? 2 : undefined;
  const rq2 = qp ? ell.aM * ell.aM : authalicR2(ell);
  return rq2 * widthDeg * DEG_TO_RAD * (uNorth - uSouth);
}

function authalicR2(ell: Ellipsoid): number {
  const e = Math.sqrt(ell.es);
  const qp = 1 - ((1 - ell.es) / (2 * e)) * Math.log((1 - e) / (1 + e));
  return (ell.aM * ell.aM * qp) / 2;
}

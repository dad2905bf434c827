import { DEG_TO_RAD, RAD_TO_DEG } from '../constants';
import { sampleRegion, type RegionSamples } from '../sampling';
import type { RegionInput } from './geojson';
import { prepareRegion, type PreparedRegion } from './prepare';

export interface RegionSummary {
  areaKm2: number;
  /** [west, south, east, north] degrees; west > east when the region crosses the antimeridian (RFC 7946 §5.2). */
  bbox: [number, number, number, number];
  parts: number;
  holes: number;
  vertexCount: number;
  crossesAntimeridian: boolean;
  /** "north" / "south" when the region encloses a pole. */
  containsPole: 'north' | 'south' | null;
  /** Area-weighted centre (mean of the samples' unit vectors). */
  centreLonDeg: number;
  centreLatDeg: number;
  /** Longitude span, latitude span (degrees) and the spans on the ground (km) at the centre. */
  lonSpanDeg: number;
  latSpanDeg: number;
  eastWestKm: number;
  northSouthKm: number;
  /**
   * Shape from the area-weighted spread of the samples about the centre (√12 × standard deviation,
   * the extent of a uniform strip of the same spread), east–west and north–south, km. Unlike the
   * extent, outlying islands barely move it.
   */
  eastWestSpreadKm: number;
  northSouthSpreadKm: number;
}

const wrap = (x: number) => (x > 180 ? x - 360 : x < -180 ? x + 360 : x);

/**
 * What the engine sees in a region: area (GeographicLib, WGS84), extent, parts, antimeridian and
 * pole, and its area-weighted centre and spread — from the samples given, or from 2 000 equal-area
 * samples with seed 1 (deterministic).
 * Example: regionSummary(fiji).crossesAntimeridian === true.
 */
export function regionSummary(input: RegionInput | PreparedRegion, options: { samples?: RegionSamples } = {}): RegionSummary {
  const region = 'rings' in input ? input : prepareRegion(input);
  const samples = options.samples ?? sampleRegion(region, { count: 2000, seed: 1, pairs: 0 });
  let x = 0, y = 0, z = 0;
  for (let i = 0; i < samples.count; i++) {
    const lon = samples.lonDeg[i] * DEG_TO_RAD;
    const lat = samples.latDeg[i] * DEG_TO_RAD;
    x += Math.cos(lat) * Math.cos(lon);
    y += Math.cos(lat) * Math.sin(lon);
    z += Math.sin(lat);
  }
  const centreLat = Math.atan2(z, Math.hypot(x, y)) * RAD_TO_DEG;
  const centreLon = Math.atan2(y, x) * RAD_TO_DEG;
  let se = 0;
  let sn = 0;
  const cosC = Math.cos(centreLat * DEG_TO_RAD);
  for (let i = 0; i < samples.count; i++) {
    let dl = samples.lonDeg[i] - centreLon;
    dl -= 360 * Math.round(dl / 360);
    const e = dl * cosC;
    const n = samples.latDeg[i] - centreLat;
    se += e * e;
    sn += n * n;
  }
  const spread = (m2: number) => Math.sqrt((12 * m2) / samples.count) * 111.32;
  const full = region.widthDeg >= 360;
  const bbox: [number, number, number, number] = full
    ? [-180, region.southDeg, 180, region.northDeg]
    : [wrap(region.westDeg), region.southDeg, wrap(region.westDeg + region.widthDeg), region.northDeg];
  const latSpan = region.northDeg - region.southDeg;
  const kmPerDeg = 111.32;
  return {
    areaKm2: samples.areaKm2,
    bbox,
    parts: region.polygonCount,
    holes: region.holeCount,
    vertexCount: region.vertexCount,
    crossesAntimeridian: region.crossesAntimeridian,
    containsPole: region.containsPole === 1 ? 'north' : region.containsPole === -1 ? 'south' : null,
    centreLonDeg: centreLon,
    centreLatDeg: centreLat,
    lonSpanDeg: region.widthDeg,
    latSpanDeg: latSpan,
    eastWestKm: region.widthDeg * kmPerDeg * Math.cos(centreLat * DEG_TO_RAD),
    northSouthKm: latSpan * kmPerDeg,
    eastWestSpreadKm: spread(se),
    northSouthSpreadKm: spread(sn),
  };
}

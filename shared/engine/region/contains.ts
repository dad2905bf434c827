import { buildPointIndex } from './point-index';
import type { PreparedRegion } from './prepare';

/**
 * A point-in-region test for lon/lat degrees (any longitude, wrapped into the region's frame),
 * even–odd over all rings as prepareRegion reads them. Build once, call many times.
 * Example: createRegionTest(prepareRegion(fiji))(179.5, -16.5) === true.
 */
export function createRegionTest(region: PreparedRegion, rows = 512): (lonDeg: number, latDeg: number) => boolean {
  const ny = Math.max(8, rows);
  const rowLat = new Float64Array(ny + 1);
  for (let r = 0; r <= ny; r++) rowLat[r] = region.southDeg + ((region.northDeg - region.southDeg) * r) / ny;
  const index = buildPointIndex(region.rings, region.westDeg, region.westDeg + region.widthDeg, ny, rowLat);
  const west = region.westDeg;
  return (lon, lat) => {
    const x = west + ((((lon - west) % 360) + 360) % 360);
    return index.contains(x, lat) || (x - 360 >= west && index.contains(x - 360, lat));
  };
}

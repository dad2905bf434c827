/** Graticule spacing in degrees, smallest first; the first that gives at most MAX_LINES lines across the region is used. */
const INTERVALS_DEG = [0.1, 0.2, 0.25, 0.5, 1, 2, 5, 10, 15, 30];
const MAX_LINES = 8;

export interface GraticuleLine {
  kind: 'meridian' | 'parallel';
  valueDeg: number;
  /** Points in lon/lat degrees. */
  points: [number, number][];
}

/**
 * Meridians and parallels at a round interval covering a lon/lat box one interval beyond the
 * region's bounding box [west, south, east, north] (east < west for a box across ±180°),
 * each densified to 32 steps per interval so curved lines stay smooth.
 */
export function graticuleFor(bbox: number[]): { intervalDeg: number; lines: GraticuleLine[] } {
  const [west, south] = bbox;
  let east = bbox[2];
  const north = bbox[3];
  if (east < west) east += 360;
  const extent = Math.max(east - west, north - south, 1e-6);
  const iv = INTERVALS_DEG.find((d) => extent / d <= MAX_LINES) ?? 30;
  const lon0 = Math.floor(west / iv) * iv - iv, lon1 = Math.ceil(east / iv) * iv + iv;
  const lat0 = Math.max(-90, Math.floor(south / iv) * iv - iv), lat1 = Math.min(90, Math.ceil(north / iv) * iv + iv);
  const step = iv / 32;
  const round = (v: number) => Number(v.toFixed(6));
  const lines: GraticuleLine[] = [];
  for (let lon = lon0; lon <= lon1 + 1e-9; lon += iv) {
    const points: [number, number][] = [];
    for (let lat = lat0; lat <= lat1 + 1e-9; lat += step) points.push([round(lon), round(Math.min(lat, lat1))]);
    lines.push({ kind: 'meridian', valueDeg: round(((lon + 540) % 360) - 180), points });
  }
  for (let lat = lat0; lat <= lat1 + 1e-9; lat += iv) {
    if (Math.abs(lat) >= 90) continue;
    const points: [number, number][] = [];
    for (let lon = lon0; lon <= lon1 + 1e-9; lon += step) points.push([round(lon), round(lat)]);
    lines.push({ kind: 'parallel', valueDeg: round(lat), points });
  }
  return { intervalDeg: iv, lines };
}

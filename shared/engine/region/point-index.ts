import type { FrameRing } from './prepare';

/**
 * Even–odd point-in-region test over many rings, in the region's longitude frame, on a uniform
 * grid: each cell keeps the edges that touch it and whether a reference point inside it is in
 * the region (from one horizontal sweep per row), so a query only crosses the segment from the
 * reference point to the query point with the cell's own edges.
 */
export interface PointIndex {
  readonly nx: number;
  readonly ny: number;
  /** Cells that touch the region (an edge passes through, or the cell lies inside), row-major. */
  readonly occupied: Uint32Array;
  contains(lonFrameDeg: number, latDeg: number): boolean;
  /** contains() for a point already known to lie in cell (row * nx + col). */
  containsInCell(lonFrameDeg: number, latDeg: number, cell: number): boolean;
}

/**
 * Builds the index over [west, east] with nx columns and rows bounded by the increasing
 * latitudes rowLatDeg (ny + 1 values; rows need not be equal in latitude).
 * Example: buildPointIndex(prepareRegion(r).rings, -10, 10, 64, rowLats).contains(1, 45).
 */
export function buildPointIndex(rings: FrameRing[], west: number, east: number, nx: number, rowLatDeg: Float64Array): PointIndex {
  let edgeCount = 0;
  for (const r of rings) edgeCount += r.lon.length;
  const ax = new Float64Array(edgeCount);
  const ay = new Float64Array(edgeCount);
  const bx = new Float64Array(edgeCount);
  const by = new Float64Array(edgeCount);
  let e = 0;
  for (const r of rings) {
    const n = r.lon.length;
    for (let i = 0; i < n; i++) {
      const j = i + 1 === n ? 0 : i + 1;
      if (r.lon[i] === r.lon[j] && r.lat[i] === r.lat[j]) continue;
      ax[e] = r.lon[i]; ay[e] = r.lat[i]; bx[e] = r.lon[j]; by[e] = r.lat[j];
      e++;
    }
  }
  edgeCount = e;
  const ny = rowLatDeg.length - 1;
  const south = rowLatDeg[0];
  const north = rowLatDeg[ny];
  const cw = Math.max(east - west, 1e-9) / nx;
  const cx = (x: number) => Math.min(nx - 1, Math.max(0, Math.floor((x - west) / cw)));
  const cy = (y: number) => {
    let lo = 0;
    let hi = ny - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (rowLatDeg[mid] <= y) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };
  const refY = (row: number) => rowLatDeg[row] + fy * (rowLatDeg[row + 1] - rowLatDeg[row]);

  // Edges per cell (compressed rows), conservatively by each edge's bounding box.
  // Reference points, off-centre by irrational fractions so they avoid grid-aligned vertices.
  const fx = 0.5 + 0.1 * (Math.SQRT2 - 1.4);
  const fy = 0.5 + 0.1 * (Math.PI - 3.1);
  const counts = new Uint32Array(nx * ny + 1);
  const forEachCell = (k: number, f: (c: number) => void) => {
    const x0 = cx(Math.min(ax[k], bx[k])), x1 = cx(Math.max(ax[k], bx[k]));
    const y0 = cy(Math.min(ay[k], by[k])), y1 = cy(Math.max(ay[k], by[k]));
    for (let y = y0; y <= y1; y++) for (let x = x0; x <= x1; x++) f(y * nx + x);
  };
  for (let k = 0; k < edgeCount; k++) forEachCell(k, (c) => counts[c + 1]++);
  for (let c = 0; c < nx * ny; c++) counts[c + 1] += counts[c];
  const cellEdges = new Uint32Array(counts[nx * ny]);
  const fill = counts.slice(0, nx * ny);
  for (let k = 0; k < edgeCount; k++) forEachCell(k, (c) => (cellEdges[fill[c]++] = k));

  const inside = new Uint8Array(nx * ny);
  const rowEdges: number[][] = Array.from({ length: ny }, () => []);
  for (let k = 0; k < edgeCount; k++) {
    const y0 = cy(Math.min(ay[k], by[k])), y1 = cy(Math.max(ay[k], by[k]));
    for (let y = y0; y <= y1; y++) rowEdges[y].push(k);
  }
  const xs: number[] = [];
  for (let row = 0; row < ny; row++) {
    const yr = refY(row);
    xs.length = 0;
    for (const k of rowEdges[row]) {
      if ((ay[k] > yr) !== (by[k] > yr)) xs.push(ax[k] + ((yr - ay[k]) * (bx[k] - ax[k])) / (by[k] - ay[k]));
    }
    xs.sort((a, b) => a - b);
    let p = 0;
    for (let col = 0; col < nx; col++) {
      const xr = west + (col + fx) * cw;
      while (p < xs.length && xs[p] < xr) p++;
      // Crossings to the east of the reference point decide its parity.
      inside[row * nx + col] = (xs.length - p) & 1;
    }
  }

  const occupiedList: number[] = [];
  for (let c = 0; c < nx * ny; c++) if (inside[c] || counts[c + 1] > counts[c]) occupiedList.push(c);

  const containsInCell = (x: number, y: number, c: number): boolean => {
      const col = c % nx;
      const row = (c - col) / nx;
      let parity = inside[c];
      const rx = west + (col + fx) * cw;
      const ry = refY(row);
      for (let i = counts[c], end = counts[c + 1]; i < end; i++) {
        const k = cellEdges[i];
        const d1 = orient(ax[k], ay[k], bx[k], by[k], rx, ry);
        const d2 = orient(ax[k], ay[k], bx[k], by[k], x, y);
        if ((d1 > 0) === (d2 > 0)) continue;
        const d3 = orient(rx, ry, x, y, ax[k], ay[k]);
        const d4 = orient(rx, ry, x, y, bx[k], by[k]);
        if ((d3 > 0) !== (d4 > 0)) parity ^= 1;
      }
      return parity === 1;
  };
  return {
    nx,
    ny,
    occupied: Uint32Array.from(occupiedList),
    containsInCell,
    contains(x, y) {
      if (!(x >= west && x <= east && y >= south && y <= north)) return false;
      return containsInCell(x, y, cy(y) * nx + cx(x));
    },
  };
}

function orient(ax: number, ay: number, bx: number, by: number, px: number, py: number): number {
  return (bx - ax) * (py - ay) - (by - ay) * (px - ax);
}

import type { Polygon, MultiPolygon } from 'geojson';

/** A projected ring as flat [x0, y0, x1, y1, …] in metres (or pixels after toPixels). */
export type FlatRing = Float64Array;

/**
 * Square frame around the projected region shared by the PNG heatmaps and the SVG overlays:
 * u = (x − cx)/span + ½, v = ½ − (y − cy)/span, so (u, v) ∈ [0, 1]² with v pointing down.
 * A PNG of n × n pixels has pixel column u·n and row v·n; the SVG uses the same u, v × 1000.
 */
export interface Frame {
  cx: number;
  cy: number;
  span: number;
}

/** Longest lon/lat edge drawn as one straight projected segment; longer ones are split. */
const MAX_EDGE_DEG = 0.25;

export type ForwardDeg = (lonDeg: number, latDeg: number) => [number, number] | null;

/** Polygon rings of a Polygon or MultiPolygon, in lon/lat degrees. */
export function ringsOf(geometry: Polygon | MultiPolygon): number[][][] {
  return geometry.type === 'Polygon' ? geometry.coordinates : geometry.coordinates.flat();
}

/**
 * Projects every ring, splitting edges longer than MAX_EDGE_DEG (edges are straight in lon/lat,
 * as RFC 7946 draws them) so the outline follows the projection's curvature. Vertices the
 * projection cannot map are dropped.
 */
export function projectRings(rings: number[][][], forward: ForwardDeg): FlatRing[] {
  const out: FlatRing[] = [];
  for (const ring of rings) {
    const pts: number[] = [];
    for (let i = 0; i < ring.length; i++) {
      const [lon1, lat1] = ring[i];
      if (i > 0) {
        const [lon0, lat0] = ring[i - 1];
        // An edge between ±180° (a ring drawn across the antimeridian) goes the short way round.
        const dLon = lon1 - lon0 - 360 * Math.round((lon1 - lon0) / 360);
        const steps = Math.ceil(Math.max(Math.abs(dLon), Math.abs(lat1 - lat0)) / MAX_EDGE_DEG);
        for (let s = 1; s < steps; s++) {
          const f = s / steps;
          const p = forward(lon0 + f * dLon, lat0 + f * (lat1 - lat0));
          if (p) pts.push(p[0], p[1]);
        }
      }
      const p = forward(lon1, lat1);
      if (p) pts.push(p[0], p[1]);
    }
    if (pts.length >= 6) out.push(Float64Array.from(pts));
  }
  return out;
}

/** The square frame holding every projected ring with a margin of padFraction of the span on each side. */
export function frameFor(rings: FlatRing[], padFraction = 0.03): Frame {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const r of rings) {
    for (let i = 0; i < r.length; i += 2) {
      if (r[i] < minX) minX = r[i];
      if (r[i] > maxX) maxX = r[i];
      if (r[i + 1] < minY) minY = r[i + 1];
      if (r[i + 1] > maxY) maxY = r[i + 1];
    }
  }
  if (!(maxX > minX) && !(maxY > minY)) throw new Error('the region has no extent in this projection');
  const span = Math.max(maxX - minX, maxY - minY) * (1 + 2 * padFraction);
  return { cx: (minX + maxX) / 2, cy: (minY + maxY) / 2, span };
}

/** Projected metres → frame units (0–1, v down). */
export function toUnit(frame: Frame, x: number, y: number): [number, number] {
  return [(x - frame.cx) / frame.span + 0.5, 0.5 - (y - frame.cy) / frame.span];
}

/** Frame units → projected metres. */
export function fromUnit(frame: Frame, u: number, v: number): [number, number] {
  return [frame.cx + (u - 0.5) * frame.span, frame.cy + (0.5 - v) * frame.span];
}

/** Rings in projected metres → rings in pixels of an n × n image. */
export function ringsToPixels(rings: FlatRing[], frame: Frame, sizePx: number): FlatRing[] {
  return rings.map((r) => {
    const out = new Float64Array(r.length);
    for (let i = 0; i < r.length; i += 2) {
      out[i] = ((r[i] - frame.cx) / frame.span + 0.5) * sizePx;
      out[i + 1] = (0.5 - (r[i + 1] - frame.cy) / frame.span) * sizePx;
    }
    return out;
  });
}

import sharp from 'sharp';
import type { Polygon, MultiPolygon } from 'geojson';
import { frameFor, projectRings, ringsOf, ringsToPixels, type Frame } from './frame.js';
import type { CandidateProjection } from './projection.js';
import type { FieldSpec } from './field-spec.js';
import { rasterMask } from './raster-mask.js';
import { renderFieldRgba } from './render-field.js';

export interface RenderedHeatmap {
  png: Buffer;
  frame: Frame;
  /** Pixels inside the region that got a colour. */
  coloured: number;
  timingsMs: { mask: number; field: number; encode: number };
}

/**
 * Renders one field of one candidate over the region as an n × n PNG: the region is projected,
 * framed (see Frame) and rasterised to a mask; each pixel inside is coloured from the factors at
 * its inverse-projected position; outside pixels stay fully transparent.
 */
export async function renderHeatmap(
  geometry: Polygon | MultiPolygon,
  projection: CandidateProjection,
  spec: FieldSpec,
  sizePx: number,
): Promise<RenderedHeatmap> {
  const t0 = performance.now();
  const rings = projectRings(ringsOf(geometry), projection.forwardDeg);
  const frame = frameFor(rings);
  const mask = rasterMask(ringsToPixels(rings, frame, sizePx), sizePx, sizePx);
  const t1 = performance.now();
  const toMetres = (px: number, py: number): [number, number] => [
    frame.cx + (px / sizePx - 0.5) * frame.span,
    frame.cy + (0.5 - py / sizePx) * frame.span,
  ];
  const { rgba, coloured } = renderFieldRgba(sizePx, mask, toMetres, projection, spec);
  const t2 = performance.now();
  const png = await sharp(rgba, { raw: { width: sizePx, height: sizePx, channels: 4 } })
    .png({ compressionLevel: 6, adaptiveFiltering: false })
    .toBuffer();
  const t3 = performance.now();
  return { png, frame, coloured, timingsMs: { mask: t1 - t0, field: t2 - t1, encode: t3 - t2 } };
}

import { RAMPS, rampIndex } from './ramps.js';
import type { FieldSpec } from './field-spec.js';

/** What the renderer needs of a projection, in radians and projected metres. */
export interface PixelProjection {
  /** Projected metres → lon/lat radians in xy[0], xy[1]; false where there is no inverse. */
  inverse: (xM: number, yM: number, out: Float64Array) => boolean;
  /** Tissot quantities at lon/lat radians into out (engine evaluator layout); false where undefined. */
  factors: (lonRad: number, latRad: number, out: Float64Array) => boolean;
}

/**
 * Largest number of lattice nodes per side at which factors are evaluated. Above it the lattice
 * is every `step` pixels and values in between are interpolated bilinearly: the factors are smooth
 * at the scale of a few pixels, and this keeps a 1024² image to ~66 000 evaluations. The region
 * mask stays exact per pixel.
 */
const MAX_NODES_PER_SIDE = 256;

/**
 * Colours the pixels of an n × n image whose centres are inside the region mask; every other
 * pixel is transparent (alpha 0). `pixelToMetres` maps a pixel-centre position to projected metres.
 * Returns straight RGBA bytes.
 */
export function renderFieldRgba(
  sizePx: number,
  mask: Uint8Array,
  pixelToMetres: (px: number, py: number) => [number, number],
  projection: PixelProjection,
  spec: FieldSpec,
): { rgba: Uint8Array; coloured: number } {
  const lut = RAMPS[spec.ramp];
  const step = Math.max(1, Math.ceil(sizePx / MAX_NODES_PER_SIDE));
  const nodesPerSide = Math.floor((sizePx - 1) / step) + 2;
  const ll = new Float64Array(2);
  const f = new Float64Array(8);
  const evalAt = (px: number, py: number): number => {
    const [x, y] = pixelToMetres(px, py);
    if (!projection.inverse(x, y, ll) || !projection.factors(ll[0], ll[1], f)) return NaN;
    return spec.value(f);
  };

  // Nodes sit on pixel centres i·step; only those next to a pixel inside the region are evaluated.
  const nodes = new Float64Array(nodesPerSide * nodesPerSide).fill(NaN);
  if (step > 1) {
    const needed = new Uint8Array(nodesPerSide * nodesPerSide);
    for (let py = 0; py < sizePx; py++) {
      const j = Math.floor(py / step);
      for (let px = 0; px < sizePx; px++) {
        if (!mask[py * sizePx + px]) continue;
        const i = Math.floor(px / step);
        const base = j * nodesPerSide + i;
        needed[base] = needed[base + 1] = needed[base + nodesPerSide] = needed[base + nodesPerSide + 1] = 1;
      }
    }
    for (let j = 0; j < nodesPerSide; j++) {
      for (let i = 0; i < nodesPerSide; i++) {
        if (needed[j * nodesPerSide + i]) nodes[j * nodesPerSide + i] = evalAt(i * step + 0.5, j * step + 0.5);
      }
    }
  }

  const rgba = new Uint8Array(sizePx * sizePx * 4);
  let coloured = 0;
  for (let py = 0; py < sizePx; py++) {
    const fy = py / step;
    const j = Math.floor(fy);
    const wy = fy - j;
    for (let px = 0; px < sizePx; px++) {
      const p = py * sizePx + px;
      if (!mask[p]) continue;
      let v: number;
      if (step === 1) v = evalAt(px + 0.5, py + 0.5);
      else {
        const fx = px / step;
        const i = Math.floor(fx);
        const wx = fx - i;
        const base = j * nodesPerSide + i;
        const v00 = nodes[base], v10 = nodes[base + 1], v01 = nodes[base + nodesPerSide], v11 = nodes[base + nodesPerSide + 1];
        v = (1 - wy) * ((1 - wx) * v00 + wx * v10) + wy * ((1 - wx) * v01 + wx * v11);
        // A node the projection cannot map (an edge of its domain): evaluate this pixel itself.
        if (Number.isNaN(v)) v = evalAt(px + 0.5, py + 0.5);
      }
      if (Number.isNaN(v)) continue;
      const c = rampIndex(spec.toT(v)) * 3;
      rgba[p * 4] = lut[c];
      rgba[p * 4 + 1] = lut[c + 1];
      rgba[p * 4 + 2] = lut[c + 2];
      rgba[p * 4 + 3] = 255;
      coloured++;
    }
  }
  return { rgba, coloured };
}

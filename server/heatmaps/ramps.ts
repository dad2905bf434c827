/**
 * Colour ramps for the heatmaps, as 256-entry sRGB lookup tables built once.
 *
 * - `diverging`: the "cool to warm" map of K. Moreland, "Diverging Color Maps for Scientific
 *   Visualization", ISVC 2009 (LNCS 5876, pp. 92–103), computed with the paper's algorithm: its
 *   two end colours are converted to Msh (polar CIELAB) and interpolated through an unsaturated
 *   midpoint of M = 88, so lightness rises evenly to a light grey and falls evenly again. The paper
 *   designs it for readers with red–green colour blindness (the two arms differ in blue–yellow).
 *   Used for ln s, centred on s = 1.
 * - `sequential`: viridis (S. van der Walt & N. Smith, 2015, designed in CAM02-UCS for uniform
 *   perceived steps and legibility under the common colour-vision deficiencies). The anchors below
 *   are every 16th of the 256 published entries of matplotlib's `_viridis_data` (entries 0, 16, …,
 *   240 and 255), interpolated linearly in sRGB; neighbouring published entries differ by < 2 %,
 *   so 16-entry steps stay within rounding of the full table's smoothness.
 */

export type RampName = 'diverging' | 'sequential';

/** Viridis anchors (sRGB, 0–1) at published-table positions i/255 for i = 0, 16, …, 240, 255. */
const VIRIDIS_ANCHORS: readonly (readonly [number, number, number, number])[] = [
  [0, 0.267004, 0.004874, 0.329415],
  [16, 0.282327, 0.094955, 0.417331],
  [32, 0.278826, 0.17549, 0.483397],
  [48, 0.258965, 0.251537, 0.524736],
  [64, 0.229739, 0.322361, 0.545706],
  [80, 0.19943, 0.387607, 0.554642],
  [96, 0.172719, 0.448791, 0.557885],
  [112, 0.149039, 0.508051, 0.55725],
  [128, 0.127568, 0.566949, 0.550556],
  [144, 0.120638, 0.625828, 0.533488],
  [160, 0.157851, 0.683765, 0.501686],
  [176, 0.24607, 0.73891, 0.452024],
  [192, 0.369214, 0.788888, 0.382914],
  [208, 0.515992, 0.831158, 0.294279],
  [224, 0.678489, 0.863742, 0.189503],
  [240, 0.845561, 0.887322, 0.099702],
  [255, 0.993248, 0.906157, 0.143936],
];

/** Moreland 2009, table 1 end points of the cool-to-warm map (sRGB, 0–1). */
const COOL: readonly [number, number, number] = [0.23, 0.299, 0.754];
const WARM: readonly [number, number, number] = [0.706, 0.016, 0.15];

const LUT_SIZE = 256;

function buildViridis(): Uint8Array {
  const lut = new Uint8Array(LUT_SIZE * 3);
  for (let i = 0; i < LUT_SIZE; i++) {
    let j = 0;
    while (j < VIRIDIS_ANCHORS.length - 2 && VIRIDIS_ANCHORS[j + 1][0] < i) j++;
    const [i0, r0, g0, b0] = VIRIDIS_ANCHORS[j];
    const [i1, r1, g1, b1] = VIRIDIS_ANCHORS[j + 1];
    const f = (i - i0) / (i1 - i0);
    lut[i * 3] = Math.round(255 * (r0 + f * (r1 - r0)));
    lut[i * 3 + 1] = Math.round(255 * (g0 + f * (g1 - g0)));
    lut[i * 3 + 2] = Math.round(255 * (b0 + f * (b1 - b0)));
  }
  return lut;
}

// sRGB ↔ CIELAB with the D65 white Moreland's reference code uses (Xn 0.9505, Yn 1, Zn 1.089).
const XN = 0.9505, YN = 1.0, ZN = 1.089;
const toLinear = (c: number) => (c > 0.04045 ? ((c + 0.055) / 1.055) ** 2.4 : c / 12.92);
const fromLinear = (c: number) => (c > 0.0031308 ? 1.055 * c ** (1 / 2.4) - 0.055 : 12.92 * c);
const labF = (t: number) => (t > 0.008856 ? Math.cbrt(t) : 7.787 * t + 16 / 116);
const labFInv = (t: number) => (t > 0.20689 ? t * t * t : (t - 16 / 116) / 7.787);

/** sRGB (0–1) → CIELAB (IEC 61966-2-1 transfer and matrix, CIE 1976 L*a*b*). */
export function srgbToLab([r, g, b]: readonly number[]): [number, number, number] {
  const R = toLinear(r), G = toLinear(g), B = toLinear(b);
  const x = labF((0.4124 * R + 0.3576 * G + 0.1805 * B) / XN);
  const y = labF((0.2126 * R + 0.7152 * G + 0.0722 * B) / YN);
  const z = labF((0.0193 * R + 0.1192 * G + 0.9505 * B) / ZN);
  return [116 * y - 16, 500 * (x - y), 200 * (y - z)];
}

function labToSrgb(L: number, a: number, bb: number): [number, number, number] {
  const fy = (L + 16) / 116;
  const X = XN * labFInv(fy + a / 500), Y = YN * labFInv(fy), Z = ZN * labFInv(fy - bb / 200);
  const R = 3.2406 * X - 1.5372 * Y - 0.4986 * Z;
  const G = -0.9689 * X + 1.8758 * Y + 0.0415 * Z;
  const B = 0.0557 * X - 0.204 * Y + 1.057 * Z;
  const clamp = (c: number) => Math.min(1, Math.max(0, fromLinear(c)));
  return [clamp(R), clamp(G), clamp(B)];
}

type Msh = [number, number, number];
function toMsh(rgb: readonly number[]): Msh {
  const [L, a, b] = srgbToLab(rgb);
  const M = Math.hypot(L, a, b);
  return [M, Math.acos(L / M), Math.atan2(b, a)];
}

/** Moreland 2009, "AdjustHue": spins the hue of the unsaturated end so the path stays smooth. */
function adjustHue([mSat, sSat, hSat]: Msh, mUnsat: number): number {
  if (mSat >= mUnsat) return hSat;
  const spin = (sSat * Math.sqrt(mUnsat * mUnsat - mSat * mSat)) / (mSat * Math.sin(sSat));
  return hSat > -Math.PI / 3 ? hSat + spin : hSat - spin;
}

/** Moreland 2009, "InterpolateColor" between the cool and warm ends, t in [0, 1]. */
function coolWarm(t: number): [number, number, number] {
  let m1 = toMsh(COOL), m2 = toMsh(WARM);
  let u = t;
  const mMid = Math.max(m1[0], m2[0], 88);
  if (u < 0.5) {
    m2 = [mMid, 0, 0];
    u *= 2;
  } else {
    m1 = [mMid, 0, 0];
    u = 2 * u - 1;
  }
  if (m1[1] < 0.05 && m2[1] > 0.05) m1 = [m1[0], m1[1], adjustHue(m2, m1[0])];
  else if (m2[1] < 0.05 && m1[1] > 0.05) m2 = [m2[0], m2[1], adjustHue(m1, m2[0])];
  const M = (1 - u) * m1[0] + u * m2[0];
  const s = (1 - u) * m1[1] + u * m2[1];
  const h = (1 - u) * m1[2] + u * m2[2];
  return labToSrgb(M * Math.cos(s), M * Math.sin(s) * Math.cos(h), M * Math.sin(s) * Math.sin(h));
}

function buildCoolWarm(): Uint8Array {
  const lut = new Uint8Array(LUT_SIZE * 3);
  for (let i = 0; i < LUT_SIZE; i++) {
    const [r, g, b] = coolWarm(i / (LUT_SIZE - 1));
    lut[i * 3] = Math.round(255 * r);
    lut[i * 3 + 1] = Math.round(255 * g);
    lut[i * 3 + 2] = Math.round(255 * b);
  }
  return lut;
}

/** The lookup tables, 256 × RGB bytes each. Frozen in spirit: never written after start. */
export const RAMPS: Readonly<Record<RampName, Uint8Array>> = Object.freeze({
  diverging: buildCoolWarm(),
  sequential: buildViridis(),
});

/** Index into a LUT for t in [0, 1] (clamped; NaN maps to 0). */
export function rampIndex(t: number): number {
  if (!(t > 0)) return 0;
  if (t >= 1) return LUT_SIZE - 1;
  return Math.round(t * (LUT_SIZE - 1));
}

/** The colour at t in [0, 1] as "#rrggbb", for legends. */
export function rampHex(ramp: RampName, t: number): string {
  const i = rampIndex(t) * 3;
  const lut = RAMPS[ramp];
  return '#' + [lut[i], lut[i + 1], lut[i + 2]].map((c) => c.toString(16).padStart(2, '0')).join('');
}

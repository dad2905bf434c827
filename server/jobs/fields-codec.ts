/**
 * The per-sample fields of one scorecard, packed for the `scorecards.fields` blob:
 * "WMF1" · uint32 n · float64 lon[n] · float64 lat[n] · float32 h, k, s, ω°, a, b [n each]
 * (little-endian). Positions keep full precision; factors keep float32 (7 digits), which is
 * below what a heatmap or an export shows. NaN marks a sample where the projection is undefined.
 */
export interface SampleFields {
  lonDeg: Float64Array;
  latDeg: Float64Array;
  h: Float32Array;
  k: Float32Array;
  s: Float32Array;
  omegaDeg: Float32Array;
  a: Float32Array;
  b: Float32Array;
}

const MAGIC = 'WMF1';
const FACTOR_KEYS = ['h', 'k', 's', 'omegaDeg', 'a', 'b'] as const;
const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

export function encodeFields(f: SampleFields): Buffer {
  const n = f.lonDeg.length;
  const header = Buffer.alloc(8);
  header.write(MAGIC, 0, 'ascii');
  header.writeUInt32LE(n, 4);
  const parts: Buffer[] = [header];
  if (LITTLE_ENDIAN) {
    // The typed arrays' bytes are already little-endian: copy them as they are.
    for (const arr of [f.lonDeg, f.latDeg, ...FACTOR_KEYS.map((k) => f[k])]) parts.push(Buffer.from(arr.buffer, arr.byteOffset, arr.byteLength));
    return Buffer.concat(parts);
  }
  const body = Buffer.alloc(n * 16 + n * 4 * FACTOR_KEYS.length);
  let off = 0;
  for (const arr of [f.lonDeg, f.latDeg]) for (let i = 0; i < n; i++, off += 8) body.writeDoubleLE(arr[i], off);
  for (const key of FACTOR_KEYS) for (let i = 0; i < n; i++, off += 4) body.writeFloatLE(f[key][i], off);
  return Buffer.concat([header, body]);
}

export function decodeFields(buf: Buffer): SampleFields {
  if (buf.length < 8 || buf.toString('ascii', 0, 4) !== MAGIC) throw new Error('the stored sample fields are not in a known format');
  const n = buf.readUInt32LE(4);
  if (buf.length !== 8 + n * 16 + n * 4 * FACTOR_KEYS.length) throw new Error('the stored sample fields are truncated');
  // Copy into aligned typed arrays (the blob's offset inside its pool need not be aligned).
  const bytes = (at: number, len: number) => new Uint8Array(buf.subarray(at, at + len)).buffer;
  const f64 = (at: number) => (LITTLE_ENDIAN ? new Float64Array(bytes(at, n * 8)) : Float64Array.from({ length: n }, (_, i) => buf.readDoubleLE(at + 8 * i)));
  const f32 = (at: number) => (LITTLE_ENDIAN ? new Float32Array(bytes(at, n * 4)) : Float32Array.from({ length: n }, (_, i) => buf.readFloatLE(at + 4 * i)));
  let off = 8;
  const lonDeg = f64(off);
  off += n * 8;
  const latDeg = f64(off);
  off += n * 8;
  const out = { lonDeg, latDeg } as SampleFields;
  for (const key of FACTOR_KEYS) {
    out[key] = f32(off);
    off += n * 4;
  }
  return out;
}

/** Summary numbers of a candidate's sample fields, used to fix heatmap colour domains. */
export interface FieldStats {
  definedCount: number;
  /** max |ln s| over the samples. */
  lnArealScaleAbsMax: number;
  omegaMaxDeg: number;
  /** The best uniform rescale c: ln c = −½ mean(ln a + ln b) (Airy 1861 / Kavrayskiy's criterion). */
  bestScale: number;
  /** max over samples of max(|ln ca|, |ln cb|), as a percentage e^x − 1. */
  scaleErrorMaxPct: number;
}

export function fieldStats(f: SampleFields, bestScale?: number): FieldStats {
  let n = 0, sumLnAb = 0, lnS = 0, om = 0;
  for (let i = 0; i < f.s.length; i++) {
    const s = f.s[i];
    if (!(s > 0)) continue;
    n++;
    sumLnAb += Math.log(f.a[i]) + Math.log(f.b[i]);
    lnS = Math.max(lnS, Math.abs(Math.log(s)));
    om = Math.max(om, f.omegaDeg[i]);
  }
  const c = bestScale ?? (n ? Math.exp(-sumLnAb / (2 * n)) : 1);
  const lnC = Math.log(c);
  let err = 0;
  for (let i = 0; i < f.s.length; i++) {
    if (!(f.s[i] > 0)) continue;
    err = Math.max(err, Math.abs(lnC + Math.log(f.a[i])), Math.abs(lnC + Math.log(f.b[i])));
  }
  return { definedCount: n, lnArealScaleAbsMax: lnS, omegaMaxDeg: om, bestScale: c, scaleErrorMaxPct: (Math.exp(err) - 1) * 100 };
}

import { describe, expect, it } from 'vitest';
import { decodeFields, encodeFields, fieldStats } from './fields-codec.js';

const fields = () => ({
  lonDeg: Float64Array.from([-71.123456789, 10.5, 0]),
  latDeg: Float64Array.from([-33.4, 45.000000001, 60]),
  h: Float32Array.from([1, 1.01, NaN]),
  k: Float32Array.from([1, 0.99, NaN]),
  s: Float32Array.from([1, 0.9999, NaN]),
  omegaDeg: Float32Array.from([0, 1.1, NaN]),
  a: Float32Array.from([1, 1.01, NaN]),
  b: Float32Array.from([1, 0.99, NaN]),
});

describe('sample fields blob', () => {
  it('round-trips positions exactly and factors as float32, NaN included', () => {
    const back = decodeFields(encodeFields(fields()));
    expect(Array.from(back.lonDeg)).toEqual([-71.123456789, 10.5, 0]);
    expect(Array.from(back.latDeg)).toEqual([-33.4, 45.000000001, 60]);
    expect(back.omegaDeg[1]).toBe(Math.fround(1.1));
    expect(Number.isNaN(back.s[2])).toBe(true);
  });

  it('refuses a blob that is not one or is cut short', () => {
    expect(() => decodeFields(Buffer.from('nope'))).toThrow(/not in a known format/);
    expect(() => decodeFields(encodeFields(fields()).subarray(0, 40))).toThrow(/truncated/);
  });

  it('summarises the defined samples, with the closed-form best uniform scale', () => {
    const st = fieldStats(fields());
    expect(st.definedCount).toBe(2);
    // ln c = −½ mean(ln a + ln b) over the two defined samples.
    const lnAb = [0, Math.log(Math.fround(1.01)) + Math.log(Math.fround(0.99))];
    expect(st.bestScale).toBeCloseTo(Math.exp(-(lnAb[0] + lnAb[1]) / 4), 12);
    expect(st.omegaMaxDeg).toBeCloseTo(1.1, 6);
  });
});

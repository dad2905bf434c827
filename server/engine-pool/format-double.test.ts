/** 17-significant-digit output round-trips every double (IEEE 754-2008 §5.12.2). */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatDouble } from './format-double';

describe('formatDouble', () => {
  it('round-trips any double', () => {
    fc.assert(fc.property(fc.double({ noNaN: true }), (x) => Object.is(Number(formatDouble(x)), x)), { numRuns: 20_000 });
  });
  it('round-trips doubles in the factors\' usual range', () => {
    fc.assert(fc.property(fc.double({ min: 1e-6, max: 1e7, noNaN: true }), (x) => Number(formatDouble(x)) === x), { numRuns: 50_000 });
  });
  it('writes plain decimals, trimmed, and nan', () => {
    expect(formatDouble(2)).toBe('2');
    expect(formatDouble(0.5)).toBe('0.5');
    expect(formatDouble(-1.25)).toBe('-1.25');
    expect(formatDouble(0.1)).toBe('0.10000000000000001');
    expect(formatDouble(1e-7)).toBe('9.9999999999999995e-8');
    expect(formatDouble(NaN)).toBe('nan');
    expect(formatDouble(0)).toBe('0');
  });
});

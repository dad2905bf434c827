import { describe, expect, it } from 'vitest';
import type { MetricColumn } from '../api/audit-metrics.js';
import { metricShown, metricText } from './metric-display.js';

const col = (extra: Record<string, unknown>) =>
  ({ key: 'a.b', label: 'L', units: '%', better: 'lower', explanation: '', digits: 4, ...extra }) as unknown as MetricColumn;

describe('metric display', () => {
  it('shows a logarithmic error as a percentage error, 100·(e^x − 1)', () => {
    // ln(1.02) is a 2 % error by definition of the natural logarithm.
    expect(metricShown(col({ display: 'ln-as-pct' }), { a: { b: Math.log(1.02) } })).toBeCloseTo(2, 12);
  });

  it('shows a share as a percentage, and plain values as stored', () => {
    expect(metricShown(col({ display: 'share' }), { a: { b: 0.25 } })).toBe(25);
    expect(metricShown(col({ share: true }), { a: { b: 0.5 } })).toBe(50);
    expect(metricShown(col({ display: 'plain' }), { a: { b: 1.2345678 } })).toBe(1.2345678);
  });

  it('prints "–" for a missing or non-finite metric and keeps units', () => {
    expect(metricText(col({ display: 'plain' }), { a: {} })).toBe('–');
    expect(metricText(col({ display: 'plain' }), { a: { b: null } })).toBe('–');
    expect(metricText(col({ display: 'plain' }), { a: { b: 1.234567 } })).toBe('1.235 %');
    expect(metricText(col({ display: 'plain' }), { a: { b: 1.234567 } }, false)).toBe('1.235');
  });
});

describe('metric display near zero', () => {
  it('prints floating-point noise below 1e-9 as 0 and small real values in exponent form', () => {
    expect(metricText(col({ display: 'plain' }), { a: { b: 7.44e-15 } }, false)).toBe('0');
    expect(metricText(col({ display: 'plain' }), { a: { b: 0.00012345 } }, false)).toBe('1.23e-4');
  });
});

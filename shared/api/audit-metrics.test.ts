import { describe, expect, it } from 'vitest';
import { displayValue, columnFor, rankForPurpose } from './audit-metrics.js';

const card = (candidateId: number, ratio: number, ak: number, omega = 0) => ({
  candidateId,
  metrics: { arealScale: { ratio }, airyKavrayskiy: ak, angularDeformationDeg: { mean: omega } },
});

describe('rankForPurpose', () => {
  it('ranks by the purpose’s metric, best first', () => {
    const cards = [card(1, 1.2, 0.01, 3), card(2, 1.05, 0.02, 1), card(3, 1.5, 0.005, 0)];
    expect(rankForPurpose('equal-area', cards).order).toEqual([2, 1, 3]);
    expect(rankForPurpose('conformal', cards).order).toEqual([3, 2, 1]);
    expect(rankForPurpose('reference', cards).order).toEqual([3, 1, 2]);
  });

  it('breaks ties within rounding by the overall distortion', () => {
    // Two equal-area maps: both spreads are 1 up to rounding noise.
    const cards = [card(1, 1 + 3e-12, 0.0005), card(2, 1 + 1e-12, 0.0002)];
    expect(rankForPurpose('equal-area', cards).order).toEqual([2, 1]);
  });

  it('puts candidates without a value last', () => {
    const cards = [{ candidateId: 9, metrics: {} }, card(1, 1.1, 0.01)];
    expect(rankForPurpose('equal-area', cards).order).toEqual([1, 9]);
  });
});

describe('displayValue', () => {
  it('shows logarithmic errors as percentages and shares as per cent of the region', () => {
    expect(displayValue(columnFor('scaleError.mean'), { scaleError: { mean: Math.log(1.02) } })).toBeCloseTo(2, 12);
    expect(displayValue(columnFor('withinTolerance.angular1Deg'), { withinTolerance: { angular1Deg: 0.25 } })).toBe(25);
    expect(displayValue(columnFor('airyKavrayskiy'), { airyKavrayskiy: null })).toBeNull();
  });
});

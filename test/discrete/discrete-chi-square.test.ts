import erfc from '@stdlib/math-base-special-erfc';
import { describe, expect, it } from 'vitest';
import { InvalidTargetError } from '../../src/index.js';
import { discreteChiSquareCheck } from '../../src/checks/discrete-chi-square.js';

// binomial(3, 1/2) pmf: 1/8, 3/8, 3/8, 1/8 (hand computed)
const b3 = (k: number): number => [0.125, 0.375, 0.375, 0.125][k] ?? 0;
const rep = (counts: number[]): number[] => counts.flatMap((c, k) => new Array<number>(c).fill(k));

describe('discreteChiSquareCheck', () => {
  it('discreteChiSquareCheck gives X² = 0 and df = 3 when counts equal expectations (no pooling needed)', () => {
    const r = discreteChiSquareCheck(rep([5, 15, 15, 5]), b3, [0, 3]);
    expect(r.statistic).toBe(0);
    expect(r.df).toBe(3);
    expect(r.cells).toBe(4);
  });

  it('discreteChiSquareCheck pools cells to expected counts >= 5 and matches a hand-computed X² and p-value', () => {
    // n = 16: expected 2, 6, 6, 2. Pooled upward: {0, 1} (8), then {2} (6), then {3} (2 < 5) merges into
    // the last cell: {2, 3} (8). Counts 0, 4, 8, 4 -> cells 4 and 12 vs 8 and 8: X² = 16/8 + 16/8 = 4, df = 1.
    const r = discreteChiSquareCheck(rep([0, 4, 8, 4]), b3, [0, 3]);
    expect(r.cells).toBe(2);
    expect(r.df).toBe(1);
    expect(r.statistic).toBeCloseTo(4, 12);
    // chi-square(1) upper tail: erfc(sqrt(x / 2)) (Abramowitz & Stegun 26.4.4 with 2(1 − Φ(√x)) = erfc(√(x/2))), @stdlib erfc
    expect(r.pValue).toBeCloseTo(erfc(Math.sqrt(2)), 12);
  });

  it('discreteChiSquareCheck pools an infinite tail: geometric(1/2) on [0, ∞) with n = 40', () => {
    // pmf 2^-(k+1); n = 40: expected 20, 10, 5, 2.5, 1.25, ... -> cells {0}, {1}, {2}, {3, 4, ...} (5, the whole tail).
    const pmf = (k: number): number => 2 ** -(k + 1);
    const r = discreteChiSquareCheck(rep([20, 10, 5, 3, 2]), pmf, [0, Infinity]);
    expect(r.cells).toBe(4);
    // counts 20, 10, 5, 5 vs expected 20, 10, 5, 5 (tail mass 1/8 · 40): X² = 0 up to the summation's rounding
    expect(r.statistic).toBeLessThan(1e-12);
  });

  it('discreteChiSquareCheck gives p = 0 for a draw outside the support or not an integer', () => {
    expect(discreteChiSquareCheck([...rep([5, 15, 15, 5]), 4], b3, [0, 3]).pValue).toBe(0);
    expect(discreteChiSquareCheck([...rep([5, 15, 15, 5]), 1.5], b3, [0, 3]).outside).toBe(1);
    // every draw outside: p = 0 (was a misleading 'more draws are needed'); a single valid draw still asks for more
    const allOut = discreteChiSquareCheck([7, 8, 9.5, -1], b3, [0, 3]);
    expect([allOut.pValue, allOut.outside]).toEqual([0, 4]);
  });

  it('discreteChiSquareCheck throws typed errors for a pmf that is not normalized, a bad support, empty draws', () => {
    expect(() => discreteChiSquareCheck([0, 1], (k) => 0.4 * b3(k), [0, 3])).toThrow(/sums to 0.4/);
    expect(() => discreteChiSquareCheck([0, 1], b3, [0.5, 3])).toThrow(InvalidTargetError);
    expect(() => discreteChiSquareCheck([], b3, [0, 3])).toThrow(InvalidTargetError);
    expect(() => discreteChiSquareCheck([0, 1], () => NaN, [0, 3])).toThrow(/is not a probability/);
    expect(() => discreteChiSquareCheck([0], b3, [0, 3])).toThrow(/more draws are needed/);
  });
});

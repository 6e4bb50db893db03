import erfc from '@stdlib/math-base-special-erfc';
import chi2gof from '@stdlib/stats-chi2gof';
import { describe, expect, it } from 'vitest';
import { InvalidTargetError, chiSquareCheck, mersenneTwister } from '../../src/index.js';
import { upperRegularizedGamma } from '../../src/targets/_internals/gamma-series.js';
import { ALPHA } from '../helpers/statistical.js';

describe('chiSquareCheck', () => {
  it('chiSquareCheck matches a hand-computed X² and the closed-form tail for df = 2', () => {
    // counts (10, 20, 30), probabilities (0.2, 0.3, 0.5): n = 60, expected (12, 18, 30)
    // X² = 4/12 + 4/18 + 0 = 5/9. For df = 2 the chi-square upper tail is exp(−x/2).
    const r = chiSquareCheck([10, 20, 30], [0.2, 0.3, 0.5]);
    expect(r.statistic).toBeCloseTo(5 / 9, 12);
    expect(r.df).toBe(2);
    expect(r.pValue).toBeCloseTo(Math.exp(-5 / 18), 10);
  });

  it('chiSquareCheck p-value equals the chi-square upper tail Q(df/2, X²/2) for df = 5', () => {
    // counts (30, 18, 25, 12, 7, 8), probabilities (0.25, 0.2, 0.2, 0.15, 0.1, 0.1), n = 100
    // expected (25, 20, 20, 15, 10, 10):
    // X² = 25/25 + 4/20 + 25/20 + 9/15 + 9/10 + 4/10 = 1 + 0.2 + 1.25 + 0.6 + 0.9 + 0.4 = 4.35
    const r = chiSquareCheck([30, 18, 25, 12, 7, 8], [0.25, 0.2, 0.2, 0.15, 0.1, 0.1]);
    expect(r.statistic).toBeCloseTo(4.35, 12);
    expect(r.df).toBe(5);
    // Reference: the chi-square survival function is Q(df/2, x/2) (A&S 26.4.19),
    // computed by exactdraw's incomplete-gamma series, itself tested against
    // closed forms in test/targets/gamma-series.test.ts.
    expect(r.pValue).toBeCloseTo(upperRegularizedGamma(2.5, 4.35 / 2), 10);
    // and against the closed form for odd df = 5 (Abramowitz & Stegun 26.4.4):
    // Q = 2(1 − Φ(√x)) + √(2x/π) e^(−x/2) (1 + x/3), with 2(1 − Φ(√x)) = erfc(√(x/2))
    // from @stdlib/math-base-special-erfc.
    const x = 4.35;
    const closed = erfc(Math.sqrt(x / 2)) + Math.sqrt((2 * x) / Math.PI) * Math.exp(-x / 2) * (1 + x / 3);
    expect(r.pValue).toBeCloseTo(closed, 10);
  });

  it('chiSquareCheck accepts fair die counts and (twin) rejects a biased die at ALPHA, n = 60000', () => {
    const u = mersenneTwister(8301);
    const n = 60_000;
    const fair = new Array<number>(6).fill(0);
    const biased = new Array<number>(6).fill(0);
    for (let i = 0; i < n; i++) fair[Math.floor(u() * 6)]++;
    // biased die: face 0 gets 1/6 + 0.01
    for (let i = 0; i < n; i++) {
      const v = u();
      biased[v < 1 / 6 + 0.01 ? 0 : 1 + Math.floor(((v - 1 / 6 - 0.01) / (5 / 6 - 0.01)) * 5)]++;
    }
    const p = new Array<number>(6).fill(1 / 6);
    expect(chiSquareCheck(fair, p).pValue).toBeGreaterThan(ALPHA);
    expect(chiSquareCheck(biased, p).pValue).toBeLessThan(ALPHA);
  });

  it('chiSquareCheck agrees with @stdlib/stats-chi2gof (statistic, df, p-value) on 200 random tables', () => {
    // Reference: @stdlib/stats-chi2gof (Pearson statistic and chi-square upper tail).
    const u = mersenneTwister(4401);
    for (let t = 0; t < 200; t++) {
      const k = 2 + Math.floor(u() * 30);
      const w = Array.from({ length: k }, () => 0.05 + u());
      const tot = w.reduce((a, b) => a + b, 0);
      const p = w.map((v) => v / tot);
      const n = 20 + Math.floor(u() * 5000);
      const skew = u() < 0.5 ? 0 : 0.3 * u();
      const counts = new Array<number>(k).fill(0);
      for (let i = 0; i < n; i++) {
        let v = u() ** (1 + skew);
        let j = 0;
        while (j < k - 1 && v >= p[j]) v -= p[j++];
        counts[j]++;
      }
      const ours = chiSquareCheck(counts, p);
      const ref = chi2gof(Float64Array.from(counts), Float64Array.from(p)) as { statistic: number; pValue: number; df: number };
      expect(ours.statistic).toBeCloseTo(ref.statistic, 9);
      expect(ours.df).toBe(ref.df);
      expect(Math.abs(ours.pValue - ref.pValue)).toBeLessThanOrEqual(1e-12 + 1e-9 * ref.pValue);
    }
  });

  it('chiSquareCheck: a zero-probability bin is ignored when empty and gives X² = Infinity, p = 0 when not', () => {
    const a = chiSquareCheck([10, 20, 0, 30], [0.2, 0.3, 0, 0.5]);
    expect(a.statistic).toBeCloseTo(5 / 9, 12); // the df = 2 example above
    expect(a.df).toBe(2);
    const b = chiSquareCheck([10, 20, 1, 30], [0.2, 0.3, 0, 0.5]);
    expect(b.statistic).toBe(Infinity);
    expect(b.pValue).toBe(0);
    expect(() => chiSquareCheck([0, 0], [0.5, 0.5])).toThrow(/chiSquareCheck: counts sum to 0/);
    expect(() => chiSquareCheck([3, 0], [1, 0])).toThrow(/at least two bins must have positive probability/);
  });

  it('chiSquareCheck rejects bad inputs with InvalidTargetError', () => {
    expect(() => chiSquareCheck([1, 2], [0.5, 0.3, 0.2])).toThrow(InvalidTargetError);
    expect(() => chiSquareCheck([1], [1])).toThrow(InvalidTargetError);
    expect(() => chiSquareCheck([1, 2], [0.5, 0.6])).toThrow(/chiSquareCheck: probabilities sum to 1.1/);
    expect(() => chiSquareCheck([1, -2], [0.5, 0.5])).toThrow(/chiSquareCheck: counts\[1\] = -2/);
    expect(() => chiSquareCheck([1, 2.5], [0.5, 0.5])).toThrow(InvalidTargetError);
    expect(() => chiSquareCheck([1, 2], [1.5, -0.5])).toThrow(/chiSquareCheck: probabilities\[0\] = 1.5/);
    expect(() => chiSquareCheck(null as unknown as number[], [1])).toThrow(InvalidTargetError);
  });
});

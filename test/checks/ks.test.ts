import { describe, expect, it } from 'vitest';
import { InvalidTargetError, ksCheck, mersenneTwister } from '../../src/index.js';
import { ALPHA, expectRate } from '../helpers/statistical.js';

const uniformCdf = (x: number): number => (x <= 0 ? 0 : x >= 1 ? 1 : x);

/** Binomial coefficient C(n, k) for small n. */
function choose(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n - k + i)) / i;
  return c;
}

/**
 * Exact P(D_n ≥ d) for d ≥ 1/2, written independently of the code under test:
 * for d ≥ 1/2 the events D⁺ ≥ d and D⁻ ≥ d are disjoint and equally likely, so
 * P(D_n ≥ d) = 2 P(D⁺_n ≥ d), with the Smirnov / Birnbaum & Tingey (1951) formula
 * P(D⁺_n ≥ d) = d Σ_{j=0}^{⌊n(1−d)⌋} C(n, j) (1 − d − j/n)^(n−j) (d + j/n)^(j−1)
 * (from memory; it gives 2(1 − d) for n = 1, the direct result).
 */
function ksTailAboveHalf(n: number, d: number): number {
  let s = 0;
  for (let j = 0; j <= Math.floor(n * (1 - d)); j++) {
    s += choose(n, j) * Math.pow(1 - d - j / n, n - j) * Math.pow(d + j / n, j - 1);
  }
  return 2 * d * s;
}

describe('ksCheck', () => {
  it('ksCheck matches a hand-computed small case: x = (0.1, 0.4, 0.7) against U(0, 1)', () => {
    // D = max_i max(i/n − F(x_i), F(x_i) − (i−1)/n), n = 3:
    // i=1: 1/3 − 0.1 = 0.2333, 0.1 − 0 = 0.1
    // i=2: 2/3 − 0.4 = 0.2667, 0.4 − 1/3 = 0.0667
    // i=3: 1 − 0.7 = 0.3,      0.7 − 2/3 = 0.0333   → D = 0.3
    // For 1/(2n) ≤ d ≤ 1/n, P(D_n < d) = n! (2d − 1/n)^n (Ruben & Gambino 1982,
    // quoted in Marsaglia, Tsang & Wang 2003; from memory), so
    // p = 1 − 6 (0.6 − 1/3)^3 = 0.886222...
    const r = ksCheck([0.7, 0.1, 0.4], uniformCdf);
    expect(r.statistic).toBeCloseTo(0.3, 12);
    expect(r.pValue).toBeCloseTo(1 - 6 * Math.pow(0.6 - 1 / 3, 3), 9);
  });

  it('ksCheck matches the exact tail for D ≥ 1/2: x = (0.6, 0.7, 0.8) gives D = 0.6, p = 0.144', () => {
    // i=1: F(x1) − 0 = 0.6 is the largest gap; the others are 0.367, 0.2, ... → D = 0.6.
    // P(D_3 ≥ 0.6) = 2 · 0.6 · [0.4³/0.6 + 3 · (0.4 − 1/3)²] = 0.144 (formula above).
    const r = ksCheck([0.8, 0.6, 0.7], uniformCdf);
    expect(r.statistic).toBeCloseTo(0.6, 12);
    expect(ksTailAboveHalf(3, 0.6)).toBeCloseTo(0.144, 12);
    expect(r.pValue).toBeCloseTo(0.144, 9);
    const r5 = ksCheck([0.05, 0.1, 0.15, 0.2, 0.25], uniformCdf); // D = 1 − 0.25 = 0.75
    expect(r5.statistic).toBeCloseTo(0.75, 12);
    expect(r5.pValue).toBeCloseTo(ksTailAboveHalf(5, 0.75), 9);
  });

  it('ksCheck rejects at 0.05 about 5% of null samples (n = 50, 2000 replicates)', () => {
    const u = mersenneTwister(8201);
    const n = 50;
    const reps = 2000;
    const x = new Float64Array(n);
    let rejected = 0;
    for (let r = 0; r < reps; r++) {
      for (let i = 0; i < n; i++) x[i] = u();
      if (ksCheck(x, uniformCdf).pValue < 0.05) rejected++;
    }
    expectRate(rejected, reps, 0.05, 'KS null rejection rate');
  });

  it('ksCheck accepts a uniform sample and (twin) rejects a slightly biased one at ALPHA, n = 20000', () => {
    const u = mersenneTwister(8202);
    const n = 20_000;
    const good = new Float64Array(n);
    const bad = new Float64Array(n);
    for (let i = 0; i < n; i++) good[i] = u();
    for (let i = 0; i < n; i++) bad[i] = Math.pow(u(), 1.1);
    expect(ksCheck(good, uniformCdf).pValue).toBeGreaterThan(ALPHA);
    expect(ksCheck(bad, uniformCdf).pValue).toBeLessThan(ALPHA);
  });

  it('ksCheck rejects bad inputs with InvalidTargetError', () => {
    expect(() => ksCheck([0.5], uniformCdf)).toThrow(InvalidTargetError);
    expect(() => ksCheck([], uniformCdf)).toThrow(/ksCheck: draws must hold at least 2 values, got 0/);
    expect(() => ksCheck([0.1, NaN], uniformCdf)).toThrow(/ksCheck: draws\[1\] is NaN/);
    expect(() => ksCheck('ab' as unknown as number[], uniformCdf)).toThrow(InvalidTargetError);
    expect(() => ksCheck([0.1, 0.2], undefined as unknown as (x: number) => number)).toThrow(/ksCheck: cdf must be a function/);
  });
});

import erfc from '@stdlib/math-base-special-erfc';
import gammaln from '@stdlib/math-base-special-gammaln';
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { describe, expect, it } from 'vitest';
import { lowerRegularizedGamma as P, upperRegularizedGamma as Q } from '../../src/targets/_internals/gamma-series.js';

/** Relative difference, guarded at 0. */
function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

/**
 * Q(n, x) for integer n by the Poisson sum e^(−x) Σ_{k<n} x^k / k!
 * (Abramowitz & Stegun 6.5.13), each term in log space.
 */
function poissonQ(n: number, x: number): number {
  let s = 0;
  for (let k = 0; k < n; k++) s += Math.exp(k * Math.log(x) - x - gammaln(k + 1));
  return s;
}

describe('gamma-series: regularized incomplete gamma', () => {
  it('P(1e4, 1e4) ≈ 0.50133 (value of the independent series, test/reference/README.md)', () => {
    expect(P(1e4, 1e4)).toBeCloseTo(0.50133, 5);
  });

  it('P(a, a) follows the asymptotic 1/2 + 1/(3√(2πa)) for large a', () => {
    // Temme's uniform expansion at x = a: P(a, a) = 1/2 + 1/(3√(2πa)) + O(a^(-3/2))
    // (from memory; the O term is below 1e-6 here).
    for (const a of [1e4, 1e5, 1e6]) {
      expect(Math.abs(P(a, a) - (0.5 + 1 / (3 * Math.sqrt(2 * Math.PI * a)))), `a = ${a}`).toBeLessThan(2e-6);
    }
  });

  it('P(a, x) agrees with the Wilson–Hilferty approximation at a = 1e4 (second opinion)', () => {
    // Wilson & Hilferty (1931): P(a, x) ≈ Φ(((x/a)^(1/3) − 1 + 1/(9a)) · 3√a), error O(1/a).
    const a = 1e4;
    for (const k of [-4, -2, -1, 0, 1, 2, 4]) {
      const x = a + k * Math.sqrt(a);
      const wh = normalCdf((Math.cbrt(x / a) - 1 + 1 / (9 * a)) * 3 * Math.sqrt(a), 0, 1);
      expect(Math.abs(P(a, x) - wh), `x = ${x}`).toBeLessThan(2e-5);
    }
  });

  it('P and Q match the closed form for a = 1: P(1, x) = 1 − e^(−x)', () => {
    for (const x of [1e-8, 0.01, 0.5, 1.9, 2.1, 10, 50, 700]) {
      expect(rel(P(1, x), -Math.expm1(-x)), `P x = ${x}`).toBeLessThan(1e-14);
      expect(rel(Q(1, x), Math.exp(-x)), `Q x = ${x}`).toBeLessThan(1e-13);
    }
  });

  it('P and Q match the closed form for a = 1/2: P(1/2, x) = erf(√x), Q = erfc(√x) (@stdlib erfc)', () => {
    for (const x of [1e-6, 0.1, 1, 1.4, 1.6, 5, 30, 300]) {
      expect(rel(Q(0.5, x), erfc(Math.sqrt(x))), `Q x = ${x}`).toBeLessThan(1e-12);
      expect(Math.abs(P(0.5, x) - (1 - erfc(Math.sqrt(x)))), `P x = ${x}`).toBeLessThan(1e-14);
    }
  });

  it('Q(n, x) matches the Poisson sum for integer n on both sides of x = n + 1 (series and continued fraction)', () => {
    for (const n of [2, 5, 30, 200]) {
      for (const f of [0.3, 0.8, 1, 1.2, 2, 4]) {
        const x = f * n;
        const ref = poissonQ(n, x);
        if (ref > 1e-3) expect(rel(Q(n, x), ref), `Q(${n}, ${x})`).toBeLessThan(1e-11);
        else expect(rel(Q(n, x), ref), `far tail Q(${n}, ${x})`).toBeLessThan(1e-10);
        expect(Math.abs(P(n, x) + Q(n, x) - 1)).toBeLessThan(1e-14);
      }
    }
  });

  it('P(a, x) matches @stdlib gamma cdf where @stdlib is accurate (shape 2.5, 10, 100; test/reference/README.md)', () => {
    for (const a of [2.5, 10, 100]) {
      const sd = Math.sqrt(a);
      for (let k = -4; k <= 4; k += 0.5) {
        const x = a + k * sd;
        if (x <= 0) continue;
        // test/reference/README.md: @stdlib is within 1.1e-13 at these shapes, mean ± 4 sd
        expect(Math.abs(P(a, x) - gammaCdf(x, a, 1)), `a = ${a}, x = ${x}`).toBeLessThan(5e-13);
      }
    }
  });

  it('P and Q handle the ends and bad inputs', () => {
    expect(P(3, 0)).toBe(0);
    expect(Q(3, 0)).toBe(1);
    expect(P(3, -1)).toBe(0);
    expect(P(3, Infinity)).toBe(1);
    expect(Q(3, Infinity)).toBe(0);
    expect(P(0, 1)).toBeNaN();
    expect(P(-1, 1)).toBeNaN();
    expect(P(1, NaN)).toBeNaN();
    expect(Q(NaN, 1)).toBeNaN();
  });

  it('Q(a, x) stays accurate in the far upper tail (x = 3a, a = 500) where 1 − P has no digits', () => {
    // Reference: Poisson sum for integer a = 500 at x = 1500 (about 1e-195)
    const ref = poissonQ(500, 1500);
    expect(ref).toBeGreaterThan(0);
    expect(ref).toBeLessThan(1e-100); // so 1 − P(500, 1500) would round to exactly 0
    expect(rel(Q(500, 1500), ref)).toBeLessThan(1e-9);
  });
});

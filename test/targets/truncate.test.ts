import erfc from '@stdlib/math-base-special-erfc';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InvalidTargetError, betaTarget, gammaTarget, mersenneTwister, normalTarget, truncate } from '../../src/index.js';
import type { Sampler, Target, Uniform } from '../../src/index.js';
import { generatorSampler, methodSuites } from '../helpers/method-suite.js';
import { simpson } from './quadrature.js';

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

/**
 * Exact draws from the standard normal tail beyond a > 0 by Marsaglia's (1964)
 * exponential-rejection tail method (Devroye 1986, IX.1.2), written
 * independently of the library: E1 = −log(1−u)/a, E2 = −log(1−v), accept a + E1
 * when 2·E2 > E1².
 */
function normalTailDraws(a: number, n: number, u: Uniform): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; ; k++) {
      if (k > 1000) throw new Error('tail sampler stalled');
      const e1 = -Math.log(1 - u()) / a;
      const e2 = -Math.log(1 - u());
      if (2 * e2 > e1 * e1) {
        out[i] = a + e1;
        break;
      }
    }
  }
  return out;
}

// truncate(normal(0, 1), 8, Infinity).cdf fits exact tail draws (KS + AD, seed 3101) and rejects draws
// shifted by 0.01 (seed 3102), through the shared method suite
const tail8 = truncate(normalTarget(0, 1), 8, Infinity);
const tailDraws = (seed: number, shift: number): Sampler => {
  const u = mersenneTwister(seed);
  return generatorSampler((out) => {
    const xs = normalTailDraws(8, out.length, u);
    for (let i = 0; i < out.length; i++) out[i] = xs[i] + shift;
  });
};
methodSuites('truncate: the cdf against exact tail draws', [
  {
    name: 'truncate(normal(0, 1), 8, Infinity).cdf against exact tail draws; twin: draws shifted by 0.01',
    make: (seed) => tailDraws(seed, 0),
    biased: (seed) => tailDraws(seed, 0.01),
    cdf: (x) => (tail8.cdf as (x: number) => number)(x),
    n: 20_000,
    seed: 3101,
    twinSeed: 3102,
    stream: false,
  },
]);

describe('truncate', () => {
  it('truncate(normal(0, 1), 8, Infinity): sf matches erfc(x/√2)/erfc(8/√2) (@stdlib erfc) to 1e-12 relative, cdf to 1e-14 absolute', () => {
    const t = truncate(normalTarget(0, 1), 8, Infinity);
    expect(t.support).toEqual([8, Infinity]);
    const e8 = erfc(8 / Math.SQRT2);
    for (const x of [8 + 1e-9, 8 + 1e-4, 8.01, 8.3, 9, 10, 12, 20]) {
      const sfRef = erfc(x / Math.SQRT2) / e8;
      const cdfRef = 1 - sfRef;
      expect(relErr(t.sf!(x), sfRef), `sf x = ${x}`).toBeLessThan(1e-12);
      // the cdf is 1 − sf: absolute accuracy ~1e-16 (relative accuracy near x = 8 is
      // limited by that subtraction in the reference as much as in the code)
      expect(Math.abs(t.cdf!(x) - cdfRef), `cdf x = ${x}`).toBeLessThan(1e-14);
    }
    expect(t.cdf!(8)).toBe(0);
    expect(t.cdf!(Infinity)).toBe(1);
  });

  it('twin: the naive form (F(x) − F(8)) / (1 − F(8)) is far off, so the accuracy test above can fail', () => {
    const F = normalTarget(0, 1).cdf;
    const naive = (x: number): number => (F(x) - F(8)) / (1 - F(8));
    const ref = 1 - erfc(8.01 / Math.SQRT2) / erfc(8 / Math.SQRT2);
    expect(relErr(naive(8.01), ref)).toBeGreaterThan(1e-3);
  });

  it('truncate(normal(0, 1), -Infinity, -8): cdf matches erfc(−x/√2)/erfc(8/√2)', () => {
    const t = truncate(normalTarget(0, 1), -Infinity, -8);
    const e8 = erfc(8 / Math.SQRT2);
    for (const x of [-20, -10, -9, -8.5, -8.01]) {
      expect(relErr(t.cdf!(x), erfc(-x / Math.SQRT2) / e8), `x = ${x}`).toBeLessThan(1e-12);
    }
    expect(t.cdf!(-8)).toBe(1);
  });

  it('truncate(gamma(2, 1), 50, Infinity): cdf matches the closed form 1 − e^(−(x−50))(1+x)/51', () => {
    // Q(2, x) = e^(−x)(1 + x) (Abramowitz & Stegun 6.5.13)
    const t = truncate(gammaTarget(2, 1), 50, Infinity);
    for (const x of [50.001, 50.5, 52, 60, 100]) {
      const sfRef = (Math.exp(-(x - 50)) * (1 + x)) / 51;
      expect(relErr(t.sf!(x), sfRef), `sf x = ${x}`).toBeLessThan(1e-12);
      expect(relErr(t.cdf!(x), 1 - sfRef), `cdf x = ${x}`).toBeLessThan(1e-11);
    }
  });

  it('truncate(beta(2, 1), 1 − 1e-6, 1): cdf matches the closed form ((1−L²) − (1−x²))/(1−L²)', () => {
    const L = 1 - 1e-6;
    const t = truncate(betaTarget(2, 1), L, 2);
    expect(t.support).toEqual([L, 1]);
    const S = (x: number): number => (1 - x) * (1 + x); // 1 − x² without cancellation
    for (const x of [L + 1e-9, L + 3e-7, 1 - 1e-8]) {
      expect(relErr(t.cdf!(x), (S(L) - S(x)) / S(L)), `x = ${x}`).toBeLessThan(1e-8);
    }
  });

  it('truncate(normal(0, 1), -1, 2): cdf matches the integral of the renormalised density', () => {
    const t = truncate(normalTarget(0, 1), -1, 2);
    const f = (x: number): number => Math.exp(t.logDensity(x));
    const mass = simpson(f, -1, 2, 4000);
    for (const x of [-0.9, 0, 0.5, 1.9]) {
      expect(Math.abs(t.cdf!(x) - simpson(f, -1, x, 4000) / mass), `x = ${x}`).toBeLessThan(1e-10);
    }
  });

  it('truncate keeps logDensity inside and gives −Infinity outside; cdf is 0 at lower, 1 at upper and nondecreasing (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: 1e-3, max: 10, noNaN: true }),
        (mean, sd, lowZ, widthZ) => {
          const base = normalTarget(mean, sd);
          const lo = mean + lowZ * sd;
          const hi = lo + widthZ * sd;
          const t = truncate(base, lo, hi);
          expect(t.cdf!(lo)).toBe(0);
          expect(t.cdf!(hi)).toBe(1);
          expect(t.logDensity(lo - sd)).toBe(-Infinity);
          expect(t.logDensity(hi + sd)).toBe(-Infinity);
          const mid = (lo + hi) / 2;
          expect(t.logDensity(mid)).toBe(base.logDensity(mid));
          let prev = 0;
          for (let i = 1; i <= 20; i++) {
            const c = t.cdf!(lo + ((hi - lo) * i) / 20);
            expect(c >= prev - 1e-15 && c <= 1).toBe(true);
            prev = c;
          }
        },
      ),
      { seed: 20265, numRuns: 200 },
    );
  });

  it('truncate clamps the mode hint into the new support', () => {
    expect(truncate(normalTarget(0, 1), 2, 5).mode).toBe(2);
    expect(truncate(normalTarget(0, 1), -1, 1).mode).toBe(0);
    expect(truncate(normalTarget(0, 1), -7, -3).mode).toBe(-3);
    expect(truncate(gammaTarget(3, 1), 0, 1).mode).toBe(1); // gamma(3) mode is 2
    expect(truncate({ logDensity: (x: number) => -x * x }, 0, 1).mode).toBeUndefined();
  });

  it('truncate intersects with the target support and passes dLogDensity through', () => {
    const t = truncate(betaTarget(2, 3), 0.5, 3);
    expect(t.support).toEqual([0.5, 1]);
    expect(t.dLogDensity!(0.7)).toBe(betaTarget(2, 3).dLogDensity(0.7));
    expect(t.dLogDensity!(0.2)).toBeNaN();
    const tt = truncate(truncate(normalTarget(0, 1), -2, 2), 0, 5);
    expect(tt.support).toEqual([0, 2]);
    expect(tt.cdf!(1)).toBeCloseTo((normalTarget(0, 1).cdf(1) - 0.5) / (normalTarget(0, 1).cdf(2) - 0.5), 12);
  });

  it('truncate of a target without cdf has no cdf, no sf and no dLogDensity', () => {
    const t = truncate({ logDensity: (x: number) => -Math.abs(x) }, -1, 1);
    expect(t.cdf).toBeUndefined();
    expect(t.sf).toBeUndefined();
    expect(t.dLogDensity).toBeUndefined();
    expect(t.logDensity(0.5)).toBe(-0.5);
    expect(t.logDensity(1.5)).toBe(-Infinity);
  });

  it('truncate omits the cdf when the interval mass underflows (normal on [40, 41])', () => {
    const t = truncate(normalTarget(0, 1), 40, 41);
    expect(t.cdf).toBeUndefined();
    expect(Number.isFinite(t.logDensity(40.5))).toBe(true);
  });

  it('truncate rejects bad bounds and targets with InvalidTargetError naming the API, parameter and value', () => {
    const n = normalTarget(0, 1);
    const bad: [() => unknown, RegExp][] = [
      [() => truncate(n, 2, 1), /truncate: lower must be < upper, got lower = 2, upper = 1/],
      [() => truncate(n, 1, 1), /truncate: lower must be < upper/],
      [() => truncate(n, NaN, 1), /truncate: lower .* got NaN/],
      [() => truncate(n, 0, NaN), /truncate: upper .* got NaN/],
      [() => truncate(n, '0' as unknown as number, 1), /truncate: lower/],
      [() => truncate(gammaTarget(2), -5, -1), /truncate: .*does not overlap/],
      [() => truncate(gammaTarget(2), -1, 0), /truncate: .*does not overlap/],
      [() => truncate(betaTarget(2, 2), 1, 3), /truncate: .*does not overlap/],
      [() => truncate(null as unknown as Target, 0, 1), /truncate: target/],
      [() => truncate({ logDensity: 3 } as unknown as Target, 0, 1), /truncate: target.logDensity/],
      [() => truncate({ logDensity: (x: number) => -x, cdf: 1 } as unknown as Target, 0, 1), /truncate: target.cdf/],
      [() => truncate({ logDensity: (x: number) => -x, support: [2, 1] } as unknown as Target, 0, 1), /truncate: target.support/],
    ];
    for (const [f, re] of bad) {
      expect(f).toThrow(InvalidTargetError);
      expect(f).toThrow(re);
    }
  });
});

import erfc from '@stdlib/math-base-special-erfc';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { describe, expect, it } from 'vitest';
import {
  InvalidTargetError,
  chiSquareTarget,
  exponentialTarget,
  generalizedInverseGaussianTarget,
  gumbelTarget,
  inverseGammaTarget,
  laplaceTarget,
  lognormalTarget,
  paretoTarget,
  weibullTarget,
} from '../../src/index.js';
import type { FamilyTarget } from '../../src/index.js';
import { logBesselK, QuadratureCdf } from '../../src/targets/_internals/gig-quadrature.js';
import { centralDifference, simpson } from './quadrature.js';

interface Case {
  name: string;
  t: FamilyTarget;
  /** A second source for the cdf: a closed form (named), or undefined when only quadrature exists. */
  closed?: (x: number) => number;
  /** Points in the bulk and tails. */
  points: number[];
  /** Scale for finite differences. */
  scale: number;
  /** Where the quadrature starts (the mass below it is negligible), or 'log' for ∫ in u = log x from far below. */
  from: number | 'log';
  /** A kink or peak to split the quadrature at. */
  split?: number;
}

/** ∫ from the start of the case to x of the density, by composite Simpson (independent of the code under test). */
function massTo(c: Case, x: number): number {
  const f = (y: number): number => Math.exp(c.t.logDensity(y));
  if (c.from === 'log') {
    // u = log y, dy = y du: smooth for the power-law behaviour at 0 (poles included)
    const g = (u: number): number => Math.exp(c.t.logDensity(Math.exp(u)) + u);
    const hi = Math.log(x);
    return simpson(g, -745, Math.min(hi, -40), 20000) + (hi > -40 ? simpson(g, -40, hi, 200000) : 0);
  }
  if (c.split !== undefined && x > c.split && c.from < c.split) return simpson(f, c.from, c.split, 100000) + simpson(f, c.split, x, 100000);
  return simpson(f, c.from, x, 200000);
}

// Closed forms below: common practice (standard textbook cdfs), from memory.
const cases: Case[] = [
  { name: 'exponential(1)', t: exponentialTarget(), closed: (x) => -Math.expm1(-x), points: [0.01, 0.5, 1, 3, 10], scale: 1, from: 0 },
  { name: 'exponential(25)', t: exponentialTarget(25), closed: (x) => -Math.expm1(-25 * x), points: [1e-4, 0.01, 0.04, 0.2], scale: 0.04, from: 0 },
  { name: 'laplace(0, 1)', t: laplaceTarget(), closed: (x) => (x < 0 ? 0.5 * Math.exp(x) : 1 - 0.5 * Math.exp(-x)), points: [-5, -1, -0.1, 0.3, 2, 8], scale: 1, from: -60, split: 0 },
  { name: 'laplace(3, 0.2)', t: laplaceTarget(3, 0.2), closed: (x) => (x < 3 ? 0.5 * Math.exp((x - 3) / 0.2) : 1 - 0.5 * Math.exp(-(x - 3) / 0.2)), points: [2, 2.9, 3.1, 4], scale: 0.2, from: 3 - 12, split: 3 },
  { name: 'weibull(0.6, 2)', t: weibullTarget(0.6, 2), closed: (x) => -Math.expm1(-Math.pow(x / 2, 0.6)), points: [1e-8, 0.01, 0.5, 2, 10, 60], scale: 1, from: 'log' },
  { name: 'weibull(2.5, 1)', t: weibullTarget(2.5), closed: (x) => -Math.expm1(-Math.pow(x, 2.5)), points: [0.05, 0.4, 0.9, 1.5, 2.2], scale: 0.4, from: 'log' },
  { name: 'lognormal(0, 1)', t: lognormalTarget(), closed: (x) => 0.5 * erfc(-Math.log(x) / Math.SQRT2), points: [0.05, 0.3, 1, 2.5, 20], scale: 0.5, from: 'log' },
  { name: 'lognormal(2, 0.25)', t: lognormalTarget(2, 0.25), closed: (x) => 0.5 * erfc(-(Math.log(x) - 2) / 0.25 / Math.SQRT2), points: [4, 6, 7.4, 9, 14], scale: 1, from: 'log' },
  // chi-square(1) = square of a standard normal: P(X ≤ x) = erf(√(x/2)); chi-square(4): 1 − e^(−x/2)(1 + x/2)
  { name: 'chiSquare(1)', t: chiSquareTarget(1), closed: (x) => 1 - erfc(Math.sqrt(x / 2)), points: [1e-10, 0.01, 0.5, 1, 4, 12], scale: 0.3, from: 'log' },
  { name: 'chiSquare(4)', t: chiSquareTarget(4), closed: (x) => 1 - Math.exp(-x / 2) * (1 + x / 2), points: [0.3, 2, 4, 9, 20], scale: 1, from: 'log' },
  { name: 'chiSquare(2500) (series, not @stdlib)', t: chiSquareTarget(2500), points: [2400, 2480, 2500, 2530, 2620], scale: 10, from: 2500 - 15 * Math.sqrt(5000) },
  // inverse gamma with shape 1: e^(−β/x); shape 2: e^(−β/x)(1 + β/x)
  { name: 'inverseGamma(1, 2)', t: inverseGammaTarget(1, 2), closed: (x) => Math.exp(-2 / x), points: [0.1, 0.5, 2, 10, 100], scale: 0.2, from: 'log' },
  { name: 'inverseGamma(2, 0.5)', t: inverseGammaTarget(2, 0.5), closed: (x) => Math.exp(-0.5 / x) * (1 + 0.5 / x), points: [0.05, 0.2, 0.5, 3], scale: 0.05, from: 'log' },
  { name: 'inverseGamma(3.5, 4)', t: inverseGammaTarget(3.5, 4), points: [0.3, 0.8, 1.5, 4], scale: 0.1, from: 'log' },
  { name: 'pareto(3, 2)', t: paretoTarget(3, 2), closed: (x) => 1 - Math.pow(2 / x, 3), points: [2.01, 2.5, 4, 20], scale: 0.2, from: 2 },
  { name: 'pareto(0.8, 1)', t: paretoTarget(0.8), closed: (x) => 1 - Math.pow(1 / x, 0.8), points: [1.001, 1.5, 3, 50], scale: 0.1, from: 1 },
  { name: 'gumbel(0, 1)', t: gumbelTarget(), closed: (x) => Math.exp(-Math.exp(-x)), points: [-2, -0.5, 0, 1, 4, 15], scale: 0.5, from: -5 },
  { name: 'gumbel(10, 3)', t: gumbelTarget(10, 3), closed: (x) => Math.exp(-Math.exp(-(x - 10) / 3)), points: [5, 9, 12, 25], scale: 1, from: 10 - 15 },
  // GIG(−1/2, a, b) is the inverse Gaussian with mean μ = √(b/a) and shape λ = b:
  // F(x) = Φ(√(λ/x)(x/μ − 1)) + e^(2λ/μ) Φ(−√(λ/x)(x/μ + 1)) (common practice; Φ from @stdlib)
  {
    name: 'generalizedInverseGaussian(−1/2, 1, 4) (inverse Gaussian, mean 2, shape 4)',
    t: generalizedInverseGaussianTarget(-0.5, 1, 4),
    closed: (x) => normalCdf(Math.sqrt(4 / x) * (x / 2 - 1), 0, 1) + Math.exp(4) * normalCdf(-Math.sqrt(4 / x) * (x / 2 + 1), 0, 1),
    points: [0.2, 0.8, 1.5, 2, 3, 6, 15],
    scale: 0.3,
    from: 'log',
  },
  { name: 'generalizedInverseGaussian(2, 3, 0.5)', t: generalizedInverseGaussianTarget(2, 3, 0.5), points: [0.1, 0.4, 0.8, 1.5, 4], scale: 0.1, from: 'log' },
  { name: 'generalizedInverseGaussian(−3, 0.01, 8)', t: generalizedInverseGaussianTarget(-3, 0.01, 8), points: [0.3, 1, 2, 8, 60], scale: 0.1, from: 'log' },
];

describe('more ready-made families', () => {
  for (const c of cases) {
    it(`${c.name}: cdf matches the Simpson integral of exp(logDensity) (normalization and cdf at once)`, () => {
      for (const x of c.points) expect(Math.abs(c.t.cdf(x) - massTo(c, x)), `x = ${x}`).toBeLessThan(2e-9);
    });
    if (c.closed !== undefined) {
      const closed = c.closed;
      it(`${c.name}: cdf (from @stdlib or exactdraw) matches the closed form pointwise`, () => {
        for (const x of c.points) expect(Math.abs(c.t.cdf(x) - closed(x)), `x = ${x}`).toBeLessThan(1e-13);
      });
    }
    it(`${c.name}: sf = 1 − cdf, cdf is 0 at the lower end, dLogDensity matches finite differences`, () => {
      for (const x of c.points) {
        expect(Math.abs(c.t.sf(x) + c.t.cdf(x) - 1)).toBeLessThan(1e-13);
        const h = 1e-5 * Math.min(c.scale, Math.abs(x - c.t.support[0]) || c.scale);
        const fd = centralDifference((y) => c.t.logDensity(y), x, h);
        expect(Math.abs(c.t.dLogDensity(x) - fd), `x = ${x}`).toBeLessThan(1e-5 * (1 + Math.abs(fd)));
      }
      expect(c.t.cdf(c.t.support[0])).toBe(0);
      expect(c.t.sf(c.t.support[0])).toBe(1);
      expect(c.t.logDensity(c.t.support[0] - 1)).toBe(-Infinity);
    });
  }

  it('sf keeps relative precision in the far upper tail (closed forms)', () => {
    expect(exponentialTarget(2).sf(300) / Math.exp(-600)).toBeCloseTo(1, 12);
    expect(paretoTarget(3, 2).sf(2e10) / 1e-30).toBeCloseTo(1, 12);
    expect(weibullTarget(2).sf(20) / Math.exp(-400)).toBeCloseTo(1, 12);
    expect(gumbelTarget().sf(50) / -Math.expm1(-Math.exp(-50))).toBeCloseTo(1, 12);
    // lognormal sf = Φ(−z) (Φ from @stdlib)
    expect(lognormalTarget().sf(Math.exp(20)) / normalCdf(-20, 0, 1)).toBeCloseTo(1, 12);
    // inverse gamma with shape 1: sf = 1 − e^(−β/x) = −expm1(−β/x)
    expect(inverseGammaTarget(1, 2).sf(1e12) / -Math.expm1(-2e-12)).toBeCloseTo(1, 10);
  });

  it('mode hints are the maxima of the density (closed forms)', () => {
    expect(weibullTarget(2.5, 3).mode).toBeCloseTo(3 * Math.pow(1.5 / 2.5, 1 / 2.5), 14);
    expect(lognormalTarget(1, 0.5).mode).toBeCloseTo(Math.exp(0.75), 14);
    expect(inverseGammaTarget(3, 2).mode).toBeCloseTo(0.5, 15);
    expect(paretoTarget(2, 5).mode).toBe(5);
    for (const [p, a, b] of [[2, 3, 0.5], [-3, 0.01, 8], [0.9, 1, 1e-6]] as const) {
      const t = generalizedInverseGaussianTarget(p, a, b);
      const m = t.mode!;
      expect(Math.abs(t.dLogDensity(m))).toBeLessThan(1e-9 / m);
    }
  });

  it('chiSquareTarget(df) is gammaTarget(df/2, 1/2): pole declared for df < 2', () => {
    expect(chiSquareTarget(1).poles).toBe('lower');
    expect(chiSquareTarget(2).poles).toBeUndefined();
    expect(weibullTarget(0.5).poles).toBe('lower');
    expect(weibullTarget(1).logDensity(0)).toBe(0);
  });

  it('log K_ν(z) from the trapezoidal sum matches the closed forms at ν = ±1/2, ±3/2', () => {
    // K_{1/2}(z) = √(π/(2z)) e^(−z); K_{3/2}(z) = √(π/(2z)) e^(−z) (1 + 1/z) (Abramowitz & Stegun 10.2.17)
    for (const z of [1e-9, 1e-3, 0.5, 3, 40, 1e5]) {
      const half = 0.5 * Math.log(Math.PI / (2 * z)) - z;
      expect(Math.abs(logBesselK('t', 0.5, z) - half)).toBeLessThan(1e-13 * (1 + Math.abs(half)));
      expect(Math.abs(logBesselK('t', -0.5, z) - half)).toBeLessThan(1e-13 * (1 + Math.abs(half)));
      expect(Math.abs(logBesselK('t', 1.5, z) - (half + Math.log1p(1 / z)))).toBeLessThan(1e-13 * (1 + Math.abs(half)));
    }
    // K_0(1) = 0.42102443824070834 (Abramowitz & Stegun Table 9.8, from memory)
    expect(Math.exp(logBesselK('t', 0, 1))).toBeCloseTo(0.42102443824070834, 13);
  });

  it('the GIG cdf table integrates to the Bessel normalizer (total mass 1 within 1e-12)', () => {
    for (const [p, a, b] of [[-0.5, 1, 4], [2, 3, 0.5], [0.1, 1e-6, 1e-6], [20, 1, 1], [-3, 2, 8]] as const) {
      const t = generalizedInverseGaussianTarget(p, a, b);
      const logC = t.logDensity(1) + (a + b) / 2;
      expect(Math.abs(new QuadratureCdf('t', p, a, b, logC).mass - 1), `GIG(${p}, ${a}, ${b})`).toBeLessThan(1e-12);
    }
  });

  const bad: [string, () => unknown, RegExp][] = [
    ['exponentialTarget', () => exponentialTarget(0), /exponentialTarget: rate must be a finite number > 0, got 0/],
    ['laplaceTarget', () => laplaceTarget(NaN), /laplaceTarget: location must be a finite number, got NaN/],
    ['laplaceTarget', () => laplaceTarget(0, -1), /laplaceTarget: scale must be a finite number > 0, got -1/],
    ['weibullTarget', () => weibullTarget(Infinity), /weibullTarget: shape must be a finite number > 0, got Infinity/],
    ['lognormalTarget', () => lognormalTarget(0, 0), /lognormalTarget: sigma must be a finite number > 0, got 0/],
    ['chiSquareTarget', () => chiSquareTarget(-2), /chiSquareTarget: df must be a finite number > 0, got -2/],
    ['inverseGammaTarget', () => inverseGammaTarget(1, 0), /inverseGammaTarget: scale must be a finite number > 0, got 0/],
    ['paretoTarget', () => paretoTarget('3' as unknown as number), /paretoTarget: shape must be a finite number > 0, got '3'/],
    ['gumbelTarget', () => gumbelTarget(0, NaN), /gumbelTarget: scale must be a finite number > 0, got NaN/],
    ['generalizedInverseGaussianTarget', () => generalizedInverseGaussianTarget(1, 0, 1), /generalizedInverseGaussianTarget: a must be a finite number > 0, got 0/],
    ['generalizedInverseGaussianTarget', () => generalizedInverseGaussianTarget(1, 1e-301, 1e-301), /√\(a·b\) must lie in/],
  ];
  for (const [name, f, msg] of bad) {
    it(`${name} throws InvalidTargetError naming API, parameter and value (${msg.source.slice(0, 40)})`, () => {
      expect(f).toThrow(InvalidTargetError);
      expect(f).toThrow(msg);
    });
  }
});

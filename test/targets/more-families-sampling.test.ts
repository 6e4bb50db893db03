import { expect } from 'vitest';
import {
  chiSquareTarget,
  exactSampler,
  exponentialTarget,
  generalizedInverseGaussianTarget,
  gumbelTarget,
  inverseGammaTarget,
  laplaceTarget,
  lognormalTarget,
  paretoTarget,
  truncate,
  weibullTarget,
} from '../../src/index.js';
import type { ExactSampler, FamilyTarget, TruncatedTarget } from '../../src/index.js';
import { methodSuites } from '../helpers/method-suite.js';

/** Draws per statistical check (modest, to keep the suite fast). */
const N = 3000;

interface Case {
  name: string;
  make: (k: number) => FamilyTarget;
  /** A truncation interval inside the bulk. */
  window: [number, number];
}

// Each family at two parameter settings; `make(1)` is the target, `make(1.3)` the
// biased twin (one parameter off by 30 % — a by 1.3³ for the last GIG —, or the location moved by 1.7 scale).
const cases: Case[] = [
  { name: 'exponential(1)', make: (k) => exponentialTarget(k), window: [0.2, 2] },
  { name: 'exponential(40)', make: (k) => exponentialTarget(40 * k), window: [0.001, 0.05] },
  { name: 'laplace(0, 1)', make: (k) => laplaceTarget((k - 1) * 1.7, 1), window: [-1, 3] },
  { name: 'laplace(1e3, 1e-3)', make: (k) => laplaceTarget(1e3 + (k - 1) * 1.7e-3, 1e-3), window: [1e3 - 2e-3, 1e3 + 1e-3] },
  { name: 'weibull(0.6, 2) (pole at 0)', make: (k) => weibullTarget(0.6 * k, 2), window: [0.1, 5] },
  { name: 'weibull(3, 1)', make: (k) => weibullTarget(3 * k, 1), window: [0.5, 1.2] },
  { name: 'lognormal(0, 1)', make: (k) => lognormalTarget(0, k), window: [0.5, 4] },
  { name: 'lognormal(3, 0.2)', make: (k) => lognormalTarget(3, 0.2 * k), window: [18, 25] },
  { name: 'chiSquare(1) (pole at 0)', make: (k) => chiSquareTarget(k), window: [0.05, 2] },
  { name: 'chiSquare(30)', make: (k) => chiSquareTarget(30 * k), window: [20, 40] },
  { name: 'inverseGamma(3, 2)', make: (k) => inverseGammaTarget(3 * k, 2), window: [0.4, 2] },
  { name: 'inverseGamma(0.7, 1) (heavy tail)', make: (k) => inverseGammaTarget(0.7 * k, 1), window: [0.5, 20] },
  { name: 'pareto(2.5, 1)', make: (k) => paretoTarget(2.5 * k, 1), window: [1.1, 3] },
  { name: 'pareto(0.6, 3) (heavy tail)', make: (k) => paretoTarget(0.6 * k, 3), window: [3.5, 100] },
  { name: 'gumbel(0, 1)', make: (k) => gumbelTarget((k - 1) * 1.7, 1), window: [-1, 2] },
  { name: 'gumbel(-50, 4)', make: (k) => gumbelTarget(-50 + (k - 1) * 6.8, 4), window: [-55, -40] },
  { name: 'GIG(−1/2, 1, 4)', make: (k) => generalizedInverseGaussianTarget(-0.5, k, 4), window: [1, 3] },
  { name: 'GIG(0.3, 2, 0.05)', make: (k) => generalizedInverseGaussianTarget(0.3, 2 * k ** 3, 0.05), window: [0.05, 1] },
];

// Seeds 100, 101, … in the order of the cases (untruncated, then truncated), as before the shared suite.
methodSuites<ExactSampler>(
  'exactSampler on the new families: KS and Anderson–Darling at 1e-4, each with a biased twin',
  cases.flatMap((c, i) => {
    const t = c.make(1);
    const tt: TruncatedTarget = truncate(t, c.window[0], c.window[1]);
    return [
      {
        name: `exactSampler(${c.name}) against the family's cdf (twin: a parameter off)`,
        make: (seed: number) => exactSampler(c.make(1), { seed }),
        afterFit: (s: ExactSampler) => expect(s.stats.samples).toBe(N),
        biased: (seed: number) => exactSampler(c.make(1.3), { seed }),
        cdf: t.cdf,
        n: N,
        seed: 100 + 2 * i,
        support: t.support,
      },
      {
        name: `exactSampler(truncate(${c.name}, ${c.window[0]}, ${c.window[1]})) (twin: a parameter off)`,
        make: (seed: number) => exactSampler(truncate(c.make(1), c.window[0], c.window[1]), { seed }),
        biased: (seed: number) => exactSampler(truncate(c.make(1.3), c.window[0], c.window[1]), { seed }),
        cdf: tt.cdf as (x: number) => number,
        n: N,
        seed: 101 + 2 * i,
        support: c.window,
      },
    ];
  }),
);

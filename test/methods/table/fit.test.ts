/**
 * Goodness of fit of tableSampler (the fast path) draws against @stdlib CDFs
 * (KS + Anderson–Darling at ALPHA = 1e-4, fixed seeds), each with a biased
 * twin at the same n that must be rejected, and the stream checks, through the
 * shared method suite (test/helpers/method-suite.ts).
 *
 * References: @stdlib/stats-base-dists-{normal,gamma,beta,t}-cdf, accurate
 * for these parameters per test/reference/README.md (gamma only below
 * shape 1000); the truncated normal on [8, ∞) uses
 * 1 − erfc(x/√2)/erfc(8/√2) with @stdlib/math-base-special-erfc.
 *
 * Cases with few strips (10 or 16) push about half the draws through the
 * caps and a tenth through evaluations of the target: they test the rare
 * paths of the kernel (squeeze chord, upper lines, evaluation, tails) at a
 * rate a default table never reaches.
 */
import betaCdf from '@stdlib/stats-base-dists-beta-cdf';
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import erfc from '@stdlib/math-base-special-erfc';
import type { Target } from '../../../src/core/types.js';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import { tableSampler } from '../../../src/methods/table-sampler.js';
import type { TableSamplerOptions } from '../../../src/methods/table-sampler.js';
import { betaTarget } from '../../../src/targets/beta.js';
import { gammaTarget } from '../../../src/targets/gamma.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { studentTTarget } from '../../../src/targets/student-t.js';
import { truncate } from '../../../src/targets/truncate.js';
import { methodSuites } from '../../helpers/method-suite.js';

const N = 20_000;
const SQRT1_2 = Math.SQRT1_2;

/** Truncated standard normal on [8, ∞): 1 − Q(x)/Q(8) with Q(x) = erfc(x/√2)/2 (@stdlib erfc). */
const tail8Cdf = (x: number): number => (x <= 8 ? 0 : 1 - erfc(x * SQRT1_2) / erfc(8 * SQRT1_2));

interface Case {
  name: string;
  target: Target;
  twin: Target; // a slightly wrong target: its draws must be rejected against `cdf`
  cdf: (x: number) => number;
  support: [number, number];
  opts: TableSamplerOptions;
  seed: number;
}

const normal = normalTarget(0, 1);
const cases: Case[] = [
  { name: 'normal(0, 1)', target: normal, twin: normalTarget(0.05, 1), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: {}, seed: 11 },
  { name: 'normal(0, 1), 10 strips', target: normal, twin: normalTarget(0, 1.06), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: { strips: 10 }, seed: 12 },
  { name: 'normal(0, 1), secant hull, inverse-sqrt, 16 strips', target: normal, twin: normalTarget(-0.05, 1), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: { derivativeFree: true, transform: 'inverse-sqrt', strips: 16 }, seed: 13 },
  { name: 'normal(0, 1), tail mass 1e-2', target: normal, twin: normalTarget(0, 0.95), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: { tailMass: 1e-2, strips: 40 }, seed: 14 },
  // location 1e6, sd 1e-6: draws are resolved to 1.2e-10 = 1.2e-4 sd, far below what KS sees at this n
  { name: 'normal(1e6, 1e-6)', target: normalTarget(1e6, 1e-6), twin: normalTarget(1e6 + 5e-8, 1e-6), cdf: (x) => normalCdf(x, 1e6, 1e-6), support: [-Infinity, Infinity], opts: {}, seed: 15 },
  { name: 'gamma(2.5, 1)', target: gammaTarget(2.5, 1), twin: gammaTarget(2.6, 1), cdf: (x) => gammaCdf(x, 2.5, 1), support: [0, Infinity], opts: {}, seed: 21 },
  { name: 'gamma(2.5, 1), 10 strips', target: gammaTarget(2.5, 1), twin: gammaTarget(2.6, 1), cdf: (x) => gammaCdf(x, 2.5, 1), support: [0, Infinity], opts: { strips: 10 }, seed: 22 },
  // shape 1: the exponential, mode and finite density at the support's end x = 0
  { name: 'gamma(1, 1)', target: gammaTarget(1, 1), twin: gammaTarget(1, 1.04), cdf: (x) => gammaCdf(x, 1, 1), support: [0, Infinity], opts: {}, seed: 23 },
  { name: 'gamma(1, 1), 10 strips', target: gammaTarget(1, 1), twin: gammaTarget(1.05, 1), cdf: (x) => gammaCdf(x, 1, 1), support: [0, Infinity], opts: { strips: 10 }, seed: 24 },
  { name: 'gamma(30, 2), secant hull', target: gammaTarget(30, 2), twin: gammaTarget(30, 2.1), cdf: (x) => gammaCdf(x, 30, 2), support: [0, Infinity], opts: { derivativeFree: true }, seed: 25 },
  { name: 'gamma(1.3, 0.5), inverse-sqrt', target: gammaTarget(1.3, 0.5), twin: gammaTarget(1.3, 0.53), cdf: (x) => gammaCdf(x, 1.3, 0.5), support: [0, Infinity], opts: { transform: 'inverse-sqrt' }, seed: 26 },
  { name: 'beta(2, 5)', target: betaTarget(2, 5), twin: betaTarget(2.1, 5), cdf: (x) => betaCdf(x, 2, 5), support: [0, 1], opts: {}, seed: 31 },
  { name: 'beta(2, 5), 12 strips', target: betaTarget(2, 5), twin: betaTarget(2, 5.3), cdf: (x) => betaCdf(x, 2, 5), support: [0, 1], opts: { strips: 12 }, seed: 32 },
  // shape 1 at the lower end: finite, nonzero density at x = 0 (a clamped sure rectangle)
  { name: 'beta(1, 4)', target: betaTarget(1, 4), twin: betaTarget(1, 4.2), cdf: (x) => betaCdf(x, 1, 4), support: [0, 1], opts: {}, seed: 33 },
  { name: 'normal truncated to [8, ∞)', target: truncate(normal, 8, Infinity), twin: truncate(normal, 8.005, Infinity), cdf: tail8Cdf, support: [8, Infinity], opts: {}, seed: 41 },
  { name: 'normal truncated to [8, ∞), 10 strips', target: truncate(normal, 8, Infinity), twin: truncate(normal, 8.005, Infinity), cdf: tail8Cdf, support: [8, Infinity], opts: { strips: 10 }, seed: 42 },
  { name: 'Student-t(3), inverse-sqrt', target: studentTTarget(3), twin: studentTTarget(3, 0.06), cdf: (x) => tCdf(x, 3), support: [-Infinity, Infinity], opts: { transform: 'inverse-sqrt' }, seed: 51 },
  { name: 'Student-t(3), inverse-sqrt, 16 strips, tail mass 1e-3', target: studentTTarget(3), twin: studentTTarget(3, -0.06), cdf: (x) => tCdf(x, 3), support: [-Infinity, Infinity], opts: { transform: 'inverse-sqrt', strips: 16, tailMass: 1e-3 }, seed: 52 },
];

methodSuites('tableSampler goodness of fit (KS + AD at ALPHA, biased twins)', [
  ...cases.map((c) => ({
    name: `tableSampler(${c.name})`,
    make: (seed: number) => tableSampler(c.target, { ...c.opts, seed }),
    biased: (seed: number) => tableSampler(c.twin, { ...c.opts, seed }),
    cdf: c.cdf,
    n: N,
    seed: c.seed,
    support: c.support,
  })),
  {
    name: 'adaptiveRejectionSampler(gamma(2.5), { fast: true })',
    make: (seed) => adaptiveRejectionSampler(gammaTarget(2.5, 1), { fast: true, seed }),
    biased: (seed) => adaptiveRejectionSampler(gammaTarget(2.6, 1), { fast: true, seed }),
    cdf: (x) => gammaCdf(x, 2.5, 1),
    n: N,
    seed: 61,
  },
]);

// a larger sample to see small biases (a region sampled with a slightly wrong
// probability, a position map off by a fraction of a strip); twins shifted by 0.015 sd
const GAMMA_SD = Math.sqrt(2.5); // gamma(2.5, 1) has variance 2.5 (common practice)
methodSuites('tableSampler goodness of fit at n = 400,000', [
  {
    name: 'tableSampler(normal(0, 1)), n = 400,000',
    make: (seed) => tableSampler(normal, { seed }),
    biased: (seed) => tableSampler(normalTarget(0.015, 1), { seed }),
    cdf: (x) => normalCdf(x, 0, 1),
    n: 400_000,
    seed: 71,
    stream: false, // checked above
  },
  {
    // the twin: the same draws against the cdf shifted by 0.015 sd
    name: 'tableSampler(gamma(2.5), 16 strips), n = 400,000',
    make: (seed) => tableSampler(gammaTarget(2.5, 1), { seed, strips: 16 }),
    biased: (seed) => tableSampler(gammaTarget(2.5, 1), { seed, strips: 16 }),
    cdf: (x) => gammaCdf(x, 2.5, 1),
    twinCdf: (x) => gammaCdf(x - 0.015 * GAMMA_SD, 2.5, 1),
    n: 400_000,
    seed: 72,
    stream: false, // checked above
  },
]);

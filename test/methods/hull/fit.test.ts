/**
 * Goodness of fit of adaptiveRejectionSampler draws against @stdlib CDFs
 * (KS + Anderson–Darling at ALPHA = 1e-4, fixed seeds), each with a biased
 * twin at the same n that must be rejected, and the stream checks, through the
 * shared method suite (test/helpers/method-suite.ts).
 *
 * References: @stdlib/stats-base-dists-{normal,gamma,beta,t}-cdf, accurate
 * for these parameters per test/reference/README.md (gamma only below
 * shape 1000); the truncated normal on [8, ∞) uses
 * 1 − erfc(x/√2)/erfc(8/√2) with @stdlib/math-base-special-erfc.
 */
import betaCdf from '@stdlib/stats-base-dists-beta-cdf';
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import erfc from '@stdlib/math-base-special-erfc';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import type { AdaptiveRejectionOptions } from '../../../src/methods/adaptive-rejection.js';
import type { Target } from '../../../src/core/types.js';
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
  opts: AdaptiveRejectionOptions;
  seed: number;
}

const cases: Case[] = [
  { name: 'normal(0, 1), tangents', target: normalTarget(0, 1), twin: normalTarget(0.05, 1), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: {}, seed: 11 },
  { name: 'normal(0, 1), secants', target: normalTarget(0, 1), twin: normalTarget(0, 1.08), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: { derivativeFree: true }, seed: 12 },
  { name: 'normal(0, 1), inverse-sqrt', target: normalTarget(0, 1), twin: normalTarget(-0.05, 1), cdf: (x) => normalCdf(x, 0, 1), support: [-Infinity, Infinity], opts: { transform: 'inverse-sqrt' }, seed: 13 },
  // location 1e6, sd 1e-6: draws are resolved to 1.2e-10 = 1.2e-4 sd, far below what KS sees at this n
  { name: 'normal(1e6, 1e-6), tangents', target: normalTarget(1e6, 1e-6), twin: normalTarget(1e6 + 5e-8, 1e-6), cdf: (x) => normalCdf(x, 1e6, 1e-6), support: [-Infinity, Infinity], opts: {}, seed: 14 },
  { name: 'gamma(2.5, 1), tangents', target: gammaTarget(2.5, 1), twin: gammaTarget(2.6, 1), cdf: (x) => gammaCdf(x, 2.5, 1), support: [0, Infinity], opts: {}, seed: 21 },
  { name: 'gamma(30, 2), secants', target: gammaTarget(30, 2), twin: gammaTarget(30, 2.1), cdf: (x) => gammaCdf(x, 30, 2), support: [0, Infinity], opts: { derivativeFree: true }, seed: 22 },
  { name: 'gamma(1.3, 0.5), inverse-sqrt', target: gammaTarget(1.3, 0.5), twin: gammaTarget(1.3, 0.53), cdf: (x) => gammaCdf(x, 1.3, 0.5), support: [0, Infinity], opts: { transform: 'inverse-sqrt' }, seed: 23 },
  { name: 'beta(2, 3), tangents', target: betaTarget(2, 3), twin: betaTarget(2.1, 3), cdf: (x) => betaCdf(x, 2, 3), support: [0, 1], opts: {}, seed: 31 },
  // shape 1 at the lower end: finite, nonzero density at x = 0
  { name: 'beta(1, 4), secants', target: betaTarget(1, 4), twin: betaTarget(1, 4.2), cdf: (x) => betaCdf(x, 1, 4), support: [0, 1], opts: { derivativeFree: true }, seed: 32 },
  { name: 'beta(300, 700), tangents', target: betaTarget(300, 700), twin: betaTarget(303, 700), cdf: (x) => betaCdf(x, 300, 700), support: [0, 1], opts: {}, seed: 33 },
  { name: 'normal truncated to [8, ∞), tangents', target: truncate(normalTarget(0, 1), 8, Infinity), twin: truncate(normalTarget(0, 1), 8.005, Infinity), cdf: tail8Cdf, support: [8, Infinity], opts: {}, seed: 41 },
  { name: 'normal truncated to [8, ∞), secants', target: truncate(normalTarget(0, 1), 8, Infinity), twin: truncate(normalTarget(0, 1), 8.005, Infinity), cdf: tail8Cdf, support: [8, Infinity], opts: { derivativeFree: true }, seed: 42 },
  { name: 'Student-t(3), inverse-sqrt, tangents', target: studentTTarget(3), twin: studentTTarget(3, 0.06), cdf: (x) => tCdf(x, 3), support: [-Infinity, Infinity], opts: { transform: 'inverse-sqrt' }, seed: 51 },
  { name: 'Student-t(3), inverse-sqrt, secants', target: studentTTarget(3), twin: studentTTarget(3, -0.06), cdf: (x) => tCdf(x, 3), support: [-Infinity, Infinity], opts: { transform: 'inverse-sqrt', derivativeFree: true }, seed: 52 },
];

methodSuites(
  'adaptiveRejectionSampler goodness of fit (KS + AD at ALPHA, biased twins)',
  cases.map((c) => ({
    name: `adaptiveRejectionSampler(${c.name})`,
    make: (seed: number) => adaptiveRejectionSampler(c.target, { ...c.opts, seed }),
    biased: (seed: number) => adaptiveRejectionSampler(c.twin, { ...c.opts, seed }),
    cdf: c.cdf,
    n: N,
    seed: c.seed,
    support: c.support,
  })),
);

// a larger sample to see small biases (e.g. a piece sampled from a slightly different
// envelope than the one used in the acceptance test); twins shifted by 0.02 sd
methodSuites('adaptiveRejectionSampler goodness of fit at n = 200,000', [
  {
    name: 'adaptiveRejectionSampler(normal(0, 1)), n = 200,000',
    make: (seed) => adaptiveRejectionSampler(normalTarget(0, 1), { seed }),
    biased: (seed) => adaptiveRejectionSampler(normalTarget(0.02, 1), { seed }),
    cdf: (x) => normalCdf(x, 0, 1),
    n: 200_000,
    seed: 61,
    stream: false, // checked above
  },
  {
    name: "adaptiveRejectionSampler(Student-t(3), { transform: 'inverse-sqrt' }), n = 200,000",
    make: (seed) => adaptiveRejectionSampler(studentTTarget(3), { seed, transform: 'inverse-sqrt' }),
    biased: (seed) => adaptiveRejectionSampler(studentTTarget(3, 0.02 * Math.sqrt(3)), { seed, transform: 'inverse-sqrt' }),
    cdf: (x) => tCdf(x, 3),
    n: 200_000,
    seed: 62,
    stream: false, // checked above
  },
]);

/**
 * Chi-square at ALPHA with fixed seeds against @stdlib pmfs (checked pointwise in
 * references.test.ts), each with a biased twin at the same n.
 */
import binomialLogpmf from '@stdlib/stats-base-dists-binomial-logpmf';
import negativeBinomialLogpmf from '@stdlib/stats-base-dists-negative-binomial-logpmf';
import poissonLogpmf from '@stdlib/stats-base-dists-poisson-logpmf';
import { describe, expect, it } from 'vitest';
import type { DiscreteTarget } from '../../src/index.js';
import {
  binomialTarget,
  discreteChiSquareCheck,
  discreteSampler,
  geometricTarget,
  negativeBinomialTarget,
  poissonTarget,
  truncateDiscrete,
  type DiscreteMethod,
  type DiscreteSamplerOptions,
} from '../../src/index.js';
import { normalizedPmf } from '../helpers/discrete-reference.js';
import { ALPHA } from '../helpers/statistical.js';

interface Case {
  name: string;
  target: DiscreteTarget;
  twin: DiscreteTarget; // a slightly wrong target: its draws must be rejected
  pmf: (k: number) => number; // reference pmf (normalized)
  support: readonly [number, number];
  method: DiscreteMethod;
  options?: DiscreteSamplerOptions;
  n: number;
}

const pois = (l: number) => (k: number) => Math.exp(poissonLogpmf(k, l)); // @stdlib
const bimodalLog = (w: number) => (k: number) =>
  // invented bimodal count law: 0.6 Poisson(3) + 0.4 Poisson(30), unnormalized log-pmf
  k < 0 ? -Infinity : Math.log(0.6 * Math.exp(poissonLogpmf(k, 3)) + w * Math.exp(poissonLogpmf(k, 30)));
const farTail = (l: number, lo: number): DiscreteTarget => truncateDiscrete(poissonTarget(l), lo, Infinity);
const deepLog = (w: number) => (k: number) =>
  // invented count law with a deep valley: (1 − w) Poisson(4) + w Poisson(400); logPmf falls by more than 40 between
  // the modes, so a table grown from the first mode stops at k = 33 and everything beyond (mass w) is its tail
  k < 0 ? -Infinity : Math.log((1 - w) * Math.exp(poissonLogpmf(k, 4)) + w * Math.exp(poissonLogpmf(k, 400)));
const universal: DiscreteSamplerOptions = { method: 'log-concave-universal' };

const cases: Case[] = [
  { name: 'Poisson(0.5)', target: poissonTarget(0.5), twin: poissonTarget(0.52), pmf: pois(0.5), support: [0, Infinity], method: 'table', n: 100_000 },
  { name: 'Poisson(30)', target: poissonTarget(30), twin: poissonTarget(30.4), pmf: pois(30), support: [0, Infinity], method: 'log-concave-rejection', n: 100_000 },
  { name: 'Poisson(30), table', target: poissonTarget(30), twin: poissonTarget(30.4), pmf: pois(30), support: [0, Infinity], method: 'table', options: { expectedDraws: 100_000 }, n: 100_000 },
  { name: 'Poisson(30), ratio-of-uniforms', target: poissonTarget(30), twin: poissonTarget(30.4), pmf: pois(30), support: [0, Infinity], method: 'ratio-of-uniforms', options: { method: 'ratio-of-uniforms' }, n: 100_000 },
  { name: 'Poisson(1e4)', target: poissonTarget(1e4), twin: poissonTarget(1e4 + 12), pmf: pois(1e4), support: [0, Infinity], method: 'log-concave-rejection', n: 100_000 },
  { name: 'Poisson(1e7)', target: poissonTarget(1e7), twin: poissonTarget(1e7 + 500), pmf: pois(1e7), support: [0, Infinity], method: 'log-concave-rejection', n: 100_000 },
  { name: 'binomial(20, 0.3)', target: binomialTarget(20, 0.3), twin: binomialTarget(20, 0.303), pmf: (k) => Math.exp(binomialLogpmf(k, 20, 0.3)), support: [0, 20], method: 'table', n: 100_000 },
  { name: 'binomial(1e6, 1e-4)', target: binomialTarget(1e6, 1e-4), twin: binomialTarget(1e6, 1.015e-4), pmf: (k) => Math.exp(binomialLogpmf(k, 1e6, 1e-4)), support: [0, 1e6], method: 'log-concave-rejection', n: 100_000 },
  {
    name: 'negative binomial(3.5, 0.1)',
    target: negativeBinomialTarget(3.5, 0.1),
    twin: negativeBinomialTarget(3.5, 0.102),
    pmf: (k) => Math.exp(negativeBinomialLogpmf(k, 3.5, 0.1)),
    support: [0, Infinity],
    method: 'log-concave-rejection',
    n: 100_000,
  },
  {
    name: 'negative binomial(0.5, 0.05) (not log-concave)',
    target: negativeBinomialTarget(0.5, 0.05),
    twin: negativeBinomialTarget(0.5, 0.052),
    pmf: (k) => Math.exp(negativeBinomialLogpmf(k, 0.5, 0.05)),
    support: [0, Infinity],
    method: 'ratio-of-uniforms',
    n: 100_000,
  },
  { name: 'geometric(0.01)', target: geometricTarget(0.01), twin: geometricTarget(0.0106), pmf: (k) => 0.01 * 0.99 ** k, support: [0, Infinity], method: 'log-concave-rejection', n: 100_000 },
  {
    name: 'custom bimodal on [0, 200]',
    target: { logPmf: bimodalLog(0.4), support: [0, 200] },
    twin: { logPmf: bimodalLog(0.43), support: [0, 200] },
    pmf: normalizedPmf(bimodalLog(0.4), 0, 200),
    support: [0, 200],
    method: 'table',
    options: { expectedDraws: 100_000 },
    n: 100_000,
  },
  {
    name: 'custom bimodal on [0, ∞) (table grown through the valley)',
    target: { logPmf: bimodalLog(0.4) },
    twin: { logPmf: bimodalLog(0.43) },
    pmf: normalizedPmf(bimodalLog(0.4), 0, 400),
    support: [0, Infinity],
    method: 'table',
    options: { expectedDraws: 100_000 },
    n: 100_000,
  },
  {
    // before 0.x the table stopped at 33 and drew nothing beyond (30 % of the mass lost); the probes beyond the edge grow it
    name: 'deep-valley mixture on [0, ∞), forced table (mass 0.3 beyond the first table edge)',
    target: { logPmf: deepLog(0.3) },
    twin: { logPmf: deepLog(0.28) },
    pmf: normalizedPmf(deepLog(0.3), 0, 1000),
    support: [0, Infinity],
    method: 'table',
    options: { method: 'table' },
    n: 100_000,
  },
  { name: 'Poisson(0.5), universal', target: poissonTarget(0.5), twin: poissonTarget(0.52), pmf: pois(0.5), support: [0, Infinity], method: 'log-concave-universal', options: universal, n: 100_000 },
  { name: 'Poisson(30), universal', target: poissonTarget(30), twin: poissonTarget(30.4), pmf: pois(30), support: [0, Infinity], method: 'log-concave-universal', options: universal, n: 100_000 },
  { name: 'Poisson(1e4), universal', target: poissonTarget(1e4), twin: poissonTarget(1e4 + 12), pmf: pois(1e4), support: [0, Infinity], method: 'log-concave-universal', options: universal, n: 100_000 },
  {
    name: 'binomial(20, 0.3), universal',
    target: binomialTarget(20, 0.3),
    twin: binomialTarget(20, 0.303),
    pmf: (k) => Math.exp(binomialLogpmf(k, 20, 0.3)),
    support: [0, 20],
    method: 'log-concave-universal',
    options: universal,
    n: 100_000,
  },
  {
    // k >= λ + 10 sqrt(λ) = 11000 for λ = 1e4; reference pmf normalized by summation of @stdlib's logpmf
    name: 'Poisson(1e4) truncated to k >= 11000',
    target: farTail(1e4, 11000),
    twin: farTail(1e4 + 50, 11000),
    pmf: normalizedPmf((k) => poissonLogpmf(k, 1e4), 11000, 13000),
    support: [11000, Infinity],
    method: 'log-concave-rejection',
    n: 100_000,
  },
];

describe('discreteSampler statistical checks (chi-square, cells pooled to expected >= 5)', () => {
  for (const c of cases) {
    it(`discreteSampler on ${c.name} passes at ALPHA and (twin) a slightly wrong parameter is rejected at the same n`, () => {
      const s = discreteSampler(c.target, { seed: 20261202, ...c.options });
      expect(s.choice.method, s.choice.reason).toBe(c.method);
      const good = s.fill(new Float64Array(c.n));
      const r = discreteChiSquareCheck(good, c.pmf, c.support);
      expect(r.pValue, `X² = ${r.statistic}, df = ${r.df}`).toBeGreaterThan(ALPHA);
      const b = discreteSampler(c.twin, { seed: 20261202, ...c.options });
      expect(b.choice.method).toBe(c.method);
      const bad = b.fill(new Float64Array(c.n));
      const rb = discreteChiSquareCheck(bad, c.pmf, c.support);
      expect(rb.pValue, `twin X² = ${rb.statistic}, df = ${rb.df}`).toBeLessThan(ALPHA);
    });
  }
});

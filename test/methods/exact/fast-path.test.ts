/**
 * exactSampler with expectedDraws: the table-driven fast path, exact (KS and
 * AD at ALPHA with a biased twin each, through the shared method suite
 * test/helpers/method-suite.ts), and its wiring.
 */
import { describe, expect, it } from 'vitest';
import { exactSampler, gammaTarget, normalTarget, studentTTarget, FAST_PATH_MIN_DRAWS } from '../../../src/index.js';
import type { ExactSampler } from '../../../src/index.js';
import { methodSuites } from '../../helpers/method-suite.js';

const gamma25 = gammaTarget(2.5, 1);
const t3 = studentTTarget(3);

methodSuites<ExactSampler>('exactSampler with expectedDraws (fast path): exact', [
  {
    name: 'exactSampler(gamma(2.5), { expectedDraws: FAST_PATH_MIN_DRAWS }) uses the table-driven fast path and stays exact',
    make: (seed) => exactSampler(gamma25, { seed, expectedDraws: FAST_PATH_MIN_DRAWS }),
    beforeFit: (s) => {
      expect(s.choice.method).toBe('adaptive-rejection');
      expect(s.choice.reason).toContain('fast path');
      expect('table' in s.sampler).toBe(true);
    },
    // cdf from @stdlib/stats-base-dists-gamma-cdf (accurate at shape 2.5, test/reference/README.md)
    cdf: gamma25.cdf as (x: number) => number,
    // twin: the same sampler's draws checked against gamma(2.6) are rejected
    biased: (seed) => exactSampler(gamma25, { seed, expectedDraws: 1e5 }),
    twinCdf: gammaTarget(2.6, 1).cdf as (x: number) => number,
    n: 20_000,
    seed: 31,
    twinSeed: 32,
  },
  {
    name: 'exactSampler(Student-t(3), { expectedDraws: 1e6 }) is served by the inverse-sqrt fast path and stays exact',
    make: (seed) => exactSampler(t3, { seed, expectedDraws: 1e6 }),
    beforeFit: (s) => {
      expect(s.choice.transform).toBe('inverse-sqrt');
      expect('table' in s.sampler).toBe(true);
    },
    // cdf from @stdlib/stats-base-dists-t-cdf
    cdf: t3.cdf as (x: number) => number,
    // twin (added with the shared suite): the same method on t(3) shifted by 0.06, as for tableSampler
    biased: (seed) => exactSampler(studentTTarget(3, 0.06), { seed, expectedDraws: 1e6 }),
    n: 20_000,
    seed: 33,
  },
]);

describe('exactSampler with expectedDraws (fast path wiring)', () => {
  it('exactSampler keeps the plain hull for few draws', () => {
    const plain = exactSampler(normalTarget(0, 1), { seed: 1 });
    expect(plain.choice.reason).not.toContain('fast path');
    expect('table' in plain.sampler).toBe(false);
  });

  it('exactSampler rejects a bad expectedDraws with a typed error', () => {
    expect(() => exactSampler(normalTarget(0, 1), { expectedDraws: -1 })).toThrow(/expectedDraws/);
    expect(() => exactSampler(normalTarget(0, 1), { expectedDraws: 1.5 })).toThrow(/expectedDraws/);
  });
});

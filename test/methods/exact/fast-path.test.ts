import { describe, expect, it } from 'vitest';
import { exactSampler, gammaTarget, normalTarget, studentTTarget, FAST_PATH_MIN_DRAWS } from '../../../src/index.js';
import { draw, expectFits, expectRejects } from '../../helpers/statistical.js';

describe('exactSampler with expectedDraws (fast path wiring)', () => {
  it('exactSampler uses the table-driven fast path from FAST_PATH_MIN_DRAWS expected draws and stays exact', () => {
    const t = gammaTarget(2.5, 1);
    const s = exactSampler(t, { seed: 31, expectedDraws: FAST_PATH_MIN_DRAWS });
    expect(s.choice.method).toBe('adaptive-rejection');
    expect(s.choice.reason).toContain('fast path');
    expect('table' in s.sampler).toBe(true);
    // cdf from @stdlib/stats-base-dists-gamma-cdf (accurate at shape 2.5, test/reference/README.md)
    expectFits(draw(s, 20_000), t.cdf!, 'fast gamma(2.5)');
    // twin: the same sampler's draws checked against gamma(2.6) are rejected
    expectRejects(draw(exactSampler(t, { seed: 32, expectedDraws: 1e5 }), 20_000), gammaTarget(2.6, 1).cdf!, 'twin');
  });

  it('exactSampler keeps the plain hull for few draws and serves Student-t(3) by the inverse-sqrt fast path for many', () => {
    const plain = exactSampler(normalTarget(0, 1), { seed: 1 });
    expect(plain.choice.reason).not.toContain('fast path');
    expect('table' in plain.sampler).toBe(false);
    const t3 = studentTTarget(3);
    const s = exactSampler(t3, { seed: 33, expectedDraws: 1e6 });
    expect(s.choice.transform).toBe('inverse-sqrt');
    expect('table' in s.sampler).toBe(true);
    // cdf from @stdlib/stats-base-dists-t-cdf
    expectFits(draw(s, 20_000), t3.cdf!, 'fast t(3)');
  });

  it('exactSampler rejects a bad expectedDraws with a typed error', () => {
    expect(() => exactSampler(normalTarget(0, 1), { expectedDraws: -1 })).toThrow(/expectedDraws/);
    expect(() => exactSampler(normalTarget(0, 1), { expectedDraws: 1.5 })).toThrow(/expectedDraws/);
  });
});

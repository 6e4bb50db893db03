import betaln from '@stdlib/math-base-special-betaln';
import gammaln from '@stdlib/math-base-special-gammaln';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { adaptiveRejectionSampler, betaTarget, exactSampler, gammaTarget, poleTransform, ratioOfUniformsSampler } from '../../../src/index.js';
import { expectReproducible } from '../../helpers/statistical.js';

/** softplus(t) = log(1 + e^t), computed stably (common practice). */
const softplus = (t: number): number => Math.max(t, 0) + Math.log1p(Math.exp(-Math.abs(t)));

describe('poleTransform properties (fast-check, fixed seed)', () => {
  it('gamma(shape, rate) after Y = log X: log g(y) = shape·(y + log rate) − rate·e^y − lnΓ(shape) (closed form) for random shape, rate, y', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 0.99, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: -700, max: 5, noNaN: true }), (a, lr, y) => {
        const rate = Math.pow(10, lr);
        const tr = poleTransform(gammaTarget(a, rate), 'lower');
        const ref = a * (y + Math.log(rate)) - rate * Math.exp(y) - gammaln(a);
        const v = tr.target.logDensity(y);
        if (ref < -1e300) return;
        expect(Math.abs(v - ref)).toBeLessThan(1e-11 * (1 + Math.abs(ref)));
        expect(tr.toX(y)).toBeGreaterThan(0);
      }),
      { seed: 11, numRuns: 300 },
    );
  });

  it('beta(a, b) after the logit: log g(y) = −a·softplus(−y) − b·softplus(y) − lnB(a, b) for random a, b < 1 and |y| ≤ 700; toX stays strictly inside (0, 1)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 0.99, noNaN: true }), fc.double({ min: 0.05, max: 0.99, noNaN: true }), fc.double({ min: -700, max: 700, noNaN: true }), (a, b, y) => {
        const tr = poleTransform(betaTarget(a, b), 'both');
        const ref = -a * softplus(-y) - b * softplus(y) - betaln(a, b);
        expect(Math.abs(tr.target.logDensity(y) - ref)).toBeLessThan(1e-11 * (1 + Math.abs(ref)));
        const x = tr.toX(y);
        expect(x > 0 && x < 1).toBe(true);
      }),
      { seed: 12, numRuns: 300 },
    );
  });
});

describe('samplers across a pole: same seed, same draws', () => {
  it('exactSampler, the hull and ratio-of-uniforms with poleAt are reproducible per seed', () => {
    expectReproducible((seed) => exactSampler(gammaTarget(0.3), { seed }));
    expectReproducible((seed) => exactSampler(betaTarget(0.4, 0.6), { seed, expectedDraws: 1e5 }));
    expectReproducible((seed) => adaptiveRejectionSampler(betaTarget(0.4, 0.6), { seed, poleAt: 'both' }));
    expectReproducible((seed) => adaptiveRejectionSampler(gammaTarget(0.4), { seed, poleAt: 'lower', fast: true }));
    expectReproducible((seed) => ratioOfUniformsSampler(gammaTarget(0.4), { seed, poleAt: 'auto' }));
  });
});

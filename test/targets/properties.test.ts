import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { betaTarget, gammaTarget, normalTarget } from '../../src/index.js';
import type { FamilyTarget } from '../../src/index.js';

/** Log-uniform double in [10^lo, 10^hi]. */
const logUniform = (lo: number, hi: number): fc.Arbitrary<number> =>
  fc.double({ min: lo, max: hi, noNaN: true }).map((e) => Math.pow(10, e));

/**
 * At an interior mode: logDensity finite, dLogDensity ≈ 0 relative to the
 * scale (|d|·sd ≤ tol), and the mode beats its neighbours at ±1% of sd.
 */
function expectInteriorMode(t: FamilyTarget, sd: number, tol: number): void {
  const m = t.mode as number;
  expect(typeof m).toBe('number');
  const lm = t.logDensity(m);
  expect(Number.isFinite(lm)).toBe(true);
  expect(Math.abs(t.dLogDensity(m)) * sd).toBeLessThan(tol);
  expect(lm).toBeGreaterThanOrEqual(t.logDensity(m + 0.01 * sd));
  expect(lm).toBeGreaterThanOrEqual(t.logDensity(m - 0.01 * sd));
}

describe('target properties over parameter ranges (fast-check)', () => {
  it('normalTarget(mean ±1e6, sd 1e-6..1e6): finite logDensity and zero slope at the mode, cdf(mode) = 1/2', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), logUniform(-6, 6), (mean, sd) => {
        const t = normalTarget(mean, sd);
        expect(t.mode).toBe(mean);
        expectInteriorMode(t, sd, 1e-12);
        // value at the mode: 1/(sd √(2π)) (closed form)
        expect(t.logDensity(mean)).toBeCloseTo(-Math.log(sd * Math.sqrt(2 * Math.PI)), 10);
        expect(t.cdf(mean)).toBe(0.5);
      }),
      { seed: 20261, numRuns: 300 },
    );
  });

  it('gammaTarget(shape 1..1e4, rate 1e-3..1e3): finite logDensity at the mode, zero slope there (interior) or the boundary slope −rate (shape 1)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e4, noNaN: true }), logUniform(-3, 3), (shape, rate) => {
        const t = gammaTarget(shape, rate);
        const sd = Math.sqrt(shape) / rate;
        if (shape === 1) {
          expect(t.mode).toBe(0);
          expect(t.logDensity(0)).toBeCloseTo(Math.log(rate), 12);
          expect(t.dLogDensity(0)).toBe(-rate);
          return;
        }
        expectInteriorMode(t, sd, 1e-8);
        if (shape >= 100) {
          // density at the mode ≈ 1/(√(2π(shape − 1))/rate) up to O(1/shape) (Stirling; common practice)
          expect(Math.abs(t.logDensity(t.mode as number) + Math.log(Math.sqrt(2 * Math.PI * (shape - 1)) / rate))).toBeLessThan(1 / shape);
        }
      }),
      { seed: 20262, numRuns: 300 },
    );
  });

  it('gammaTarget shape exactly 1 is the exponential with its mode at the boundary', () => {
    const t = gammaTarget(1, 4);
    expect(t.mode).toBe(0);
    expect(t.dLogDensity(0)).toBe(-4);
  });

  it('betaTarget(a, b in (1, 1e3]): finite logDensity and zero slope at the interior mode', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e3, noNaN: true, minExcluded: true }),
        fc.double({ min: 1, max: 1e3, noNaN: true, minExcluded: true }),
        (a, b) => {
          const t = betaTarget(a, b);
          const sd = Math.sqrt((a * b) / ((a + b) * (a + b) * (a + b + 1)));
          // When a or b is barely above 1 the mode sits within ~1e-14 of an end and the
          // log-density is sharply curved there: measure the slope against the local
          // scale 1/√(−d²logf/dx²) = 1/√((a−1)/m² + (b−1)/(1−m)²) as well.
          // If the exact mode lies closer to an end than the last double inside (0, 1),
          // the hint must be that last double, and then the slope cannot vanish.
          const m = t.mode as number;
          const exact = (a - 1) / (a - 1 + (b - 1)); // (a − 1)/(a + b − 2) without the rounding of a + b
          if (1 - exact < Math.pow(2, -54)) {
            expect(m).toBe(1 - Math.pow(2, -53));
            expect(Number.isFinite(t.logDensity(m))).toBe(true);
            expect(t.dLogDensity(m)).toBeGreaterThan(0);
            return;
          }
          const local = 1 / Math.sqrt((a - 1) / (m * m) + (b - 1) / ((1 - m) * (1 - m)));
          expectInteriorMode(t, Math.min(sd, local), 1e-6);
        },
      ),
      { seed: 20263, numRuns: 300 },
    );
  });

  it('betaTarget with a = 1 or b = 1 (and the other in 1..1e3) has its finite maximum at the boundary mode', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e3, noNaN: true, minExcluded: true }), fc.boolean(), (c, left) => {
        const t = left ? betaTarget(1, c) : betaTarget(c, 1);
        const m = t.mode as number;
        expect(m).toBe(left ? 0 : 1);
        // Beta(1, c) density at 0 and Beta(c, 1) density at 1 is c (closed form)
        expect(t.logDensity(m)).toBeCloseTo(Math.log(c), 10);
        expect(t.logDensity(m)).toBeGreaterThan(t.logDensity(left ? 1e-3 : 1 - 1e-3));
      }),
      { seed: 20264, numRuns: 200 },
    );
  });
});

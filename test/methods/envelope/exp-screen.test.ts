/**
 * The squeeze screen of the hull and piecewise kernels (`expScreen`) must never pass where
 * the exp test fails: `u < expScreen(y)` has to imply `u < exp(y)`, so that
 * the screen changes only the cost of the kernel, never a decision or a draw.
 * Checked against the vendored exp (the function the kernel compares with),
 * and, as an outside reference, against Math.exp with a 1-ulp allowance.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { expScreen } from '../../../src/methods/envelope/exp-screen.js';
import { exp } from '../../../src/vendor/math.js';

describe('hull kernel: exp screen of the squeeze test', () => {
  it('is at most the vendored exp(y) on a dense grid near 0, where the cubic is tightest', () => {
    let worst = Infinity;
    for (let i = -200000; i <= 2000; i++) {
      const y = i * 1e-6;
      const gap = exp(y) - expScreen(y);
      if (gap < worst) worst = gap;
    }
    expect(worst).toBeGreaterThan(0);
  });

  it('is at most the vendored exp(y) for any y (property, wide range incl. tiny and large |y|)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.double({ min: -745, max: 1, noNaN: true }), fc.double({ min: -1e-6, max: 1e-6, noNaN: true })), (y) => expScreen(y) <= exp(y)),
      { numRuns: 20000, seed: 2026 },
    );
  });

  it('is also at most Math.exp(y) minus one ulp of 1 near 0 (outside reference)', () => {
    for (let i = -5000; i <= 100; i++) {
      const y = i * 1e-5;
      expect(expScreen(y)).toBeLessThanOrEqual(Math.exp(y) - 1.1e-16);
    }
  });

  it('twin: the same grid check rejects a screen that is not a lower bound (1 + y + y²/2 lies above exp(y) for y < 0)', () => {
    const wrong = (y: number): number => 1 + y * (1 + 0.5 * y);
    let over = 0;
    for (let i = -200000; i < 0; i++) {
      const y = i * 1e-6;
      if (wrong(y) > exp(y)) over++;
    }
    expect(over).toBeGreaterThan(1000);
  });

  it('is tight: within 1e-9 of exp(y) for |y| ≤ 0.01 (the screen catches almost every squeeze pass)', () => {
    for (let i = -1000; i <= 0; i++) {
      const y = i * 1e-5;
      expect(exp(y) - expScreen(y)).toBeLessThan(1e-9);
    }
  });
});

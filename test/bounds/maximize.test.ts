import { describe, expect, it } from 'vitest';
import { fromUnit, maximizeLog } from '../../src/bounds/maximize.js';
import { InvalidTargetError, NonFiniteDensityError } from '../../src/core/errors.js';

describe('maximizeLog', () => {
  it('maximizeLog finds the maximum of a parabola to near machine precision', () => {
    const r = maximizeLog('t', (x) => -((x - 1.234) ** 2), -Infinity, Infinity);
    expect(Math.abs(r.x - 1.234)).toBeLessThan(1e-7);
    expect(r.value).toBeGreaterThan(-1e-14);
    expect(r.risingTail).toBeUndefined();
  });

  it('maximizeLog finds a narrow peak far from the origin given only its scale-free hint', () => {
    // normal log-density with mean 1e6, sd 1e-6 (maximum 0 at 1e6 + 1e-7, hint off by 1e-7)
    const m = 1e6 + 1e-7;
    const r = maximizeLog('t', (x) => -0.5 * ((x - m) / 1e-6) ** 2, -Infinity, Infinity, { hint: 1e6 });
    expect(r.value).toBeGreaterThan(-1e-6);
  });

  it('maximizeLog finds the global one of several maxima (bimodal, unequal heights)', () => {
    const f = (x: number): number => Math.log(0.3 * Math.exp(-0.5 * (x + 3) ** 2) + 0.7 * Math.exp(-0.5 * ((x - 4) / 0.2) ** 2));
    const r = maximizeLog('t', f, -Infinity, Infinity);
    expect(Math.abs(r.x - 4)).toBeLessThan(1e-3);
  });

  it('maximizeLog reports a maximum at a finite end and a rising tail at an infinite end', () => {
    const r = maximizeLog('t', (x) => -x, 0, Infinity);
    expect(r.x).toBe(0);
    expect(r.value).toBe(-0);
    expect(maximizeLog('t', (x) => x * x, -Infinity, Infinity).risingTail).toBeDefined();
    expect(maximizeLog('t', (x) => x, 0, Infinity).risingTail).toBe('upper');
    expect(maximizeLog('t', (x) => -x, -Infinity, 0).risingTail).toBe('lower');
    // unbounded at a finite end: -0.5 log x on (0, 1]
    expect(maximizeLog('t', (x) => (x > 0 ? -0.5 * Math.log(x) : -Infinity), 0, 1).risingTail).toBe('lower');
    // rising to a finite limit is not flagged: -1/x on [1, ∞)
    expect(maximizeLog('t', (x) => -1 / x, 1, Infinity).risingTail).toBeUndefined();
  });

  it('maximizeLog throws typed errors for no mass, NaN and +Infinity', () => {
    expect(() => maximizeLog('api', () => -Infinity, -Infinity, Infinity)).toThrow(InvalidTargetError);
    expect(() => maximizeLog('api', () => -Infinity, -Infinity, Infinity)).toThrow(/no mass found/);
    expect(() => maximizeLog('api', () => NaN, 0, 1)).toThrow(NonFiniteDensityError);
    expect(() => maximizeLog('api', (x) => (x > 0.7 ? Infinity : 0), 0, 1)).toThrow(NonFiniteDensityError);
  });

  it('fromUnit maps (0, 1) onto each kind of support, monotonically', () => {
    for (const [a, b] of [[-Infinity, Infinity], [0, Infinity], [-Infinity, 2], [1, 3]] as const) {
      let prev = -Infinity;
      for (let i = 1; i < 100; i++) {
        const x = fromUnit(i / 100, a, b, 0.5, 1);
        expect(x).toBeGreaterThan(prev);
        expect(x >= a && x <= b).toBe(true);
        prev = x;
      }
    }
  });
});

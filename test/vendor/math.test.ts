/**
 * The deterministic elementary functions (src/vendor/math.ts) against the
 * engine's Math.* (an independent implementation): within 2 ulps on 20,000
 * inputs each (both sides are faithful, under 1 ulp from the true value, so they
 * may be 2 apart), exact where the result is a double, and the special values.
 */
import { describe, expect, it } from 'vitest';
import * as dm from '../../src/vendor/math.js';
import { mersenneTwister } from '../../src/index.js';

/** Distance in ulps between two doubles of the same sign (Infinity when one is not finite and they differ). */
function ulps(a: number, b: number): number {
  if (Object.is(a, b)) return 0;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Infinity;
  const f = new Float64Array([a, b]);
  const i = new BigInt64Array(f.buffer);
  const d = i[0] - i[1];
  return Number(d < 0n ? -d : d);
}

const u = mersenneTwister(11);
const inputs = (lo: number, hi: number): number[] => Array.from({ length: 20_000 }, () => lo + (hi - lo) * u());
const CASES: [string, (x: number) => number, (x: number) => number, number[]][] = [
  ['exp', dm.exp, Math.exp, inputs(-700, 700)],
  ['log', dm.log, Math.log, inputs(1e-300, 1e6).concat(inputs(0.5, 2))],
  ['log1p', dm.log1p, Math.log1p, inputs(-0.999, 10).concat(inputs(-1e-8, 1e-8))],
  ['expm1', dm.expm1, Math.expm1, inputs(-40, 700).concat(inputs(-1e-8, 1e-8))],
  ['sin', dm.sin, Math.sin, inputs(-1e4, 1e4)],
  ['cos', dm.cos, Math.cos, inputs(-1e4, 1e4)],
  ['tan', dm.tan, Math.tan, inputs(-1.5, 1.5)],
  ['atan', dm.atan, Math.atan, inputs(-1e3, 1e3)],
  ['tanh', dm.tanh, Math.tanh, inputs(-30, 30)],
];

describe('deterministic math', () => {
  for (const [name, f, engine, xs] of CASES) {
    it(`${name}(x) is within 2 ulps of the engine's Math.${name} on ${xs.length} inputs`, () => {
      let worst = 0;
      for (const x of xs) worst = Math.max(worst, ulps(f(x), engine(x)));
      expect(worst).toBeLessThanOrEqual(2);
    });
  }

  it('pow(x, y) is within 2 ulps of Math.pow, and exact for powers of two (2^k for k in [-1074, 1023])', () => {
    let worst = 0;
    for (let i = 0; i < 20_000; i++) {
      const x = 1e-3 + 50 * u();
      const y = -20 + 40 * u();
      worst = Math.max(worst, ulps(dm.pow(x, y), Math.pow(x, y)));
    }
    expect(worst).toBeLessThanOrEqual(2);
    // 2^k is a double for every k in [-1074, 1023] (IEEE 754 binary64; common practice); the table is built by doubling
    let p = 1;
    for (let k = 0; k <= 1023; k++, p *= 2) expect(dm.pow(2, k)).toBe(p);
    p = 1;
    for (let k = 0; k >= -1074; k--, p /= 2) expect(dm.pow(2, k)).toBe(p);
  });

  it('atan2(y, x) is within 2 ulps of Math.atan2 in all four quadrants', () => {
    let worst = 0;
    for (let i = 0; i < 20_000; i++) {
      const y = u() * 20 - 10;
      const x = u() * 20 - 10;
      worst = Math.max(worst, ulps(dm.atan2(y, x), Math.atan2(y, x)));
    }
    expect(worst).toBeLessThanOrEqual(2);
  });

  it('special values: exp(0) = 1, log(1) = 0, exp(-Infinity) = 0, log(0) = -Infinity, log(-1) is NaN, log1p(-1) = -Infinity, expm1(-0) is -0', () => {
    // IEEE 754 / C99 Annex F special cases (common practice)
    expect([dm.exp(0), dm.log(1), dm.exp(-Infinity), dm.log(0), dm.log1p(-1)]).toEqual([1, 0, 0, -Infinity, -Infinity]);
    expect(Number.isNaN(dm.log(-1))).toBe(true);
    expect(Object.is(dm.expm1(-0), -0)).toBe(true);
    // within 1 ulp of e and ln 2 rounded to doubles (ECMAScript Math.E, Math.LN2); exp(1) is 1 ulp above Math.E
    expect(ulps(dm.exp(1), Math.E)).toBeLessThanOrEqual(1);
    expect(ulps(dm.log(2), Math.LN2)).toBeLessThanOrEqual(1);
  });

  it('twin: the ulp measure sees a one-ulp and a large difference', () => {
    expect(ulps(1, 1 + Number.EPSILON)).toBe(1);
    expect(ulps(dm.exp(1), 2.7)).toBeGreaterThan(1e12);
  });
});

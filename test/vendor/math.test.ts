/**
 * The deterministic elementary functions (src/vendor/math.ts) against the
 * engine's Math.* (an independent implementation): within 2 ulps on 20,000
 * inputs each (both sides are faithful, under 1 ulp from the true value, so they
 * may be 2 apart), exact where the result is a double, and the special values.
 */
import { describe, expect, it } from 'vitest';
import * as dm from '../../src/vendor/math.js';
import { mersenneTwister } from '../../src/index.js';
import { ldexp } from '../../src/vendor/math/ldexp.js';
// the package the build replaces by the port (a dependency of the vendored @stdlib exp and pow)
import stdlibLdexp from '@stdlib/math-base-special-ldexp';

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
  ['sinh', dm.sinh, Math.sinh, inputs(-700, 700).concat(inputs(-1e-3, 1e-3))],
  ['cosh', dm.cosh, Math.cosh, inputs(-700, 700)],
  ['asinh', dm.asinh, Math.asinh, inputs(-1e6, 1e6).concat(inputs(-1, 1))],
  ['log10', dm.log10, Math.log10, inputs(1e-300, 1e6).concat(inputs(0.5, 2))],
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

  it('twoTo(k) is exactly 2^k: the doubles made by doubling and halving for k in [-1074, 1023], pow(2, k) and pow(0.5, -k) for every k in [-1200, 1200], and NaN for a k that is not an integer', () => {
    // 2^k by repeated doubling / halving is exact (IEEE 754 binary64, common practice); beyond the range 0 and Infinity
    let p = 1;
    for (let k = 0; k <= 1100; k++, p *= 2) expect(dm.twoTo(k)).toBe(p);
    p = 1;
    for (let k = 0; k >= -1100; k--, p /= 2) expect(dm.twoTo(k)).toBe(p);
    const bad: number[] = [];
    for (let k = -1200; k <= 1200; k++) if (!Object.is(dm.twoTo(k), dm.pow(2, k)) || !Object.is(dm.twoTo(k), dm.pow(0.5, -k))) bad.push(k);
    expect(bad).toEqual([]);
    expect([dm.twoTo(0.5), dm.twoTo(NaN), dm.twoTo(Infinity)].every((v) => Number.isNaN(v))).toBe(true);
  });

  it('twin: the check of twoTo sees an exponent off by one (a helper that returned 2^(k+1) fails it)', () => {
    const offByOne = (k: number): number => dm.twoTo(k + 1);
    let bad = 0;
    for (let k = -1200; k <= 1200; k++) if (!Object.is(offByOne(k), dm.pow(2, k))) bad++;
    expect(bad).toBeGreaterThan(2000);
  });

  it('ldexp (the port the build gives to @stdlib exp, pow, sin/cos/tan) returns the bits of @stdlib/math-base-special-ldexp on 200,000 pairs: normal and subnormal fractions, exponents over the whole range and beyond, and the special values', () => {
    const frac: number[] = [0, -0, NaN, Infinity, -Infinity, 1, -1, 5e-324, -5e-324, 2.2250738585072014e-308, 2.225073858507201e-308, 1.7976931348623157e308, 0.7071067811865476, 1.4142135623730951];
    for (let i = 0; i < 2_000; i++) {
      const m = 1 + u();
      frac.push(m * dm.twoTo(Math.floor(-1074 + 2098 * u())) * (u() < 0.5 ? -1 : 1)); // any binary exponent, subnormals included
    }
    const exps = [0, 1, -1, 52, -52, 1023, 1024, -1022, -1023, -1074, -1075, -1076, 2046, -2098, 3000, -3000];
    for (let i = 0; i < 84; i++) exps.push(Math.floor(-2200 + 4400 * u()));
    const bad: string[] = [];
    for (const f of frac) for (const e of exps) if (!Object.is(ldexp(f, e), stdlibLdexp(f, e))) bad.push(`ldexp(${f}, ${e}) = ${ldexp(f, e)}, @stdlib: ${stdlibLdexp(f, e)}`);
    expect(bad.slice(0, 5)).toEqual([]);
    expect(frac.length * exps.length).toBeGreaterThan(200_000);
  });

  it('twin: the ldexp comparison sees a port that rounds a subnormal result twice (frac·2^(exp+1)·2^-1 instead of one multiplication)', () => {
    const twice = (f: number, e: number): number => (e < -1022 ? ldexp(ldexp(f, e + 1), -1) : ldexp(f, e));
    let bad = 0;
    for (let i = 0; i < 20_000; i++) {
      const f = 1 + u();
      if (!Object.is(twice(f, -1070), stdlibLdexp(f, -1070))) bad++;
    }
    expect(bad).toBeGreaterThan(1_000);
  });

  it('log10 of the double nearest 10^k is k for k in [-307, 308] (the figure ticks floor it)', () => {
    // |log10(fl(10^k)) - k| <= 2^-53 / ln 10 < half an ulp of k for k != 0, so k is the correctly rounded value
    const bad: number[] = [];
    for (let k = -307; k <= 308; k++) if (dm.log10(Number(`1e${k}`)) !== k) bad.push(k);
    expect(bad).toEqual([]);
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

  it('special cases: every function gives the bits Math.* gives at ±0, and pow those of ** at ±0, ±Infinity, ±1, NaN (the ECMAScript specification fixes them exactly)', () => {
    // ECMAScript Number::exponentiate and Math.* special cases for ±0 are exact, so the engine is the reference here
    const unary: [string, (x: number) => number, (x: number) => number][] = [
      ['exp', dm.exp, Math.exp], ['log', dm.log, Math.log], ['log1p', dm.log1p, Math.log1p], ['expm1', dm.expm1, Math.expm1],
      ['sin', dm.sin, Math.sin], ['cos', dm.cos, Math.cos], ['tan', dm.tan, Math.tan], ['atan', dm.atan, Math.atan],
      ['tanh', dm.tanh, Math.tanh], ['sinh', dm.sinh, Math.sinh], ['cosh', dm.cosh, Math.cosh], ['asinh', dm.asinh, Math.asinh],
      ['log10', dm.log10, Math.log10],
    ];
    const bad: string[] = [];
    for (const [name, f, g] of unary) for (const z of [0, -0]) if (!Object.is(f(z), g(z))) bad.push(`${name}(${Object.is(z, -0) ? '-0' : '0'})`);
    // pow: the exact cases of ECMAScript's ** (Number::exponentiate): bases ±0, ±Infinity, ±1, NaN, and negative bases with |y| >= 2^53 (even integers)
    const ys = [0.3333, -0.6667, 2.5, -2.5, 1, -1, 2, -2, 3, -3, 4, -4, 5, -5, 6, -6, 0.5, -0.5, Infinity, -Infinity, 1e300, -1e300, 0, -0, NaN];
    for (const x of [0, -0, Infinity, -Infinity, 1, -1, NaN]) {
      for (const y of ys) if (!Object.is(dm.pow(x, y), Math.pow(x, y))) bad.push(`pow(${Object.is(x, -0) ? '-0' : x}, ${y}) = ${dm.pow(x, y)}`);
    }
    for (const x of [-2, -0.5, -Number.MAX_VALUE, -Number.MIN_VALUE]) {
      for (const y of [2 ** 53, -(2 ** 53), 1e300, -1e300, Infinity, -Infinity]) if (!Object.is(dm.pow(x, y), Math.pow(x, y))) bad.push(`pow(${x}, ${y}) = ${dm.pow(x, y)}`);
    }
    expect(bad).toEqual([]);
  });

  it('twin: the ulp measure sees a one-ulp and a large difference', () => {
    expect(ulps(1, 1 + Number.EPSILON)).toBe(1);
    expect(ulps(dm.exp(1), 2.7)).toBeGreaterThan(1e12);
  });
});

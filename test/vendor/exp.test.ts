/**
 * The vendored `exp` and `expm1` must return the same bits as `@stdlib/math-base-special-exp`
 * (FDLIBM's e_exp.c in pure JavaScript) for every input: it performs the same
 * operations and only replaces the final ldexp(y, k) by a multiplication with
 * a tabulated 2^k where both are y·2^k rounded once. The reference is the
 * @stdlib package itself, imported directly (its own ldexp, not the build's).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import stdlibExp from '@stdlib/math-base-special-exp';
import stdlibExpm1 from '@stdlib/math-base-special-expm1';
import { exp } from '../../src/vendor/math/exp.js';
import { expm1 } from '../../src/vendor/math/expm1.js';

const same = (x: number): boolean => Object.is(exp(x), stdlibExp(x));

describe('exp (vendored)', () => {
  it('equals the @stdlib exp bit for bit at the branch boundaries, the subnormal and overflow ends and special values', () => {
    const edges = [0, -0, 5e-324, -5e-324, 3.725290298461914e-9, -3.725290298461914e-9, 3.7252902984619136e-9, 3.7252902984619145e-9, 1, -1, 0.34657359027997264, -0.34657359027997264,
      709.782712893384, 709.7827128933839, 709.78, 709.7827128933841, -745.1332191019411, -745.1332191019412, -745.13, -744.44, -708.3964185322641, -708.39, -708.4, -709, -720, -730, -740,
      708.4, 709.4, 709.7, 1e-300, 1e300, -1e300, Infinity, -Infinity, NaN];
    for (const x of edges) expect(same(x), `x = ${x}`).toBe(true);
  });

  it('equals the @stdlib exp bit for bit on random inputs across the whole range, near 0 and near both ends (property)', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.double({ min: -746, max: 710, noNaN: true }),
          fc.double({ min: -40, max: 40, noNaN: true }),
          fc.double({ min: -1e-6, max: 1e-6, noNaN: true }),
          fc.double({ min: -746, max: -700, noNaN: true }),
          fc.double({ min: 700, max: 710, noNaN: true }),
        ),
        same,
      ),
      { numRuns: 200000, seed: 2026 },
    );
  });

  it('equals it on every k of the argument reduction (a grid through each interval [k − 1/2, k + 1/2]·ln 2)', () => {
    let bad = 0;
    for (let k = -1076; k <= 1025; k++) for (let j = -8; j <= 8; j++) if (!same((k + j / 16) * Math.LN2)) bad++;
    expect(bad).toBe(0);
  });

  it('twin: the bit-for-bit check sees a one-ulp change (the comparison is not vacuous)', () => {
    const x = -0.7;
    const nudged = exp(x) * (1 + 2 ** -52);
    expect(Object.is(nudged, stdlibExp(x))).toBe(false);
  });
});

const sameM1 = (x: number): boolean => Object.is(expm1(x), stdlibExpm1(x));

describe('expm1 (vendored)', () => {
  it('equals the @stdlib expm1 bit for bit at the branch boundaries (0.5·ln 2, 1.5·ln 2, 56·ln 2, 2^-54, k = 20, k = 56, k = 1024) and special values', () => {
    const ln2 = Math.LN2;
    const edges = [0, -0, 5e-324, -5e-324, 5.551115123125783e-17, -5.551115123125783e-17, 5.551115123125782e-17, 5.551115123125784e-17, 0.34657359027997264, -0.34657359027997264,
      0.3465735902799727, -0.3465735902799727, 1.039720770839918, -1.039720770839918, 1.0397207708399179, 1.0397207708399183, -0.25, 38.816242111356935, -38.816242111356935,
      38.81624211135693, -38.81624211135693, 19.5 * ln2, 20.5 * ln2, 56.4 * ln2, 56.6 * ln2, -56.4 * ln2, 709.782712893384, 709.7827128933839, 709.7827128933841, 709.7, 709.5,
      1023.9 * ln2, 1e-300, 1e300, -1e300, Infinity, -Infinity, NaN];
    for (const x of edges) expect(sameM1(x), `x = ${x}`).toBe(true);
  });

  it('equals the @stdlib expm1 bit for bit on random inputs across the whole range and near 0 (property)', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.double({ min: -50, max: 710, noNaN: true }),
          fc.double({ min: -3, max: 3, noNaN: true }),
          fc.double({ min: -1e-6, max: 1e-6, noNaN: true }),
          fc.double({ min: 700, max: 710, noNaN: true }),
          fc.double({ noNaN: true }),
        ),
        sameM1,
      ),
      { numRuns: 200000, seed: 2027 },
    );
  });

  it('equals it on every k of the argument reduction (a grid through each interval [k − 1/2, k + 1/2]·ln 2)', () => {
    let bad = 0;
    for (let k = -60; k <= 1025; k++) for (let j = -8; j <= 8; j++) if (!sameM1((k + j / 16) * Math.LN2)) bad++;
    expect(bad).toBe(0);
  });

  it('twin: the bit-for-bit check sees a one-ulp change (the comparison is not vacuous)', () => {
    const x = -0.7;
    const nudged = expm1(x) * (1 + 2 ** -52);
    expect(Object.is(nudged, stdlibExpm1(x))).toBe(false);
  });
});

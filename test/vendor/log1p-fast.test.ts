/**
 * `log1pFast` must return the same bits as the vendored FDLIBM log1p
 * (`@stdlib/math-base-special-log1p`) for every input: it only writes out
 * one branch of the same algorithm so that an engine can inline it.
 * The reference is the @stdlib package itself, imported directly.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import stdlibLog1p from '@stdlib/math-base-special-log1p';
import { log1pFast } from '../../src/vendor/math/log1p-fast.js';

const same = (x: number): boolean => Object.is(log1pFast(x), stdlibLog1p(x));

describe('log1pFast', () => {
  it('equals the @stdlib log1p bit for bit on the branch boundaries and special values', () => {
    const edges = [-1, -0.9999999999999999, -0.5, -0.29289321881345254, -0.2928932188134524, -0.2928932188134525, 0.41421356237309503, 0.414213562373095, 0.4142135623730951,
      1.862645149230957e-9, 1.8626451492309568e-9, -1.862645149230957e-9, -1.8626451492309568e-9, 0, -0, 5e-324, -5e-324, 1, 1e300, Infinity, -Infinity, NaN, -2];
    for (const x of edges) expect(same(x), `x = ${x}`).toBe(true);
  });

  it('equals the @stdlib log1p bit for bit on random inputs across (-1, 10) and at tiny |x| (property)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.double({ min: -1, max: 10, noNaN: true }), fc.double({ min: -1e-6, max: 1e-6, noNaN: true }), fc.double({ min: -0.3, max: 0.42, noNaN: true })), same),
      { numRuns: 100000, seed: 2026 },
    );
  });

  it('equals it on a dense grid of the sampling kernels\' inputs, -u·q for u, q in [0, 1)', () => {
    let bad = 0;
    for (let i = 0; i < 2000; i++) for (let j = 1; j <= 50; j++) if (!same(-(i / 2000) * (j / 50) * 0.999)) bad++;
    expect(bad).toBe(0);
  });

  it('twin: the bit-for-bit check sees a one-ulp change (the comparison is not vacuous)', () => {
    const x = -0.1;
    const nudged = log1pFast(x) * (1 + 2 ** -52);
    expect(Object.is(nudged, stdlibLog1p(x))).toBe(false);
  });
});

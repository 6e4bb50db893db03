/** x^y: `@stdlib/math-base-special-pow` (pure JavaScript, IEEE basic arithmetic only; bundled). @internal @packageDocumentation */
import impl from '@stdlib/math-base-special-pow';

/** 2^53: every double at least this large in magnitude is an even integer. */
const TWO_53 = 9007199254740992;

/**
 * x^y, the same bits on every engine, with the special cases of ECMAScript's
 * `**` (which the core's `a ** b` became). @internal
 *
 * @remarks
 * Version 0.3.1 of the package gets some exact cases wrong, so they are
 * decided here and the package is called for the rest: a base of −0 or
 * −Infinity (it tests the high word for zero and misses −0: pow(−0, 0.3333)
 * gave 1.1e-108 and pow(−0, −0.6667) 8.9e215 instead of 0 and Infinity), a
 * negative base with |y| ≥ 2^53 (it took such y for odd: pow(−1, 1e300)
 * gave −1), and the cases where ECMAScript differs from C99 (`NaN ** 0` is
 * 1, `1 ** Infinity` is NaN).
 */
export const pow = (x: number, y: number): number => {
  if (y === 0) return 1;
  if (x !== x || y !== y) return NaN;
  if (y - y !== 0) return x === 1 || x === -1 ? NaN : impl(Math.abs(x), y);
  if (x === 0 || x - x !== 0) {
    // ±0 and ±Infinity: the magnitude of the +0 / +Infinity case, negative exactly for a negative base and an odd integer y
    const r = impl(x === 0 ? 0 : Infinity, y);
    return (x < 0 || 1 / x < 0) && Number.isInteger(y) && y % 2 !== 0 ? -r : r;
  }
  return x < 0 && (y >= TWO_53 || y <= -TWO_53) ? impl(-x, y) : impl(x, y);
};

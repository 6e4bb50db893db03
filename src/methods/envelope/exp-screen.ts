/**
 * A cheap lower bound of exp for screening acceptance tests of the sampling
 * kernels (hull and piecewise). @internal
 *
 * @packageDocumentation
 */
const SIXTH = 1 / 6;

/**
 * A lower bound of exp(y) without a transcendental call, for screening the
 * squeeze test: 1 + y + y²/2 + y³/6 − 1e-15. For every real y the cubic is at
 * most exp(y) (the Taylor remainder y⁴·e^ξ/24 is not negative), and the
 * margin 1e-15 exceeds the rounding of the cubic and of the vendored exp near
 * 1 (a few ulps of 1, 2.2e-16 each), so `u < expScreen(y)` implies
 * `u < exp(y)`: the kernel takes the same decisions, and gives the same draws,
 * as with exp alone, and calls exp only when the screen fails (about y⁴/24 of
 * the squeeze passes, plus the rejections of the screen). Checked against
 * the vendored exp in test/methods/envelope/exp-screen.test.ts.
 * @internal
 */
export function expScreen(y: number): number {
  return 1 + y * (1 + y * (0.5 + y * SIXTH)) - 1e-15;
}

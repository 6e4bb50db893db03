/**
 * Beta target.
 *
 * @packageDocumentation
 */
import { betaCdf, betaln } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import type { PoleTarget } from './end-distance.js';
import { log, log1p, pow } from '../vendor/math.js';

/** The largest double below 1. */
const ONE_BELOW = /* @__PURE__ */ (() => 1 - pow(2, -53))();

/**
 * The beta distribution Beta(a, b) (density x^(a−1) (1−x)^(b−1) / B(a, b) on
 * (0, 1)) as a {@link FamilyTarget}.
 *
 * @remarks
 * The log-density `(a − 1)·log x + (b − 1)·log1p(−x) − lnB(a, b)` is computed
 * by exactdraw in log space with `@stdlib/math-base-special-betaln`.
 *
 * Ends of the support `[0, 1]`: where the exponent of an end is 0 (a = 1 at
 * x = 0, b = 1 at x = 1) the density is finite and nonzero there and gets its
 * exact value (e.g. `logDensity(0) = log b` when a = 1). Where the exponent
 * is positive the density is 0 there (`-Infinity`). Where it is negative
 * (a < 1 at 0, b < 1 at 1) the true density is unbounded; since the
 * {@link Target} contract forbids `+Infinity`, exactdraw's convention is to
 * treat that end as open and return `-Infinity` at the single point (which
 * has probability 0). Every interior point gets its correct value.
 *
 * Mode hint: `(a − 1)/(a + b − 2)` when a > 1 and b > 1 (kept on the
 * nearest double inside (0, 1) if it would round onto an end); 0.5 for a = b = 1
 * (uniform: every point is a mode); 0 when a ≤ 1 ≤ b (decreasing density)
 * and 1 when b ≤ 1 ≤ a (increasing density) — when the exponent at that end
 * is negative the hint marks the end where the density is unbounded, not a
 * finite maximum; absent for a < 1 and b < 1 (U-shaped, unbounded at both ends).
 *
 * `dLogDensity(x) = (a − 1)/x − (b − 1)/(1 − x)`, with the one-sided limit at
 * x = 0 and x = 1 and NaN outside [0, 1].
 *
 * Poles: where an exponent is negative the target declares the unbounded
 * end(s) in `poles` (see {@link PoleTarget}), and gives
 * `logDensityFromUpper(d)` = log f(1 − d) and its derivative computed from
 * the distance d = 1 − x itself (`log1p(−d)` and `log d`), so that the change
 * of variables of {@link exactSampler} keeps full resolution near 1, where
 * the doubles x are spaced by 1.1e-16.
 *
 * `cdf` is `@stdlib/stats-base-dists-beta-cdf`; `sf(x)` is the beta cdf of
 * `1 − x` with the parameters swapped (accurate near x = 1).
 *
 * @param a - first shape parameter, a finite number > 0
 * @param b - second shape parameter, a finite number > 0
 * @returns the target, with support `[0, 1]`
 * @throws {@link InvalidTargetError} when `a` or `b` is not a finite number > 0
 * @example
 * ```ts
 * const t = betaTarget(2, 5);
 * t.mode; // 0.2
 * ```
 */
export function betaTarget(a: number, b: number): FamilyTarget & PoleTarget {
  const api = 'betaTarget';
  checkPositive(api, 'a', a);
  checkPositive(api, 'b', b);
  const am1 = a - 1;
  const bm1 = b - 1;
  const c = -betaln(a, b);
  const atZero = a === 1 ? c : -Infinity;
  const atOne = b === 1 ? c : -Infinity;
  const dAtZero = a > 1 ? Infinity : a < 1 ? -Infinity : -bm1;
  const dAtOne = b > 1 ? -Infinity : b < 1 ? Infinity : am1;
  let mode: number | undefined;
  // When a or b is barely above 1 the interior mode can round onto an end,
  // where the density is 0: keep the hint on the nearest interior double.
  if (a > 1 && b > 1) mode = Math.min(ONE_BELOW, Math.max(Number.MIN_VALUE, am1 / (am1 + bm1)));
  else if (a < 1 && b < 1) mode = undefined;
  else if (a === 1 && b === 1) mode = 0.5;
  else if (a <= 1 && b >= 1) mode = 0;
  else mode = 1; // b <= 1 <= a
  const target: FamilyTarget & PoleTarget = {
    logDensity(x: number): number {
      if (x > 0 && x < 1) {
        return (am1 === 0 ? 0 : am1 * log(x)) + (bm1 === 0 ? 0 : bm1 * log1p(-x)) + c;
      }
      if (x === 0) return atZero;
      if (x === 1) return atOne;
      return x !== x ? NaN : -Infinity;
    },
    dLogDensity(x: number): number {
      if (x > 0 && x < 1) return am1 / x - bm1 / (1 - x);
      if (x === 0) return dAtZero;
      if (x === 1) return dAtOne;
      return NaN;
    },
    support: [0, 1] as const,
    ...(a < 1 || b < 1 ? { poles: a < 1 && b < 1 ? ('both' as const) : a < 1 ? ('lower' as const) : ('upper' as const) } : {}),
    logDensityFromUpper(d: number): number {
      if (d > 0 && d < 1) return (am1 === 0 ? 0 : am1 * log1p(-d)) + (bm1 === 0 ? 0 : bm1 * log(d)) + c;
      if (d === 0) return atOne;
      if (d === 1) return atZero;
      return d !== d ? NaN : -Infinity;
    },
    dLogDensityFromUpper(d: number): number {
      if (d > 0 && d < 1) return am1 / (1 - d) - bm1 / d;
      if (d === 0) return dAtOne;
      if (d === 1) return dAtZero;
      return NaN;
    },
    cdf(x: number): number {
      if (x !== x) return NaN;
      if (x <= 0) return 0;
      if (x >= 1) return 1;
      return betaCdf(x, a, b);
    },
    sf(x: number): number {
      if (x !== x) return NaN;
      if (x <= 0) return 1;
      if (x >= 1) return 0;
      return betaCdf(1 - x, b, a);
    },
  };
  if (mode !== undefined) return { ...target, mode };
  return target;
}

/**
 * Types of the ready-made targets.
 *
 * @packageDocumentation
 */
import type { Target } from '../core/types.js';

/**
 * A {@link Target} that may also carry a survival function.
 *
 * @remarks
 * `sf` is an exactdraw extension, not part of the {@link Target} contract:
 * samplers ignore it. {@link truncate} uses it to renormalise the cdf
 * accurately when the truncation interval lies in the upper tail, where
 * `1 − cdf(x)` has lost all its digits.
 */
export interface SurvivalTarget extends Target {
  /** Optional survival function `1 − cdf(x)`, computed without cancellation in the upper tail. */
  sf?(x: number): number;
}

/**
 * A target built by one of the ready-made factories ({@link normalTarget},
 * {@link gammaTarget}, {@link betaTarget}, {@link studentTTarget},
 * {@link logisticTarget}): every optional member of {@link Target} is
 * present except, for some parameters, `mode`.
 *
 * @remarks
 * `logDensity` is normalized. `dLogDensity` returns the one-sided limit at a
 * finite end of the support and `NaN` strictly outside the support.
 */
export interface FamilyTarget extends SurvivalTarget {
  /** Normalized log-density; `-Infinity` outside the support. */
  logDensity(x: number): number;
  /** Derivative of `logDensity`; one-sided limit at a finite end of the support, `NaN` outside it. */
  dLogDensity(x: number): number;
  /** Support `[lower, upper]`. */
  readonly support: readonly [number, number];
  /** Normalized cumulative distribution function. */
  cdf(x: number): number;
  /** Survival function `1 − cdf(x)`, accurate in the upper tail (exactdraw extension). */
  sf(x: number): number;
}

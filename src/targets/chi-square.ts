/**
 * Chi-square target.
 *
 * @packageDocumentation
 */
import { chisquareCdf } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import type { PoleTarget } from './end-distance.js';
import { gammaTarget } from './gamma.js';
import { lowerRegularizedGamma } from './_internals/gamma-series.js';

/**
 * Degrees of freedom from which {@link chiSquareTarget} computes its cdf
 * with exactdraw's incomplete gamma series (shape df/2 ≥ 100) instead of
 * `@stdlib/stats-base-dists-chisquare-cdf`, which shares the inaccuracy of
 * the `@stdlib` gamma cdf at large shapes.
 *
 * @example
 * ```ts
 * chiSquareTarget(CHI_SQUARE_SERIES_MIN_DF).cdf(200); // from the series
 * ```
 */
export const CHI_SQUARE_SERIES_MIN_DF = 200;

/**
 * The chi-square distribution with `df` degrees of freedom (the gamma
 * distribution with shape df/2 and rate 1/2) as a {@link FamilyTarget}.
 *
 * @remarks
 * `logDensity`, `dLogDensity`, the mode hint, the convention at x = 0 and
 * `sf` are those of {@link gammaTarget}`(df/2, 1/2)`. For df < 2 the
 * density is unbounded at 0 (chi-square(1) is the square of a standard
 * normal): the target then declares `poles: 'lower'` (see
 * {@link PoleTarget}) and {@link exactSampler} samples log X.
 *
 * `cdf` is `@stdlib/stats-base-dists-chisquare-cdf` for df <
 * {@link CHI_SQUARE_SERIES_MIN_DF}; from there on (gamma shape ≥ 100) it is
 * the regularized incomplete gamma P(df/2, x/2) of exactdraw's series,
 * because the `@stdlib` gamma cdf is measured wrong at shapes ≥ 1000 (see
 * DEVELOPERS.md).
 *
 * @param df - degrees of freedom, a finite number > 0 (not necessarily an integer)
 * @returns the target, with support `[0, Infinity]`
 * @throws {@link InvalidTargetError} when `df` is not a finite number > 0
 * @example
 * ```ts
 * const t = chiSquareTarget(3);
 * t.cdf(7.814727903251178); // ≈ 0.95
 * ```
 */
export function chiSquareTarget(df: number): FamilyTarget & PoleTarget {
  const api = 'chiSquareTarget';
  checkPositive(api, 'df', df);
  const g = gammaTarget(df / 2, 0.5);
  const shape = df / 2;
  const series = df >= CHI_SQUARE_SERIES_MIN_DF;
  return {
    logDensity: g.logDensity,
    dLogDensity: g.dLogDensity,
    support: g.support,
    ...(g.mode !== undefined ? { mode: g.mode } : {}),
    ...(df < 2 ? { poles: 'lower' as const } : {}),
    cdf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 0;
      return series ? lowerRegularizedGamma(shape, x / 2) : chisquareCdf(x, df);
    },
    sf: g.sf,
  };
}

/**
 * Inverse-gamma target.
 *
 * @packageDocumentation
 */
import { gammaln, invgammaCdf } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { GAMMA_SERIES_MIN_SHAPE } from './gamma.js';
import { lowerRegularizedGamma, upperRegularizedGamma } from './_internals/gamma-series.js';
import { log } from '../vendor/math.js';

/**
 * The inverse-gamma distribution with shape `shape` (α) and scale `scale`
 * (β): 1/X ~ gamma(α, rate β), density β^α x^(−α−1) e^(−β/x) / Γ(α) on
 * x > 0, as a {@link FamilyTarget}. The conjugate prior of a normal
 * variance.
 *
 * @remarks
 * `logDensity(x) = α·log β − lnΓ(α) − (α + 1)·log x − β/x` (`-Infinity` at 0,
 * where the density tends to 0); `dLogDensity(x) = −(α + 1)/x + β/x²`
 * (+Infinity at 0, the one-sided limit). The mode hint is β/(α + 1). The
 * upper tail decays like x^(−α−1): heavy for small α.
 *
 * CDF: P(X ≤ x) = Q(α, β/x), the upper regularized incomplete gamma:
 * `@stdlib/stats-base-dists-invgamma-cdf` for α < {@link GAMMA_SERIES_MIN_SHAPE},
 * exactdraw's series / continued fraction from there on (the `@stdlib` gamma
 * functions are measured wrong at shapes ≥ 1000, see DEVELOPERS.md).
 * `sf(x) = P(α, β/x)` from the same series (accurate in the upper tail).
 *
 * @param shape - shape α, a finite number > 0
 * @param scale - scale β, a finite number > 0
 * @defaultValue scale = 1
 * @returns the target, with support `[0, Infinity]`
 * @throws {@link InvalidTargetError} when `shape` or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const t = inverseGammaTarget(3, 2);
 * t.mode; // 0.5
 * ```
 */
export function inverseGammaTarget(shape: number, scale: number = 1): FamilyTarget {
  const api = 'inverseGammaTarget';
  checkPositive(api, 'shape', shape);
  checkPositive(api, 'scale', scale);
  const c = shape * log(scale) - gammaln(shape);
  const ap1 = shape + 1;
  const useSeries = shape >= GAMMA_SERIES_MIN_SHAPE;
  return {
    logDensity(x: number): number {
      if (x > 0) return x === Infinity ? -Infinity : c - ap1 * log(x) - scale / x;
      if (x === 0) return -Infinity;
      return x < 0 ? -Infinity : NaN;
    },
    dLogDensity(x: number): number {
      if (x > 0) return (-ap1 + scale / x) / x;
      if (x === 0) return Infinity;
      return NaN;
    },
    support: [0, Infinity] as const,
    mode: scale / ap1,
    cdf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 0;
      return useSeries ? upperRegularizedGamma(shape, scale / x) : invgammaCdf(x, shape, scale);
    },
    sf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 1;
      return lowerRegularizedGamma(shape, scale / x);
    },
  };
}

/**
 * Lognormal target.
 *
 * @packageDocumentation
 */
import { lognormalCdf, normalCdf } from '../vendor/stdlib.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { exp, log } from '../vendor/math.js';

/** log(2π) / 2. */
const HALF_LOG_2PI = 0.9189385332046728;

/**
 * The lognormal distribution: log X ~ N(mu, sigma²), as a
 * {@link FamilyTarget}.
 *
 * @remarks
 * With z = (log x − mu)/sigma: `logDensity(x) = −z²/2 − log x − log(sigma) −
 * log(2π)/2` for x > 0 (−Infinity at 0, where the density tends to 0);
 * `dLogDensity(x) = −(1 + z/sigma)/x` (+Infinity at 0, the one-sided limit).
 * The mode hint is e^(mu − sigma²). `cdf` is
 * `@stdlib/stats-base-dists-lognormal-cdf`; `sf(x)` is the normal cdf at −z
 * (accurate in the upper tail).
 *
 * @param mu - mean of log X, a finite number
 * @param sigma - standard deviation of log X, a finite number > 0
 * @defaultValue mu = 0, sigma = 1
 * @returns the target, with support `[0, Infinity]`
 * @throws {@link InvalidTargetError} when `mu` is not finite or `sigma` is not a finite number > 0
 * @example
 * ```ts
 * const t = lognormalTarget(0, 0.5);
 * t.cdf(1); // 0.5 (the median is e^mu)
 * ```
 */
export function lognormalTarget(mu: number = 0, sigma: number = 1): FamilyTarget {
  const api = 'lognormalTarget';
  checkFinite(api, 'mu', mu);
  checkPositive(api, 'sigma', sigma);
  const c = -log(sigma) - HALF_LOG_2PI;
  const mode = exp(mu - sigma * sigma);
  return {
    logDensity(x: number): number {
      if (x > 0) {
        if (x === Infinity) return -Infinity;
        const lx = log(x);
        const z = (lx - mu) / sigma;
        return -0.5 * z * z - lx + c;
      }
      if (x === 0) return -Infinity;
      return x < 0 ? -Infinity : NaN;
    },
    dLogDensity(x: number): number {
      if (x > 0) return -(1 + (log(x) - mu) / (sigma * sigma)) / x;
      if (x === 0) return Infinity;
      return NaN;
    },
    support: [0, Infinity] as const,
    ...(mode > 0 && Number.isFinite(mode) ? { mode } : {}),
    cdf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 0;
      return lognormalCdf(x, mu, sigma);
    },
    sf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 1;
      return normalCdf((mu - log(x)) / sigma, 0, 1);
    },
  };
}

/**
 * Normal (Gaussian) target.
 *
 * @packageDocumentation
 */
import { normalCdf } from '../vendor/stdlib.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { log } from '../vendor/math.js';

/** log(2π) / 2. */
const HALF_LOG_2PI = 0.9189385332046728;

/**
 * The normal distribution N(mean, sd²) as a {@link FamilyTarget}.
 *
 * @remarks
 * Everything is computed in standardized form z = (x − mean) / sd, so means
 * up to ±1e9 and standard deviations from 1e-9 to 1e9 work:
 * `logDensity(x) = −z²/2 − log(sd) − log(2π)/2`, `dLogDensity(x) = −z / sd`.
 * `cdf` is `@stdlib/stats-base-dists-normal-cdf` at z (accurate in the lower
 * tail); `sf(x)` is the same function at −z (accurate in the upper tail).
 * The mode hint is `mean`.
 *
 * @param mean - location, a finite number
 * @param sd - standard deviation, a finite number > 0
 * @returns the target, with support `[-Infinity, Infinity]`
 * @throws {@link InvalidTargetError} when `mean` is not finite or `sd` is not a finite number > 0
 * @example
 * ```ts
 * const t = normalTarget(10, 2);
 * t.logDensity(10); // −log(2) − log(2π)/2
 * ```
 */
export function normalTarget(mean: number, sd: number): FamilyTarget {
  const api = 'normalTarget';
  checkFinite(api, 'mean', mean);
  checkPositive(api, 'sd', sd);
  const logSd = log(sd);
  const c = -logSd - HALF_LOG_2PI;
  return {
    logDensity(x: number): number {
      const z = (x - mean) / sd;
      return -0.5 * z * z + c;
    },
    dLogDensity(x: number): number {
      return -(x - mean) / sd / sd;
    },
    support: [-Infinity, Infinity] as const,
    mode: mean,
    cdf(x: number): number {
      return normalCdf((x - mean) / sd, 0, 1);
    },
    sf(x: number): number {
      return normalCdf((mean - x) / sd, 0, 1);
    },
  };
}

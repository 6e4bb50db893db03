/**
 * Gumbel (type I extreme value, for maxima) target.
 *
 * @packageDocumentation
 */
import { gumbelCdf } from '../vendor/stdlib.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { exp, expm1, log } from '../vendor/math.js';

/**
 * The Gumbel distribution for maxima with location `location` and scale
 * `scale` (density e^(−z − e^(−z)) / scale, z = (x − location)/scale) as a
 * {@link FamilyTarget}. It is log-concave.
 *
 * @remarks
 * `logDensity(x) = −z − e^(−z) − log(scale)` (−Infinity once e^(−z)
 * overflows, far in the lower tail, where the density is below 1e-300);
 * `dLogDensity(x) = expm1(−z)/scale`. The mode hint is `location`. `cdf` is
 * `@stdlib/stats-base-dists-gumbel-cdf`; `sf(x) = −expm1(−e^(−z))` (accurate
 * in the upper tail).
 *
 * @param location - location (mode), a finite number
 * @param scale - scale, a finite number > 0
 * @defaultValue location = 0, scale = 1
 * @returns the target, with support `[-Infinity, Infinity]`
 * @throws {@link InvalidTargetError} when `location` is not finite or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const t = gumbelTarget(0, 1);
 * t.cdf(0); // e^(−1) ≈ 0.3679
 * ```
 */
export function gumbelTarget(location: number = 0, scale: number = 1): FamilyTarget {
  const api = 'gumbelTarget';
  checkFinite(api, 'location', location);
  checkPositive(api, 'scale', scale);
  const logScale = log(scale);
  return {
    logDensity(x: number): number {
      const z = (x - location) / scale;
      if (z !== z) return NaN;
      const e = exp(-z);
      return e === Infinity ? -Infinity : -z - e - logScale;
    },
    dLogDensity(x: number): number {
      return expm1(-(x - location) / scale) / scale;
    },
    support: [-Infinity, Infinity] as const,
    mode: location,
    cdf(x: number): number {
      return gumbelCdf(x, location, scale);
    },
    sf(x: number): number {
      return -expm1(-exp(-(x - location) / scale));
    },
  };
}

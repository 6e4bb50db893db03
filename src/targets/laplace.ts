/**
 * Laplace (double exponential) target.
 *
 * @packageDocumentation
 */
import { laplaceCdf } from '../vendor/stdlib.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { log } from '../vendor/math.js';

/**
 * The Laplace distribution with location `location` and scale `scale`
 * (density e^(−|x − location|/scale) / (2·scale)) as a {@link FamilyTarget}.
 * It is log-concave, with a kink at the location.
 *
 * @remarks
 * With z = (x − location)/scale: `logDensity(x) = −|z| − log(2·scale)`;
 * `dLogDensity(x) = −sign(z)/scale`, and 0 at z = 0 (a supergradient: the
 * tangent of slope 0 at the kink lies above log f, as tangent hulls need).
 * The mode hint is `location`. `cdf` is
 * `@stdlib/stats-base-dists-laplace-cdf` at z; `sf(x)` is the same function at
 * −z (accurate in the upper tail).
 *
 * @param location - location (median), a finite number
 * @param scale - scale, a finite number > 0
 * @defaultValue location = 0, scale = 1
 * @returns the target, with support `[-Infinity, Infinity]`
 * @throws {@link InvalidTargetError} when `location` is not finite or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const t = laplaceTarget(1, 2);
 * t.cdf(1); // 0.5
 * ```
 */
export function laplaceTarget(location: number = 0, scale: number = 1): FamilyTarget {
  const api = 'laplaceTarget';
  checkFinite(api, 'location', location);
  checkPositive(api, 'scale', scale);
  const c = -log(2 * scale);
  return {
    logDensity(x: number): number {
      return -Math.abs((x - location) / scale) + c;
    },
    dLogDensity(x: number): number {
      if (x !== x) return NaN;
      return x > location ? -1 / scale : x < location ? 1 / scale : 0;
    },
    support: [-Infinity, Infinity] as const,
    mode: location,
    cdf(x: number): number {
      return laplaceCdf((x - location) / scale, 0, 1);
    },
    sf(x: number): number {
      return laplaceCdf((location - x) / scale, 0, 1);
    },
  };
}

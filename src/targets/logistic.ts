/**
 * Logistic target.
 *
 * @packageDocumentation
 */
import { logisticCdf } from '../vendor/stdlib.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { exp, log, log1p, tanh } from '../vendor/math.js';

/**
 * The logistic distribution with location `location` and scale `scale` as a
 * {@link FamilyTarget}. It is log-concave.
 *
 * @remarks
 * With z = (x − location)/scale the log-density is evaluated in the form
 * `−|z| − 2·log1p(exp(−|z|)) − log(scale)`, which neither overflows nor
 * cancels for large |z|. `dLogDensity(x) = −tanh(z/2)/scale`. The mode hint
 * is `location`. `cdf` is `@stdlib/stats-base-dists-logistic-cdf` at z;
 * `sf(x)` is the same function at −z (accurate in the upper tail).
 *
 * @param location - location, a finite number
 * @param scale - scale, a finite number > 0
 * @defaultValue location = 0, scale = 1
 * @returns the target, with support `[-Infinity, Infinity]`
 * @throws {@link InvalidTargetError} when `location` is not finite or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const t = logisticTarget(2, 0.5);
 * ```
 */
export function logisticTarget(location: number = 0, scale: number = 1): FamilyTarget {
  const api = 'logisticTarget';
  checkFinite(api, 'location', location);
  checkPositive(api, 'scale', scale);
  const logScale = log(scale);
  return {
    logDensity(x: number): number {
      const az = Math.abs((x - location) / scale);
      return -az - 2 * log1p(exp(-az)) - logScale;
    },
    dLogDensity(x: number): number {
      return -tanh((x - location) / scale / 2) / scale;
    },
    support: [-Infinity, Infinity] as const,
    mode: location,
    cdf(x: number): number {
      return logisticCdf((x - location) / scale, 0, 1);
    },
    sf(x: number): number {
      return logisticCdf((location - x) / scale, 0, 1);
    },
  };
}

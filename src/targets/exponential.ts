/**
 * Exponential target.
 *
 * @packageDocumentation
 */
import { exponentialCdf } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { exp, log } from '../vendor/math.js';

/**
 * The exponential distribution with rate `rate` (density rate·e^(−rate·x) on
 * x ≥ 0) as a {@link FamilyTarget}. It is log-concave.
 *
 * @remarks
 * `logDensity(x) = log(rate) − rate·x` for x ≥ 0 (the end 0 is included,
 * where the density is `rate`); `dLogDensity(x) = −rate`. The mode hint is 0.
 * `cdf` is `@stdlib/stats-base-dists-exponential-cdf`; `sf(x) = e^(−rate·x)`
 * (accurate in the far upper tail).
 *
 * @param rate - rate (inverse mean), a finite number > 0
 * @defaultValue rate = 1
 * @returns the target, with support `[0, Infinity]`
 * @throws {@link InvalidTargetError} when `rate` is not a finite number > 0
 * @example
 * ```ts
 * const t = exponentialTarget(2); // mean 0.5
 * t.cdf(Math.LN2 / 2);            // 0.5
 * ```
 */
export function exponentialTarget(rate: number = 1): FamilyTarget {
  const api = 'exponentialTarget';
  checkPositive(api, 'rate', rate);
  const logRate = log(rate);
  return {
    logDensity(x: number): number {
      if (x >= 0) return x === Infinity ? -Infinity : logRate - rate * x;
      return x < 0 ? -Infinity : NaN;
    },
    dLogDensity(x: number): number {
      return x >= 0 ? -rate : NaN;
    },
    support: [0, Infinity] as const,
    mode: 0,
    cdf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 0;
      return exponentialCdf(x, rate);
    },
    sf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 1;
      return exp(-rate * x);
    },
  };
}

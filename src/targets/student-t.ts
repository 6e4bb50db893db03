/**
 * Student's t target.
 *
 * @packageDocumentation
 */
import { betaln, tCdf } from '../vendor/stdlib.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { log, log1p } from '../vendor/math.js';

/** |z| above which z² is not formed (it would overflow long before 1e154). */
const BIG_Z = 1e100;

/**
 * Student's t distribution with `df` degrees of freedom, location
 * `location` and scale `scale` as a {@link FamilyTarget}.
 *
 * @remarks
 * With z = (x − location)/scale the log-density is
 * `−log(scale) − log(df)/2 − lnB(1/2, df/2) − (df + 1)/2 · log1p(z²/df)`,
 * computed by exactdraw with `@stdlib/math-base-special-betaln` (the beta
 * function form stays accurate for large df, where a difference of two
 * lnΓ values would cancel). For |z| > 1e100 the log1p term is rewritten as
 * `2 log|z| − log df + log1p(df/z²)` so that it never overflows.
 * `dLogDensity(x) = −(df + 1)/(scale · (df/z + z))`. The mode hint is
 * `location`. Heavy tailed: not log-concave.
 * `cdf` is `@stdlib/stats-base-dists-t-cdf` at z; `sf(x)` is the same
 * function at −z (accurate in the upper tail).
 *
 * @param df - degrees of freedom, a finite number > 0
 * @param location - location, a finite number
 * @param scale - scale, a finite number > 0
 * @defaultValue location = 0, scale = 1
 * @returns the target, with support `[-Infinity, Infinity]`
 * @throws {@link InvalidTargetError} when a parameter is out of range
 * @example
 * ```ts
 * const t = studentTTarget(3);        // standard t with 3 degrees of freedom
 * const u = studentTTarget(5, 10, 2); // location 10, scale 2
 * ```
 */
export function studentTTarget(df: number, location: number = 0, scale: number = 1): FamilyTarget {
  const api = 'studentTTarget';
  checkPositive(api, 'df', df);
  checkFinite(api, 'location', location);
  checkPositive(api, 'scale', scale);
  const logDf = log(df);
  const c = -log(scale) - 0.5 * logDf - betaln(0.5, 0.5 * df);
  const h = 0.5 * (df + 1);
  return {
    logDensity(x: number): number {
      const z = (x - location) / scale;
      const az = Math.abs(z);
      if (az <= BIG_Z) return c - h * log1p((z * z) / df);
      if (az === Infinity) return -Infinity;
      return c - h * (2 * log(az) - logDf + log1p(df / az / az));
    },
    dLogDensity(x: number): number {
      const z = (x - location) / scale;
      if (z === 0) return 0;
      return -(df + 1) / (scale * (df / z + z));
    },
    support: [-Infinity, Infinity] as const,
    mode: location,
    cdf(x: number): number {
      return tCdf((x - location) / scale, df);
    },
    sf(x: number): number {
      return tCdf((location - x) / scale, df);
    },
  };
}

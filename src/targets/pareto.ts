/**
 * Pareto type I target.
 *
 * @packageDocumentation
 */
import { paretoType1Cdf } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import { exp, log } from '../vendor/math.js';

/**
 * The Pareto type I distribution with shape `shape` (tail index α) and
 * scale `scale` (x_m, the lower end): density α·x_m^α / x^(α+1) on
 * x ≥ x_m, as a {@link FamilyTarget}.
 *
 * @remarks
 * `logDensity(x) = log(α/x_m) − (α + 1)·log(x/x_m)` for x ≥ x_m (the end
 * x_m is included, where the density is α/x_m, its maximum);
 * `dLogDensity(x) = −(α + 1)/x`. The mode hint is x_m. The tail decays like
 * x^(−α−1): heavy, so {@link exactSampler} serves it with the T-concave hull
 * (α ≥ 1) or ratio-of-uniforms. `cdf` is
 * `@stdlib/stats-base-dists-pareto-type1-cdf`; `sf(x) = (x_m/x)^α`
 * (accurate in the far upper tail).
 *
 * @param shape - shape (tail index) α, a finite number > 0
 * @param scale - scale x_m (the lower end of the support), a finite number > 0
 * @defaultValue scale = 1
 * @returns the target, with support `[scale, Infinity]`
 * @throws {@link InvalidTargetError} when `shape` or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const t = paretoTarget(3, 2); // support [2, ∞)
 * t.sf(4);                      // (2/4)^3 = 0.125
 * ```
 */
export function paretoTarget(shape: number, scale: number = 1): FamilyTarget {
  const api = 'paretoTarget';
  checkPositive(api, 'shape', shape);
  checkPositive(api, 'scale', scale);
  const c = log(shape / scale);
  const ap1 = shape + 1;
  return {
    logDensity(x: number): number {
      if (x >= scale) return x === Infinity ? -Infinity : c - ap1 * log(x / scale);
      return x < scale ? -Infinity : NaN;
    },
    dLogDensity(x: number): number {
      return x >= scale ? -ap1 / x : NaN;
    },
    support: [scale, Infinity] as const,
    mode: scale,
    cdf(x: number): number {
      if (!(x > scale)) return x !== x ? NaN : 0;
      return paretoType1Cdf(x, shape, scale);
    },
    sf(x: number): number {
      if (!(x > scale)) return x !== x ? NaN : 1;
      return exp(-shape * log(x / scale));
    },
  };
}

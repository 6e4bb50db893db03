/**
 * Weibull target.
 *
 * @packageDocumentation
 */
import { weibullCdf } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import type { PoleTarget } from './end-distance.js';
import { exp, log, pow } from '../vendor/math.js';

/**
 * The Weibull distribution with shape `shape` (k) and scale `scale` (λ):
 * density (k/λ)·(x/λ)^(k−1)·e^(−(x/λ)^k) on x > 0, as a {@link FamilyTarget}.
 *
 * @remarks
 * With z = x/λ: `logDensity(x) = log(k/λ) + (k − 1)·log z − z^k`,
 * `dLogDensity(x) = ((k − 1)/z − k·z^(k−1))/λ`. It is log-concave for
 * k ≥ 1. For k < 1 the density is unbounded at 0 (an integrable pole):
 * as for {@link gammaTarget}, the point 0 itself gets `-Infinity` by
 * convention, the target declares `poles: 'lower'` (see {@link PoleTarget})
 * and {@link exactSampler} samples log X instead, whose density
 * k·e^(k·y − e^(k·y)) (λ = 1) is log-concave. At 0: `log(1/λ)` for k = 1,
 * `-Infinity` for k > 1.
 *
 * Mode hint: λ·((k − 1)/k)^(1/k) for k > 1, else 0 (for k < 1 it marks the
 * pole, not a finite maximum). `cdf` is `@stdlib/stats-base-dists-weibull-cdf`;
 * `sf(x) = e^(−z^k)` (accurate in the upper tail).
 *
 * @param shape - shape k, a finite number > 0
 * @param scale - scale λ, a finite number > 0
 * @defaultValue scale = 1
 * @returns the target, with support `[0, Infinity]`
 * @throws {@link InvalidTargetError} when `shape` or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const t = weibullTarget(1.5, 2);
 * t.sf(2); // e^(−1)
 * ```
 */
export function weibullTarget(shape: number, scale: number = 1): FamilyTarget & PoleTarget {
  const api = 'weibullTarget';
  checkPositive(api, 'shape', shape);
  checkPositive(api, 'scale', scale);
  const km1 = shape - 1;
  const c = log(shape / scale);
  const logScale = log(scale);
  const atZero = shape === 1 ? c : -Infinity;
  const dAtZero = shape > 1 ? Infinity : shape === 1 ? -1 / scale : -Infinity;
  const mode = shape > 1 ? Math.max(Number.MIN_VALUE, scale * pow(km1 / shape, 1 / shape)) : 0;
  return {
    logDensity(x: number): number {
      if (x > 0) {
        if (x === Infinity) return -Infinity;
        const lz = log(x) - logScale; // log(x/scale) without underflow of x/scale
        return (km1 === 0 ? 0 : km1 * lz) - exp(shape * lz) + c;
      }
      if (x === 0) return atZero;
      return x < 0 ? -Infinity : NaN;
    },
    dLogDensity(x: number): number {
      if (x > 0) {
        const z = x / scale;
        return (km1 / z - shape * pow(z, km1)) / scale;
      }
      if (x === 0) return dAtZero;
      return NaN;
    },
    support: [0, Infinity] as const,
    mode,
    ...(shape < 1 ? { poles: 'lower' as const } : {}),
    cdf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 0;
      return weibullCdf(x, shape, scale);
    },
    sf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 1;
      return exp(-pow(x / scale, shape));
    },
  };
}

/**
 * Gamma target.
 *
 * @packageDocumentation
 */
import { gammaCdf, gammaln } from '../vendor/stdlib.js';
import { checkPositive } from '../core/validate.js';
import type { FamilyTarget } from './family-target.js';
import type { PoleTarget } from './end-distance.js';
import { lowerRegularizedGamma, upperRegularizedGamma } from './_internals/gamma-series.js';
import { log } from '../vendor/math.js';

/**
 * Shape from which {@link gammaTarget} computes its cdf with the incomplete
 * gamma series instead of `@stdlib/stats-base-dists-gamma-cdf`.
 */
export const GAMMA_SERIES_MIN_SHAPE = 100;

/**
 * The gamma distribution with shape `shape` and rate `rate` (density
 * rate^shape x^(shape−1) e^(−rate·x) / Γ(shape) on x > 0) as a
 * {@link FamilyTarget}.
 *
 * @remarks
 * The log-density is computed by exactdraw in log space,
 * `(shape − 1)·log(rate·x) + log(rate) − rate·x − lnΓ(shape)`, with
 * `@stdlib/math-base-special-gammaln`.
 *
 * Support and the end x = 0: `support` is `[0, Infinity]`. At exactly x = 0
 * the log-density is `-Infinity` for shape > 1 (the density is 0 there),
 * `log(rate)` for shape = 1 (the exponential distribution), and — by
 * exactdraw's convention — `-Infinity` for shape < 1, where the true density
 * is unbounded at 0: the {@link Target} contract forbids `+Infinity`, so the
 * support is treated as the open interval (0, ∞) and the single point 0,
 * which has probability 0, is excluded. Every x > 0 gets its correct value.
 *
 * Mode hint: `(shape − 1) / rate` for shape ≥ 1 (kept above 0 for shape > 1
 * should it underflow; 0 for shape = 1, where the
 * density decreases from its finite maximum at 0), and 0 for shape < 1,
 * where it marks the end at which the density is unbounded, not a point of
 * maximal finite density (logDensity is `-Infinity` there, see above).
 *
 * For shape < 1 the target declares `poles: 'lower'` (see {@link PoleTarget}):
 * {@link exactSampler} then samples log X, whose density is log-concave.
 *
 * `dLogDensity(x) = (shape − 1)/x − rate`; at x = 0 it returns the one-sided
 * limit (+Infinity, −rate or −Infinity), and NaN for x < 0.
 *
 * CDF: `@stdlib/stats-base-dists-gamma-cdf` for shape < 100. That function is
 * inaccurate for shape ≥ 1000 (errors up to 2e-2 near the centre, see the
 * project's REFERENCES.md), so for shape ≥ {@link GAMMA_SERIES_MIN_SHAPE} the
 * cdf is the regularized incomplete gamma P(shape, rate·x) computed by
 * exactdraw (power series, Abramowitz & Stegun 6.5.29, with a continued
 * fraction for the upper tail). `sf(x)` = Q(shape, rate·x) always comes
 * from that series / continued fraction, so it is accurate in the far upper
 * tail.
 *
 * @param shape - shape, a finite number > 0
 * @param rate - rate (inverse scale), a finite number > 0
 * @defaultValue rate = 1
 * @returns the target, with support `[0, Infinity]`
 * @throws {@link InvalidTargetError} when `shape` or `rate` is not a finite number > 0
 * @example
 * ```ts
 * const t = gammaTarget(3, 2); // mean 1.5
 * t.mode;                      // 1
 * ```
 */
export function gammaTarget(shape: number, rate: number = 1): FamilyTarget & PoleTarget {
  const api = 'gammaTarget';
  checkPositive(api, 'shape', shape);
  checkPositive(api, 'rate', rate);
  const logRate = log(rate);
  const shapeM1 = shape - 1;
  const c = logRate - gammaln(shape);
  const atZero = shape > 1 ? -Infinity : shape === 1 ? logRate : -Infinity;
  const dAtZero = shape > 1 ? Infinity : shape === 1 ? -rate : -Infinity;
  const useSeries = shape >= GAMMA_SERIES_MIN_SHAPE;
  return {
    logDensity(x: number): number {
      if (x > 0) {
        if (x === Infinity) return -Infinity;
        const rx = rate * x;
        // rate·x underflows to 0 only for x near the smallest doubles and rate < 1
        if (rx === 0) return (shapeM1 === 0 ? 0 : shapeM1 * (log(x) + logRate)) + c;
        return (shapeM1 === 0 ? 0 : shapeM1 * log(rx)) - rx + c;
      }
      if (x === 0) return atZero;
      return x < 0 ? -Infinity : NaN;
    },
    dLogDensity(x: number): number {
      if (x > 0) return shapeM1 / x - rate;
      if (x === 0) return dAtZero;
      return NaN;
    },
    support: [0, Infinity] as const,
    ...(shape < 1 ? { poles: 'lower' as const } : {}),
    mode: shape > 1 ? Math.max(Number.MIN_VALUE, shapeM1 / rate) : 0,
    cdf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 0;
      return useSeries ? lowerRegularizedGamma(shape, rate * x) : gammaCdf(x, shape, rate);
    },
    sf(x: number): number {
      if (!(x > 0)) return x !== x ? NaN : 1;
      return upperRegularizedGamma(shape, rate * x);
    },
  };
}

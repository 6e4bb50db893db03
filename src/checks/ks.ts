/**
 * Kolmogorov–Smirnov goodness-of-fit check.
 *
 * @packageDocumentation
 */
import kstest from '@stdlib/stats-kstest';
import { InvalidTargetError } from '../core/errors.js';

/** Result of a goodness-of-fit check. */
export interface CheckResult {
  /** The test statistic. */
  statistic: number;
  /** Probability, under the null hypothesis, of a statistic at least this large. */
  pValue: number;
}

/** Validates a sample for a check and returns a sorted copy. @internal */
export function sortedSample(api: string, draws: ArrayLike<number>): Float64Array {
  if (draws === null || typeof draws !== 'object' || typeof draws.length !== 'number') {
    throw new InvalidTargetError(`${api}: draws must be an array of numbers, got ${String(draws)}`);
  }
  if (draws.length < 2) {
    throw new InvalidTargetError(`${api}: draws must hold at least 2 values, got ${draws.length}`);
  }
  const x = Float64Array.from(draws);
  for (let i = 0; i < x.length; i++) {
    if (Number.isNaN(x[i])) throw new InvalidTargetError(`${api}: draws[${i}] is NaN`);
  }
  x.sort();
  return x;
}

/**
 * Two-sided one-sample Kolmogorov–Smirnov test of `draws` against `cdf`,
 * computed by `@stdlib/stats-kstest` (exact Kolmogorov distribution of the
 * statistic; Marsaglia, Tsang & Wang 2003).
 *
 * @param draws - sample to check (at least 2 values, no NaN)
 * @param cdf - the hypothesised continuous CDF
 * @returns the statistic D and its p-value
 * @throws {@link InvalidTargetError} for a bad sample or a cdf that is not a function
 * @example
 * ```ts
 * const s = adaptiveRejectionSampler(normalTarget(0, 1), { seed: 1 });
 * const { pValue } = ksCheck(s.fill(new Float64Array(10_000)), normalTarget(0, 1).cdf!);
 * ```
 */
export function ksCheck(draws: ArrayLike<number>, cdf: (x: number) => number): CheckResult {
  if (typeof cdf !== 'function') throw new InvalidTargetError(`ksCheck: cdf must be a function, got ${typeof cdf}`);
  const x = sortedSample('ksCheck', draws);
  const r = kstest(x, cdf, { sorted: true });
  return { statistic: r.statistic, pValue: r.pValue };
}

/**
 * Chi-square goodness-of-fit check for binned or discrete data.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import { upperRegularizedGamma } from '../targets/_internals/gamma-series.js';

/** Result of {@link chiSquareCheck}. */
export interface ChiSquareResult {
  /** Pearson's X² statistic. */
  statistic: number;
  /** Upper-tail p-value of X² under the chi-square distribution with `df` degrees of freedom. */
  pValue: number;
  /** Degrees of freedom: the number of bins with positive probability, minus 1. */
  df: number;
}

/**
 * Pearson chi-square goodness-of-fit test of observed `counts` against bin
 * `probabilities` (Pearson 1900).
 *
 * @remarks
 * X² = Σ (c_i − n p_i)² / (n p_i) over the bins with p_i > 0, and the
 * p-value is the chi-square upper tail Q(df/2, X²/2) (Abramowitz & Stegun
 * 26.4.19), from exactdraw's regularized incomplete gamma function (series
 * and continued fraction, accurate far into the upper tail). A bin with
 * probability 0 and count 0 is ignored; one with probability 0 and a
 * positive count makes X² infinite and the p-value 0. Use bins with an
 * expected count of at least 5 (common practice) so that the chi-square
 * approximation holds. Tested against `@stdlib/stats-chi2gof`.
 *
 * @param counts - observed non-negative integer counts per bin
 * @param probabilities - bin probabilities (non-negative, summing to 1 within 1e-8)
 * @throws {@link InvalidTargetError} when the inputs are inconsistent
 * @example
 * ```ts
 * // bikes returned per station over a day (invented) against the planned shares
 * const { pValue, df } = chiSquareCheck([18, 25, 31, 26], [0.2, 0.25, 0.3, 0.25]);
 * ```
 */
export function chiSquareCheck(counts: ArrayLike<number>, probabilities: ArrayLike<number>): ChiSquareResult {
  const api = 'chiSquareCheck';
  if (counts === null || typeof counts !== 'object' || probabilities === null || typeof probabilities !== 'object') {
    throw new InvalidTargetError(`${api}: counts and probabilities must be arrays of numbers`);
  }
  if (counts.length !== probabilities.length || counts.length < 2) {
    throw new InvalidTargetError(`${api}: counts (length ${counts.length}) and probabilities (length ${probabilities.length}) must have the same length >= 2`);
  }
  let sum = 0;
  for (let i = 0; i < probabilities.length; i++) {
    const p = probabilities[i];
    if (!(p >= 0 && p <= 1)) throw new InvalidTargetError(`${api}: probabilities[${i}] = ${p} is not in [0, 1]`);
    sum += p;
    const c = counts[i];
    if (!(Number.isInteger(c) && c >= 0)) throw new InvalidTargetError(`${api}: counts[${i}] = ${c} is not a non-negative integer`);
  }
  if (Math.abs(sum - 1) > 1e-8) throw new InvalidTargetError(`${api}: probabilities sum to ${sum}, not 1`);
  let n = 0;
  for (let i = 0; i < counts.length; i++) n += counts[i];
  if (!(n > 0)) throw new InvalidTargetError(`${api}: counts sum to ${n}; at least one observation is needed`);
  let x2 = 0;
  let bins = 0;
  for (let i = 0; i < counts.length; i++) {
    const p = probabilities[i];
    const c = counts[i];
    if (p === 0) {
      if (c > 0) x2 = Infinity;
      continue;
    }
    bins++;
    const e = n * p;
    const d = c - e;
    x2 += (d * d) / e;
  }
  const df = bins - 1;
  if (df < 1) throw new InvalidTargetError(`${api}: at least two bins must have positive probability, got ${bins}`);
  return { statistic: x2, pValue: x2 === Infinity ? 0 : upperRegularizedGamma(df / 2, x2 / 2), df };
}

/**
 * Chi-square goodness-of-fit check for binned or discrete data.
 *
 * @packageDocumentation
 */
import chi2gof from '@stdlib/stats-chi2gof';
import { InvalidTargetError } from '../core/errors.js';

/** Result of {@link chiSquareCheck}. */
export interface ChiSquareResult {
  /** Pearson's X² statistic. */
  statistic: number;
  /** Upper-tail p-value of X² under the chi-square distribution with `df` degrees of freedom. */
  pValue: number;
  /** Degrees of freedom (bins − 1). */
  df: number;
}

/**
 * Pearson chi-square goodness-of-fit test of observed `counts` against bin
 * `probabilities`, computed by `@stdlib/stats-chi2gof`.
 *
 * @remarks
 * Use bins with an expected count of at least 5 (common practice) so that
 * the chi-square approximation holds.
 *
 * @param counts - observed non-negative integer counts per bin
 * @param probabilities - bin probabilities (non-negative, summing to 1 within 1e-8)
 * @throws {@link InvalidTargetError} when the inputs are inconsistent
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
  const r = chi2gof(Float64Array.from(counts), Float64Array.from(probabilities));
  return { statistic: r.statistic, pValue: r.pValue, df: r.df ?? counts.length - 1 };
}

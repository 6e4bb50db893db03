/**
 * Negative binomial target.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { negativeBinomialCdf, negativeBinomialLogpmf } from '../../vendor/stdlib.js';
import type { DiscreteFamilyTarget } from './family.js';

/**
 * The negative binomial distribution of the number of failures before the
 * `r`-th success in trials with success probability `p`, on {0, 1, ...}:
 * pmf C(k + r − 1, k)·p^r·(1 − p)^k. Mean r(1 − p)/p; `r` need not be an
 * integer (the gamma–Poisson mixture of over-dispersed counts).
 *
 * @remarks
 * logPmf from `@stdlib/stats-base-dists-negative-binomial-logpmf`, cdf from
 * `@stdlib/stats-base-dists-negative-binomial-cdf` (same parametrization).
 * Mode ⌊(r − 1)(1 − p)/p⌋ for r > 1, else 0. Log-concave for r ≥ 1; for
 * r < 1 it is not, and {@link discreteSampler} uses ratio-of-uniforms or a
 * table.
 *
 * @param r - number of successes, a finite number > 0
 * @param p - success probability, in (0, 1)
 * @throws {@link InvalidTargetError} for r not a finite number > 0 or p outside (0, 1)
 * @example
 * ```ts
 * import { discreteSampler, negativeBinomialTarget } from 'exactdraw';
 * const s = discreteSampler(negativeBinomialTarget(2.5, 0.2), { seed: 5 });
 * ```
 */
export function negativeBinomialTarget(r: number, p: number): DiscreteFamilyTarget {
  const api = 'negativeBinomialTarget';
  if (typeof r !== 'number' || !(r > 0) || r === Infinity) {
    throw new InvalidTargetError(`${api}: r must be a finite number > 0, got ${typeof r === 'string' ? `'${r}'` : String(r)}`);
  }
  if (typeof p !== 'number' || !(p > 0 && p < 1)) {
    throw new InvalidTargetError(`${api}: p must be a number in (0, 1), got ${typeof p === 'string' ? `'${p}'` : String(p)}`);
  }
  return {
    logPmf: (k: number): number => negativeBinomialLogpmf(k, r, p),
    support: [0, Infinity],
    mode: r > 1 ? Math.floor(((r - 1) * (1 - p)) / p) : 0,
    logConcave: r >= 1,
    normalized: true,
    cdf: (k: number): number => negativeBinomialCdf(k, r, p),
  };
}

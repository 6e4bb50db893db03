/**
 * Binomial target.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { binomialCdf, binomialLogpmf } from '../../vendor/stdlib.js';
import type { DiscreteFamilyTarget } from './family.js';

/**
 * The binomial(n, p) distribution on {0, ..., n}.
 *
 * @remarks
 * logPmf from `@stdlib/stats-base-dists-binomial-logpmf`, cdf from
 * `@stdlib/stats-base-dists-binomial-cdf`; the logPmf is checked in the
 * tests against Loader's (2000) saddle-point form, computed independently.
 * Mode ⌊(n + 1)p⌋ (clamped to n).
 *
 * @param n - number of trials, an integer in [1, 2^53 − 1]
 * @param p - success probability, in (0, 1)
 * @throws {@link InvalidTargetError} for n not a positive safe integer or p outside (0, 1)
 * @example
 * ```ts
 * import { binomialTarget, discreteSampler } from 'exactdraw';
 * const defects = discreteSampler(binomialTarget(500, 0.01), { seed: 2 }).sample();
 * ```
 */
export function binomialTarget(n: number, p: number): DiscreteFamilyTarget {
  const api = 'binomialTarget';
  if (typeof n !== 'number' || !Number.isSafeInteger(n) || n < 1) {
    throw new InvalidTargetError(`${api}: n must be an integer in [1, 2^53 - 1], got ${typeof n === 'string' ? `'${n}'` : String(n)}`);
  }
  if (typeof p !== 'number' || !(p > 0 && p < 1)) {
    throw new InvalidTargetError(`${api}: p must be a number in (0, 1), got ${typeof p === 'string' ? `'${p}'` : String(p)}`);
  }
  return {
    logPmf: (k: number): number => binomialLogpmf(k, n, p),
    support: [0, n],
    mode: Math.min(n, Math.floor((n + 1) * p)),
    logConcave: true,
    normalized: true,
    cdf: (k: number): number => binomialCdf(k, n, p),
  };
}

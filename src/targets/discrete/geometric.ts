/**
 * Geometric target.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { geometricCdf, geometricLogpmf } from '../../vendor/stdlib.js';
import type { DiscreteFamilyTarget } from './family.js';

/**
 * The geometric distribution of the number of failures before the first
 * success, on {0, 1, ...}: pmf p·(1 − p)^k.
 *
 * @remarks
 * logPmf from `@stdlib/stats-base-dists-geometric-logpmf`, cdf from
 * `@stdlib/stats-base-dists-geometric-cdf` (same parametrization). Mode 0.
 *
 * @param p - success probability, in (0, 1)
 * @throws {@link InvalidTargetError} for p outside (0, 1)
 * @example
 * ```ts
 * import { discreteSampler, geometricTarget } from 'exactdraw';
 * const failures = discreteSampler(geometricTarget(0.3), { seed: 1 }).sample();
 * ```
 */
export function geometricTarget(p: number): DiscreteFamilyTarget {
  if (typeof p !== 'number' || !(p > 0 && p < 1)) {
    throw new InvalidTargetError(`geometricTarget: p must be a number in (0, 1), got ${typeof p === 'string' ? `'${p}'` : String(p)}`);
  }
  return {
    logPmf: (k: number): number => geometricLogpmf(k, p),
    support: [0, Infinity],
    mode: 0,
    logConcave: true,
    normalized: true,
    cdf: (k: number): number => geometricCdf(k, p),
  };
}

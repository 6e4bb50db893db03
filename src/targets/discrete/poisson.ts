/**
 * Poisson target.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { poissonCdf, poissonLogpmf } from '../../vendor/stdlib.js';
import { upperRegularizedGamma } from '../_internals/gamma-series.js';

/** From this mean on, the cdf is Q(k + 1, λ) from exactdraw's incomplete-gamma series (the `@stdlib` Poisson cdf was measured 4e-3 off at λ = k = 1e4). */
export const POISSON_SERIES_MIN_MEAN = 100;
import type { DiscreteFamilyTarget } from './family.js';

/**
 * The Poisson(mean) distribution on {0, 1, 2, ...}.
 *
 * @remarks
 * logPmf from `@stdlib/stats-base-dists-poisson-logpmf`
 * (k ln λ − λ − ln k!); cdf from `@stdlib/stats-base-dists-poisson-cdf`
 * for λ < {@link POISSON_SERIES_MIN_MEAN}, and from exactdraw's regularized
 * incomplete gamma, P(X ≤ k) = Q(k + 1, λ), beyond (the `@stdlib` cdf, which
 * goes through the `@stdlib` incomplete gamma, was measured 4e-3 off at
 * λ = k = 1e4; both are checked against summed pmfs in the tests).
 * The logPmf is checked in the tests against a saddle-point form computed
 * independently (Loader 2000), up to mean 1e7 (absolute log error there
 * about 1e-8, from cancellation between terms near 1.6e8). Mode ⌊mean⌋.
 *
 * @param mean - λ, a finite number > 0 (at most 1e15)
 * @throws {@link InvalidTargetError} for a mean that is not a finite number in (0, 1e15]
 * @example
 * ```ts
 * import { discreteSampler, poissonTarget } from 'exactdraw';
 * const arrivals = discreteSampler(poissonTarget(6.2), { seed: 9 }).sample();
 * ```
 */
export function poissonTarget(mean: number): DiscreteFamilyTarget {
  if (typeof mean !== 'number' || !(mean > 0) || !(mean <= 1e15)) {
    throw new InvalidTargetError(`poissonTarget: mean must be a finite number in (0, 1e15], got ${typeof mean === 'string' ? `'${mean}'` : String(mean)}`);
  }
  return {
    logPmf: (k: number): number => poissonLogpmf(k, mean),
    support: [0, Infinity],
    mode: Math.floor(mean),
    logConcave: true,
    normalized: true,
    cdf: mean < POISSON_SERIES_MIN_MEAN ? (k: number): number => poissonCdf(k, mean) : (k: number): number => (k < 0 ? 0 : upperRegularizedGamma(Math.floor(k) + 1, mean)),
  };
}

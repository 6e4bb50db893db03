/**
 * Exponential proposal.
 *
 * @packageDocumentation
 */
import type { Proposal, Uniform } from '../core/types.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import { log } from '../vendor/math.js';

/**
 * The exponential distribution with rate `rate`, shifted to start at
 * `origin`, as a {@link Proposal}.
 *
 * @remarks
 * `sample(u)` uses one uniform per draw: `origin − log(1 − u())/rate`.
 * Since `u()` is in [0, 1), `1 − u()` is in (0, 1] and the logarithm never
 * sees 0; a uniform of 0 gives `origin`. `logDensity(x)` is
 * `log(rate) − rate·(x − origin)` for x ≥ origin and `-Infinity` below.
 *
 * @param rate - rate, a finite number > 0
 * @param origin - start of the support, a finite number
 * @defaultValue origin = 0
 * @returns the proposal, with support `[origin, Infinity]`
 * @throws {@link InvalidTargetError} when `rate` is not a finite number > 0 or `origin` is not finite
 * @example
 * ```ts
 * const g = exponentialProposal(2, 1); // mean 1.5
 * ```
 */
export function exponentialProposal(rate: number, origin: number = 0): Proposal {
  const api = 'exponentialProposal';
  checkPositive(api, 'rate', rate);
  checkFinite(api, 'origin', origin);
  const logRate = log(rate);
  return {
    sample(u: Uniform): number {
      return origin - log(1 - u()) / rate;
    },
    logDensity(x: number): number {
      return x >= origin ? logRate - rate * (x - origin) : x !== x ? NaN : -Infinity;
    },
    support: [origin, Infinity] as const,
  };
}

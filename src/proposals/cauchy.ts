/**
 * Cauchy proposal.
 *
 * @packageDocumentation
 */
import type { Proposal, Uniform } from '../core/types.js';
import { checkFinite, checkPositive } from '../core/validate.js';
import { log, log1p, tan } from '../vendor/math.js';

/** |z| above which z² is not formed (it would overflow long before 1e154). */
const BIG_Z = 1e100;

/**
 * The Cauchy distribution with location `location` and scale `scale` as a
 * {@link Proposal}; its heavy tails dominate any target whose tails decay at
 * least like 1/x².
 *
 * @remarks
 * `sample(u)` uses one uniform per draw, by inversion:
 * `location + scale·tan(π·(u() − 1/2))`. A uniform of exactly 0 gives
 * tan(−π/2) evaluated in floating point, a finite value near −1.6e16, so no
 * draw is infinite. `logDensity(x) = −log(π·scale) − log1p(z²)` with
 * z = (x − location)/scale, rewritten as `−log(π·scale) − 2 log|z| − log1p(1/z²)`
 * for |z| > 1e100 so that it never overflows.
 *
 * @param location - location, a finite number
 * @param scale - scale, a finite number > 0
 * @returns the proposal, with support `[-Infinity, Infinity]`
 * @throws {@link InvalidTargetError} when `location` is not finite or `scale` is not a finite number > 0
 * @example
 * ```ts
 * const g = cauchyProposal(0, 1);
 * ```
 */
export function cauchyProposal(location: number, scale: number): Proposal {
  const api = 'cauchyProposal';
  checkFinite(api, 'location', location);
  checkPositive(api, 'scale', scale);
  const c = -log(Math.PI * scale);
  return {
    sample(u: Uniform): number {
      return location + scale * tan(Math.PI * (u() - 0.5));
    },
    logDensity(x: number): number {
      const z = (x - location) / scale;
      const az = Math.abs(z);
      if (az <= BIG_Z) return c - log1p(z * z);
      if (az === Infinity) return -Infinity;
      return c - 2 * log(az) - log1p(1 / az / az);
    },
    support: [-Infinity, Infinity] as const,
  };
}

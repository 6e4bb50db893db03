/**
 * Uniform proposal.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import type { Proposal, Uniform } from '../core/types.js';
import { checkFinite } from '../core/validate.js';
import { log } from '../vendor/math.js';

/**
 * The uniform distribution on `[a, b]` as a {@link Proposal}.
 *
 * @remarks
 * `sample(u)` returns `a + (b − a)·u()`, one uniform per draw; the result is
 * clamped to `b` in case rounding pushes it past the end. `logDensity(x)` is
 * `−log(b − a)` on `[a, b]` and `-Infinity` elsewhere.
 *
 * @param a - lower end, a finite number
 * @param b - upper end, a finite number > a with `b − a` finite
 * @returns the proposal, with support `[a, b]`
 * @throws {@link InvalidTargetError} when an end is not finite, `a >= b`, or `b − a` overflows
 * @example
 * ```ts
 * const g = uniformProposal(-3, 3);
 * const x = g.sample(mersenneTwister(1));
 * ```
 */
export function uniformProposal(a: number, b: number): Proposal {
  const api = 'uniformProposal';
  checkFinite(api, 'a', a);
  checkFinite(api, 'b', b);
  if (!(a < b)) throw new InvalidTargetError(`${api}: b must be > a, got a = ${a}, b = ${b}`);
  const width = b - a;
  if (!Number.isFinite(width)) {
    throw new InvalidTargetError(`${api}: the width b - a must be finite, got a = ${a}, b = ${b}`);
  }
  const logDens = -log(width);
  return {
    sample(u: Uniform): number {
      const x = a + width * u();
      return x > b ? b : x;
    },
    logDensity(x: number): number {
      return x >= a && x <= b ? logDens : x !== x ? NaN : -Infinity;
    },
    support: [a, b] as const,
  };
}

/**
 * Optional target members for densities with a pole at an end of the
 * support: the log-density as a function of the distance to that end, and
 * a declaration of the poles.
 *
 * @packageDocumentation
 */
import type { Target } from '../core/types.js';

/**
 * Where a density is unbounded: at the lower end, the upper end, or both.
 *
 * @example
 * ```ts
 * const side: PoleSide | undefined = betaTarget(0.5, 0.5).poles; // 'both'
 * ```
 */
export type PoleSide = 'lower' | 'upper' | 'both';

/**
 * A {@link Target} that may describe its poles (ends of the support where
 * the density is unbounded but integrable) and evaluate its log-density by
 * the distance to an end.
 *
 * @remarks
 * Near an end e ≠ 0 the doubles x are spaced by about |e|·2^−52, so
 * `logDensity(e − d)` cannot tell distances d below that spacing apart.
 * The change of variables of exactdraw (see {@link poleTransform}) samples
 * the distance d itself; when a target gives `logDensityFromUpper(d)`
 * (= log f(upper − d), computed from d without forming upper − d) it is used
 * instead of `logDensity(upper − d)`, so that the transformed density keeps
 * full relative precision down to d = 2^−1022. `betaTarget` provides it for
 * the end 1. At an end e = 0 no such form is needed: x = d exactly.
 *
 * Every member is optional; samplers that do not use them ignore them.
 *
 * @example
 * ```ts
 * // an invented density with a pole at the upper end 3: f(x) ∝ (3 − x)^(−1/2) on [2, 3]
 * const t: PoleTarget = {
 *   logDensity: (x) => (x >= 2 && x < 3 ? -0.5 * Math.log(3 - x) : -Infinity),
 *   logDensityFromUpper: (d) => (d > 0 && d <= 1 ? -0.5 * Math.log(d) : -Infinity),
 *   support: [2, 3],
 *   poles: 'upper',
 * };
 * ```
 */
export interface PoleTarget extends Target {
  /** Declared poles: the ends where the density is unbounded (they are then not searched for). */
  readonly poles?: PoleSide;
  /** log f(lower + d) for a distance d > 0 to the lower end. */
  logDensityFromLower?(d: number): number;
  /** The derivative of log f (with respect to x) at x = lower + d. */
  dLogDensityFromLower?(d: number): number;
  /** log f(upper − d) for a distance d > 0 to the upper end. */
  logDensityFromUpper?(d: number): number;
  /** The derivative of log f (with respect to x) at x = upper − d. */
  dLogDensityFromUpper?(d: number): number;
}

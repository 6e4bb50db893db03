/**
 * The one log tolerance of the envelope engines. @internal
 *
 * @packageDocumentation
 */

/**
 * Absolute part of the tolerance (in log units) with which every envelope
 * engine (adaptive rejection, the table fast path, the piecewise method)
 * compares an evaluated log-density with its envelope or squeeze, and with
 * which the shape tests compare transformed values: a target found above the
 * envelope by more than `HULL_LOG_TOLERANCE_ABSOLUTE +
 * HULL_LOG_TOLERANCE_RELATIVE · (|ref| + |log f − ref|)` (ref the envelope's
 * reference height) is reported. It absorbs the rounding of the target's own
 * values, from which the envelopes are built; it is far below any
 * statistically visible error (a density off by e^(1e-9)).
 *
 * @example
 * ```ts
 * import { HULL_LOG_TOLERANCE_ABSOLUTE } from 'exactdraw';
 * HULL_LOG_TOLERANCE_ABSOLUTE; // 1e-9
 * ```
 */
export const HULL_LOG_TOLERANCE_ABSOLUTE = 1e-9;

/**
 * Relative part of the envelope tolerance (see {@link HULL_LOG_TOLERANCE_ABSOLUTE}):
 * for unnormalized targets with log heights far from 0.
 *
 * @example
 * ```ts
 * import { HULL_LOG_TOLERANCE_RELATIVE } from 'exactdraw';
 * HULL_LOG_TOLERANCE_RELATIVE; // 1e-12
 * ```
 */
export const HULL_LOG_TOLERANCE_RELATIVE = 1e-12;

/**
 * Tolerance (log units) of a comparison of a log-density with a bound, for
 * an envelope of reference height `ref` and a relative log-density `lr`
 * (`-Infinity` counts as 0). @internal
 */
export function logTolerance(ref: number, lr: number): number {
  return HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * (Math.abs(ref) + (lr === -Infinity ? 0 : Math.abs(lr)));
}

/**
 * Tolerance (log units) of a comparison between two log values `la`, `lb`
 * (absolute logs or logs relative to the same reference). @internal
 */
export function pairTolerance(la: number, lb: number): number {
  return HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * (Math.abs(la) + Math.abs(lb));
}

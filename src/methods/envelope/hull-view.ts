/**
 * What the table builder needs to know of a T-concave envelope (a hull):
 * its transform, its support, its touch points, its quantiles and its
 * maximum over an interval. The hull engine implements it; the table
 * builder reads a hull only through it. @internal
 *
 * @packageDocumentation
 */

/** A read-only view of a T-concave envelope. @internal */
export interface HullView {
  /** Transform id ({@link T_LOG} or {@link T_INV_SQRT}). */
  readonly kind: number;
  /** Effective support. */
  readonly lower: number;
  readonly upper: number;
  /** Number of touch points. */
  touchPointCount(): number;
  /** Position of touch point i (increasing in i). */
  touchPointX(i: number): number;
  /** logDensity at touch point i (absolute). */
  touchPointLogDensity(i: number): number;
  /** Quantiles of the envelope at the increasing probabilities `ps`. */
  envelopeQuantiles(ps: readonly number[]): number[];
  /** Maximum of the envelope (absolute log) over [a, b]. */
  maxLogEnvelope(a: number, b: number): number;
}

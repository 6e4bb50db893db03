/**
 * Public types of {@link exactSampler} (in their own module so that the
 * chooser's helpers can use them without an import circle).
 *
 * @packageDocumentation
 */
import type { Sampler, SamplerOptions } from '../../core/types.js';

/** Options of {@link exactSampler}: the uniform source and the rejection bound, passed to the chosen method. */
export interface ExactSamplerOptions extends SamplerOptions {
  /**
   * How many draws you expect to take from this sampler. At
   * {@link FAST_PATH_MIN_DRAWS} or more, targets served by a hull or by
   * piecewise envelopes use the table-driven fast path (`tableSampler`,
   * `piecewiseSampler({ fast: true })`). It changes speed and the stream,
   * never the distribution.
   * @defaultValue 1 (a fresh target per draw, as in a Gibbs sampler)
   */
  expectedDraws?: number;
  /**
   * Consecutive rejections before {@link StalledSamplerError} (passed on).
   * @defaultValue 1,000,000
   */
  maxRejections?: number;
}

/** Names of the methods {@link exactSampler} can choose. */
export type ExactMethod = 'adaptive-rejection' | 'piecewise' | 'ratio-of-uniforms' | 'certified';

/** What the shape scan of {@link exactSampler} saw. */
export interface ShapeScan {
  /** Scan points with a positive density. */
  readonly points: number;
  /** logDensity evaluations of the scan. */
  readonly evaluations: number;
  /** No scan triple has a second divided difference of log f above rounding. */
  readonly logConcave: boolean;
  /** The scan point nearest the centre where log f was seen convex, or a zero of the density inside its support (NaN when log-concave). */
  readonly convexAt: number;
  /** No scan triple has a second divided difference of T(f) = −1/√f above rounding. */
  readonly tConcave: boolean;
  /** The scan point nearest the centre where −1/√f was seen convex (NaN when T-concave). */
  readonly tConvexAt: number;
  /** Tail exponent α estimated where a tail is neither log- nor T-concave (f ~ |x|^−α), else NaN. */
  readonly heavyTailExponent: number;
  /** Smallest distance between neighbouring scan points of positive density (NaN without a scan). */
  readonly finestSpacing: number;
  /** Where {@link ShapeScan.finestSpacing} is (midpoint of the two points). */
  readonly finestSpacingAt: number;
  /** Largest distance between neighbouring scan points where log f is within 30 of its maximum: a feature narrower than this there can be missed (NaN without a scan). */
  readonly bodySpacing: number;
  /** Where {@link ShapeScan.bodySpacing} is (midpoint of the two points). */
  readonly bodySpacingAt: number;
}

/**
 * A shape proof from interval bounds (targets with `d2LogDensityBounds`):
 * bisection of the support until every cell's bounds prove the condition,
 * one is disproved, or the cell budget (512) is spent.
 */
export interface ShapeProof {
  /** `'log'`: (log f)″ ≤ 0 (log-concave); `'inverse-sqrt'`: (log f)″ ≤ ((log f)′)²/2 (−1/√f concave). */
  readonly transform: 'log' | 'inverse-sqrt';
  /** Whether the condition is proven on the whole support. */
  readonly proven: boolean;
  /** Cells on which the condition was proven. */
  readonly cells: number;
  /** Calls of `d2LogDensityBounds` and `dLogDensityBounds` made by the proof. */
  readonly boundEvaluations: number;
  /** A cell where the bounds prove the condition false, if one was found. */
  readonly refutedOn: readonly [number, number] | undefined;
  /** The cell left undecided when the budget ran out or a cell could not be split. */
  readonly undecidedOn: readonly [number, number] | undefined;
}

/** A method that {@link exactSampler} tried and that refused the target at construction. */
export interface RefusedMethod {
  /** The method (with its transform, for the hull). */
  readonly method: string;
  /** The message of the {@link ShapeViolationError} it threw. */
  readonly error: string;
}

/** The method an {@link ExactSampler} uses, and why. */
export interface ExactChoice {
  /** The method doing the work. */
  readonly method: ExactMethod;
  /**
   * True when a strip table serves the draws (the fast path, chosen from
   * `expectedDraws`): {@link tableSampler} for `'adaptive-rejection'`,
   * `piecewiseSampler(t, { fast: true })` for `'piecewise'`. Since 0.1.0.
   */
  readonly table: boolean;
  /** The transform, for `'adaptive-rejection'`. */
  readonly transform: 'log' | 'inverse-sqrt' | undefined;
  /** The power r, for `'ratio-of-uniforms'`. */
  readonly power: number | undefined;
  /** Why this method: what the scan saw and what the method needs. */
  readonly reason: string;
  /** Methods tried first and refused by their own checks at construction (with the error message). */
  readonly rejected: readonly RefusedMethod[];
  /** The shape scan (for a target with `logDensityBounds` no scan is made: 0 points, and the concavity flags restate the proof). */
  readonly scan: ShapeScan;
  /**
   * What the choice assumes beyond the target's own statements, in words and
   * numbers. For a black-box target: the scan's spacing (features narrower
   * than it can be missed); for a target with bounds: nothing beyond them.
   */
  readonly assumption: string;
  /** The shape proofs tried, for a target with `d2LogDensityBounds` (undefined otherwise). */
  readonly proof: readonly ShapeProof[] | undefined;
}

/** A sampler built by {@link exactSampler}. */
export interface ExactSampler extends Sampler {
  /** Which method was chosen, and why (read-only). */
  readonly choice: ExactChoice;
  /** The chosen method's sampler (with its own envelope or region description). */
  readonly sampler: Sampler;
}

/**
 * The vocabulary of the piecewise grid: cell classes, rounding allowances,
 * tail kinds, and the read-only view of a classified grid that the envelope
 * builder ({@link buildTables}) reads. @internal
 *
 * @packageDocumentation
 */
import { pow } from '../../vendor/math.js';

/** Cell classes (see the module remarks). @internal */
export const CELL_CONCAVE = 1;
/** @internal */
export const CELL_CONVEX = 2;
/** @internal */
export const CELL_LINEAR = 3;
/** @internal */
export const CELL_UNKNOWN = 4;
/** @internal */
export const CELL_MIXED = 5;
/** @internal */
export const CELL_ZERO = 6;
/** @internal */
export const CELL_BOUNDARY = 7;
/** @internal */
export const CELL_ATOMIC = 8;
/** @internal */
export const CELL_MONOTONE = 9;
/** @internal */
export const CELL_NEGLIGIBLE = 10;

/** Names of the cell classes, by code. @internal */
export const CLASS_NAMES = ['', 'concave', 'convex', 'linear', 'unknown', 'mixed', 'zero', 'boundary', 'atomic', 'monotone', 'negligible'] as const;

/**
 * A cell whose log-density at both ends is more than 1500 below the largest
 * on the grid is "negligible": its envelope (the larger end value, width at
 * most 1.8e308) has a relative area below e^(−1500 + 710), which is 0 in
 * double precision, so the guide table never selects it and its shape does
 * not matter. Such cells occur far out in the tails, where user functions
 * often lose their derivative's accuracy (e.g. a log-sum-exp of two
 * components that round to the same value).
 * @internal
 */
export const NEGLIGIBLE_DROP = 1500;

/**
 * Rounding allowance of the shape tests of {@link piecewiseSampler} (and of
 * the shape scan of {@link exactSampler}), relative to the magnitudes
 * involved: 64 units of double rounding (64·2^−52) of each value, counting a
 * log-density as at least 1 in magnitude (a log-density near 0 is usually
 * the difference of terms of order 1, so its rounding is absolute). A
 * curvature below it is "linear".
 *
 * @example
 * ```ts
 * PIECEWISE_NOISE; // 64 * 2 ** -52 ≈ 1.4e-14
 * ```
 */
export const PIECEWISE_NOISE = /* @__PURE__ */ (() => 64 * pow(2, -52))();

/**
 * Secant construction: largest deviation (absolute part, in log space) that
 * a "linear" verdict or a borrowed chord may imply over a cell; ten times
 * below the check tolerance. A verdict or chord less certain than this is not
 * used (the cell is halved instead).
 * @internal
 */
export const SECANT_DEVIATION_ABSOLUTE = 1e-10;

/** Relative part (of |log f|) of {@link SECANT_DEVIATION_ABSOLUTE}. @internal */
export const SECANT_DEVIATION_RELATIVE = 1e-12;

/** Halvings of the cells at a change of curvature (pins it to 2^−24 of the cell it was found in). @internal */
export const PIN_ROUNDS = 24;

/** Halvings of a mixed or unknown cell before giving up (enough to reach adjacent doubles). @internal */
export const MIXED_LIMIT = 1100;

/** Bound on the classify-and-halve rounds of one settling. @internal */
export const SETTLE_MAX_ROUNDS = 1500;

/** Tail kinds. @internal */
export const TAIL_NONE = 0;
/** @internal */
export const TAIL_LOG = 1;
/** @internal */
export const TAIL_INV_SQRT = 2;

/** A tail beyond the outermost point. @internal */
export interface Tail {
  kind: number;
  /** Start (the outermost point). */
  x: number;
  /** logDensity there. */
  l: number;
  /** Decay rate into the tail (> 0): of log f (log), or of T with T = −1 at x (inverse-sqrt). */
  sig: number;
}

/** True when no double lies strictly between a and b. @internal */
export function isAtomic(a: number, b: number): boolean {
  const m = mid(a, b);
  return !(m > a && m < b);
}

/** Midpoint without overflow. @internal */
export function mid(a: number, b: number): number {
  const m = 0.5 * a + 0.5 * b;
  return m;
}

/** What the envelope builder reads of a classified grid. @internal */
export interface CellView {
  readonly api: string;
  /** Points, increasing, and logDensity there. */
  readonly x: readonly number[];
  readonly l: readonly number[];
  /** Per cell: shape class, slopes of the outer lines through its ends (NaN: none). */
  readonly cls: readonly number[];
  readonly sa: readonly number[];
  readonly sb: readonly number[];
  readonly lowerTail: Tail;
  readonly upperTail: Tail;
  /** Number of cells. */
  readonly cells: number;
  /** Throws the ShapeViolationError of cell i. */
  shapeFailure(i: number, why: string): never;
}

/**
 * Cell class from the curvature classes of its two end points (secant
 * construction; 0: no triple there, CELL_UNKNOWN: undetermined within rounding, which
 * makes the cell unknown so that it is halved).
 */
export function combine(p: number, q: number): number {
  if (p === CELL_UNKNOWN || q === CELL_UNKNOWN) return CELL_UNKNOWN;
  const hasC = p === CELL_CONCAVE || q === CELL_CONCAVE;
  const hasV = p === CELL_CONVEX || q === CELL_CONVEX;
  if (hasC && hasV) return CELL_MIXED;
  if (hasC) return CELL_CONCAVE;
  if (hasV) return CELL_CONVEX;
  if (p === CELL_LINEAR || q === CELL_LINEAR) return CELL_LINEAR;
  return CELL_UNKNOWN;
}

/** Whether a neighbour of class `nb` can lend its chord to a cell of class `c` (same curvature). */
export function compatible(c: number, nb: number): boolean {
  return nb === c || nb === CELL_LINEAR;
}

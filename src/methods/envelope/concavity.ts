/**
 * The T-concavity test on three points and the shape error of the envelope
 * engines. @internal
 *
 * @packageDocumentation
 */
import { ShapeViolationError } from '../../core/errors.js';
import { pairTolerance } from './tolerance.js';
import { T_LOG } from './transforms.js';

/** Name of the shape a transform assumes ("log-concave", ...). @internal */
export function shapeName(kind: number): string {
  return kind === T_LOG ? 'log-concave' : 'T-concave for T(f) = -1/sqrt(f)';
}

/**
 * Tolerance in transformed units for comparisons between points of
 * log-density la, lb and transformed values ya, yb (the log tolerance,
 * scaled by the derivative of T for inverse-sqrt). @internal
 */
export function transformedTolerance(kind: number, la: number, lb: number, ya: number, yb: number): number {
  const tolL = pairTolerance(la, lb);
  if (kind === T_LOG) return tolL;
  return 0.5 * Math.max(-ya, -yb) * tolL;
}

/**
 * True when (x1, y1) lies below the chord of (x0, y0) and (x2, y2) by more
 * than the tolerance (the three points have finite log-densities l0, l1, l2).
 * @internal
 */
export function belowChord(kind: number, x0: number, y0: number, l0: number, x1: number, y1: number, l1: number, x2: number, y2: number, l2: number): boolean {
  const interp = y0 + (y2 - y0) * ((x1 - x0) / (x2 - x0));
  const tol = Math.max(transformedTolerance(kind, l0, l1, y0, y1), transformedTolerance(kind, l1, l2, y1, y2));
  return !(y1 - interp >= -tol);
}

/**
 * True when three points (x increasing, transformed values y, log-densities
 * l) are passed through by no T-concave function: the middle one below the
 * chord of the outer ones, or of density 0 between two of positive density.
 * @internal
 */
export function notConcave(kind: number, x0: number, y0: number, l0: number, x1: number, y1: number, l1: number, x2: number, y2: number, l2: number): boolean {
  if (l0 === -Infinity || l2 === -Infinity) return false;
  if (l1 === -Infinity) return true;
  return belowChord(kind, x0, y0, l0, x1, y1, l1, x2, y2, l2);
}

/** The shape error of an envelope engine, naming the interval [a, b] and suggesting the alternatives. @internal */
export function shapeError(api: string, kind: number, detail: string, a: number, b: number): ShapeViolationError {
  const hint = kind === T_LOG
    ? " (for heavier tails try transform: 'inverse-sqrt'; for several modes use piecewiseSampler)"
    : ' (for several modes use piecewiseSampler)';
  return new ShapeViolationError(`${api}: target is not ${shapeName(kind)} on [${a}, ${b}]: ${detail}${hint}`, [a, b]);
}

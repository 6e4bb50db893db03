/**
 * The hull's shape checks and their messages: the tolerance in transformed
 * units, the tangent-pair and secant-triple concavity checks run at every
 * insertion, the zero-density gap error, and the explanation of a violation
 * found by the kernel. Functions over the hull's touch points (the
 * {@link ShapeCheckedHull} view, which {@link Hull} satisfies); they throw
 * {@link ShapeViolationError} and never change the hull. Storage, geometry
 * and insertion live in `hull.ts`. @internal
 *
 * @packageDocumentation
 */
import { checkLogDensity } from '../../core/evaluate.js';
import { gapError } from '../envelope/gaps.js';
import { belowChord, shapeError, transformedTolerance } from '../envelope/concavity.js';
import { HULL_LOG_TOLERANCE_RELATIVE } from '../envelope/tolerance.js';
import { transformValue } from '../envelope/transforms.js';

/** What the shape checks read of a hull (its touch points and settings). @internal */
export interface ShapeCheckedHull {
  readonly api: string;
  readonly kind: number;
  readonly tangent: boolean;
  readonly target: { readonly logDensity: (x: number) => number };
  readonly ref: number;
  readonly k: number;
  readonly touchX: Float64Array;
  readonly touchLogDensity: Float64Array;
  readonly touchDerivative: Float64Array;
  readonly touchValue: Float64Array;
  readonly touchSlope: Float64Array;
}

/** Tolerance in transformed units for comparisons between points of log-density la, lb and transformed values ya, yb. @internal */
export function tolY(h: ShapeCheckedHull, la: number, lb: number, ya: number, yb: number): number {
  return transformedTolerance(h.kind, la, lb, ya, yb);
}

/** Throws the hull's {@link ShapeViolationError} on [a, b], prefixed by `context` (what was being done) unless empty. @internal */
export function hullShapeError(h: ShapeCheckedHull, context: string, detail: string, a: number, b: number): never {
  if (context !== '') detail = `${context}; ${detail}`;
  throw shapeError(h.api, h.kind, detail, a, b);
}

/**
 * A zero of the density at x between the touch points a < x < b: locates
 * the gap by bisection (error path only) and throws
 * {@link ShapeViolationError} naming it, with what was being done.
 * @internal
 */
export function gapBetween(h: ShapeCheckedHull, a: number, x: number, b: number, lb: number): never {
  const api = h.api;
  const logf = h.target.logDensity;
  return gapError(api, (y: number) => checkLogDensity(api, y, logf(y)), a, x, b, lb);
}

/**
 * Tangent construction, points a < b: each tangent must lie above the
 * other point (equivalently the chord slope lies between the tangent
 * slopes, which therefore do not increase).
 * @internal
 */
export function checkTangentPair(h: ShapeCheckedHull, xa: number, ya: number, sa: number, la: number, ga: number, xb: number, yb: number, sb: number, lb: number, gb: number): void {
  const w = xb - xa;
  const tol = tolY(h, la, lb, ya, yb) + HULL_LOG_TOLERANCE_RELATIVE * w * (Math.abs(sa) + Math.abs(sb));
  const e1 = ya + sa * w - yb;
  const e2 = yb - sb * w - ya;
  if (!(e1 >= -tol) || !(e2 >= -tol)) {
    hullShapeError(
      h,
      '',
      `the slopes of the transformed density must not increase, but the tangent slopes are ${sa} at ${xa} and ${sb} at ${xb} around a chord slope of ${(yb - ya) / w} (log-density ${la} and ${lb}, derivatives ${ga} and ${gb})`,
      xa,
      xb,
    );
  }
}

/**
 * Secant construction, points x0 < x1 < x2: the middle one must not lie below the chord of the outer ones.
 * @param context - what was being done, for the message ('' at an insertion)
 * @internal
 */
export function checkSecantTriple(h: ShapeCheckedHull, context: string, x0: number, y0: number, l0: number, x1: number, y1: number, l1: number, x2: number, y2: number, l2: number): void {
  if (belowChord(h.kind, x0, y0, l0, x1, y1, l1, x2, y2, l2)) {
    hullShapeError(
      h,
      context,
      `the chord slopes of the transformed density must not increase, but they are ${(y1 - y0) / (x1 - x0)} on [${x0}, ${x1}] and ${(y2 - y1) / (x2 - x1)} on [${x1}, ${x2}] (log-density ${l0}, ${l1}, ${l2})`,
      x0,
      x2,
    );
  }
}

/**
 * Called by the kernel when the target at x was found above the envelope
 * or below the squeeze. Checks (x, logf(x)) against the neighbouring touch
 * points with the value-only concavity tests (no derivative needed) and
 * throws {@link ShapeViolationError} naming the interval when they fail —
 * which they do whenever the hull was built from correct values, since the
 * envelope at x is made of the neighbours' tangents or chord extensions and
 * the squeeze of their chord. Returns when they pass, so that the caller
 * reports an {@link EnvelopeViolationError}.
 * @param context - what was found, for the message
 * @internal
 */
export function explainViolation(h: ShapeCheckedHull, x: number, l: number, context: string): void {
  const k = h.k;
  const tx = h.touchX;
  const ty = h.touchValue;
  const tl = h.touchLogDensity;
  let p = 0;
  while (p < k && tx[p] <= x) p++;
  // at a touch point the target disagrees with its own earlier value: not a shape question
  if (p >= 1 && tx[p - 1] === x) return;
  if (l === -Infinity) {
    if (p >= 1 && p < k) gapBetween(h, tx[p - 1], x, tx[p], tl[p]);
    return;
  }
  const y = transformValue(h.kind, l - h.ref);
  if (p >= 2) checkSecantTriple(h, context, tx[p - 2], ty[p - 2], tl[p - 2], tx[p - 1], ty[p - 1], tl[p - 1], x, y, l);
  if (p >= 1 && p < k) checkSecantTriple(h, context, tx[p - 1], ty[p - 1], tl[p - 1], x, y, l, tx[p], ty[p], tl[p]);
  if (p + 1 < k) checkSecantTriple(h, context, x, y, l, tx[p], ty[p], tl[p], tx[p + 1], ty[p + 1], tl[p + 1]);
  if (h.tangent) {
    const ts = h.touchSlope;
    for (let i = p - 1; i <= p; i++) {
      if (i < 0 || i >= k) continue;
      const tan = ty[i] + ts[i] * (x - tx[i]);
      const tol = tolY(h, tl[i], l, ty[i], y) + HULL_LOG_TOLERANCE_RELATIVE * Math.abs(ts[i] * (x - tx[i]));
      if (!(tan >= y - tol)) {
        hullShapeError(
          h,
          context,
          `the target lies above the tangent of the transformed density at the touch point ${tx[i]} (slope ${ts[i]}, log-density ${tl[i]}, derivative ${h.touchDerivative[i]}) at x = ${x} (log-density ${l}); a T-concave target lies below all its tangents (or dLogDensity is wrong)`,
          Math.min(tx[i], x),
          Math.max(tx[i], x),
        );
      }
    }
  }
}

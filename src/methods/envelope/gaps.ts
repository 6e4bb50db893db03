/**
 * Gaps in the support: the look beyond a zero that cuts a hull's support, and the message naming a gap. @internal
 *
 * @packageDocumentation
 */
import { ShapeViolationError } from '../../core/errors.js';
import { twoTo } from '../../vendor/math.js';

/**
 * Octaves of distance beyond a zero that {@link checkBeyondZero} probes:
 * up to 2^20 times the larger of the width of the positive part and the
 * distance from the zero to it. @internal
 */
export const GAP_PROBE_OCTAVES = 20;
/** Hard cap on the probes beyond one zero (a zero very close to the positive part). @internal */
export const GAP_PROBE_MAX = 80;
/** Bisection steps locating each end of a gap once one is found (error path only). @internal */
const GAP_BISECTIONS = 60;

/**
 * Called where the density was found to be 0 at `zero`, outside the touch
 * points of positive density (nearest one: `edge`), before the hull cuts its
 * support there: probes beyond the zero at distances δ·2^k from it (δ =
 * |zero − edge|, k = 0, 1, … up to 2^{@link GAP_PROBE_OCTAVES} times
 * max(δ, `span`), at most {@link GAP_PROBE_MAX} probes, and the midpoint
 * towards a finite `bound`), within the part not yet known to be empty
 * (up to `bound`). A positive density at a probe means the support is not
 * an interval: the hull would sample only the side it started on, so the
 * gap is located by bisection and a {@link ShapeViolationError} names it.
 *
 * What this cannot see: a positive part beyond the zero that holds no probe
 * — one narrower than about its distance from the zero (the probes double
 * their distance), or beyond the last probe.
 * @param api - API name for messages
 * @param evaluate - counted, checked log-density
 * @param zero - a point of log-density −Infinity outside the touch points
 * @param edge - the touch point of finite log-density nearest to `zero`
 * @param bound - the end of the support on that side (declared, or an earlier cut)
 * @param span - width of the part known to be positive (touch points)
 * @internal
 */
export function checkBeyondZero(api: string, evaluate: (x: number) => number, zero: number, edge: number, bound: number, span: number): void {
  const dir = zero > edge ? 1 : -1;
  const delta = Math.abs(zero - edge);
  if (!(delta > 0)) return;
  const reach = twoTo(GAP_PROBE_OCTAVES) * Math.max(delta, span);
  let lastZero = zero;
  for (let k = 0; k < GAP_PROBE_MAX; k++) {
    const d = delta * twoTo(k);
    let x = zero + dir * d;
    let last = false;
    if (!Number.isFinite(x) || d > reach || (dir > 0 ? !(x < bound) : !(x > bound))) {
      if (!Number.isFinite(bound)) return;
      // the midpoint towards the finite end, then stop
      x = lastZero + 0.5 * (bound - lastZero);
      if (dir > 0 ? !(x > lastZero && x < bound) : !(x < lastZero && x > bound)) return;
      last = true;
    }
    const l = evaluate(x);
    if (l > -Infinity) gapError(api, evaluate, edge, lastZero, x, l);
    lastZero = x;
    if (last) return;
  }
}

/**
 * Locates the gap around `zero` (log-density −Infinity) between `edge` and
 * `beyond` (both of finite log-density, on either side) by bisection, and
 * throws {@link ShapeViolationError} naming it (error path only). @internal
 */
export function gapError(api: string, evaluate: (x: number) => number, edge: number, zero: number, beyond: number, lBeyond: number): never {
  // start of the gap: between edge (positive) and zero
  let a = edge;
  let b = zero;
  for (let i = 0; i < GAP_BISECTIONS; i++) {
    const m = a + 0.5 * (b - a);
    if (m === a || m === b) break;
    if (evaluate(m) > -Infinity) a = m;
    else b = m;
  }
  const start = b;
  // end of the gap: between zero and beyond (positive)
  let c = zero;
  let d = beyond;
  for (let i = 0; i < GAP_BISECTIONS; i++) {
    const m = c + 0.5 * (d - c);
    if (m === c || m === d) break;
    if (evaluate(m) > -Infinity) d = m;
    else c = m;
  }
  const end = c;
  const lo = Math.min(start, end);
  const hi = Math.max(start, end);
  throw new ShapeViolationError(
    `${api}: logDensity is -Infinity on about [${lo}, ${hi}] but finite on both sides (at x = ${edge} and at x = ${beyond}, logDensity ${lBeyond}): the support is not an interval, which a hull cannot sample (it would cut its support at the gap or put mass inside it); sample each interval with its own support and mix the draws by their masses`,
    [lo, hi],
  );
}

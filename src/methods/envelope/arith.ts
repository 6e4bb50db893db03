/**
 * Small numeric helpers shared by the envelope engines. @internal
 *
 * @packageDocumentation
 */
import { exp, log } from '../../vendor/math.js';

/** log(Σ e^v) over an array (−Infinity for an empty one or all −Infinity; +Infinity if any is). @internal */
export function logSumExp(v: ArrayLike<number>): number {
  let m = -Infinity;
  for (let i = 0; i < v.length; i++) if (v[i] > m) m = v[i];
  if (m === -Infinity || m === Infinity) return m;
  let s = 0;
  for (let i = 0; i < v.length; i++) s += exp(v[i] - m);
  return m + log(s);
}

/**
 * The largest index m in [from, to] with `a[m] <= x`, for `a` non-decreasing
 * on that range and `a[from] <= x` (binary search; `from` when no later
 * entry qualifies). @internal
 */
export function lastAtOrBelow(a: ArrayLike<number>, from: number, to: number, x: number): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const m = (lo + hi + 1) >> 1;
    if (a[m] <= x) lo = m;
    else hi = m - 1;
  }
  return lo;
}

/**
 * Truncation of a discrete target to an integer interval.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import type { DiscreteTarget } from '../../core/types.js';
import { checkDiscreteTarget } from '../../discrete/validate.js';

/** A discrete target returned by {@link truncateDiscrete}: support and mode are always set. */
export interface TruncatedDiscreteTarget extends DiscreteTarget {
  /** The truncated support. */
  readonly support: readonly [number, number];
  /** The target's mode hint clamped into the new support, or the nearest end to 0 when the target gave none. */
  readonly mode: number;
}

/**
 * Restricts a discrete target to the integers in `[lower, upper]`.
 *
 * @remarks
 * The logPmf is the target's inside the new support and `-Infinity`
 * outside; it is not renormalized (so `normalized` is not passed on, while
 * `logConcave` is). The mode hint is the target's clamped
 * into the new support (the mode of the truncation for a unimodal pmf).
 * The cdf, when the target has one, is (F(k) − F(lo − 1)) / (F(hi) −
 * F(lo − 1)), given only when that mass is at least 1e-6 (below, the
 * difference of cdf values has lost its digits; far-tail truncations then
 * have no cdf, and checks sum the logPmf instead).
 *
 * @param target - the target
 * @param lower - integer or -Infinity
 * @param upper - integer or Infinity, at least `lower`
 * @throws {@link InvalidTargetError} for non-integer bounds or an empty intersection with the support
 * @example
 * ```ts
 * import { discreteSampler, poissonTarget, truncateDiscrete } from 'exactdraw';
 * const tail = truncateDiscrete(poissonTarget(100), 200, Infinity); // k >= 100 + 10·sqrt(100)
 * discreteSampler(tail, { seed: 4 }).sample(); // 200 or a little more
 * ```
 */
export function truncateDiscrete(target: DiscreteTarget, lower: number, upper: number): TruncatedDiscreteTarget {
  const api = 'truncateDiscrete';
  const base = checkDiscreteTarget(api, target);
  if (typeof lower !== 'number' || !(Number.isSafeInteger(lower) || lower === -Infinity)) {
    throw new InvalidTargetError(`${api}: lower must be an integer or -Infinity, got ${typeof lower === 'string' ? `'${lower}'` : String(lower)}`);
  }
  if (typeof upper !== 'number' || !(Number.isSafeInteger(upper) || upper === Infinity)) {
    throw new InvalidTargetError(`${api}: upper must be an integer or Infinity, got ${typeof upper === 'string' ? `'${upper}'` : String(upper)}`);
  }
  const lo = Math.max(lower, base.lower);
  const hi = Math.min(upper, base.upper);
  if (!(lo <= hi)) {
    throw new InvalidTargetError(`${api}: [lower, upper] = [${lower}, ${upper}] does not meet the target's support [${base.lower}, ${base.upper}]`);
  }
  const lp = base.logPmf;
  const m0 = base.mode ?? (lo > 0 ? lo : hi < 0 ? hi : 0);
  const out: { -readonly [K in keyof TruncatedDiscreteTarget]: TruncatedDiscreteTarget[K] } = {
    logPmf: (k: number): number => (k < lo || k > hi ? -Infinity : lp(k)),
    support: [lo, hi],
    mode: Math.min(hi, Math.max(lo, m0)),
  };
  // a log-concave pmf stays log-concave on an interval; `normalized` is not passed on (the remaining mass may be tiny)
  if (base.logConcave) out.logConcave = true;
  const F0 = target.cdf;
  if (typeof F0 === 'function') {
    const F = F0.bind(target);
    const fBelow = lo === -Infinity ? 0 : F(lo - 1);
    const fTop = hi === Infinity ? 1 : F(hi);
    const mass = fTop - fBelow;
    if (mass >= 1e-6 && mass <= 1 + 1e-12) {
      out.cdf = (k: number): number => {
        if (k < lo) return 0;
        if (k >= hi) return 1;
        const v = (F(Math.floor(k)) - fBelow) / mass;
        return v < 0 ? 0 : v > 1 ? 1 : v;
      };
    }
  }
  return out;
}

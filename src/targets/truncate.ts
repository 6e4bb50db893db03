/**
 * Truncation of a target to an interval.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import { checkTarget } from '../core/validate.js';
import type { SurvivalTarget } from './family-target.js';
import type { PoleSide, PoleTarget } from './end-distance.js';

/**
 * A target returned by {@link truncate}: its support is always set.
 */
export interface TruncatedTarget extends SurvivalTarget, PoleTarget {
  /** The truncated support: the intersection of the target's support with `[lower, upper]`. */
  readonly support: readonly [number, number];
}

/**
 * Restricts `target` to `[lower, upper]`.
 *
 * @remarks
 * - Support: the intersection of `target.support` (default the whole line)
 *   with `[lower, upper]`; an empty or single-point intersection throws.
 * - `logDensity`: the target's log-density inside the new support,
 *   `-Infinity` outside. It is *not* renormalised (the {@link Target}
 *   contract allows unnormalized densities); only the cdf is.
 * - `dLogDensity`: passed through inside the new support (NaN outside);
 *   absent when the target has none.
 * - `mode`: the target's mode hint clamped into the new support. For a
 *   unimodal target the clamped mode is the mode of the truncation. Absent
 *   when the target has none.
 * - Poles ({@link PoleTarget}): a declared pole, and the log-density by the
 *   distance to that end, are kept for each end of the target's support that
 *   the truncation keeps (e.g. `truncate(gammaTarget(0.5), 0, 1e-6)` keeps
 *   the pole at 0) and dropped for an end it moves.
 * - `cdf`: `(F(x) − F(lo)) / (F(hi) − F(lo))` with `[lo, hi]` the new support.
 *   When the target also has `sf` (the exactdraw extension of
 *   {@link SurvivalTarget}; all ready-made targets have it) and the interval
 *   lies in the upper tail (F(lo) > 1/2), the survival form
 *   `(S(lo) − S(x)) / (S(lo) − S(hi))` is used instead, so that e.g. a normal
 *   truncated to [8, ∞) — where F(8) rounds to 1 − 6e-16 — keeps a cdf
 *   accurate to full relative precision. `sf` is provided alongside, by the
 *   form that is accurate for it. If the target has no cdf, the truncation
 *   has neither cdf nor sf; if the interval's mass underflows to 0 in double
 *   precision (e.g. a normal truncated to [40, 41]), they are omitted too
 *   rather than returning garbage.
 *
 * @param target - the target to truncate
 * @param lower - lower end (may be `-Infinity`)
 * @param upper - upper end (may be `Infinity`), must be > `lower`
 * @returns the truncated target
 * @throws {@link InvalidTargetError} when the target is malformed, a bound is
 *   NaN or not a number, `lower >= upper`, or the intersection with the
 *   target's support is empty or a single point
 * @example
 * ```ts
 * const tail = truncate(normalTarget(0, 1), 8, Infinity);
 * tail.cdf!(8.1); // ≈ 0.56, to full precision
 * ```
 */
export function truncate(target: SurvivalTarget, lower: number, upper: number): TruncatedTarget {
  const api = 'truncate';
  const base = checkTarget(api, target);
  if (typeof lower !== 'number' || Number.isNaN(lower)) {
    throw new InvalidTargetError(`${api}: lower must be a number (not NaN), got ${String(lower)}`);
  }
  if (typeof upper !== 'number' || Number.isNaN(upper)) {
    throw new InvalidTargetError(`${api}: upper must be a number (not NaN), got ${String(upper)}`);
  }
  if (!(lower < upper)) {
    throw new InvalidTargetError(`${api}: lower must be < upper, got lower = ${lower}, upper = ${upper}`);
  }
  const lo = Math.max(lower, base.lower);
  const hi = Math.min(upper, base.upper);
  if (!(lo < hi)) {
    throw new InvalidTargetError(
      `${api}: [lower, upper] = [${lower}, ${upper}] does not overlap the target's support [${base.lower}, ${base.upper}] in an interval (intersection [${lo}, ${hi}])`,
    );
  }
  const F0 = (target as { cdf?: unknown }).cdf;
  const S0 = (target as { sf?: unknown }).sf;
  if (F0 !== undefined && typeof F0 !== 'function') {
    throw new InvalidTargetError(`${api}: target.cdf must be a function when given, got ${typeof F0}`);
  }
  if (S0 !== undefined && typeof S0 !== 'function') {
    throw new InvalidTargetError(`${api}: target.sf must be a function when given, got ${typeof S0}`);
  }
  const ld = base.logDensity;
  const out: { -readonly [K in keyof TruncatedTarget]: TruncatedTarget[K] } = {
    logDensity(x: number): number {
      if (x < lo || x > hi) return -Infinity;
      return ld(x);
    },
    support: [lo, hi] as const,
  };
  const dld = base.dLogDensity;
  if (dld !== undefined) {
    out.dLogDensity = (x: number): number => (x < lo || x > hi ? NaN : dld(x));
  }
  if (base.mode !== undefined) out.mode = Math.min(hi, Math.max(lo, base.mode));
  keepPoles(target as PoleTarget, out, lo === base.lower, hi === base.upper, hi - lo);
  if (typeof F0 === 'function') {
    const F = (F0 as (x: number) => number).bind(target);
    const S = typeof S0 === 'function' ? (S0 as (x: number) => number).bind(target) : undefined;
    const fLo = F(lo);
    const fHi = F(hi);
    const upperTail = S !== undefined && fLo > 0.5;
    const lowerTail = fHi < 0.5;
    const sLo = S !== undefined ? S(lo) : 1 - fLo;
    const sHi = S !== undefined ? S(hi) : 1 - fHi;
    const mass = upperTail ? sLo - sHi : fHi - fLo;
    if (mass > 0 && mass <= 1) {
      out.cdf = (x: number): number => {
        if (x !== x) return NaN;
        if (x <= lo) return 0;
        if (x >= hi) return 1;
        const v = upperTail ? (sLo - (S as (y: number) => number)(x)) / mass : (F(x) - fLo) / mass;
        return v < 0 ? 0 : v > 1 ? 1 : v;
      };
      const sfBySurvival = S !== undefined && !lowerTail;
      out.sf = (x: number): number => {
        if (x !== x) return NaN;
        if (x <= lo) return 1;
        if (x >= hi) return 0;
        const v = sfBySurvival ? ((S as (y: number) => number)(x) - sHi) / mass : (fHi - F(x)) / mass;
        return v < 0 ? 0 : v > 1 ? 1 : v;
      };
    }
  }
  return out;
}

/** Copies the pole declaration and distance forms of the ends that the truncation keeps. */
function keepPoles(
  target: PoleTarget,
  out: { -readonly [K in keyof TruncatedTarget]: TruncatedTarget[K] },
  keepLower: boolean,
  keepUpper: boolean,
  width: number,
): void {
  const p = target.poles;
  const lower = keepLower && (p === 'lower' || p === 'both');
  const upper = keepUpper && (p === 'upper' || p === 'both');
  const side: PoleSide | undefined = lower && upper ? 'both' : lower ? 'lower' : upper ? 'upper' : undefined;
  if (side !== undefined) out.poles = side;
  const fl = target.logDensityFromLower;
  const dfl = target.dLogDensityFromLower;
  const fu = target.logDensityFromUpper;
  const dfu = target.dLogDensityFromUpper;
  if (keepLower && typeof fl === 'function') out.logDensityFromLower = (d: number): number => (d > width ? -Infinity : fl.call(target, d));
  if (keepLower && typeof dfl === 'function') out.dLogDensityFromLower = (d: number): number => (d > width ? NaN : dfl.call(target, d));
  if (keepUpper && typeof fu === 'function') out.logDensityFromUpper = (d: number): number => (d > width ? -Infinity : fu.call(target, d));
  if (keepUpper && typeof dfu === 'function') out.dLogDensityFromUpper = (d: number): number => (d > width ? NaN : dfu.call(target, d));
}

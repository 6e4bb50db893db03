/**
 * Automatic rejection constant: the supremum of logf − log g.
 *
 * @packageDocumentation
 */
import { checkCovers, checkProposal } from '../core/proposal-check.js';
import { ImproperDensityError, InvalidTargetError } from '../core/errors.js';
import { checkLogDensity } from '../core/evaluate.js';
import type { Proposal, Target } from '../core/types.js';
import { checkOptionKeys, checkTarget } from '../core/validate.js';
import { maximizeLog } from './maximize.js';
import { pow } from '../vendor/math.js';

/**
 * Safety margin added to the located supremum, in log space:
 * `1e-6 + 1e-9·|sup|` (a relative widening of about one part in a million,
 * costing about 1e-6 of the acceptance rate). It absorbs the error of the
 * local refinement and of floating-point rounding in logf − log g; it does not
 * and cannot make up for a feature the search missed, which the sampler's
 * per-evaluation envelope check reports instead.
 */
export const BOUND_MARGIN_ABSOLUTE = 1e-6;
/** Relative part of the safety margin; see {@link BOUND_MARGIN_ABSOLUTE}. */
export const BOUND_MARGIN_RELATIVE = 1e-9;

/** Options of {@link findLogBound}. */
export interface FindLogBoundOptions {
  /** A point near the maximiser of logf − log g; defaults to the target's mode hint. */
  hint?: number;
  /** Length scale of the target around the hint, to place the search probes. @defaultValue 1 */
  scale?: number;
}

/** Result of {@link findLogBound}. */
export interface LogBound {
  /** log C: an upper bound of logf(x) − log g(x) over the support, margin included. */
  logBound: number;
  /** Where the supremum was found. */
  argmax: number;
  /** Evaluations of the target's logDensity spent by the search. */
  evaluations: number;
}

/**
 * Finds log C = sup over the target's support of logDensity(x) − proposal.logDensity(x),
 * the tightest constant for which C·g dominates f, plus a tiny safety margin.
 *
 * @remarks
 * Robust global search: geometric probes from the hint towards both ends,
 * a uniform grid in a coordinate that maps the support to a finite interval,
 * then golden-section refinement around the best local maxima (a few hundred
 * evaluations). When logf − log g keeps rising towards an end, the supremum is
 * infinite and no constant exists: the error says which tail.
 *
 * @param target - the target (unnormalized log-density)
 * @param proposal - the proposal whose support must cover the target's
 * @param opts - search hints
 * @returns `{ logBound, argmax, evaluations }`
 * @throws {@link InvalidTargetError} for bad inputs, a proposal that does not cover the
 *   support, a proposal with lighter tails than the target, or a target with no mass found
 * @throws {@link ImproperDensityError} when the target itself does not decay in a tail
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity
 * @example
 * ```ts
 * const { logBound } = findLogBound(normalTarget(0, 1), cauchyProposal(0, 1));
 * Math.exp(logBound); // ≈ sqrt(2π/e) = 1.5203 (ratio of normalized densities)
 * ```
 */
export function findLogBound(target: Target, proposal: Proposal, opts: FindLogBoundOptions = {}): LogBound {
  const api = 'findLogBound';
  const t = checkTarget(api, target);
  const pSupport = checkProposal(api, proposal);
  checkCovers(api, [t.lower, t.upper], pSupport);
  checkOptionKeys(api, opts, ['hint', 'scale']);
  const logf = t.logDensity;
  const logg = (x: number): number => proposal.logDensity(x);
  let evaluations = 0;
  const h = (x: number): number => {
    evaluations++;
    const lf = checkLogDensity(api, x, logf(x));
    if (lf === -Infinity) return -Infinity;
    const lg = logg(x);
    if (lg !== lg || lg === Infinity) {
      throw new InvalidTargetError(`${api}: proposal.logDensity(${x}) returned ${lg}; it must be finite or -Infinity`);
    }
    if (lg === -Infinity) {
      throw new InvalidTargetError(`${api}: the proposal has zero density at x = ${x} where the target has log density ${lf}; no constant C makes C·g dominate f there`);
    }
    return lf - lg;
  };
  const hint = opts.hint ?? t.mode;
  const r = maximizeLog(api, h, t.lower, t.upper, { hint, scale: opts.scale });
  if (r.risingTail !== undefined) {
    const side = r.risingTail;
    const end = side === 'upper' ? t.upper : t.lower;
    // Walk the tail from a point inside the support (the hint, else a finite end, else 0), not from
    // r.x: for a symmetric logf − log g the best probe can lie in the other tail, and walking from
    // there towards the rising side climbs the target's body (a proper target reported as improper).
    const base =
      hint !== undefined && Number.isFinite(hint) && hint >= t.lower && hint <= t.upper
        ? hint
        : Number.isFinite(t.lower) ? t.lower : Number.isFinite(t.upper) ? t.upper : 0;
    if (!Number.isFinite(end) && targetRises(logf, base, side)) {
      throw new ImproperDensityError(
        `${api}: the target's log density keeps rising as x → ${side === 'upper' ? '+∞' : '−∞'} (${side} tail); it does not decay, so its mass is infinite`,
      );
    }
    const where = Number.isFinite(end) ? `x → ${end} (the ${side} end of the support)` : `x → ${side === 'upper' ? '+∞' : '−∞'} (the ${side} tail)`;
    throw new InvalidTargetError(
      `${api}: logDensity − proposal.logDensity keeps rising as ${where}; the supremum is infinite, so no rejection constant exists. ` +
        (Number.isFinite(end)
          ? 'The target is unbounded relative to the proposal at that end.'
          : "The proposal's tail is lighter than the target's: use a heavier-tailed proposal (e.g. cauchyProposal)."),
    );
  }
  const logBound = r.value + BOUND_MARGIN_ABSOLUTE + BOUND_MARGIN_RELATIVE * Math.abs(r.value);
  return { logBound, argmax: r.x, evaluations };
}

/** True when logf itself keeps increasing along the tail (the target is improper there). */
function targetRises(logf: (x: number) => number, x0: number, side: 'lower' | 'upper'): boolean {
  const dir = side === 'upper' ? 1 : -1;
  let prev = -Infinity;
  let rises = 0;
  for (let k = 4; k <= 60; k += 4) {
    const v = logf(x0 + dir * pow(2, k));
    if (v !== v) return false;
    if (v > prev) rises++;
    prev = v;
  }
  return rises >= 14 && prev > -Infinity;
}

/**
 * Setup helpers shared by the discrete methods: a counted, memoized
 * evaluator of the log-pmf and the mode search. @internal
 *
 * @packageDocumentation
 */
import { checkLogDensity } from '../../core/evaluate.js';
import type { Counters } from '../../core/counters.js';
import { ImproperDensityError, InvalidTargetError } from '../../core/errors.js';
import type { CheckedDiscreteTarget } from '../validate.js';

/** Largest |k| passed to logPmf: draws stay safe integers. @internal */
export const MAX_DISCRETE_K = 9007199254740991; // Number.MAX_SAFE_INTEGER (a literal: a bundle drops an unused one)
/**
 * Absolute log tolerance of the shape checks and log margin added to every
 * hat: a hat is raised by this much (costing a factor e^1e-6 in acceptance)
 * so that rounding in logPmf cannot push the target above it. @internal
 */
export const DISCRETE_LOG_MARGIN = 1e-6;

/** Points kept in the evaluator's small linear cache before it falls back to a Map. @internal */
const SMALL_CACHE = 24;

/**
 * Counted, memoized logPmf for setup; -Infinity outside the support without a call.
 * The first {@link SMALL_CACHE} points live in two short plain arrays
 * scanned linearly (a fresh sampler for one draw evaluates about ten points;
 * a Map, or typed arrays with their off-heap buffers, per sampler were a
 * large part of its setup cost, mostly garbage collection), later ones in a Map.
 * @internal
 */
export class SetupEvaluator {
  readonly api: string;
  readonly t: CheckedDiscreteTarget;
  private readonly counters: Counters;
  private readonly keys: number[] = [];
  private readonly vals: number[] = [];
  private memo: Map<number, number> | undefined;

  constructor(api: string, t: CheckedDiscreteTarget, counters: Counters) {
    this.api = api;
    this.t = t;
    this.counters = counters;
  }

  /** logPmf(k), checked. */
  h(k: number): number {
    if (k < this.t.lower || k > this.t.upper || Math.abs(k) > MAX_DISCRETE_K) return -Infinity;
    const keys = this.keys;
    const n = keys.length;
    for (let i = 0; i < n; i++) if (keys[i] === k) return this.vals[i];
    const memo = this.memo;
    if (memo !== undefined) {
      const c = memo.get(k);
      if (c !== undefined) return c;
    }
    const v = this.t.logPmf(k);
    this.counters.setupEvaluations++;
    checkLogDensity(this.api, k, v);
    if (n < SMALL_CACHE) {
      keys.push(k);
      this.vals.push(v);
    } else (this.memo ??= new Map<number, number>()).set(k, v);
    return v;
  }
}

/**
 * Finds a mode (a local maximum of logPmf on the integers) by climbing from
 * the hint (or from the finite end of the support, or 0) with doubling steps
 * and bisection on the sign of the forward difference. Exact for unimodal
 * pmfs; for a multimodal pmf it returns a local mode. O(log distance)
 * evaluations; bounded.
 * @internal
 */
export function findMode(ev: SetupEvaluator, start: number): number {
  const { lower: lo, upper: hi } = ev.t;
  const api = ev.api;
  const hs = ev.h(start);
  if (hs === -Infinity) {
    throw new InvalidTargetError(`${api}: target.logPmf(${start}) is -Infinity where the mode search starts; give target.mode (an integer where the pmf is positive)`);
  }
  // dir = +1 if the pmf increases to the right of start, -1 to the left, 0 at a local max
  const dir = ev.h(start + 1) > hs ? 1 : ev.h(start - 1) > hs ? -1 : 0;
  if (dir === 0) return start;
  const end = dir > 0 ? hi : lo;
  // a: a point where the pmf still increases in direction dir (h(a + dir) > h(a))
  let a = start;
  let step = 1;
  for (let it = 0; it < 1100; it++) {
    let b = a + dir * step;
    if (dir > 0 ? b >= end : b <= end) b = end;
    if (Math.abs(b) >= MAX_DISCRETE_K / 2) {
      throw new ImproperDensityError(`${api}: target.logPmf increases without bound toward ${dir > 0 ? '+' : '-'}Infinity (still increasing at ${a}); the pmf does not decay`);
    }
    if (b === end || !(ev.h(b + dir) > ev.h(b))) {
      // the mode lies in (a, b]: bisection keeping "increasing at lo_" and "not increasing at hi_"
      let x = a;
      let y = b;
      for (let j = 0; j < 64 && Math.abs(y - x) > 1; j++) {
        const mid = x + dir * Math.floor(Math.abs(y - x) / 2);
        if (ev.h(mid + dir) > ev.h(mid)) x = mid;
        else y = mid;
      }
      return ev.h(y) >= ev.h(x) ? y : x;
    }
    a = b;
    step *= 2;
  }
  throw new ImproperDensityError(`${api}: the mode search from ${start} did not end; the pmf does not decay`);
}

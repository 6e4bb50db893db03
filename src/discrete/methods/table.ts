/**
 * The table method: every point that carries mass above e^-40 of the
 * maximum goes into an alias table; unbounded tails beyond the table are
 * drawn by rejection from a geometric hat, only when the table's tail entry
 * is drawn. @internal
 *
 * @remarks
 * Finite support with few points: the table holds the whole support (any
 * shape, multimodal included) and no draw is ever rejected. Otherwise the
 * table is grown from the mode outward, one point at a time, until logPmf
 * has fallen {@link TABLE_LOG_DROP} below the largest value seen and is
 * decreasing with non-positive second difference at the edge; beyond an
 * edge b that is not the end of the support, the tail is bounded by the
 * geometric hat h(b) + j·(h(b) − h(b − 1)) (valid if the pmf is log-concave
 * beyond b — an assumption checked at every tail evaluation,
 * {@link EnvelopeViolationError} otherwise). The tail's hat mass is one
 * more entry of the table. Rounding: the table's probabilities are
 * multiples of 2^-52 (see weightedIndexSampler), so a tail whose hat mass is
 * below about 2^-53 may round to probability 0.
 * @internal
 */
import { checkLogDensity } from '../../core/evaluate.js';
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, InvalidTargetError, ShapeViolationError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import { TABLE_UNITS, buildAlias, quantizeWeights } from '../_internals/tables.js';
import { DISCRETE_LOG_MARGIN, MAX_DISCRETE_K, type SetupEvaluator } from '../_internals/setup.js';
import type { DiscreteSampler } from '../types.js';
import { checkDiscreteFillArray, int32RangeError } from '../validate.js';
import { exp, expm1, log } from '../../vendor/math.js';

/** logPmf drop below the maximum at which the table stops growing (e^-40 ≈ 4e-18). @internal */
export const TABLE_LOG_DROP = 40;
/** Largest number of points in a table of {@link discreteSampler}. */
export const MAX_DISCRETE_TABLE_POINTS = 1048576; // 2^20

/** The layout of a table. @internal */
export interface DiscreteTable {
  /** First point of the table. */
  readonly first: number;
  /** Last point of the table. */
  readonly last: number;
  /** logPmf over first..last. */
  readonly logp: Float64Array;
  /** Right and left tail slopes (< 0), NaN for no tail. */
  readonly slopeRight: number;
  readonly slopeLeft: number;
}

/** Builds the table (setup only). @internal */
export function buildDiscreteTable(ev: SetupEvaluator, m: number | undefined, maxPoints: number, probe: boolean): DiscreteTable {
  const api = ev.api;
  const { lower: lo, upper: hi } = ev.t;
  if (hi - lo + 1 <= maxPoints) {
    const n = hi - lo + 1;
    const logp = new Float64Array(n);
    for (let i = 0; i < n; i++) logp[i] = ev.h(lo + i);
    return { first: lo, last: hi, logp, slopeRight: NaN, slopeLeft: NaN };
  }
  if (m === undefined) throw new InvalidTargetError(`${api}: a table over a support of ${hi - lo + 1} points needs a mode`);
  let max = ev.h(m);
  const grow = (dir: 1 | -1): { edge: number; slope: number } => {
    const end = dir > 0 ? hi : lo;
    let k = m;
    let past = m; // an edge must lie beyond this point (moved out by a failed probe)
    for (let count = 0; ; count++) {
      if (k === end) return { edge: k, slope: NaN };
      if (count > maxPoints) {
        throw new ShapeViolationError(`${api}: the table would need more than ${maxPoints} points: logPmf has not fallen ${TABLE_LOG_DROP} below its maximum within ${maxPoints} points of ${m} toward ${dir > 0 ? '+' : '-'}Infinity`);
      }
      const hk = ev.h(k);
      if (hk > max) max = hk;
      const h1 = ev.h(k - dir);
      const h2 = ev.h(k - 2 * dir);
      if (hk < max - TABLE_LOG_DROP && hk < h1 && hk - h1 <= h1 - h2 + DISCRETE_LOG_MARGIN && Math.abs(k - m) >= 2 && dir * (k - past) > 0) {
        const bad = probe ? probeTail(ev, m, k, hk, hk - h1, dir, end) : undefined;
        if (bad === undefined) return { edge: k, slope: hk - h1 };
        past = bad; // mass above the tail hat at `bad`: grow the table past it
      }
      k += dir;
    }
  };
  const right = grow(1);
  const left = grow(-1);
  const n = right.edge - left.edge + 1;
  const logp = new Float64Array(n);
  for (let i = 0; i < n; i++) logp[i] = ev.h(left.edge + i);
  return { first: left.edge, last: right.edge, logp, slopeRight: right.slope, slopeLeft: left.slope };
}

/**
 * Gives tail entry i at least one unit when its weight is positive and
 * returns rho = min(1, exact share / assigned share) (1 for no tail).
 */
function tailShare(w: Float64Array, units: Float64Array, i: number): number {
  if (!(w[i] > 0)) return 1;
  if (units[i] === 0) {
    let big = 0;
    for (let j = 1; j < units.length; j++) if (units[j] > units[big]) big = j;
    units[big] -= 1;
    units[i] = 1;
  }
  let sum = 0;
  for (let j = 0; j < w.length; j++) sum += w[j];
  return Math.min(1, ((w[i] / sum) * TABLE_UNITS) / units[i]);
}

/** Probes beyond a table edge reach this many times the edge's distance from the mode (at least {@link TABLE_PROBE_MIN_REACH}). @internal */
export const TABLE_PROBE_REACH = 64;
/** Smallest reach of the probes beyond a table edge, in points. @internal */
export const TABLE_PROBE_MIN_REACH = 1024;

/**
 * Checks the geometric tail hat beyond a candidate edge b at the points
 * b ± 1, 2, 4, ... up to the reach (a black-box pmf can always hide mass
 * between probes; the reach and spacing are the assumption, stated in the
 * sampler's reason). Returns the first probe where logPmf is above the hat
 * (the table must grow past it), or undefined.
 * @internal
 */
function probeTail(ev: SetupEvaluator, m: number, b: number, hb: number, slope: number, dir: 1 | -1, end: number): number | undefined {
  const reach = Math.max(TABLE_PROBE_MIN_REACH, TABLE_PROBE_REACH * Math.abs(b - m));
  for (let d = 1; d <= reach; d *= 2) {
    const k = b + dir * d;
    if (dir > 0 ? k > end : k < end) return undefined;
    if (Math.abs(k) > MAX_DISCRETE_K) return undefined;
    if (ev.h(k) > hb + d * slope + DISCRETE_LOG_MARGIN) return k;
  }
  return undefined;
}

/** The sampler over a {@link DiscreteTable}. @internal */
export function tableSamplerOf(
  api: string,
  tab: DiscreteTable,
  logPmf: (k: number) => number,
  lo: number,
  hi: number,
  u: Uniform,
  counters: Counters,
  maxRejections: number,
): DiscreteSampler {
  const { first, last, logp, slopeRight: sR, slopeLeft: sL } = tab;
  const n = logp.length;
  let max = -Infinity;
  for (let i = 0; i < n; i++) if (logp[i] > max) max = logp[i];
  if (max === -Infinity) throw new InvalidTargetError(`${api}: target.logPmf is -Infinity at every point of [${first}, ${last}]; the target has no mass`);
  const w = new Float64Array(n + 2);
  for (let i = 0; i < n; i++) w[i] = exp(logp[i] - max);
  const hR = logp[n - 1] + DISCRETE_LOG_MARGIN;
  const hL = logp[0] + DISCRETE_LOG_MARGIN;
  if (!Number.isNaN(sR)) w[n] = exp(hR - max + sR) / -expm1(sR);
  if (!Number.isNaN(sL)) w[n + 1] = exp(hL - max + sL) / -expm1(sL);
  const units = quantizeWeights(api, w, (i) => (i < n ? `the weight of ${first + i}` : 'a tail weight'));
  // A tail is never dropped: a tail weight rounded to 0 units gets 1 (taken from the largest entry), and a
  // tail drawn more often than its weight's exact share is accepted with the ratio rho <= 1 on top of the hat
  // test, so that tail points keep their probability relative to the table points (up to rounding).
  const rhoR = tailShare(w, units, n);
  const rhoL = tailShare(w, units, n + 1);
  const t = buildAlias(units);
  const K = t.cells;
  const C = t.cellUnits;
  const P = t.threshold;
  const A = t.alias;
  const tail = (i: number): number => {
    // i = n: right tail, n + 1: left tail; one proposal; NaN when rejected
    const right = i === n;
    const s = right ? sR : sL;
    const j = 1 + Math.floor(log(1 - u()) / s);
    const k = right ? last + j : first - j;
    const v = 1 - u();
    if (!(k >= lo && k <= hi) || Math.abs(k) > MAX_DISCRETE_K) return NaN;
    const g = (right ? hR : hL) + j * s;
    const hk = logPmf(k);
    counters.densityEvaluations++;
    checkLogDensity(api, k, hk);
    if (hk > g) throw new EnvelopeViolationError(api, k, hk, g);
    return v <= (right ? rhoR : rhoL) * exp(hk - g) ? k : NaN;
  };
  const draw = (): number => {
    for (let rej = 0; rej < maxRejections; rej++) {
      counters.proposals++;
      const x = u() * K;
      const j = Math.floor(x);
      const i = (x - j) * C < P[j] ? j : A[j];
      if (i < n) return first + i;
      const k = tail(i);
      if (k === k) return k;
    }
    throw new StalledSamplerError(api, maxRejections, counters.samples, counters.proposals);
  };
  return {
    sample(): number {
      const k = draw();
      counters.samples++;
      return k;
    },
    fill<T extends Float64Array | Int32Array>(out: T): T {
      checkDiscreteFillArray(api, out);
      const len = out.length;
      const int = out instanceof Int32Array;
      for (let q = 0; q < len; q++) {
        counters.proposals++;
        const x = u() * K;
        const j = Math.floor(x);
        const i = (x - j) * C < P[j] ? j : A[j];
        let k: number;
        if (i < n) k = first + i;
        else {
          k = tail(i);
          if (k !== k) k = draw(); // rejected: start again
        }
        if (int && (k > 2147483647 || k < -2147483648)) throw int32RangeError(api, k);
        out[q] = k;
        counters.samples++;
      }
      return out;
    },
    get stats() {
      return counters.snapshot();
    },
  };
}

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
import { buildAlias, quantizeWeights } from '../_internals/tables.js';
import { DISCRETE_LOG_MARGIN, MAX_DISCRETE_K, type SetupEvaluator } from '../_internals/setup.js';
import type { DiscreteSampler } from '../types.js';
import { checkDiscreteFillArray, int32RangeError } from '../validate.js';
import { exp, expm1, log } from '../../vendor/math.js';

/** logPmf drop below the maximum at which the table stops growing (e^-40 ≈ 4e-18). @internal */
export const TABLE_LOG_DROP = 40;
/** Largest number of points in a table of {@link discreteSampler}. */
export const MAX_DISCRETE_TABLE_POINTS = 1 << 20;

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
export function buildDiscreteTable(ev: SetupEvaluator, m: number | undefined, maxPoints: number): DiscreteTable {
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
    for (let count = 0; ; count++) {
      if (k === end) return { edge: k, slope: NaN };
      if (count > maxPoints) {
        throw new ShapeViolationError(`${api}: the table would need more than ${maxPoints} points: logPmf has not fallen ${TABLE_LOG_DROP} below its maximum within ${maxPoints} points of ${m} toward ${dir > 0 ? '+' : '-'}Infinity`);
      }
      const hk = ev.h(k);
      if (hk > max) max = hk;
      const h1 = ev.h(k - dir);
      const h2 = ev.h(k - 2 * dir);
      if (hk < max - TABLE_LOG_DROP && hk < h1 && hk - h1 <= h1 - h2 + DISCRETE_LOG_MARGIN && Math.abs(k - m) >= 2) {
        return { edge: k, slope: hk - h1 };
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
    return v <= exp(hk - g) ? k : NaN;
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

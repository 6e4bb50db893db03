/**
 * The strip table of the fast path built over a piecewise envelope
 * (multimodal and non-concave targets). @internal
 *
 * @remarks
 * The pieces of {@link piecewiseSampler}'s envelope carry an upper envelope
 * and a lower squeeze that are valid because of each cell's curvature (see
 * there), and both are monotone on every piece: linear in log space on the
 * exponential pieces, and a decreasing function of the distance from the
 * piece's high end on the inverse-sqrt (heavy tail) pieces. So on any strip
 * [a, b] inside one piece, the envelope's maximum and the squeeze's minimum
 * are taken at a or b, and the constants
 *
 *     M = max(env(a), env(b)),   m = min(sq(a), sq(b))
 *
 * bound the target on the strip from above and below exactly as far as the
 * piecewise envelope does; no new shape reasoning is involved. The body of
 * the table covers the contiguous run of finite pieces that holds all the
 * envelope's mass but about `tailMass` on each side. A piece holding at
 * least 1/`strips` of the body's envelope area is cut into strips of equal
 * width, about one per 1/`strips` of area and more where its envelope
 * varies steeply; runs of lighter pieces are merged into one strip while
 * the run holds less than 1/`strips` and its envelope varies by less than
 * e^0.5. On a strip over several pieces the same argument holds piece by
 * piece: M is the largest, m the smallest, of the pieces' envelope and
 * squeeze values at their ends inside the strip. The pieces outside the
 * body form the two tail regions, sampled as the piecewise kernel samples
 * pieces.
 *
 * Setup evaluates the target at every strip boundary and checks each value
 * against the envelope and squeeze of the pieces meeting there (with the
 * piecewise tolerance): a value outside them proves the scan missed a
 * feature, and the caller inserts such points into the grid and rebuilds
 * before any draw is made (see `violations`). The values also give a
 * sharper bound where they can: M is never below, and m never above, the
 * values at the strip's ends.
 * @internal
 */
import type { Counters } from '../../core/counters.js';
import { InvalidTargetError } from '../../core/errors.js';
import { checkLogDensity } from '../../core/evaluate.js';
import { pieceLogEnvelope, pieceLogSqueeze } from '../envelope/piece-tables.js';
import type { Tables } from '../envelope/piece-tables.js';
import { logTolerance } from '../envelope/tolerance.js';
import { T_LOG } from '../envelope/transforms.js';
import { piecewiseCap, piecewiseTailCandidate } from './piecewise-kernel.js';
import { stripRegions } from './strip-table.js';
import type { PiecewiseStrips, StripTable } from './strip-table.js';
import { exp } from '../../vendor/math.js';

/** Strips per unit of log-envelope variation inside a piece (at most 0.1 per strip in massive pieces). @internal */
const STRIPS_PER_LOG_UNIT = 10;
/** Pieces below this share of the body's area get strips by area only. @internal */
const STEEP_MIN_SHARE = 1e-4;
/** A run of light pieces merged into one strip spans at most this much log-envelope variation. @internal */
const MERGE_MAX_LOG_VARIATION = 0.5;

/** A boundary value outside the piecewise envelope or squeeze (for a repair). @internal */
export interface BoundaryViolation {
  readonly x: number;
  readonly logDensity: number;
  /** The violated bound (absolute log), and which one. */
  readonly bound: number;
  readonly what: 'envelope' | 'squeeze';
}

/** Inputs of {@link buildPiecewiseStripTable}. @internal */
export interface PiecewiseStripInput {
  readonly api: string;
  readonly t: Tables;
  readonly logDensity: (x: number) => number;
  readonly counters: Counters;
  readonly strips: number;
  readonly tailMass: number;
  readonly maxStrips: number;
}

/**
 * Builds the strip table over the piecewise envelope `t` (see the module
 * remarks). Returns the table, or the boundary values that contradict the
 * envelope (then the table is not usable).
 * @internal
 */
export function buildPiecewiseStripTable(inp: PiecewiseStripInput): { table: StripTable | null; violations: BoundaryViolation[] } {
  const { api, t, logDensity, counters } = inp;
  const m = t.n;
  const ref = t.ref;
  const area = new Float64Array(m);
  let total = 0;
  for (let j = 0; j < m; j++) {
    area[j] = exp(t.logAreas[j]);
    total += area[j];
  }
  if (!(total > 0 && total < Infinity)) throw new InvalidTargetError(`${api}: the piecewise envelope has area ${total} (relative to e^${ref})`);
  const finite = (j: number): boolean => t.lo[j] > -Infinity && t.hi[j] < Infinity && t.width[j] > 0;
  const eps = inp.tailMass * total;
  // body: pieces jL..jR
  let jL = 0;
  let acc = 0;
  while (jL < m && (!finite(jL) || acc + area[jL] <= eps)) acc += area[jL++];
  let jR = m - 1;
  acc = 0;
  while (jR >= jL && (!finite(jR) || acc + area[jR] <= eps)) acc += area[jR--];
  if (jR < jL) throw new InvalidTargetError(`${api}: the piecewise envelope has no finite piece holding mass, so no table can be built over it`);
  for (let j = jL; j <= jR; j++) {
    if (!finite(j)) throw new InvalidTargetError(`${api}: the piecewise envelope has an unbounded piece [${t.lo[j]}, ${t.hi[j]}] between finite ones`);
  }
  let bodyArea = 0;
  for (let j = jL; j <= jR; j++) bodyArea += area[j];
  for (let k = jL + 1; k <= jR; k++) {
    if (t.lo[k] !== t.hi[k - 1]) throw new InvalidTargetError(`${api}: the piecewise envelope pieces [.., ${t.hi[k - 1]}] and [${t.lo[k]}, ..] do not meet`);
  }
  // ----- strips: massive pieces are subdivided, runs of light pieces merged ---------------------------
  const unit = bodyArea / inp.strips;
  const xs: number[] = [];
  const first: number[] = [];
  const last: number[] = [];
  let open = false;
  let runArea = 0;
  let runTop = -Infinity;
  let runLow = Infinity;
  const close = (): void => {
    open = false;
  };
  for (let j = jL; j <= jR; j++) {
    const ea = pieceLogEnvelope(t, j, t.lo[j]);
    const eb = pieceLogEnvelope(t, j, t.hi[j]);
    const variation = Math.abs(ea - eb);
    const share = area[j] / bodyArea;
    let s = area[j] >= unit ? Math.round(area[j] / unit) : 0;
    if (share >= STEEP_MIN_SHARE && variation === variation) s = Math.max(s, Math.min(Math.ceil(variation * STRIPS_PER_LOG_UNIT), 4 * Math.ceil(area[j] / unit) + 4));
    if (s >= 1) {
      close();
      for (let q = 0; q < s; q++) {
        xs.push(q === 0 ? t.lo[j] : t.lo[j] + ((t.hi[j] - t.lo[j]) * q) / s);
        first.push(j);
        last.push(j);
      }
      continue;
    }
    // a light piece: extend the open run while its mass stays below one unit and its envelope varies by less than MERGE_MAX_LOG_VARIATION
    const top = Math.max(runTop, ea, eb);
    const low = Math.min(runLow, ea, eb);
    if (open && (runArea + area[j] > unit || top - low > MERGE_MAX_LOG_VARIATION)) close();
    if (!open) {
      open = true;
      xs.push(t.lo[j]);
      first.push(j);
      last.push(j);
      runArea = 0;
      runTop = -Infinity;
      runLow = Infinity;
    }
    last[last.length - 1] = j;
    runArea += area[j];
    runTop = Math.max(runTop, ea, eb);
    runLow = Math.min(runLow, ea, eb);
  }
  let n = xs.length;
  if (n > inp.maxStrips) throw new InvalidTargetError(`${api}: the table would need ${n} strips, more than ${inp.maxStrips}; use fewer strips or a coarser envelope (targetAreaRatio, maxPieces)`);
  xs.push(t.hi[jR]);
  const x = Float64Array.from(xs);
  const pFirst = Int32Array.from(first);
  const pLast = Int32Array.from(last);
  n = pFirst.length;

  // ----- values at the boundaries, checked against the pieces meeting there ------------------------
  const l = new Float64Array(n + 1);
  const violations: BoundaryViolation[] = [];
  for (let b = 0; b <= n; b++) {
    const xb = x[b];
    const raw = logDensity(xb);
    counters.setupEvaluations++;
    const v = checkLogDensity(api, xb, raw);
    l[b] = v;
    const lr = v - ref;
    const tol = logTolerance(ref, lr);
    const j0 = b > 0 ? pLast[b - 1] : pFirst[0];
    const j1 = b < n ? pFirst[b] : pLast[n - 1];
    for (let j = Math.min(j0, j1); j <= Math.max(j0, j1); j++) {
      if (!(t.lo[j] <= xb && xb <= t.hi[j])) continue;
      const env = pieceLogEnvelope(t, j, xb);
      const sq = pieceLogSqueeze(t, j, xb);
      if (lr > env + tol) violations.push({ x: xb, logDensity: v, bound: env + ref, what: 'envelope' });
      else if (lr < sq - tol) violations.push({ x: xb, logDensity: v, bound: sq + ref, what: 'squeeze' });
    }
  }
  if (violations.length > 0) return { table: null, violations };

  // ----- bounds per strip: extremes of the pieces' envelopes and squeezes at their ends within the strip ----
  const logUp = new Float64Array(n);
  const logLo = new Float64Array(n);
  const up = new Float64Array(n);
  const lo = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = x[i];
    const b = x[i + 1];
    let M = Math.max(l[i], l[i + 1]) - ref; // never below a value it bounds
    let q = Math.min(l[i], l[i + 1]) - ref;
    for (let j = pFirst[i]; j <= pLast[i]; j++) {
      const pa = t.lo[j] > a ? t.lo[j] : a;
      const pb = t.hi[j] < b ? t.hi[j] : b;
      const e0 = pieceLogEnvelope(t, j, pa);
      const e1 = pieceLogEnvelope(t, j, pb);
      const s0 = pieceLogSqueeze(t, j, pa);
      const s1 = pieceLogSqueeze(t, j, pb);
      if (e0 > M) M = e0;
      if (e1 > M) M = e1;
      if (s0 < q) q = s0;
      if (s1 < q) q = s1;
    }
    if (q > M) q = M;
    logUp[i] = M + ref;
    logLo[i] = q + ref;
    up[i] = exp(M);
    lo[i] = exp(q);
  }

  // ----- tails and regions -------------------------------------------------------------------------------
  const tail = (from: number, to: number): { idx: Int32Array; cum: Float64Array } => {
    const idx: number[] = [];
    const cum: number[] = [];
    let c = 0;
    for (let j = from; j <= to; j++) {
      if (!(area[j] > 0)) continue;
      c += area[j];
      idx.push(j);
      cum.push(c);
    }
    return { idx: Int32Array.from(idx), cum: Float64Array.from(cum) };
  };
  const left = tail(0, jL - 1);
  const right = tail(jR + 1, m - 1);
  const leftArea = left.cum.length > 0 ? left.cum[left.cum.length - 1] : 0;
  const rightArea = right.cum.length > 0 ? right.cum[right.cum.length - 1] : 0;
  const regions = stripRegions(n, x, logUp, up, lo, leftArea, rightArea);
  const nan = (k: number): Float64Array => new Float64Array(k).fill(NaN);
  const pw: PiecewiseStrips = { tables: t, first: pFirst, last: pLast, tailL: left.idx, cumL: left.cum, tailR: right.idx, cumR: right.cum, tail: piecewiseTailCandidate, cap: piecewiseCap };
  const table: StripTable = {
    api,
    kind: T_LOG,
    ref,
    lower: t.lo[0],
    upper: t.hi[m - 1],
    n,
    x,
    l,
    y: nan(n + 1),
    chordSlope: nan(n),
    logUp,
    logLo,
    up,
    lo,
    leftLineSlope: nan(n),
    rightLineSlope: nan(n),
    left: null,
    right: null,
    ...regions,
    piecewise: pw,
  };
  return { table, violations };
}

/**
 * The sampling kernel of the fast path. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, StalledSamplerError } from '../../core/errors.js';
import { checkLogDensity } from '../../core/evaluate.js';
import type { UniformBlock } from '../../random/uniform-block.js';
import { nextUniform } from '../../random/uniform-block.js';
import { notConcave, shapeError } from '../envelope/concavity.js';
import { logTolerance } from '../envelope/tolerance.js';
import { T_LOG, invertPiece, logHeight, transformValue } from '../envelope/transforms.js';
import type { AliasCells } from './alias.js';
import { CELL_STRIDE } from './alias.js';
import { R_CAP, R_LEFT_TAIL, R_RIGHT_TAIL } from './strip-table.js';
import type { KernelState, StripTable, TailPiece } from './strip-table.js';
import { exp, log } from '../../vendor/math.js';

/** The largest double below 1. */
const BELOW_ONE = 0.9999999999999999;

/** A strip table with its alias cells and target: the state of a table sampler. @internal */
export interface TableState extends KernelState {
  readonly cells: AliasCells;
}

/**
 * Fills `out[0..n)` (see {@link tableSampler} for the method and the stream).
 *
 * @remarks
 * The loop body of the common case is: one uniform, a multiply, a
 * truncation, a subtraction, the cell's threshold, one multiply-add, a
 * sign test and the clamp to the support; nothing is allocated and no function but the uniform is
 * called. Counters are kept in locals and added on exit (also when an
 * error is thrown).
 * @internal
 */
export function tableFill(st: TableState, out: Float64Array, n: number, counters: Counters, blk: UniformBlock, maxRejections: number): void {
  const tab = st.cells.tab;
  const K = st.cells.K;
  const lower = st.table.lower;
  const upper = st.table.upper;
  const buf = blk.buf;
  let pos = blk.pos;
  let len = blk.len;
  let i = 0;
  let rejected = 0;
  let streak = 0;
  let inFlight = 0;
  try {
    while (i < n) {
      if (pos >= len) {
        blk.refill();
        pos = 0;
        len = blk.len;
      }
      const t = buf[pos++] * K;
      const j = t | 0;
      const v = t - j;
      const o = j * CELL_STRIDE;
      // branch-free choice between the cell's own region (v < P) and its alias:
      // the two are about equally likely in many cells, so a branch would be mispredicted
      const k = o + 1 + 2 * +(v >= tab[o]);
      const s = tab[k + 1];
      const x = tab[k] + v * s;
      if (s > 0) {
        // a sure rectangle; the clamp keeps a draw rounded past a finite end of the support inside it
        // (three stores, not one store of a conditional expression: V8 merged the tagged ends with x
        // and boxed x, allocating a heap number per draw)
        if (x < lower) out[i++] = lower;
        else if (x > upper) out[i++] = upper;
        else out[i++] = x;
        continue;
      }
      inFlight = 1;
      blk.pos = pos;
      const y = slowCandidate(st, counters, j, v, blk);
      pos = blk.pos;
      len = blk.len;
      inFlight = 0;
      if (st.accepted) {
        out[i++] = y;
        streak = 0;
        continue;
      }
      rejected++;
      if (++streak >= maxRejections) {
        throw new StalledSamplerError(st.table.api, streak, counters.samples + i, counters.proposals + i + rejected);
      }
    }
  } finally {
    if (inFlight === 0) blk.pos = pos;
    counters.samples += i;
    counters.proposals += i + rejected + inFlight;
  }
}

/** Log-units tolerance of a comparison with the absolute log-density lf. */
function tolLog(ref: number, lf: number): number {
  return logTolerance(ref, lf - ref);
}

/**
 * The rare path, for cell j and cell variable v whose region is a cap, a
 * tail, or a sure rectangle too narrow for the one-step formula (S = 0). Sets `st.accepted` and returns the
 * candidate.
 */
function slowCandidate(st: TableState, counters: Counters, j: number, v: number, blk: UniformBlock): number {
  const tb = st.table;
  const tab = st.cells.tab;
  const o = j * CELL_STRIDE;
  const own = v < tab[o];
  const b = own ? tab[o + 1] : tab[o + 3];
  const r = -(own ? tab[o + 2] : tab[o + 4]) - 1;
  let pos = b + v * st.cells.invT[r];
  pos = pos < 0 ? 0 : pos >= 1 ? BELOW_ONE : pos;
  const type = tb.regionType[r];
  const pw = tb.piecewise;
  if (type === R_LEFT_TAIL || type === R_RIGHT_TAIL) {
    return pw === null ? hullTailCandidate(st, counters, type, pos, blk) : pw.tail(st, counters, pw, type, pos, blk);
  }
  const i = tb.regionStrip[r];
  const a = tb.x[i];
  const bb = tb.x[i + 1];
  let x = a + (bb - a) * pos;
  if (x < a) x = a;
  else if (x > bb) x = bb;
  if (type !== R_CAP) {
    st.accepted = true;
    return x;
  }
  // cap: a height uniform on (m_i, M_i] (1 − u keeps it above m_i ≥ 0, so it never is 0)
  const up = tb.up[i];
  const hv = up - nextUniform(blk) * (up - tb.lo[i]);
  if (pw === null) hullCap(st, counters, i, x, hv);
  else pw.cap(st, counters, pw, i, x, hv);
  return x;
}

/** A tail of a T-concave table: the exact extension of the outermost chord, inverted at pos, accepted against the target. */
function hullTailCandidate(st: TableState, counters: Counters, type: number, pos: number, blk: UniformBlock): number {
  const tb = st.table;
  const kind = tb.kind;
  const ref = tb.ref;
  const p = (type === R_LEFT_TAIL ? tb.left : tb.right) as TailPiece;
  const d = invertPiece(kind, p.inversion, p.rate, p.width, pos);
  let x = p.highEnd + p.direction * d;
  if (x < p.lo) x = p.lo;
  else if (x > p.hi) x = p.hi;
  const lenv = logHeight(kind, p.anchorValue + p.slope * (x - p.anchor));
  const lf = evaluate(st, counters, x);
  if (lf - ref > lenv + tolLog(ref, lf)) violation(st, x, lf, lenv + ref, 'envelope', type === R_LEFT_TAIL ? -1 : tb.n);
  const u = nextUniform(blk);
  st.accepted = u < exp(lf - ref - lenv);
  return x;
}

/** A cap of a T-concave table at x in strip i with height hv: the chord squeeze, the neighbours' chord extensions, then the target. Sets `st.accepted`. */
function hullCap(st: TableState, counters: Counters, i: number, x: number, hv: number): void {
  const tb = st.table;
  const kind = tb.kind;
  const ref = tb.ref;
  const a = tb.x[i];
  const bb = tb.x[i + 1];
  const th = kind === T_LOG ? log(hv) : -1 / Math.sqrt(hv);
  // chord squeeze, anchored at its higher end
  const y = tb.y;
  const ci = tb.chordSlope[i];
  const sq = ci === ci ? (y[i] >= y[i + 1] ? y[i] + ci * (x - a) : y[i + 1] + ci * (x - bb)) : -Infinity;
  if (th < sq) {
    st.accepted = true;
    return;
  }
  const sl = tb.leftLineSlope[i];
  const sr = tb.rightLineSlope[i];
  const tl = sl === sl ? y[i] + sl * (x - a) : Infinity;
  const tr = sr === sr ? y[i + 1] + sr * (x - bb) : Infinity;
  const ul = tl < tr ? tl : tr;
  if (th >= ul) {
    st.accepted = false;
    return;
  }
  const lf = evaluate(st, counters, x);
  const tol = tolLog(ref, lf);
  if (lf > tb.logUp[i] + tol) violation(st, x, lf, tb.logUp[i], 'envelope', i);
  const lul = logHeight(kind, ul) + ref;
  if (lf > lul + tol) violation(st, x, lf, lul, 'envelope', i);
  const lsq = sq === -Infinity ? -Infinity : logHeight(kind, sq) + ref;
  if (lf < lsq - tol) violation(st, x, lf, lsq, 'squeeze', i);
  st.accepted = th < transformValue(kind, lf - ref);
}

/** Evaluates the target at x while sampling: counted, checked for NaN and +Infinity. @internal */
export function evaluate(st: KernelState, counters: Counters, x: number): number {
  const lf = st.logDensity(x);
  counters.densityEvaluations++;
  return checkLogDensity(st.table.api, x, lf);
}

/**
 * Reports the target found above an envelope (or below a squeeze) at x in
 * strip i (−1: left tail, n: right tail): a ShapeViolationError when x and
 * the neighbouring strip boundaries contradict T-concavity (the bounds are
 * derived from those values and T-concavity alone, so this is the case for
 * any deterministic target), an EnvelopeViolationError otherwise.
 */
function violation(st: TableState, x: number, lf: number, bound: number, what: 'envelope' | 'squeeze', i: number): never {
  const tb = st.table;
  const kind = tb.kind;
  const xs = tb.x;
  const ls = tb.l;
  const ys = tb.y;
  const n = tb.n;
  const yx = transformValue(kind, lf - tb.ref);
  // the boundaries around x: x lies between boundary p − 1 and p
  const p = i + 1;
  const triples: [number, number, number, number, number, number, number, number, number][] = [];
  const at = (k: number): [number, number, number] => [xs[k], ys[k], ls[k]];
  if (p - 2 >= 0 && p - 1 <= n) triples.push([...at(p - 2), ...at(p - 1), x, yx, lf]);
  if (p - 1 >= 0 && p <= n) triples.push([...at(p - 1), x, yx, lf, ...at(p)]);
  if (p >= 0 && p + 1 <= n) triples.push([x, yx, lf, ...at(p), ...at(p + 1)]);
  const rel = what === 'envelope' ? 'above the envelope' : 'below the squeeze';
  for (const q of triples) {
    if (notConcave(kind, ...q)) {
      throw shapeError(
        tb.api,
        kind,
        `target is ${rel} at x = ${x} (log target ${lf}, log ${what} ${bound}): the points ${q[0]}, ${q[3]}, ${q[6]} (log-density ${q[2]}, ${q[5]}, ${q[8]}) have increasing chord slopes of the transformed density`,
        Math.min(q[0], q[6]),
        Math.max(q[0], q[6]),
      );
    }
  }
  throw new EnvelopeViolationError(tb.api, x, lf, bound, what);
}

/**
 * The grid of the piecewise method: evaluated points, the shape class of
 * every cell between consecutive points, the location of curvature changes,
 * the tails, and the pieces of the envelope built from all of it. @internal
 *
 * @remarks
 * Shape classes of a cell [a, b] (log f is written l):
 * - `C` concave, `V` convex, `L` linear within rounding, from the data:
 *   with derivatives, l'(a) ≥ s ≥ l'(b) (concave) or l'(a) ≤ s ≤ l'(b)
 *   (convex), s the chord slope; without, the chord slopes of the cell and
 *   its neighbours (second divided differences at both ends).
 * - `M` mixed: the data contradict both (a curvature change, a kink or a
 *   jump inside); `U` unknown (no curvature data yet).
 * - `ZERO` l = -Infinity at both ends (no mass); `BOUND` at one end (the
 *   edge of the density's support, or a zero of it).
 * - `ATOM` no double lies strictly between a and b, so the only possible
 *   draws are a and b; `MONO` a tiny cell around a curvature change, taken
 *   as monotone because the slopes around it share their sign; `NEG` a
 *   cell of zero area in double precision ({@link NEGLIGIBLE_DROP}).
 *
 * Envelopes (lines in log space, i.e. exponential pieces), valid given the
 * class: concave, the minimum of the two outer lines (tangents at a and b,
 * or without derivatives the chords of the neighbouring cells extended)
 * above, the chord below; convex, the chord above, the maximum of the outer
 * lines below; linear, the chord for both; boundary, the outer line at the
 * finite end (the density is log-concave next to its zeros, because a convex
 * function cannot reach -Infinity at a finite point); atom and monotone,
 * the larger endpoint value above and the smaller below.
 *
 * @packageDocumentation
 */
import { ImproperDensityError, ShapeViolationError } from '../../core/errors.js';
import { T_INV_SQRT, T_LOG, pieceConstant, pieceLogArea } from '../hull/transforms.js';
import type { Evaluator, ScanPoint } from './scan.js';
import { exp, log, log1p, pow } from '../../vendor/math.js';

/** Cell classes (see the module remarks). @internal */
export const C = 1;
/** @internal */
export const V = 2;
/** @internal */
export const L = 3;
/** @internal */
export const U = 4;
/** @internal */
export const M = 5;
/** @internal */
export const ZERO = 6;
/** @internal */
export const BOUND = 7;
/** @internal */
export const ATOM = 8;
/** @internal */
export const MONO = 9;
/** @internal */
export const NEG = 10;

/** Names of the cell classes, by code. @internal */
export const CLASS_NAMES = ['', 'concave', 'convex', 'linear', 'unknown', 'mixed', 'zero', 'boundary', 'atomic', 'monotone', 'negligible'] as const;

/**
 * A cell whose log-density at both ends is more than 1500 below the largest
 * on the grid is "negligible": its envelope (the larger end value, width at
 * most 1.8e308) has a relative area below e^(−1500 + 710), which is 0 in
 * double precision, so the guide table never selects it and its shape does
 * not matter. Such cells occur far out in the tails, where user functions
 * often lose their derivative's accuracy (e.g. a log-sum-exp of two
 * components that round to the same value).
 * @internal
 */
export const NEGLIGIBLE_DROP = 1500;

/**
 * Rounding allowance in the shape tests: 64 units of double rounding of
 * each value involved, counting a log-density as at least 1 in magnitude
 * (a log-density near 0 is usually the difference of terms of order 1, so
 * its rounding is absolute). A curvature below it is "linear".
 * @internal
 */
export const NOISE = /* @__PURE__ */ (() => 64 * pow(2, -52))();

/**
 * Secant construction: largest deviation (absolute part, in log space) that
 * a "linear" verdict or a borrowed chord may imply over a cell; ten times
 * below the check tolerance. A verdict or chord less certain than this is not
 * used (the cell is halved instead).
 * @internal
 */
export const SECANT_DEVIATION_ABSOLUTE = 1e-10;

/** Relative part (of |log f|) of {@link SECANT_DEVIATION_ABSOLUTE}. @internal */
export const SECANT_DEVIATION_RELATIVE = 1e-12;

/** Halvings of the cells at a change of curvature (pins it to 2^−24 of the cell it was found in). @internal */
export const PIN_ROUNDS = 24;

/** Halvings of a mixed or unknown cell before giving up (enough to reach adjacent doubles). @internal */
export const MIXED_LIMIT = 1100;

/** Bound on the classify-and-halve rounds of one settling. @internal */
export const SETTLE_MAX_ROUNDS = 1500;

/** Absolute part of the log tolerance of envelope and squeeze checks (as the hull engine's). @internal */
export const LOG_TOLERANCE_ABSOLUTE = 1e-9;

/** Relative part of the log tolerance (of |log f| and of the reference height). @internal */
export const LOG_TOLERANCE_RELATIVE = 1e-12;

/** Tail kinds. @internal */
export const TAIL_NONE = 0;
/** @internal */
export const TAIL_LOG = 1;
/** @internal */
export const TAIL_INV_SQRT = 2;

/** A tail beyond the outermost point. @internal */
export interface Tail {
  kind: number;
  /** Start (the outermost point). */
  x: number;
  /** logDensity there. */
  l: number;
  /** Decay rate into the tail (> 0): of log f (log), or of T with T = −1 at x (inverse-sqrt). */
  sig: number;
}

/** Flat tables of the envelope, read by the kernel. @internal */
export interface Tables {
  n: number;
  lo: Float64Array;
  hi: Float64Array;
  kind: Uint8Array;
  xh: Float64Array;
  dir: Float64Array;
  w: Float64Array;
  href: Float64Array;
  sig: Float64Array;
  q: Float64Array;
  sqa: Float64Array;
  sqv: Float64Array;
  sqs: Float64Array;
  logAreas: Float64Array;
  logSqueezeAreas: Float64Array;
  shape: Uint8Array;
  /** Reference height: every stored log value is relative to it. */
  ref: number;
  /** log of the envelope area (absolute). */
  logEnvelopeArea: number;
  /** log of the squeeze area (absolute). */
  logSqueezeArea: number;
  /** Normalized areas for the guide table. */
  area: Float64Array;
}

/** Growable piece lists (setup only). */
class PieceLists {
  lo: number[] = [];
  hi: number[] = [];
  kind: number[] = [];
  xh: number[] = [];
  dir: number[] = [];
  href: number[] = [];
  sig: number[] = [];
  sqa: number[] = [];
  sqv: number[] = [];
  sqs: number[] = [];
  shape: number[] = [];
  cell: number[] = [];

  /** Adds a piece on [lo, hi] with envelope line y0 + s·(x − x0) and squeeze line v0 + t·(x − x1) (v0 = -Infinity: none). */
  add(lo: number, hi: number, x0: number, y0: number, s: number, x1: number, v0: number, t: number, shape: number, cell: number): void {
    if (!(hi > lo)) return;
    this.lo.push(lo);
    this.hi.push(hi);
    this.kind.push(T_LOG);
    if (s > 0) {
      this.xh.push(hi);
      this.dir.push(-1);
      this.href.push(y0 + s * (hi - x0));
      this.sig.push(s);
    } else {
      this.xh.push(lo);
      this.dir.push(1);
      this.href.push(y0 + s * (lo - x0));
      this.sig.push(-s);
    }
    this.sqa.push(x1);
    this.sqv.push(v0);
    this.sqs.push(t);
    this.shape.push(shape);
    this.cell.push(cell);
  }

  /** Adds a tail piece. */
  addTail(t: Tail, dir: number, ref: number, cell: number): void {
    this.lo.push(dir > 0 ? t.x : -Infinity);
    this.hi.push(dir > 0 ? Infinity : t.x);
    this.kind.push(t.kind === TAIL_LOG ? T_LOG : T_INV_SQRT);
    this.xh.push(t.x);
    this.dir.push(dir);
    this.href.push(t.l - ref);
    this.sig.push(t.sig);
    this.sqa.push(t.x);
    this.sqv.push(-Infinity);
    this.sqs.push(0);
    this.shape.push(0);
    this.cell.push(cell);
  }
}

/** True when no double lies strictly between a and b. @internal */
export function isAtomic(a: number, b: number): boolean {
  const m = mid(a, b);
  return !(m > a && m < b);
}

/** Midpoint without overflow. @internal */
export function mid(a: number, b: number): number {
  const m = 0.5 * a + 0.5 * b;
  return m;
}

/** log(Σ e^v) over an array. @internal */
export function logSumExp(v: ArrayLike<number>): number {
  let m = -Infinity;
  for (let i = 0; i < v.length; i++) if (v[i] > m) m = v[i];
  if (m === -Infinity || m === Infinity) return m;
  let s = 0;
  for (let i = 0; i < v.length; i++) s += exp(v[i] - m);
  return m + log(s);
}

/**
 * The evaluated grid and everything derived from it. All state changes go
 * through {@link Grid.settle}, {@link Grid.refine} and {@link Grid.repair},
 * each bounded by the evaluator's budget and by depth counters.
 * @internal
 */
export class Grid {
  x: number[];
  l: number[];
  g: number[];
  /** Per cell: halvings spent on locating shape changes in its lineage. */
  depth: number[];
  /** Per cell: shape class. */
  cls: number[] = [];
  /** Per cell: slope of the outer line through the left end (NaN: none). */
  sa: number[] = [];
  /** Secant construction: curvature class of each point (0: no triple, U: undetermined). */
  pc: number[] = [];
  /** Per cell: slope of the outer line through the right end (NaN: none). */
  sb: number[] = [];
  lowerTail: Tail = { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
  upperTail: Tail = { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
  /** Points whose value contradicted the envelope they were inserted into (setup and repairs). */
  surprises = 0;

  /**
   * @param api - API name for messages
   * @param ev - counted access to the target
   * @param tangent - use dLogDensity
   * @param pts - scanned points (increasing)
   * @param lower - effective lower end (-Infinity: a tail)
   * @param upper - effective upper end (+Infinity: a tail)
   * @param centre - centre of the scan (for tail exponents in messages)
   */
  constructor(
    readonly api: string,
    readonly ev: Evaluator,
    readonly tangent: boolean,
    pts: readonly ScanPoint[],
    readonly lower: number,
    readonly upper: number,
    readonly centre: number,
  ) {
    this.x = pts.map((p) => p.x);
    this.l = pts.map((p) => p.l);
    this.g = pts.map((p) => p.g);
    this.depth = new Array<number>(Math.max(0, pts.length - 1)).fill(0);
  }

  /** Number of cells. */
  get cells(): number {
    return this.x.length - 1;
  }

  private chord(i: number): number {
    return (this.l[i + 1] - this.l[i]) / (this.x[i + 1] - this.x[i]);
  }

  private chordNoise(i: number): number {
    const la = this.l[i];
    const lb = this.l[i + 1];
    return (NOISE * (Math.abs(la) + Math.abs(lb) + 2)) / (this.x[i + 1] - this.x[i]) + NOISE * Math.abs(this.chord(i));
  }

  /** Computes the class and outer slopes of every cell. */
  classify(): void {
    const n = this.cells;
    const x = this.x;
    const l = this.l;
    const g = this.g;
    const cls = new Array<number>(n);
    const pc = this.tangent ? [] : this.pointClasses();
    let top = -Infinity;
    for (const v of l) if (v > top) top = v;
    const negligible = top - NEGLIGIBLE_DROP;
    for (let i = 0; i < n; i++) {
      const la = l[i];
      const lb = l[i + 1];
      if (la === -Infinity && lb === -Infinity) cls[i] = ZERO;
      else if (la < negligible && lb < negligible) cls[i] = NEG;
      else if (isAtomic(x[i], x[i + 1])) cls[i] = ATOM;
      else if (la === -Infinity || lb === -Infinity) cls[i] = BOUND;
      else if (this.tangent) {
        const ga = g[i];
        const gb = g[i + 1];
        if (!Number.isFinite(ga) || !Number.isFinite(gb)) cls[i] = U;
        else {
          const s = this.chord(i);
          const e = this.chordNoise(i) + NOISE * (Math.abs(ga) + Math.abs(gb));
          const dl = ga - s;
          const dr = s - gb;
          const cc = dl >= -e && dr >= -e;
          const cv = dl <= e && dr <= e;
          cls[i] = cc && cv ? L : cc ? C : cv ? V : M;
        }
      } else {
        cls[i] = combine(pc[i], pc[i + 1]);
      }
    }
    const sa = new Array<number>(n).fill(NaN);
    const sb = new Array<number>(n).fill(NaN);
    for (let i = 0; i < n; i++) {
      const c = cls[i];
      if (c === C || c === V) {
        if (this.tangent) {
          sa[i] = g[i];
          sb[i] = g[i + 1];
        } else {
          if (i > 0 && compatible(c, cls[i - 1]) && this.lendable(i - 1, i)) sa[i] = this.chord(i - 1);
          if (i + 1 < n && compatible(c, cls[i + 1]) && this.lendable(i + 1, i)) sb[i] = this.chord(i + 1);
        }
      } else if (c === BOUND) {
        // the outer line at the finite end, trusted when the cell beyond it is concave
        if (l[i] === -Infinity) {
          if (i + 1 < n && (cls[i + 1] === C || cls[i + 1] === L) && (this.tangent || this.lendable(i + 1, i))) {
            sb[i] = this.tangent ? g[i + 1] : this.chord(i + 1);
          }
        } else if (i > 0 && (cls[i - 1] === C || cls[i - 1] === L) && (this.tangent || this.lendable(i - 1, i))) {
          sa[i] = this.tangent ? g[i] : this.chord(i - 1);
        }
      }
    }
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(sa[i])) sa[i] = NaN;
      if (!Number.isFinite(sb[i])) sb[i] = NaN;
    }
    this.cls = cls;
    this.sa = sa;
    this.sb = sb;
    this.pc = pc;
  }

  /** Secant construction: curvature class of each point from the chords on its two sides (0: no triple; U: undetermined). */
  private pointClasses(): number[] {
    const n = this.x.length;
    const l = this.l;
    const pc = new Array<number>(n).fill(0);
    for (let j = 1; j + 1 < n; j++) {
      if (l[j - 1] === -Infinity || l[j] === -Infinity || l[j + 1] === -Infinity) continue;
      const k = this.chord(j) - this.chord(j - 1);
      const e = this.chordNoise(j) + this.chordNoise(j - 1);
      if (k < -e) pc[j] = C;
      else if (k > e) pc[j] = V;
      else {
        // "linear" only if the curvature this allows, |l''| ≲ 2e/(w0 + w1),
        // moves log f from a chord by a negligible amount on both cells
        const w0 = this.x[j] - this.x[j - 1];
        const w1 = this.x[j + 1] - this.x[j];
        const w = Math.max(w0, w1);
        const dev = (e * w * w) / (w0 + w1);
        pc[j] = dev <= SECANT_DEVIATION_ABSOLUTE + SECANT_DEVIATION_RELATIVE * Math.abs(l[j]) ? L : U;
      }
    }
    return pc;
  }

  /** Secant construction: whether the chord of cell j is accurate enough to serve as an outer line over cell i. */
  private lendable(j: number, i: number): boolean {
    const w = this.x[i + 1] - this.x[i];
    const lmag = Math.max(Math.abs(this.l[i]), Math.abs(this.l[i + 1]));
    return this.chordNoise(j) * w <= SECANT_DEVIATION_ABSOLUTE + SECANT_DEVIATION_RELATIVE * lmag;
  }

  /** Whether the chords of the cells on both sides of cell i share a strict sign with its own. */
  private monotone(i: number): boolean {
    const n = this.cells;
    const s = this.chord(i);
    if (this.tangent) {
      const ga = this.g[i];
      const gb = this.g[i + 1];
      return (s > 0 && ga > 0 && gb > 0) || (s < 0 && ga < 0 && gb < 0);
    }
    const left = i > 0 ? this.chord(i - 1) : s;
    const right = i + 1 < n ? this.chord(i + 1) : s;
    return (s > 0 && left > 0 && right > 0) || (s < 0 && left < 0 && right < 0);
  }

  /**
   * Classifies and halves, until no cell needs halving: mixed and unknown
   * cells, cells without an envelope line, and the two cells on both sides
   * of every point where a concave cell meets a convex one (up to
   * {@link PIN_ROUNDS} halvings, or until the cells at the change become
   * linear within rounding). Bounded by depth counters and the evaluation budget.
   */
  settle(): void {
    for (let round = 0; ; round++) {
      if (round > SETTLE_MAX_ROUNDS) {
        throw new ShapeViolationError(`${this.api}: the shape classification did not settle after ${SETTLE_MAX_ROUNDS} rounds of halvings (${this.cells} cells)`);
      }
      this.classify();
      const n = this.cells;
      const cls = this.cls;
      const depth = this.depth;
      const flag = new Uint8Array(n);
      let flagged = false;
      const mark = (i: number, limit: number): void => {
        if (i < 0 || i >= n) return;
        const c = cls[i];
        if (c === ZERO || c === ATOM || c === NEG) return;
        if (depth[i] < limit && flag[i] === 0) {
          flag[i] = 1;
          flagged = true;
        }
      };
      for (let i = 0; i < n; i++) {
        const c = cls[i];
        if (c === M) {
          if (depth[i] < PIN_ROUNDS) {
            if (!this.tangent) mark(i - 1, PIN_ROUNDS);
            mark(i, PIN_ROUNDS);
            if (!this.tangent) mark(i + 1, PIN_ROUNDS);
          } else if (this.monotone(i)) {
            cls[i] = MONO;
          } else if (depth[i] < MIXED_LIMIT) {
            mark(i, MIXED_LIMIT);
          } else {
            this.shapeFailure(i, 'the log-density changes curvature and direction inside it');
          }
        } else if (c === U && !this.tangent) {
          // an undetermined end point: halve the wider cell next to it (the
          // verdict there is uncertain because its neighbours differ in width)
          for (const j of [i, i + 1]) {
            if (this.pc[j] !== U) continue;
            const wl = this.x[j] - this.x[j - 1];
            const wr = this.x[j + 1] - this.x[j];
            let k = wl >= wr ? j - 1 : j;
            const ck = cls[k];
            if (ck === ZERO || ck === ATOM || ck === NEG) k = i;
            if (depth[k] < MIXED_LIMIT) mark(k, MIXED_LIMIT);
            else this.shapeFailure(k, 'the curvature at its ends stays undetermined within rounding');
          }
          if (this.pc[i] !== U && this.pc[i + 1] !== U) {
            if (depth[i] < MIXED_LIMIT) mark(i, MIXED_LIMIT);
            else this.shapeFailure(i, 'no curvature information could be obtained for it');
          }
        } else if (c === U || (c === BOUND && this.sa[i] !== this.sa[i] && this.sb[i] !== this.sb[i]) || (c === C && this.sa[i] !== this.sa[i] && this.sb[i] !== this.sb[i])) {
          if (depth[i] < MIXED_LIMIT) mark(i, MIXED_LIMIT);
          else this.shapeFailure(i, 'no valid envelope line could be found for it');
        }
      }
      // direct changes between concave and convex: pin them. A change with
      // linear cells between is already resolved to rounding: those cells have
      // a curvature below the rounding allowance, so either construction holds
      // on them within the check tolerance.
      for (let i = 0; i + 1 < n; i++) {
        const c = cls[i];
        const d = cls[i + 1];
        if ((c === C && d === V) || (c === V && d === C)) {
          mark(i, PIN_ROUNDS);
          mark(i + 1, PIN_ROUNDS);
        }
      }
      if (!flagged) return;
      this.split(flag, true);
    }
  }

  private shapeFailure(i: number, why: string): never {
    const a = this.x[i];
    const b = this.x[i + 1];
    throw new ShapeViolationError(
      `${this.api}: cannot bound the target on [${a}, ${b}] (logDensity ${this.l[i]} and ${this.l[i + 1]}): ${why}, even after ${this.depth[i]} halvings`,
      [a, b],
    );
  }

  /**
   * Halves every flagged cell (evaluating its midpoint). With `pin`, the
   * halves count one more halving in their lineage; refinement halvings do
   * not. Returns the number of midpoints whose value contradicts the
   * current envelope or squeeze of their cell (possible only if the cell's
   * class was wrong; the next classification sees the new point).
   */
  split(flag: Uint8Array, pin: boolean): number {
    const n = this.cells;
    const nx: number[] = [];
    const nl: number[] = [];
    const ng: number[] = [];
    const nd: number[] = [];
    let surprises = 0;
    const checkable = !pin && this.cls.length === n;
    for (let i = 0; i < n; i++) {
      nx.push(this.x[i]);
      nl.push(this.l[i]);
      ng.push(this.g[i]);
      if (flag[i] === 1) {
        const a = this.x[i];
        const b = this.x[i + 1];
        const m = mid(a, b);
        if (m > a && m < b) {
          const lm = this.ev.l(m);
          const gm = this.tangent ? this.ev.g(m, lm) : NaN;
          if (checkable && this.contradicts(i, m, lm)) surprises++;
          nx.push(m);
          nl.push(lm);
          ng.push(gm);
          const d = this.depth[i] + (pin ? 1 : 0);
          nd.push(d, d);
          continue;
        }
      }
      nd.push(this.depth[i]);
    }
    nx.push(this.x[n]);
    nl.push(this.l[n]);
    ng.push(this.g[n]);
    this.x = nx;
    this.l = nl;
    this.g = ng;
    this.depth = nd;
    this.surprises += surprises;
    return surprises;
  }

  /** Whether the value lm at m lies above the envelope or below the squeeze of cell i (current classification). */
  private contradicts(i: number, m: number, lm: number): boolean {
    const e = this.cellEnvelope(i, m);
    const tol = LOG_TOLERANCE_ABSOLUTE + LOG_TOLERANCE_RELATIVE * (Math.abs(lm === -Infinity ? 0 : lm) + Math.abs(e.env === -Infinity ? 0 : e.env));
    return lm > e.env + tol || lm < e.sq - tol;
  }

  /** Envelope and squeeze (absolute logs) of cell i at x, from its class and outer lines. */
  cellEnvelope(i: number, x: number): { env: number; sq: number } {
    const a = this.x[i];
    const b = this.x[i + 1];
    const la = this.l[i];
    const lb = this.l[i + 1];
    const c = this.cls[i];
    const A = la + this.sa[i] * (x - a);
    const B = lb + this.sb[i] * (x - b);
    const chord = la === -Infinity || lb === -Infinity ? -Infinity : la + this.chord(i) * (x - a);
    switch (c) {
      case C: {
        const env = this.sa[i] !== this.sa[i] ? B : this.sb[i] !== this.sb[i] ? A : Math.min(A, B);
        return { env, sq: chord };
      }
      case V: {
        const sq = this.sa[i] !== this.sa[i] ? (this.sb[i] !== this.sb[i] ? -Infinity : B) : this.sb[i] !== this.sb[i] ? A : Math.max(A, B);
        return { env: chord, sq };
      }
      case L:
        return { env: chord, sq: chord };
      case BOUND:
        return { env: la === -Infinity ? B : A, sq: -Infinity };
      case ATOM:
      case MONO:
        return { env: Math.max(la, lb), sq: Math.min(la, lb) };
      case NEG:
        return { env: Math.max(la, lb), sq: -Infinity };
      case ZERO:
        return { env: -Infinity, sq: -Infinity };
      default:
        return { env: Infinity, sq: -Infinity };
    }
  }

  /** Determines both tails (throws when a tail cannot be bounded). */
  tails(): void {
    this.lowerTail = this.lower === -Infinity ? this.tail(-1) : { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
    this.upperTail = this.upper === Infinity ? this.tail(1) : { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
  }

  /**
   * The tail beyond the outermost point in direction `o`: exponential when
   * the outermost cell is concave (or linear) and the density decreases
   * outwards, else T = −1/√f when T(f) is concave on the outermost cell(s)
   * and decreasing (Hörmann 1995), else an error that names the tail.
   */
  private tail(o: 1 | -1): Tail {
    const n = this.x.length;
    const api = this.api;
    const side = o > 0 ? 'upper' : 'lower';
    const k = o > 0 ? n - 1 : 0;
    const k1 = k - o;
    const k2 = k - 2 * o;
    const xk = this.x[k];
    const lk = this.l[k];
    if (n < 2 || !(lk > -Infinity)) {
      throw new ImproperDensityError(`${api}: no decay found in the ${side} tail (the scan ended at x = ${xk})`);
    }
    const cell = o > 0 ? n - 2 : 0;
    const cls = this.cls[cell];
    const chord = this.chord(cell);
    const slope = this.tangent && Number.isFinite(this.g[k]) ? this.g[k] : chord;
    const out = o * slope; // rate of change of log f moving outwards
    if ((cls === C || cls === L || cls === NEG) && out < 0) return { kind: TAIL_LOG, x: xk, l: lk, sig: -out };
    // T(f) = −1/√f relative to f(x_k): T = −e^{−(l − l_k)/2}, so T(x_k) = −1 and T' = −T·l'/2.
    const T1 = -exp(-0.5 * (this.l[k1] - lk));
    const w1 = Math.abs(xk - this.x[k1]);
    const tChordOut = (o * (-1 - T1)) / w1; // dT/dx on the outer cell
    let tConcave = false;
    let tSlope = NaN;
    if (this.tangent && Number.isFinite(this.g[k]) && Number.isFinite(this.g[k1])) {
      const tk = 0.5 * this.g[k];
      const tk1 = -0.5 * T1 * this.g[k1];
      const tl = o > 0 ? tk1 : tk;
      const tr = o > 0 ? tk : tk1;
      const e = NOISE * (Math.abs(tl) + Math.abs(tr) + (2 + Math.abs(T1)) / w1);
      tConcave = tl - tChordOut >= -e && tChordOut - tr >= -e;
      tSlope = tk;
    } else if (k2 >= 0 && k2 < n && this.l[k2] > -Infinity) {
      const T2 = -exp(-0.5 * (this.l[k2] - lk));
      const w2 = Math.abs(this.x[k1] - this.x[k2]);
      const tChordIn = (o > 0 ? T1 - T2 : T2 - T1) / w2;
      const cl = o > 0 ? tChordIn : tChordOut;
      const cr = o > 0 ? tChordOut : tChordIn;
      const e = NOISE * ((2 + Math.abs(T1) + Math.abs(T2)) / Math.min(w1, w2) + Math.abs(cl) + Math.abs(cr));
      tConcave = cl - cr >= -e;
      tSlope = tChordOut;
    }
    const tOut = o * tSlope;
    if (tConcave && tOut < 0 && Number.isFinite(tOut)) return { kind: TAIL_INV_SQRT, x: xk, l: lk, sig: -tOut };
    if (!(out < 0)) {
      throw new ImproperDensityError(
        `${api}: no decay found in the ${side} tail: at the outermost scanned point x = ${xk} logDensity is ${lk} and its slope outwards is ${out} (not negative); the mass may be infinite`,
      );
    }
    const r0 = log(Math.abs(this.x[k1] - this.centre));
    const r1 = log(Math.abs(xk - this.centre));
    const alpha = r1 > r0 ? -(lk - this.l[k1]) / (r1 - r0) : NaN;
    if (alpha <= 1) {
      throw new ImproperDensityError(
        `${api}: the ${side} tail decays like |x|^(−${alpha.toPrecision(3)}) near x = ${xk}; with an exponent ≤ 1 the mass is infinite`,
      );
    }
    throw new ShapeViolationError(
      `${api}: the ${side} tail beyond x = ${xk} is neither log-concave nor T-concave for T(f) = −1/√f (it decays like |x|^(−${alpha.toPrecision(3)}), slower than |x|^−2); piecewise envelopes cannot bound it. Use ratioOfUniformsSampler with power ≥ 1/(α − 1), or truncate the target`,
      o > 0 ? [xk, Infinity] : [-Infinity, xk],
    );
  }

  /** Builds the flat tables of the current envelope. */
  tables(): Tables {
    const n = this.cells;
    let ref = -Infinity;
    for (const v of this.l) if (v > ref) ref = v;
    const P = new PieceLists();
    if (this.lowerTail.kind !== TAIL_NONE) P.addTail(this.lowerTail, -1, ref, -1);
    for (let i = 0; i < n; i++) this.cellPieces(P, i, ref);
    if (this.upperTail.kind !== TAIL_NONE) P.addTail(this.upperTail, 1, ref, n);
    const m = P.lo.length;
    if (m === 0) throw new ShapeViolationError(`${this.api}: the envelope has no piece of positive area`);
    const t: Tables = {
      n: m,
      lo: Float64Array.from(P.lo),
      hi: Float64Array.from(P.hi),
      kind: Uint8Array.from(P.kind),
      xh: Float64Array.from(P.xh),
      dir: Float64Array.from(P.dir),
      w: new Float64Array(m),
      href: Float64Array.from(P.href),
      sig: Float64Array.from(P.sig),
      q: new Float64Array(m),
      sqa: Float64Array.from(P.sqa),
      sqv: Float64Array.from(P.sqv),
      sqs: Float64Array.from(P.sqs),
      logAreas: new Float64Array(m),
      logSqueezeAreas: new Float64Array(m),
      shape: Uint8Array.from(P.shape),
      ref,
      logEnvelopeArea: -Infinity,
      logSqueezeArea: -Infinity,
      area: new Float64Array(m),
    };
    for (let j = 0; j < m; j++) {
      const w = t.hi[j] - t.lo[j];
      t.w[j] = w;
      const kind = t.kind[j];
      if (kind === T_LOG) {
        t.q[j] = pieceConstant(T_LOG, t.href[j], t.sig[j], w);
        t.logAreas[j] = pieceLogArea(T_LOG, t.href[j], t.sig[j], w);
      } else {
        t.q[j] = pieceConstant(T_INV_SQRT, -1, t.sig[j], w);
        t.logAreas[j] = t.href[j] + pieceLogArea(T_INV_SQRT, -1, t.sig[j], w);
      }
      const sv = t.sqv[j];
      if (sv === -Infinity || w === Infinity) t.logSqueezeAreas[j] = -Infinity;
      else {
        const s0 = sv + t.sqs[j] * (t.lo[j] - t.sqa[j]);
        const s1 = sv + t.sqs[j] * (t.hi[j] - t.sqa[j]);
        t.logSqueezeAreas[j] = pieceLogArea(T_LOG, Math.max(s0, s1), Math.abs(t.sqs[j]), w);
      }
      if (!(t.logAreas[j] < Infinity)) {
        throw new ShapeViolationError(`${this.api}: internal: the envelope piece on [${t.lo[j]}, ${t.hi[j]}] has no finite area`, [t.lo[j], t.hi[j]]);
      }
    }
    let top = -Infinity;
    for (let j = 0; j < m; j++) if (t.logAreas[j] > top) top = t.logAreas[j];
    if (!(top > -Infinity)) throw new ShapeViolationError(`${this.api}: the envelope has no piece of positive area`);
    for (let j = 0; j < m; j++) t.area[j] = exp(t.logAreas[j] - top);
    t.logEnvelopeArea = logSumExp(t.logAreas) + ref;
    t.logSqueezeArea = logSumExp(t.logSqueezeAreas) + ref;
    return t;
  }

  /** Pieces of cell i (relative to ref). */
  private cellPieces(P: PieceLists, i: number, ref: number): void {
    const a = this.x[i];
    const b = this.x[i + 1];
    const la = this.l[i] - ref;
    const lb = this.l[i + 1] - ref;
    const c = this.cls[i];
    const sa = this.sa[i];
    const sb = this.sb[i];
    const w = b - a;
    switch (c) {
      case ZERO:
        return;
      case L: {
        const s = (lb - la) / w;
        P.add(a, b, a, la, s, a, la, s, c, i);
        return;
      }
      case ATOM:
      case MONO: {
        P.add(a, b, a, Math.max(la, lb), 0, a, Math.min(la, lb), 0, c, i);
        return;
      }
      case NEG: {
        P.add(a, b, a, Math.max(la, lb), 0, a, -Infinity, 0, c, i);
        return;
      }
      case BOUND: {
        if (la === -Infinity) P.add(a, b, b, lb, sb, a, -Infinity, 0, c, i);
        else P.add(a, b, a, la, sa, a, -Infinity, 0, c, i);
        return;
      }
      case C:
      case V: {
        const s = (lb - la) / w;
        const hasA = sa === sa;
        const hasB = sb === sb;
        let z: number;
        if (hasA && hasB) {
          const den = sa - sb;
          let tz = den !== 0 ? (s - sb) / den : 0.5;
          if (!(tz >= 0)) tz = 0;
          if (tz > 1) tz = 1;
          z = a + w * tz;
          if (z < a) z = a;
          if (z > b) z = b;
        } else z = hasA ? b : a;
        if (c === C) {
          if (z > a) P.add(a, z, a, la, sa, a, la, s, c, i);
          if (b > z) P.add(z, b, b, lb, sb, a, la, s, c, i);
        } else {
          // convex: chord above; outer lines below (none when neither exists)
          if (!hasA && !hasB) {
            P.add(a, b, a, la, s, a, -Infinity, 0, c, i);
            return;
          }
          if (z > a) P.add(a, z, a, la, s, a, la, sa, c, i);
          if (b > z) P.add(z, b, a, la, s, b, lb, sb, c, i);
        }
        return;
      }
      default:
        this.shapeFailure(i, `internal: unresolved class ${CLASS_NAMES[c]}`);
    }
  }

  /**
   * Refines until (envelope area)/(squeeze area) ≤ ratio or the piece cap:
   * each round halves every cell whose envelope-minus-squeeze area is at
   * least 30% of the largest, and moves a tail outwards (to its envelope
   * median) when the tail is among them; then settles and recomputes the
   * tails. Returns the final tables.
   */
  refine(ratio: number, maxPieces: number, maxRounds: number): Tables {
    let t = this.tables();
    const logRatio = log(ratio);
    for (let round = 0; round < maxRounds; round++) {
      if (t.logEnvelopeArea - t.logSqueezeArea <= logRatio || t.n >= maxPieces) break;
      const top = t.logEnvelopeArea - t.ref;
      const n = this.cells;
      const gapCell = new Float64Array(n);
      let lowGap = 0;
      let upGap = 0;
      let maxGap = 0;
      for (let j = 0; j < t.n; j++) {
        const gap = exp(t.logAreas[j] - top) - exp(t.logSqueezeAreas[j] - top);
        const lo = t.lo[j];
        if (lo === -Infinity) lowGap += gap;
        else if (t.hi[j] === Infinity) upGap += gap;
        else {
          const i = this.cellIndex(lo);
          if (i >= 0) gapCell[i] += gap;
        }
      }
      for (let i = 0; i < n; i++) if (gapCell[i] > maxGap) maxGap = gapCell[i];
      maxGap = Math.max(maxGap, lowGap, upGap);
      if (!(maxGap > 0)) break;
      const flag = new Uint8Array(n);
      let count = 0;
      for (let i = 0; i < n; i++) {
        if (gapCell[i] >= 0.3 * maxGap && this.cls[i] !== ATOM && this.cls[i] !== ZERO && this.cls[i] !== NEG) {
          flag[i] = 1;
          count++;
        }
      }
      const extendLow = lowGap >= 0.3 * maxGap;
      const extendUp = upGap >= 0.3 * maxGap;
      if (count === 0 && !extendLow && !extendUp) break;
      this.split(flag, false);
      if (extendUp) this.extend(1);
      if (extendLow) this.extend(-1);
      this.settle();
      this.tails();
      t = this.tables();
    }
    return t;
  }

  /** Index of the cell whose left end is `a` (binary search), or −1. */
  private cellIndex(a: number): number {
    const x = this.x;
    let lo = 0;
    let hi = x.length - 2;
    while (lo < hi) {
      const m = (lo + hi + 1) >> 1;
      if (x[m] <= a) lo = m;
      else hi = m - 1;
    }
    return lo >= 0 && x[lo] <= a && a < x[lo + 1] ? lo : -1;
  }

  /** Adds a point beyond the outermost one, at the median of the tail's envelope. */
  private extend(o: 1 | -1): void {
    const t = o > 0 ? this.upperTail : this.lowerTail;
    if (t.kind === TAIL_NONE) return;
    const d = t.kind === TAIL_LOG ? Math.LN2 / t.sig : 1 / t.sig;
    const xn = t.x + o * d;
    if (!Number.isFinite(xn) || xn === t.x) return;
    const ln = this.ev.l(xn);
    const gn = this.tangent ? this.ev.g(xn, ln) : NaN;
    const envAt = t.kind === TAIL_LOG ? t.l - t.sig * d : t.l - 2 * log1p(t.sig * d);
    if (ln > envAt + LOG_TOLERANCE_ABSOLUTE + LOG_TOLERANCE_RELATIVE * Math.abs(ln)) this.surprises++;
    if (o > 0) {
      this.x.push(xn);
      this.l.push(ln);
      this.g.push(gn);
      this.depth.push(0);
    } else {
      this.x.unshift(xn);
      this.l.unshift(ln);
      this.g.unshift(gn);
      this.depth.unshift(0);
    }
  }

  /**
   * Inserts an evaluated point (a repair after a violation at x), then
   * settles and recomputes the tails. The point may lie in a tail.
   */
  insert(xv: number, lv: number): void {
    const gv = this.tangent ? this.ev.g(xv, lv) : NaN;
    const x = this.x;
    if (xv < x[0]) {
      x.unshift(xv);
      this.l.unshift(lv);
      this.g.unshift(gv);
      this.depth.unshift(0);
    } else if (xv > x[x.length - 1]) {
      x.push(xv);
      this.l.push(lv);
      this.g.push(gv);
      this.depth.push(0);
    } else {
      const i = this.cellIndex(xv);
      if (i < 0 || x[i] === xv) return;
      x.splice(i + 1, 0, xv);
      this.l.splice(i + 1, 0, lv);
      this.g.splice(i + 1, 0, gv);
      this.depth.splice(i, 1, this.depth[i], this.depth[i]);
    }
    this.settle();
    this.tails();
  }

  /** Approximate locations of curvature changes (between concave and convex runs, and the tiny cells pinning them). */
  inflections(): number[] {
    const out: number[] = [];
    let last = -1;
    for (let i = 0; i < this.cells; i++) {
      const c = this.cls[i];
      if (c === MONO || (c === ATOM && this.l[i] > -Infinity && this.l[i + 1] > -Infinity)) {
        out.push(mid(this.x[i], this.x[i + 1]));
        last = -1;
      } else if (c === C || c === V) {
        if (last >= 0 && this.cls[last] !== c) out.push(mid(this.x[last + 1], this.x[i]));
        last = i;
      } else if (c !== L) last = -1;
    }
    return out;
  }

  /** Approximate locations of local extrema of log f (sign changes of the slope on the grid). */
  extrema(): number[] {
    const out: number[] = [];
    const n = this.x.length;
    for (let j = 1; j + 1 < n; j++) {
      if (!(this.l[j - 1] > -Infinity && this.l[j] > -Infinity && this.l[j + 1] > -Infinity)) continue;
      const s0 = this.tangent && Number.isFinite(this.g[j]) ? this.g[j] : this.chord(j - 1);
      const s1 = this.tangent && Number.isFinite(this.g[j + 1]) ? this.g[j + 1] : this.chord(j);
      if ((s0 > 0 && s1 <= 0) || (s0 < 0 && s1 >= 0)) {
        if (this.tangent) {
          // interpolate the derivative's zero on [x_j, x_{j+1}]
          const t = s0 / (s0 - s1);
          out.push(this.x[j] + t * (this.x[j + 1] - this.x[j]));
        } else out.push(this.x[j]);
      }
    }
    return out;
  }
}

/**
 * Cell class from the curvature classes of its two end points (secant
 * construction; 0: no triple there, U: undetermined within rounding, which
 * makes the cell unknown so that it is halved).
 */
function combine(p: number, q: number): number {
  if (p === U || q === U) return U;
  const hasC = p === C || q === C;
  const hasV = p === V || q === V;
  if (hasC && hasV) return M;
  if (hasC) return C;
  if (hasV) return V;
  if (p === L || q === L) return L;
  return U;
}

/** Whether a neighbour of class `nb` can lend its chord to a cell of class `c` (same curvature). */
function compatible(c: number, nb: number): boolean {
  return nb === c || nb === L;
}

/**
 * The grid of the piecewise method: evaluated points, the shape class of
 * every cell between consecutive points, the location of curvature changes,
 * the tails, and the pieces of the envelope built from all of it. @internal
 *
 * @remarks
 * Shape classes of a cell [a, b] (log f is written l):
 * - concave (`CELL_CONCAVE`), convex (`CELL_CONVEX`), linear within
 *   rounding (`CELL_LINEAR`), from the data:
 *   with derivatives, l'(a) ≥ s ≥ l'(b) (concave) or l'(a) ≤ s ≤ l'(b)
 *   (convex), s the chord slope; without, the chord slopes of the cell and
 *   its neighbours (second divided differences at both ends).
 * - `CELL_MIXED`: the data contradict both (a curvature change, a kink or a
 *   jump inside); `CELL_UNKNOWN` (no curvature data yet).
 * - `CELL_ZERO` l = -Infinity at both ends (no mass); `CELL_BOUNDARY` at one end (the
 *   edge of the density's support, or a zero of it).
 * - `CELL_ATOMIC` no double lies strictly between a and b, so the only possible
 *   draws are a and b; `CELL_MONOTONE` a tiny cell around a curvature change, taken
 *   as monotone because the slopes around it share their sign; `CELL_NEGLIGIBLE` a
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
import type { Evaluator } from '../../core/evaluate.js';
import { lastAtOrBelow } from '../envelope/arith.js';
import type { Tables } from '../envelope/piece-tables.js';
import { HULL_LOG_TOLERANCE_ABSOLUTE, HULL_LOG_TOLERANCE_RELATIVE } from '../envelope/tolerance.js';
import {
  CELL_ATOMIC, CELL_BOUNDARY, CELL_CONCAVE, CELL_CONVEX, CELL_LINEAR, CELL_MIXED, CELL_MONOTONE, CELL_NEGLIGIBLE, CELL_UNKNOWN, CELL_ZERO,
  MIXED_LIMIT, NEGLIGIBLE_DROP, PIECEWISE_NOISE, PIN_ROUNDS, SECANT_DEVIATION_ABSOLUTE, SECANT_DEVIATION_RELATIVE, SETTLE_MAX_ROUNDS,
  TAIL_INV_SQRT, TAIL_LOG, TAIL_NONE, combine, compatible, isAtomic, mid,
} from './cells.js';
import type { CellView, Tail } from './cells.js';
import { buildTables } from './pieces.js';
import type { ScanPoint } from './scan.js';
import { exp, log, log1p } from '../../vendor/math.js';

/**
 * The evaluated grid and everything derived from it. All state changes go
 * through {@link Grid.settle}, {@link Grid.refine} and {@link Grid.repair},
 * each bounded by the evaluator's budget and by depth counters.
 * @internal
 */
export class Grid implements CellView {
  x: number[];
  l: number[];
  g: number[];
  /** Per cell: halvings spent on locating shape changes in its lineage. */
  depth: number[];
  /** Per cell: shape class. */
  cls: number[] = [];
  /** Per cell: slope of the outer line through the left end (NaN: none). */
  sa: number[] = [];
  /** Secant construction: curvature class of each point (0: no triple, CELL_UNKNOWN: undetermined). */
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

  /** Chord slope of cell i in log space. */
  chord(i: number): number {
    return (this.l[i + 1] - this.l[i]) / (this.x[i + 1] - this.x[i]);
  }

  private chordNoise(i: number): number {
    const la = this.l[i];
    const lb = this.l[i + 1];
    return (PIECEWISE_NOISE * (Math.abs(la) + Math.abs(lb) + 2)) / (this.x[i + 1] - this.x[i]) + PIECEWISE_NOISE * Math.abs(this.chord(i));
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
      if (la === -Infinity && lb === -Infinity) cls[i] = CELL_ZERO;
      else if (la < negligible && lb < negligible) cls[i] = CELL_NEGLIGIBLE;
      else if (isAtomic(x[i], x[i + 1])) cls[i] = CELL_ATOMIC;
      else if (la === -Infinity || lb === -Infinity) cls[i] = CELL_BOUNDARY;
      else if (this.tangent) {
        const ga = g[i];
        const gb = g[i + 1];
        if (!Number.isFinite(ga) || !Number.isFinite(gb)) cls[i] = CELL_UNKNOWN;
        else {
          const s = this.chord(i);
          const e = this.chordNoise(i) + PIECEWISE_NOISE * (Math.abs(ga) + Math.abs(gb));
          const dl = ga - s;
          const dr = s - gb;
          const cc = dl >= -e && dr >= -e;
          const cv = dl <= e && dr <= e;
          cls[i] = cc && cv ? CELL_LINEAR : cc ? CELL_CONCAVE : cv ? CELL_CONVEX : CELL_MIXED;
        }
      } else {
        cls[i] = combine(pc[i], pc[i + 1]);
      }
    }
    const sa = new Array<number>(n).fill(NaN);
    const sb = new Array<number>(n).fill(NaN);
    for (let i = 0; i < n; i++) {
      const c = cls[i];
      if (c === CELL_CONCAVE || c === CELL_CONVEX) {
        if (this.tangent) {
          sa[i] = g[i];
          sb[i] = g[i + 1];
        } else {
          if (i > 0 && compatible(c, cls[i - 1]) && this.lendable(i - 1, i)) sa[i] = this.chord(i - 1);
          if (i + 1 < n && compatible(c, cls[i + 1]) && this.lendable(i + 1, i)) sb[i] = this.chord(i + 1);
        }
      } else if (c === CELL_BOUNDARY) {
        // the outer line at the finite end, trusted when the cell beyond it is concave
        if (l[i] === -Infinity) {
          if (i + 1 < n && (cls[i + 1] === CELL_CONCAVE || cls[i + 1] === CELL_LINEAR) && (this.tangent || this.lendable(i + 1, i))) {
            sb[i] = this.tangent ? g[i + 1] : this.chord(i + 1);
          }
        } else if (i > 0 && (cls[i - 1] === CELL_CONCAVE || cls[i - 1] === CELL_LINEAR) && (this.tangent || this.lendable(i - 1, i))) {
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

  /** Secant construction: curvature class of each point from the chords on its two sides (0: no triple; CELL_UNKNOWN: undetermined). */
  private pointClasses(): number[] {
    const n = this.x.length;
    const l = this.l;
    const pc = new Array<number>(n).fill(0);
    for (let j = 1; j + 1 < n; j++) {
      if (l[j - 1] === -Infinity || l[j] === -Infinity || l[j + 1] === -Infinity) continue;
      const k = this.chord(j) - this.chord(j - 1);
      const e = this.chordNoise(j) + this.chordNoise(j - 1);
      if (k < -e) pc[j] = CELL_CONCAVE;
      else if (k > e) pc[j] = CELL_CONVEX;
      else {
        // "linear" only if the curvature this allows, |l''| ≲ 2e/(w0 + w1),
        // moves log f from a chord by a negligible amount on both cells
        const w0 = this.x[j] - this.x[j - 1];
        const w1 = this.x[j + 1] - this.x[j];
        const w = Math.max(w0, w1);
        const dev = (e * w * w) / (w0 + w1);
        pc[j] = dev <= SECANT_DEVIATION_ABSOLUTE + SECANT_DEVIATION_RELATIVE * Math.abs(l[j]) ? CELL_LINEAR : CELL_UNKNOWN;
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
        if (c === CELL_ZERO || c === CELL_ATOMIC || c === CELL_NEGLIGIBLE) return;
        if (depth[i] < limit && flag[i] === 0) {
          flag[i] = 1;
          flagged = true;
        }
      };
      for (let i = 0; i < n; i++) {
        const c = cls[i];
        if (c === CELL_MIXED) {
          if (depth[i] < PIN_ROUNDS) {
            if (!this.tangent) mark(i - 1, PIN_ROUNDS);
            mark(i, PIN_ROUNDS);
            if (!this.tangent) mark(i + 1, PIN_ROUNDS);
          } else if (this.monotone(i)) {
            cls[i] = CELL_MONOTONE;
          } else if (depth[i] < MIXED_LIMIT) {
            mark(i, MIXED_LIMIT);
          } else {
            this.shapeFailure(i, 'the log-density changes curvature and direction inside it');
          }
        } else if (c === CELL_UNKNOWN && !this.tangent) {
          // an undetermined end point: halve the wider cell next to it (the
          // verdict there is uncertain because its neighbours differ in width)
          for (const j of [i, i + 1]) {
            if (this.pc[j] !== CELL_UNKNOWN) continue;
            const wl = this.x[j] - this.x[j - 1];
            const wr = this.x[j + 1] - this.x[j];
            let k = wl >= wr ? j - 1 : j;
            const ck = cls[k];
            if (ck === CELL_ZERO || ck === CELL_ATOMIC || ck === CELL_NEGLIGIBLE) k = i;
            if (depth[k] < MIXED_LIMIT) mark(k, MIXED_LIMIT);
            else this.shapeFailure(k, 'the curvature at its ends stays undetermined within rounding');
          }
          if (this.pc[i] !== CELL_UNKNOWN && this.pc[i + 1] !== CELL_UNKNOWN) {
            if (depth[i] < MIXED_LIMIT) mark(i, MIXED_LIMIT);
            else this.shapeFailure(i, 'no curvature information could be obtained for it');
          }
        } else if (c === CELL_UNKNOWN || (c === CELL_BOUNDARY && this.sa[i] !== this.sa[i] && this.sb[i] !== this.sb[i]) || (c === CELL_CONCAVE && this.sa[i] !== this.sa[i] && this.sb[i] !== this.sb[i])) {
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
        if ((c === CELL_CONCAVE && d === CELL_CONVEX) || (c === CELL_CONVEX && d === CELL_CONCAVE)) {
          mark(i, PIN_ROUNDS);
          mark(i + 1, PIN_ROUNDS);
        }
      }
      if (!flagged) return;
      this.split(flag, true);
    }
  }

  /** Throws the ShapeViolationError of a cell that cannot be bounded. */
  shapeFailure(i: number, why: string): never {
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
          const lm = this.ev.logDensity(m);
          const gm = this.tangent ? this.ev.derivative(m, lm) : NaN;
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
    const tol = HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * (Math.abs(lm === -Infinity ? 0 : lm) + Math.abs(e.env === -Infinity ? 0 : e.env));
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
      case CELL_CONCAVE: {
        const env = this.sa[i] !== this.sa[i] ? B : this.sb[i] !== this.sb[i] ? A : Math.min(A, B);
        return { env, sq: chord };
      }
      case CELL_CONVEX: {
        const sq = this.sa[i] !== this.sa[i] ? (this.sb[i] !== this.sb[i] ? -Infinity : B) : this.sb[i] !== this.sb[i] ? A : Math.max(A, B);
        return { env: chord, sq };
      }
      case CELL_LINEAR:
        return { env: chord, sq: chord };
      case CELL_BOUNDARY:
        return { env: la === -Infinity ? B : A, sq: -Infinity };
      case CELL_ATOMIC:
      case CELL_MONOTONE:
        return { env: Math.max(la, lb), sq: Math.min(la, lb) };
      case CELL_NEGLIGIBLE:
        return { env: Math.max(la, lb), sq: -Infinity };
      case CELL_ZERO:
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
    if ((cls === CELL_CONCAVE || cls === CELL_LINEAR || cls === CELL_NEGLIGIBLE) && out < 0) return { kind: TAIL_LOG, x: xk, l: lk, sig: -out };
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
      const e = PIECEWISE_NOISE * (Math.abs(tl) + Math.abs(tr) + (2 + Math.abs(T1)) / w1);
      tConcave = tl - tChordOut >= -e && tChordOut - tr >= -e;
      tSlope = tk;
    } else if (k2 >= 0 && k2 < n && this.l[k2] > -Infinity) {
      const T2 = -exp(-0.5 * (this.l[k2] - lk));
      const w2 = Math.abs(this.x[k1] - this.x[k2]);
      const tChordIn = (o > 0 ? T1 - T2 : T2 - T1) / w2;
      const cl = o > 0 ? tChordIn : tChordOut;
      const cr = o > 0 ? tChordOut : tChordIn;
      const e = PIECEWISE_NOISE * ((2 + Math.abs(T1) + Math.abs(T2)) / Math.min(w1, w2) + Math.abs(cl) + Math.abs(cr));
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

  /** Builds the flat tables of the current envelope ({@link buildTables}). */
  tables(): Tables {
    return buildTables(this);
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
        if (gapCell[i] >= 0.3 * maxGap && this.cls[i] !== CELL_ATOMIC && this.cls[i] !== CELL_ZERO && this.cls[i] !== CELL_NEGLIGIBLE) {
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
    const lo = lastAtOrBelow(x, 0, x.length - 2, a);
    return lo >= 0 && x[lo] <= a && a < x[lo + 1] ? lo : -1;
  }

  /** Adds a point beyond the outermost one, at the median of the tail's envelope. */
  private extend(o: 1 | -1): void {
    const t = o > 0 ? this.upperTail : this.lowerTail;
    if (t.kind === TAIL_NONE) return;
    const d = t.kind === TAIL_LOG ? Math.LN2 / t.sig : 1 / t.sig;
    const xn = t.x + o * d;
    if (!Number.isFinite(xn) || xn === t.x) return;
    const ln = this.ev.logDensity(xn);
    const gn = this.tangent ? this.ev.derivative(xn, ln) : NaN;
    const envAt = t.kind === TAIL_LOG ? t.l - t.sig * d : t.l - 2 * log1p(t.sig * d);
    if (ln > envAt + HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * Math.abs(ln)) this.surprises++;
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
    const gv = this.tangent ? this.ev.derivative(xv, lv) : NaN;
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
      if (c === CELL_MONOTONE || (c === CELL_ATOMIC && this.l[i] > -Infinity && this.l[i + 1] > -Infinity)) {
        out.push(mid(this.x[i], this.x[i + 1]));
        last = -1;
      } else if (c === CELL_CONCAVE || c === CELL_CONVEX) {
        if (last >= 0 && this.cls[last] !== c) out.push(mid(this.x[last + 1], this.x[i]));
        last = i;
      } else if (c !== CELL_LINEAR) last = -1;
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


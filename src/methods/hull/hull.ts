/**
 * The piecewise envelope of the hull engine: touch points, tangent
 * (Gilks & Wild 1992) or secant (Gilks 1992) upper hulls, chord squeezes,
 * shape checks and local rebuilding after an insertion. @internal
 *
 * @packageDocumentation
 */
import { ImproperDensityError, NonFiniteDensityError, ShapeViolationError } from '../../core/errors.js';
import { GuideTable } from './guide-table.js';
import { T_LOG, logHeight, pieceConstant, pieceLogArea, transformSlope, transformValue } from './transforms.js';
import { exp } from '../../vendor/math.js';

/**
 * Absolute part of the tolerance, in log-density units, of every comparison
 * between the target and the hull (envelope and squeeze checks, shape
 * checks): `logf(x) ≤ log envelope(x) + tol` with
 * `tol = 1e-9 + 1e-12·(|log envelope| + |logf|)` (roughly).
 *
 * @remarks
 * Why not 0: a log-density is computed with rounding error relative to the
 * size of its intermediate terms, not of its result — a normalized gamma
 * log-density at shape 1e4 subtracts lnΓ(1e4) ≈ 8.2e4 and keeps an absolute
 * error near 1e-11 although the result is about −5. Why so small: a target
 * that exceeds the envelope by a factor e^tol ≈ 1 + 1e-9 biases the draws by
 * at most about 1e-9 in total variation, far below what any sample can
 * detect, while every shape error of practical size (a second mode, a tail
 * heavier than the transform allows) is many orders of magnitude larger.
 */
export const HULL_LOG_TOLERANCE_ABSOLUTE = 1e-9;

/** Relative part of the hull tolerance (see {@link HULL_LOG_TOLERANCE_ABSOLUTE}): unnormalized targets with log heights far from 0. */
export const HULL_LOG_TOLERANCE_RELATIVE = 1e-12;

/**
 * Under T(f) = −1/√f, a point whose log-density lies more than 600 below the
 * reference height is not used as a touch point (its transformed value, about
 * −e^300, would leave no room for the arithmetic once setup has moved the
 * reference by up to {@link SETUP_MAX_RELATIVE_HEIGHT}); it is simply rejected.
 * @internal
 */
export const INV_SQRT_MIN_RELATIVE_LOG_HEIGHT = -600;

/** How far (in log units) the hull may rise above the highest touch point during setup before a point is added where it peaks. @internal */
export const SETUP_MAX_RELATIVE_HEIGHT = 600;

/** Result codes of {@link Hull.insert}. @internal */
export const INSERTED = 0;
/** The point was not used (duplicate, capacity reached, or too low under inverse-sqrt). @internal */
export const SKIPPED = 1;
/** The point had density 0 outside the touch points: the effective support was shrunk to it. @internal */
export const SHRUNK = 2;

/** Target functions the engine evaluates. @internal */
export interface HullTarget {
  readonly logDensity: (x: number) => number;
  readonly dLogDensity: ((x: number) => number) | undefined;
}

/** Throws a {@link NonFiniteDensityError} whose message names `dLogDensity`. @internal */
export function nonFiniteDerivative(api: string, x: number, value: number): never {
  const e = new NonFiniteDensityError(api, x, value);
  e.message = `${api}: dLogDensity(${x}) returned ${value}; it must be a finite number inside the support`;
  throw e;
}

/**
 * Mutable hull state. Touch points are kept sorted in `tx`; the envelope is
 * stored as `2k` pieces for `k` touch points: piece 0 is the left tail
 * (lower end to the first touch point), pieces `1 + 2i` and `2 + 2i` cover
 * the interval between touch points i and i + 1, split where the envelope
 * changes line (tangent intersection, or where the two neighbouring chord
 * extensions cross), and piece `2k − 1` is the right tail. Every piece thus
 * has one envelope line and one squeeze chord (none on the tails).
 *
 * A line is stored as (anchor x, value at the anchor, slope) with the anchor
 * at a touch point, and is evaluated as `value + slope·(x − anchor)`: with
 * targets concentrated far from 0 (mean 1e9, sd 1e-9) the difference
 * `x − anchor` is exact and the line keeps its precision, where
 * `intercept + slope·x` would cancel catastrophically. Transformed values
 * are those of f/e^ref, ref being the hull's maximum log height.
 * @internal
 */
export class Hull {
  readonly api: string;
  /** {@link T_LOG} or {@link T_INV_SQRT}. */
  readonly kind: number;
  /** Tangent construction (true) or secant construction (false). */
  readonly tangent: boolean;
  /** Target functions. */
  readonly target: HullTarget;
  /** Reference log height. */
  ref: number;
  /** Effective lower end of the support. */
  lower: number;
  /** Effective upper end of the support. */
  upper: number;
  /** Number of touch points. */
  k = 0;
  /** Capacity in touch points. */
  cap: number;
  /** Touch points allowed while sampling (adaptation stops there). */
  maxK: number;
  /** Calls of dLogDensity (setup and sampling). */
  derivativeEvaluations = 0;
  /** Guide table over the pieces. */
  readonly guideTable: GuideTable;
  /** True when the guide table must be rebuilt before the next draw. */
  dirty = true;
  /** Length scale used when setup needs to step outward. */
  setupScale = 1;
  private leftStep = 0;
  private rightStep = 0;
  private leftGrowth = 2;
  private rightGrowth = 2;

  // touch points
  tx!: Float64Array; // x
  tl!: Float64Array; // absolute log-density
  tg!: Float64Array; // derivative of the log-density (tangent construction)
  ty!: Float64Array; // transformed value (relative to ref)
  ts!: Float64Array; // transformed slope (tangent construction)
  // pieces
  lo!: Float64Array;
  hi!: Float64Array;
  ax!: Float64Array; // line anchor
  at!: Float64Array; // line value at anchor
  sl!: Float64Array; // line slope
  sqx!: Float64Array; // squeeze anchor
  sqt!: Float64Array; // squeeze value at anchor (-Infinity: none)
  sqs!: Float64Array; // squeeze slope
  hx!: Float64Array; // high end
  dir!: Float64Array; // +1 or -1: direction from the high end into the piece
  wd!: Float64Array; // width
  sig!: Float64Array; // |slope|
  pq!: Float64Array; // inversion constant
  th!: Float64Array; // line value at the high end
  logArea!: Float64Array; // relative log area
  area!: Float64Array; // relative area

  /**
   * @param api - API name for messages
   * @param kind - transform id
   * @param tangent - tangent (true) or secant (false) construction
   * @param target - target functions
   * @param lower - effective lower end
   * @param upper - effective upper end
   * @param ref - reference log height
   * @param cap - initial capacity in touch points
   */
  constructor(api: string, kind: number, tangent: boolean, target: HullTarget, lower: number, upper: number, ref: number, cap: number) {
    this.api = api;
    this.kind = kind;
    this.tangent = tangent;
    this.target = target;
    this.lower = lower;
    this.upper = upper;
    this.ref = ref;
    this.cap = 0;
    this.maxK = cap;
    this.guideTable = new GuideTable(0);
    this.allocate(cap);
  }

  /**
   * (Re)allocates the arrays for `cap` touch points (2·cap pieces) as views
   * of one ArrayBuffer (with the guide table's arrays), keeping the used
   * parts. One backing store instead of 24: a fresh hull (a Gibbs step) spent most of its time allocating
   * typed arrays and collecting them (measured: 47 µs per fresh sampler and
   * draw, about three quarters of it allocation and garbage collection).
   */
  private allocate(cap: number): void {
    const old = this.cap;
    // 5 touch-point arrays, 17 piece arrays and the guide table's cumulative areas (doubles), then its guide (int32)
    const doubles = 5 * cap + 18 * 2 * cap;
    const buffer = new ArrayBuffer(8 * doubles + 4 * 2 * cap);
    const store = new Float64Array(buffer, 0, doubles);
    let off = 0;
    const copy = (a: Float64Array | undefined, n: number, used: number): Float64Array => {
      const b = store.subarray(off, off + n);
      off += n;
      if (a !== undefined && used > 0) b.set(a.subarray(0, used));
      return b;
    };
    const k = old > 0 ? this.k : 0;
    this.tx = copy(this.tx, cap, k);
    this.tl = copy(this.tl, cap, k);
    this.tg = copy(this.tg, cap, k);
    this.ty = copy(this.ty, cap, k);
    this.ts = copy(this.ts, cap, k);
    const p = 2 * cap;
    const n = 2 * k;
    this.lo = copy(this.lo, p, n);
    this.hi = copy(this.hi, p, n);
    this.ax = copy(this.ax, p, n);
    this.at = copy(this.at, p, n);
    this.sl = copy(this.sl, p, n);
    this.sqx = copy(this.sqx, p, n);
    this.sqt = copy(this.sqt, p, n);
    this.sqs = copy(this.sqs, p, n);
    this.hx = copy(this.hx, p, n);
    this.dir = copy(this.dir, p, n);
    this.wd = copy(this.wd, p, n);
    this.sig = copy(this.sig, p, n);
    this.pq = copy(this.pq, p, n);
    this.th = copy(this.th, p, n);
    this.logArea = copy(this.logArea, p, n);
    this.area = copy(this.area, p, n);
    // the guide table is rebuilt from `area` before the next draw (dirty), so its old contents need not be kept
    this.guideTable.useStorage(store.subarray(off, off + p), new Int32Array(buffer, 8 * doubles, p));
    this.dirty = true;
    this.cap = cap;
  }

  /** Name of the shape assumption, for messages. */
  shapeName(): string {
    return this.kind === T_LOG ? 'log-concave' : 'T-concave for T(f) = -1/sqrt(f)';
  }

  /** Number of pieces. */
  get pieces(): number {
    return 2 * this.k;
  }

  // ----- lines ---------------------------------------------------------------

  /** Slope of the chord between touch points i and i + 1 in transformed space. */
  chord(i: number): number {
    return (this.ty[i + 1] - this.ty[i]) / (this.tx[i + 1] - this.tx[i]);
  }

  /** Slope of the envelope line on the left tail. */
  leftTailSlope(): number {
    if (this.tangent) return this.ts[0];
    return this.k >= 2 ? this.chord(0) : NaN;
  }

  /** Slope of the envelope line on the right tail. */
  rightTailSlope(): number {
    if (this.tangent) return this.ts[this.k - 1];
    return this.k >= 2 ? this.chord(this.k - 2) : NaN;
  }

  /**
   * Sets piece j on [lo, hi] with the line `at + sl·(x − ax)`, anchored at
   * the touch point the line belongs to (its tangent point, or the chord's
   * end point). Keeping the exact line — rather than re-anchoring it at the
   * rounded intersection z with its neighbour — matters: with sd 1e-6 at
   * location 1e6 the rounding of z (1.2e-10) times a tangent slope of 5e6
   * would shift the line by 6e-4 in log units at its own touch point, where
   * it must touch the target. The value at the high end, used for the area
   * and the inversion, comes from the same line. The squeeze chord is given
   * anchored at its higher touch point.
   */
  private setPiece(j: number, lo: number, hi: number, ax: number, at: number, sl: number, sqx: number, sqt: number, sqs: number): void {
    let hx: number;
    let dir: number;
    if (sl > 0) {
      hx = hi;
      dir = -1;
    } else {
      hx = lo;
      dir = 1;
    }
    const w = hi - lo;
    const s = Math.abs(sl);
    // a line rising towards an infinite end (or flat on an infinite piece) is not integrable
    let th = hx === Infinity || hx === -Infinity || !(sl === sl) ? Infinity : at + sl * (hx - ax);
    if (!(th === th)) th = Infinity;
    const la = th === Infinity ? Infinity : pieceLogArea(this.kind, th, s, w);
    this.lo[j] = lo;
    this.hi[j] = hi;
    this.ax[j] = ax;
    this.at[j] = at;
    this.sl[j] = sl;
    this.sqx[j] = sqx;
    this.sqt[j] = sqt;
    this.sqs[j] = sqs;
    this.hx[j] = hx;
    this.dir[j] = dir;
    this.wd[j] = w;
    this.sig[j] = s;
    this.th[j] = th;
    this.pq[j] = th === Infinity ? NaN : pieceConstant(this.kind, th, s, w);
    this.logArea[j] = la;
    this.area[j] = exp(la);
  }

  private setInvalid(j: number, lo: number, hi: number): void {
    this.setPiece(j, lo, hi, lo, Infinity, NaN, lo, -Infinity, 0);
  }

  /**
   * Where the envelope switches from the line through (a, ya) with slope sa
   * to the line through (b, yb) with slope sb, given the crossing fraction f
   * of [a, b]. Under T(f) = −1/√f a line that rises steeply from a very low
   * touch point reaches values near 0 only through cancellation
   * (−1e25 + 1e25), so each line is kept within its "safe reach", where
   * |t| ≥ 1e-4·|y| at its touch point (and |t| exceeds the line's change
   * over 8 ulps of x): its own evaluation then keeps a relative precision of
   * about 1e-12. Any split point gives a valid
   * envelope (each line lies above the target everywhere); moving it off the
   * crossing only loosens the envelope slightly.
   */
  private split(a: number, ya: number, sa: number, b: number, yb: number, sb: number, f: number): number {
    let z = a + f * (b - a);
    if (z > b) z = b;
    if (this.kind !== T_LOG) {
      // keep |t| above 1e-4·|y| and above the change of the line over 8 ulps of x
      const ulp = Math.max(Math.abs(a), Math.abs(b)) * 2.220446049250313e-16;
      let reachA = Infinity;
      if (sa > 0) {
        const keep = Math.max(1e-4 * -ya, 8 * sa * ulp);
        reachA = a + Math.max(0, (-ya - keep) / sa);
        if (z > reachA) z = reachA;
      }
      if (sb < 0) {
        const keep = Math.max(1e-4 * -yb, 8 * -sb * ulp);
        const reachB = b - Math.max(0, (-yb - keep) / -sb);
        if (z < reachB && reachB <= reachA) z = reachB;
      }
    }
    return z;
  }

  /** Rebuilds the two pieces of interval i (touch points i and i + 1). */
  private buildInterval(i: number): void {
    const tx = this.tx;
    const ty = this.ty;
    const a = tx[i];
    const b = tx[i + 1];
    const ya = ty[i];
    const yb = ty[i + 1];
    const w = b - a;
    const mi = this.chord(i);
    const jA = 1 + 2 * i;
    const jB = jA + 1;
    // squeeze: the chord, anchored at its higher end
    const sqx = ya >= yb ? a : b;
    const sqt = ya >= yb ? ya : yb;
    const mid = a + 0.5 * w;
    if (mid === a || mid === b) {
      // a and b are adjacent doubles: every candidate in [a, b] rounds to a or
      // b, so a flat line at the higher of the two values bounds the target at
      // every point the sampler can return (a target whose scale is below the
      // resolution of doubles, e.g. sd 1e-9 at 1e9, lives on such intervals)
      this.setPiece(jA, a, b, sqx, sqt, 0, sqx, sqt, mi);
      this.setPiece(jB, b, b, b, yb, 0, sqx, sqt, mi);
      return;
    }
    if (this.tangent) {
      const s0 = this.ts[i];
      const s1 = this.ts[i + 1];
      let f = s0 - s1 > 0 ? (mi - s1) / (s0 - s1) : 0.5;
      if (!(f >= 0)) f = f < 0 ? 0 : 0.5;
      else if (f > 1) f = 1;
      const z = this.split(a, ya, s0, b, yb, s1, f);
      this.setPiece(jA, a, z, a, ya, s0, sqx, sqt, mi);
      this.setPiece(jB, z, b, b, yb, s1, sqx, sqt, mi);
      return;
    }
    const k = this.k;
    const hasL = i >= 1;
    const hasR = i <= k - 3;
    if (hasL && hasR) {
      const mL = this.chord(i - 1);
      const mR = this.chord(i + 1);
      let f = mL - mR > 0 ? (mi - mR) / (mL - mR) : 0.5;
      if (!(f >= 0)) f = f < 0 ? 0 : 0.5;
      else if (f > 1) f = 1;
      const z = this.split(a, ya, mL, b, yb, mR, f);
      this.setPiece(jA, a, z, a, ya, mL, sqx, sqt, mi);
      this.setPiece(jB, z, b, b, yb, mR, sqx, sqt, mi);
    } else if (hasR) {
      // only the chord on the right, extended backwards through b
      const mR = this.chord(i + 1);
      const z = a + 0.5 * w;
      this.setPiece(jA, a, z, b, yb, mR, sqx, sqt, mi);
      this.setPiece(jB, z, b, b, yb, mR, sqx, sqt, mi);
    } else if (hasL) {
      // only the chord on the left, extended forwards through a
      const mL = this.chord(i - 1);
      const z = a + 0.5 * w;
      this.setPiece(jA, a, z, a, ya, mL, sqx, sqt, mi);
      this.setPiece(jB, z, b, a, ya, mL, sqx, sqt, mi);
    } else {
      // two secant points bound nothing between them
      this.setInvalid(jA, a, a + 0.5 * w);
      this.setInvalid(jB, a + 0.5 * w, b);
    }
  }

  /** Rebuilds the two tail pieces. */
  buildTails(): void {
    const k = this.k;
    const tx = this.tx;
    const ty = this.ty;
    const last = 2 * k - 1;
    const sL = this.leftTailSlope();
    const sR = this.rightTailSlope();
    if (sL === sL) this.setPiece(0, this.lower, tx[0], tx[0], ty[0], sL, 0, -Infinity, 0);
    else this.setInvalid(0, this.lower, tx[0]);
    if (sR === sR) this.setPiece(last, tx[k - 1], this.upper, tx[k - 1], ty[k - 1], sR, 0, -Infinity, 0);
    else this.setInvalid(last, tx[k - 1], this.upper);
    this.dirty = true;
  }

  /** Recomputes every transformed value and every piece (after a change of ref). */
  rebuildAll(): void {
    for (let i = 0; i < this.k; i++) this.setTransformed(i);
    for (let i = 0; i + 1 < this.k; i++) this.buildInterval(i);
    this.buildTails();
  }

  /** Changes the reference log height and rebuilds. */
  rebase(ref: number): void {
    this.ref = ref;
    this.rebuildAll();
  }

  private setTransformed(i: number): void {
    const y = transformValue(this.kind, this.tl[i] - this.ref);
    this.ty[i] = y;
    this.ts[i] = this.tangent ? transformSlope(this.kind, y, this.tg[i]) : NaN;
  }

  // ----- tolerances and shape checks -----------------------------------------

  /** Tolerance in transformed units for comparisons between points of log-density la, lb and transformed values ya, yb. */
  private tolY(la: number, lb: number, ya: number, yb: number): number {
    const tolL = HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * (Math.abs(la) + Math.abs(lb));
    if (this.kind === T_LOG) return tolL;
    return 0.5 * Math.max(-ya, -yb) * tolL;
  }

  private context = '';

  private shapeError(detail: string, a: number, b: number): never {
    if (this.context !== '') detail = `${this.context}; ${detail}`;
    const hint = this.kind === T_LOG
      ? " (for heavier tails try transform: 'inverse-sqrt'; for several modes use piecewiseSampler)"
      : ' (for several modes use piecewiseSampler)';
    throw new ShapeViolationError(`${this.api}: target is not ${this.shapeName()} on [${a}, ${b}]: ${detail}${hint}`, [a, b]);
  }

  /**
   * Tangent construction, points a < b: each tangent must lie above the
   * other point (equivalently the chord slope lies between the tangent
   * slopes, which therefore do not increase).
   */
  private checkTangentPair(xa: number, ya: number, sa: number, la: number, ga: number, xb: number, yb: number, sb: number, lb: number, gb: number): void {
    const w = xb - xa;
    const tol = this.tolY(la, lb, ya, yb) + HULL_LOG_TOLERANCE_RELATIVE * w * (Math.abs(sa) + Math.abs(sb));
    const e1 = ya + sa * w - yb;
    const e2 = yb - sb * w - ya;
    if (!(e1 >= -tol) || !(e2 >= -tol)) {
      this.shapeError(
        `the slopes of the transformed density must not increase, but the tangent slopes are ${sa} at ${xa} and ${sb} at ${xb} around a chord slope of ${(yb - ya) / w} (log-density ${la} and ${lb}, derivatives ${ga} and ${gb})`,
        xa,
        xb,
      );
    }
  }

  /** Secant construction, points x0 < x1 < x2: the middle one must not lie below the chord of the outer ones. */
  private checkSecantTriple(x0: number, y0: number, l0: number, x1: number, y1: number, l1: number, x2: number, y2: number, l2: number): void {
    const interp = y0 + (y2 - y0) * ((x1 - x0) / (x2 - x0));
    const tol = Math.max(this.tolY(l0, l1, y0, y1), this.tolY(l1, l2, y1, y2));
    if (!(y1 - interp >= -tol)) {
      this.shapeError(
        `the chord slopes of the transformed density must not increase, but they are ${(y1 - y0) / (x1 - x0)} on [${x0}, ${x1}] and ${(y2 - y1) / (x2 - x1)} on [${x1}, ${x2}] (log-density ${l0}, ${l1}, ${l2})`,
        x0,
        x2,
      );
    }
  }

  /**
   * Called by the kernel when the target at x was found above the envelope
   * or below the squeeze. Checks (x, logf(x)) against the neighbouring touch
   * points with the value-only concavity tests (no derivative needed) and
   * throws {@link ShapeViolationError} naming the interval when they fail —
   * which they do whenever the hull was built from correct values, since the
   * envelope at x is made of the neighbours' tangents or chord extensions and
   * the squeeze of their chord. Returns when they pass, so that the caller
   * reports an {@link EnvelopeViolationError}.
   * @param context - what was found, for the message
   */
  explainViolation(x: number, l: number, context: string): void {
    const k = this.k;
    const tx = this.tx;
    const ty = this.ty;
    const tl = this.tl;
    let p = 0;
    while (p < k && tx[p] <= x) p++;
    // at a touch point the target disagrees with its own earlier value: not a shape question
    if (p >= 1 && tx[p - 1] === x) return;
    this.context = context;
    try {
      if (l === -Infinity) {
        if (p >= 1 && p < k) {
          this.shapeError(`logDensity(${x}) is -Infinity between touch points of finite log-density, so the support is not an interval`, tx[p - 1], tx[p]);
        }
        return;
      }
      const y = transformValue(this.kind, l - this.ref);
      if (p >= 2) this.checkSecantTriple(tx[p - 2], ty[p - 2], tl[p - 2], tx[p - 1], ty[p - 1], tl[p - 1], x, y, l);
      if (p >= 1 && p < k) this.checkSecantTriple(tx[p - 1], ty[p - 1], tl[p - 1], x, y, l, tx[p], ty[p], tl[p]);
      if (p + 1 < k) this.checkSecantTriple(x, y, l, tx[p], ty[p], tl[p], tx[p + 1], ty[p + 1], tl[p + 1]);
      if (this.tangent) {
        for (let i = p - 1; i <= p; i++) {
          if (i < 0 || i >= k) continue;
          const tan = ty[i] + this.ts[i] * (x - tx[i]);
          const tol = this.tolY(tl[i], l, ty[i], y) + HULL_LOG_TOLERANCE_RELATIVE * Math.abs(this.ts[i] * (x - tx[i]));
          if (!(tan >= y - tol)) {
            this.shapeError(
              `the target lies above the tangent of the transformed density at the touch point ${tx[i]} (slope ${this.ts[i]}, log-density ${tl[i]}, derivative ${this.tg[i]}) at x = ${x} (log-density ${l}); a T-concave target lies below all its tangents (or dLogDensity is wrong)`,
              Math.min(tx[i], x),
              Math.max(tx[i], x),
            );
          }
        }
      }
    } finally {
      this.context = '';
    }
  }

  // ----- insertion ------------------------------------------------------------

  /**
   * Inserts the touch point (x, l, g) — l the log-density, g its derivative
   * (ignored by the secant construction) — checks the shape against its
   * neighbours and rebuilds only the pieces that depend on it.
   * @param grow - allow the arrays to grow (setup); otherwise the point is skipped at `maxK`
   * @returns {@link INSERTED}, {@link SKIPPED} or {@link SHRUNK}
   * @throws {@link ShapeViolationError} when the new point contradicts the shape assumption
   */
  insert(x: number, l: number, g: number, grow: boolean): number {
    const k = this.k;
    const tx = this.tx;
    if (l === -Infinity) {
      if (k === 0) return SKIPPED;
      if (x < tx[0]) {
        if (x > this.lower) {
          this.lower = x;
          this.buildTails();
        }
        return SHRUNK;
      }
      if (x > tx[k - 1]) {
        if (x < this.upper) {
          this.upper = x;
          this.buildTails();
        }
        return SHRUNK;
      }
      // density 0 between two points of positive density
      let i = 0;
      while (i + 1 < k && tx[i + 1] < x) i++;
      this.shapeError(`logDensity(${x}) is -Infinity between touch points of finite log-density, so the support is not an interval`, tx[i], tx[i + 1]);
    }
    if (this.kind !== T_LOG && l - this.ref < INV_SQRT_MIN_RELATIVE_LOG_HEIGHT) return SKIPPED;
    // position: first index with tx[p] > x
    let a = 0;
    let b = k;
    while (a < b) {
      const m = (a + b) >> 1;
      if (tx[m] <= x) a = m + 1;
      else b = m;
    }
    const p = a;
    if (p > 0 && tx[p - 1] === x) return SKIPPED;
    // shape checks against the neighbours, before anything changes
    const y = transformValue(this.kind, l - this.ref);
    const sNew = this.tangent ? transformSlope(this.kind, y, g) : NaN;
    const ty = this.ty;
    const tl = this.tl;
    if (this.tangent) {
      const ts = this.ts;
      const tg = this.tg;
      if (p > 0) this.checkTangentPair(tx[p - 1], ty[p - 1], ts[p - 1], tl[p - 1], tg[p - 1], x, y, sNew, l, g);
      if (p < k) this.checkTangentPair(x, y, sNew, l, g, tx[p], ty[p], ts[p], tl[p], tg[p]);
    } else {
      if (p >= 2) this.checkSecantTriple(tx[p - 2], ty[p - 2], tl[p - 2], tx[p - 1], ty[p - 1], tl[p - 1], x, y, l);
      if (p >= 1 && p < k) this.checkSecantTriple(tx[p - 1], ty[p - 1], tl[p - 1], x, y, l, tx[p], ty[p], tl[p]);
      if (p + 1 < k) this.checkSecantTriple(x, y, l, tx[p], ty[p], tl[p], tx[p + 1], ty[p + 1], tl[p + 1]);
    }
    if (k >= this.cap) {
      if (!grow) return SKIPPED;
      this.allocate(Math.max(2 * this.cap, 8));
    } else if (!grow && k >= this.maxK) {
      return SKIPPED;
    }
    // shift touch points
    const n = 2 * k;
    if (p < k) {
      this.tx.copyWithin(p + 1, p, k);
      this.tl.copyWithin(p + 1, p, k);
      this.tg.copyWithin(p + 1, p, k);
      this.ty.copyWithin(p + 1, p, k);
      this.ts.copyWithin(p + 1, p, k);
    }
    // shift pieces: old pieces [1 + 2p, 2k) move right by 2
    const from = 1 + 2 * p;
    if (k > 0 && from < n) {
      const arrays = [this.lo, this.hi, this.ax, this.at, this.sl, this.sqx, this.sqt, this.sqs, this.hx, this.dir, this.wd, this.sig, this.pq, this.th, this.logArea, this.area];
      for (let q = 0; q < arrays.length; q++) arrays[q].copyWithin(from + 2, from, n);
    }
    this.tx[p] = x;
    this.tl[p] = l;
    this.tg[p] = g;
    this.ty[p] = y;
    this.ts[p] = sNew;
    this.k = k + 1;
    const kk = this.k;
    // rebuild the intervals that depend on the new point, and the tails
    const i0 = Math.max(0, p - (this.tangent ? 1 : 2));
    const i1 = Math.min(kk - 2, p + (this.tangent ? 0 : 1));
    for (let i = i0; i <= i1; i++) this.buildInterval(i);
    this.buildTails();
    return INSERTED;
  }

  // ----- setup helpers --------------------------------------------------------

  /**
   * The next point setup should probe so that the envelope becomes valid
   * and integrable, or NaN when it already is.
   * @throws {@link ImproperDensityError} when a tail cannot be bounded
   */
  setupDeficiency(): number {
    const k = this.k;
    const tx = this.tx;
    const spread = k > 1 ? tx[k - 1] - tx[0] : 0;
    const base = Math.max(spread, this.setupScale, Math.abs(tx[0]) * 4.4e-16, 5e-324);
    if (!this.tangent && k < 3) {
      // derivative-free hulls need three touch points
      if (this.upper > tx[k - 1]) return this.outward(1, base);
      if (this.lower < tx[0]) return this.outward(-1, base);
      return tx[0] + 0.5 * (tx[1] - tx[0]);
    }
    const sL = this.leftTailSlope();
    if (this.lower === -Infinity) {
      if (!(sL * 1e300 > 1)) return this.outward(-1, base);
    } else if (this.kind !== T_LOG && tx[0] > this.lower && !(this.ty[0] + sL * (this.lower - tx[0]) < 0)) {
      return this.towardBound(-1);
    }
    const sR = this.rightTailSlope();
    if (this.upper === Infinity) {
      if (!(-sR * 1e300 > 1)) return this.outward(1, base);
    } else if (this.kind !== T_LOG && tx[k - 1] < this.upper && !(this.ty[k - 1] + sR * (this.upper - tx[k - 1]) < 0)) {
      return this.towardBound(1);
    }
    // the hull must not rise far above the touch points
    let topTouch = -Infinity;
    for (let i = 0; i < k; i++) if (this.tl[i] > topTouch) topTouch = this.tl[i];
    let worst = -1;
    let worstH = topTouch - this.ref + SETUP_MAX_RELATIVE_HEIGHT;
    const last = 2 * k - 1;
    for (let j = 0; j <= last; j++) {
      if (!(this.wd[j] > 0)) continue;
      const h = logHeight(this.kind, this.th[j]);
      if (!(h <= worstH)) {
        worst = j;
        worstH = h;
        if (h !== h) break;
      }
    }
    if (worst === 0) return this.towardBound(-1);
    if (worst === last) return this.towardBound(1);
    if (worst > 0) {
      // probe where the line peaks: the end of the piece that is not a touch point
      const i = (worst - 1) >> 1;
      const z = (worst & 1) === 1 ? this.hi[worst] : this.lo[worst];
      const a = tx[i];
      const b = tx[i + 1];
      return z > a && z < b ? z : a + 0.5 * (b - a);
    }
    return NaN;
  }

  /** A point outside the touch points on side `side`, further out at each call. */
  private outward(side: number, base: number): number {
    const k = this.k;
    if (side < 0) {
      // accelerating steps (×2, ×4, ×8, …): a tail that never decays reaches 1e300 in a few dozen probes
      if (this.leftStep > 0) {
        this.leftStep *= this.leftGrowth;
        this.leftGrowth *= 2;
      } else {
        this.leftStep = base;
      }
      const x = this.tx[0] - this.leftStep;
      if (!(x > -1e300)) this.improper(-1);
      return x > this.lower ? x : this.tx[0] - 0.5 * (this.tx[0] - this.lower);
    }
    if (this.rightStep > 0) {
      this.rightStep *= this.rightGrowth;
      this.rightGrowth *= 2;
    } else {
      this.rightStep = base;
    }
    const x = this.tx[k - 1] + this.rightStep;
    if (!(x < 1e300)) this.improper(1);
    return x < this.upper ? x : this.tx[k - 1] + 0.5 * (this.upper - this.tx[k - 1]);
  }

  private towardBound(side: number): number {
    const k = this.k;
    const t = side < 0 ? this.tx[0] : this.tx[k - 1];
    const bnd = side < 0 ? this.lower : this.upper;
    const mid = t + 0.5 * (bnd - t);
    return Math.abs(bnd - t) <= 1e-12 * Math.max(1, Math.abs(t)) || mid === t ? bnd : mid;
  }

  private improper(side: number): never {
    const k = this.k;
    const x = side < 0 ? this.tx[0] : this.tx[k - 1];
    throw new ImproperDensityError(
      `${this.api}: the ${side < 0 ? 'left' : 'right'} tail does not decay: logDensity keeps ${side < 0 ? 'increasing towards -Infinity' : 'increasing towards +Infinity'} (last touch point x = ${x}, logDensity = ${side < 0 ? this.tl[0] : this.tl[k - 1]}); the density has infinite mass, or its mode lies beyond ±1e300`,
    );
  }

  /** Largest relative log height of the hull over pieces of positive width. */
  maxRelativeHeight(): number {
    let h = -Infinity;
    for (let j = 0; j < 2 * this.k; j++) {
      if (!(this.wd[j] > 0)) continue;
      const v = logHeight(this.kind, this.th[j]);
      if (v > h) h = v;
    }
    return h;
  }

  /** Rebuilds the guide table; throws when the envelope's area is not finite and positive. */
  buildGuide(): void {
    const total = this.guideTable.build(this.area, 2 * this.k);
    if (!(total > 0 && total < Infinity)) {
      throw new ImproperDensityError(
        `${this.api}: the envelope's area is ${total} (relative to e^${this.ref}); the target cannot be bounded by a ${this.kind === T_LOG ? 'log' : 'inverse-sqrt'} hull on [${this.lower}, ${this.upper}]`,
      );
    }
    this.dirty = false;
  }
}

/**
 * The piecewise envelope of the hull engine: storage of the touch points and
 * pieces, the geometry (tangent (Gilks & Wild 1992) or secant (Gilks 1992)
 * upper hulls, chord squeezes, areas, tails, rebuilding) and insertion with
 * local rebuilding. The shape checks an insertion runs and their messages
 * live in `shape-checks.ts`. @internal
 *
 * @packageDocumentation
 */
import { ImproperDensityError, NonFiniteDensityError } from '../../core/errors.js';
import { shapeName } from '../envelope/concavity.js';
import { GuideTable } from '../envelope/guide-table.js';
import type { HullView } from '../envelope/hull-view.js';
import { FLAT_LIMIT, T_LOG, invertPiece, logHeight, pieceConstant, pieceLogArea, transformSlope, transformValue } from '../envelope/transforms.js';
import { exp, expm1, log } from '../../vendor/math.js';
import { checkSecantTriple, checkTangentPair, gapBetween } from './shape-checks.js';

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
export class Hull implements HullView {
  readonly api: string;
  /** {@link T_LOG} or {@link T_INV_SQRT}. */
  readonly kind: number;
  /** Tangent construction (true) or secant construction (false); changed only by {@link Hull.reset}. */
  tangent: boolean;
  /** Target functions; changed only by {@link Hull.reset}. */
  target: HullTarget;
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
  /**
   * Piece areas as e^tH·q/sig (differs from e^(pieceLogArea) in the last bits only): set by
   * {@link Hull.reset} for a warm-started hull; false for a fresh hull, whose areas (and so the
   * tables built from it) keep their bits.
   */
  quickAreas = false;
  /** Touch point whose pieces a deferred insertion has not built yet, or −1 ({@link Hull.insertDeferred}). */
  pending = -1;
  /** True when the guide table must be rebuilt before the next draw. */
  dirty = true;

  // touch points
  touchX!: Float64Array; // x
  touchLogDensity!: Float64Array; // absolute log-density
  touchDerivative!: Float64Array; // derivative of the log-density (tangent construction)
  touchValue!: Float64Array; // transformed value (relative to ref)
  touchSlope!: Float64Array; // transformed slope (tangent construction)
  // pieces
  lo!: Float64Array;
  hi!: Float64Array;
  lineAnchor!: Float64Array; // line anchor
  lineValue!: Float64Array; // line value at anchor
  lineSlope!: Float64Array; // line slope
  squeezeAnchor!: Float64Array; // squeeze anchor
  squeezeValue!: Float64Array; // squeeze value at anchor (-Infinity: none)
  squeezeSlope!: Float64Array; // squeeze slope
  highEnd!: Float64Array; // high end
  direction!: Float64Array; // +1 or -1: direction from the high end into the piece
  width!: Float64Array; // width
  rate!: Float64Array; // |slope|
  inversion!: Float64Array; // inversion constant
  highValue!: Float64Array; // line value at the high end
  area!: Float64Array; // relative area (the log area is computed from highValue, rate and width where needed: describeHull)
  /** The 15 piece arrays, in the order above (shifted together by {@link Hull.insert}). */
  private pieceArrays: Float64Array[] = [];

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
   * parts. One backing store instead of 24 keeps a fresh hull (a Gibbs step)
   * cheap to allocate and collect (figures: CHANGELOG.md, "Measurements").
   */
  private allocate(cap: number): void {
    const old = this.cap;
    // 5 touch-point arrays, 15 piece arrays and the guide table's cumulative areas (doubles), then its guide (int32)
    const doubles = 5 * cap + 16 * 2 * cap;
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
    this.touchX = copy(this.touchX, cap, k);
    this.touchLogDensity = copy(this.touchLogDensity, cap, k);
    this.touchDerivative = copy(this.touchDerivative, cap, k);
    this.touchValue = copy(this.touchValue, cap, k);
    this.touchSlope = copy(this.touchSlope, cap, k);
    const p = 2 * cap;
    const n = 2 * k;
    this.lo = copy(this.lo, p, n);
    this.hi = copy(this.hi, p, n);
    this.lineAnchor = copy(this.lineAnchor, p, n);
    this.lineValue = copy(this.lineValue, p, n);
    this.lineSlope = copy(this.lineSlope, p, n);
    this.squeezeAnchor = copy(this.squeezeAnchor, p, n);
    this.squeezeValue = copy(this.squeezeValue, p, n);
    this.squeezeSlope = copy(this.squeezeSlope, p, n);
    this.highEnd = copy(this.highEnd, p, n);
    this.direction = copy(this.direction, p, n);
    this.width = copy(this.width, p, n);
    this.rate = copy(this.rate, p, n);
    this.inversion = copy(this.inversion, p, n);
    this.highValue = copy(this.highValue, p, n);
    this.area = copy(this.area, p, n);
    this.pieceArrays = [this.lo, this.hi, this.lineAnchor, this.lineValue, this.lineSlope, this.squeezeAnchor, this.squeezeValue, this.squeezeSlope, this.highEnd, this.direction, this.width, this.rate, this.inversion, this.highValue, this.area];
    // the guide table is rebuilt from `area` before the next draw (dirty), so its old contents need not be kept
    this.guideTable.useStorage(store.subarray(off, off + p), new Int32Array(buffer, 8 * doubles, p));
    this.dirty = true;
    this.cap = cap;
  }

  /**
   * Empties the hull for a new target, keeping its storage (at least `cap`
   * touch points): the reuse path of `conditionalSampler`. Setup then
   * inserts the new touch points as for a fresh hull.
   * @param target - target functions
   * @param tangent - tangent (true) or secant (false) construction
   * @param lower - effective lower end
   * @param upper - effective upper end
   * @param ref - reference log height
   * @param cap - touch points the setup needs room for
   * @param quickAreas - see {@link Hull.quickAreas}
   */
  reset(target: HullTarget, tangent: boolean, lower: number, upper: number, ref: number, cap: number, quickAreas: boolean): this {
    this.quickAreas = quickAreas;
    this.target = target;
    this.tangent = tangent;
    this.lower = lower;
    this.upper = upper;
    this.ref = ref;
    this.k = 0;
    this.pending = -1;
    this.maxK = cap;
    this.derivativeEvaluations = 0;
    this.dirty = true;
    if (cap > this.cap) this.allocate(cap);
    return this;
  }

  /** Name of the shape assumption, for messages. */
  shapeName(): string {
    return shapeName(this.kind);
  }

  // ----- the view the table builder reads (HullView) ---------------------------

  /** Number of touch points. */
  touchPointCount(): number {
    return this.k;
  }

  /** Position of touch point i. */
  touchPointX(i: number): number {
    return this.touchX[i];
  }

  /** logDensity at touch point i. */
  touchPointLogDensity(i: number): number {
    return this.touchLogDensity[i];
  }

  /** Quantiles of the envelope at the increasing probabilities `ps`. */
  envelopeQuantiles(ps: readonly number[]): number[] {
    const h = this;
    const n = 2 * h.k;
    let total = 0;
    for (let j = 0; j < n; j++) total += h.area[j];
    const out: number[] = [];
    let j = 0;
    let before = 0;
    for (const p of ps) {
      const v = p * total;
      while (j < n - 1 && before + h.area[j] <= v) {
        before += h.area[j];
        j++;
      }
      const a = h.area[j];
      let frac = a > 0 ? (v - before) / a : 0.5;
      // invertPiece measures the mass from the piece's high end, which is its upper end when dir = −1
      if (h.direction[j] < 0) frac = 1 - frac;
      if (!(frac >= 0)) frac = 0;
      if (frac >= 1) frac = 0.9999999999999999;
      const w = h.width[j];
      if (!(w > 0) || !(a > 0)) {
        out.push(h.lo[j]);
        continue;
      }
      const d = invertPiece(h.kind, h.inversion[j], h.rate[j], w, frac);
      let x = h.highEnd[j] + h.direction[j] * d;
      if (x < h.lo[j]) x = h.lo[j];
      else if (x > h.hi[j]) x = h.hi[j];
      out.push(x);
    }
    return out;
  }

  /** Maximum of the envelope (log, absolute) over [a, b]. */
  maxLogEnvelope(a: number, b: number): number {
    const h = this;
    let best = -Infinity;
    for (let j = 0; j < 2 * h.k; j++) {
      const lo = h.lo[j];
      const hi = h.hi[j];
      if (!(hi >= lo) || hi < a || lo > b) continue;
      const p = a > lo ? a : lo;
      const q = b < hi ? b : hi;
      const sl = h.lineSlope[j];
      for (const z of [p, q]) {
        let t = h.lineValue[j] + sl * (z - h.lineAnchor[j]);
        if (t !== t) t = Infinity;
        const v = logHeight(h.kind, t);
        if (v > best) best = v;
      }
    }
    return best + h.ref;
  }

  // ----- lines ---------------------------------------------------------------

  /** Slope of the chord between touch points i and i + 1 in transformed space. */
  chord(i: number): number {
    return (this.touchValue[i + 1] - this.touchValue[i]) / (this.touchX[i + 1] - this.touchX[i]);
  }

  /** Slope of the envelope line on the left tail. */
  leftTailSlope(): number {
    if (this.tangent) return this.touchSlope[0];
    return this.k >= 2 ? this.chord(0) : NaN;
  }

  /** Slope of the envelope line on the right tail. */
  rightTailSlope(): number {
    if (this.tangent) return this.touchSlope[this.k - 1];
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
    // the inputs are stored first and the rest derived from the arrays: small enough for the engine to
    // inline here, so the nine double arguments are not boxed on every call (a Gibbs step builds a
    // fresh hull per draw)
    this.lo[j] = lo;
    this.hi[j] = hi;
    this.lineAnchor[j] = ax;
    this.lineValue[j] = at;
    this.lineSlope[j] = sl;
    this.squeezeAnchor[j] = sqx;
    this.squeezeValue[j] = sqt;
    this.squeezeSlope[j] = sqs;
    this.derivePiece(j);
  }

  /** The high end, direction, width, rate, high value, inversion constant and area of piece j from its stored ends and line ({@link setPiece}). */
  private derivePiece(j: number): void {
    const lo = this.lo[j];
    const hi = this.hi[j];
    const ax = this.lineAnchor[j];
    const at = this.lineValue[j];
    const sl = this.lineSlope[j];
    const hx = sl > 0 ? hi : lo;
    const dir = sl > 0 ? -1 : 1;
    const w = hi - lo;
    const s = Math.abs(sl);
    // a line rising towards an infinite end (or flat on an infinite piece) is not integrable
    let th = hx === Infinity || hx === -Infinity || !(sl === sl) ? Infinity : at + sl * (hx - ax);
    if (!(th === th)) th = Infinity;
    let q: number;
    let area: number;
    if (th === Infinity) {
      q = NaN;
      area = Infinity;
    } else if (this.kind === T_LOG && w > 0 && th > -Infinity && th < 700 && s * w >= FLAT_LIMIT) {
      // the common case: expm1 computed once for both; with `quickAreas` e^tH·q/sig (two transcendental
      // calls instead of four), else pieceLogArea's arithmetic (the same bits as the description's log
      // area). One call site of exp for all four forms, so that the engine inlines it (with one site
      // per form it inlined the first and called the others, boxing argument and result)
      const quick = this.quickAreas;
      const tail = w === Infinity;
      q = tail ? 1 : -expm1(-s * w);
      const e = exp(quick ? th : tail ? th - log(s) : th + log(q) - log(s));
      area = !quick ? e : tail ? e / s : (e * q) / s;
    } else {
      q = pieceConstant(this.kind, th, s, w);
      area = exp(pieceLogArea(this.kind, th, s, w));
    }
    this.highEnd[j] = hx;
    this.direction[j] = dir;
    this.width[j] = w;
    this.rate[j] = s;
    this.highValue[j] = th;
    this.inversion[j] = q;
    this.area[j] = area;
  }

  /** Relative log area of piece j (as {@link pieceLogArea}; `+Infinity` for a piece that is not integrable). */
  pieceLogArea(j: number): number {
    const th = this.highValue[j];
    return th === Infinity ? Infinity : pieceLogArea(this.kind, th, this.rate[j], this.width[j]);
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
    const tx = this.touchX;
    const ty = this.touchValue;
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
      const s0 = this.touchSlope[i];
      const s1 = this.touchSlope[i + 1];
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
    const tx = this.touchX;
    const ty = this.touchValue;
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
    const y = transformValue(this.kind, this.touchLogDensity[i] - this.ref);
    this.touchValue[i] = y;
    this.touchSlope[i] = this.tangent ? transformSlope(this.kind, y, this.touchDerivative[i]) : NaN;
  }

  // ----- insertion ------------------------------------------------------------

  /**
   * Inserts the touch point (x, l, g) — l the log-density, g its derivative
   * (ignored by the secant construction) — checks the shape against its
   * neighbours and rebuilds only the pieces that depend on it.
   * @param grow - allow the arrays to grow (setup); otherwise the point is skipped at `maxK`
   * @param build - rebuild the pieces that depend on the point (default); false for a batch of
   * setup points of finite log-density, after which the caller calls {@link Hull.rebuildAll}
   * @param deferred - with build false: build the pieces at the next {@link Hull.flush} instead
   * @returns true when the point was used (a new touch point, or a point of
   * density 0 outside the touch points, to which the effective support was
   * shrunk); false when it was skipped (duplicate, capacity reached, or too
   * low under inverse-sqrt)
   * @throws {@link ShapeViolationError} when the new point contradicts the shape assumption
   */
  insert(x: number, l: number, g: number, grow: boolean, build = true, deferred = false): boolean {
    if (this.pending >= 0) this.flush();
    const k = this.k;
    const tx = this.touchX;
    if (l === -Infinity) {
      if (k === 0) return false;
      if (x < tx[0]) {
        if (x > this.lower) {
          this.lower = x;
          this.buildTails();
        }
        return true;
      }
      if (x > tx[k - 1]) {
        if (x < this.upper) {
          this.upper = x;
          this.buildTails();
        }
        return true;
      }
      // density 0 between two points of positive density
      let i = 0;
      while (i + 1 < k && tx[i + 1] < x) i++;
      gapBetween(this, tx[i], x, tx[i + 1], this.touchLogDensity[i + 1]);
    }
    if (this.kind !== T_LOG && l - this.ref < INV_SQRT_MIN_RELATIVE_LOG_HEIGHT) return false;
    // position: first index with tx[p] > x
    let a = 0;
    let b = k;
    while (a < b) {
      const m = (a + b) >> 1;
      if (tx[m] <= x) a = m + 1;
      else b = m;
    }
    const p = a;
    if (p > 0 && tx[p - 1] === x) return false;
    // shape checks against the neighbours, before anything changes
    const y = transformValue(this.kind, l - this.ref);
    const sNew = this.tangent ? transformSlope(this.kind, y, g) : NaN;
    const ty = this.touchValue;
    const tl = this.touchLogDensity;
    if (this.tangent) {
      const ts = this.touchSlope;
      const tg = this.touchDerivative;
      if (p > 0) checkTangentPair(this, tx[p - 1], ty[p - 1], ts[p - 1], tl[p - 1], tg[p - 1], x, y, sNew, l, g);
      if (p < k) checkTangentPair(this, x, y, sNew, l, g, tx[p], ty[p], ts[p], tl[p], tg[p]);
    } else {
      if (p >= 2) checkSecantTriple(this, '', tx[p - 2], ty[p - 2], tl[p - 2], tx[p - 1], ty[p - 1], tl[p - 1], x, y, l);
      if (p >= 1 && p < k) checkSecantTriple(this, '', tx[p - 1], ty[p - 1], tl[p - 1], x, y, l, tx[p], ty[p], tl[p]);
      if (p + 1 < k) checkSecantTriple(this, '', x, y, l, tx[p], ty[p], tl[p], tx[p + 1], ty[p + 1], tl[p + 1]);
    }
    if (k >= this.cap) {
      if (!grow) return false;
      this.allocate(Math.max(2 * this.cap, 8));
    } else if (!grow && k >= this.maxK) {
      return false;
    }
    // shift touch points (loops, as in placePieces)
    if (p < k) {
      const a0 = this.touchX;
      const a1 = this.touchLogDensity;
      const a2 = this.touchDerivative;
      const a3 = this.touchValue;
      const a4 = this.touchSlope;
      for (let q = k; q > p; q--) {
        a0[q] = a0[q - 1];
        a1[q] = a1[q - 1];
        a2[q] = a2[q - 1];
        a3[q] = a3[q - 1];
        a4[q] = a4[q - 1];
      }
    }
    this.touchX[p] = x;
    this.touchLogDensity[p] = l;
    this.touchDerivative[p] = g;
    this.touchValue[p] = y;
    this.touchSlope[p] = sNew;
    this.k = k + 1;
    this.dirty = true;
    if (build) this.placePieces(p);
    else if (deferred) this.pending = p;
    return true;
  }

  /**
   * Inserts an evaluated candidate as {@link Hull.insert} does (checks
   * included, at once) but builds its pieces only when they are next needed
   * ({@link Hull.flush}, called by the kernel before a proposal and by the
   * description): after the last draw wanted from a target the rebuild is
   * never paid for. The pieces are the same as with an immediate insertion.
   */
  insertDeferred(x: number, l: number, g: number): boolean {
    return this.insert(x, l, g, false, false, true);
  }

  /** Builds the pieces of a deferred insertion, if any. */
  flush(): void {
    const p = this.pending;
    if (p < 0) return;
    this.pending = -1;
    this.placePieces(p);
  }

  /** Shifts the pieces after touch point p (just inserted) and rebuilds the ones that depend on it. */
  private placePieces(p: number): void {
    const kk = this.k;
    const k = kk - 1;
    // old pieces [1 + 2p, 2k) move right by 2 (loops: for the few points of a Gibbs step a copyWithin call costs more than the moves)
    const n = 2 * k;
    const from = 1 + 2 * p;
    if (k > 0 && from < n) {
      const arrays = this.pieceArrays;
      for (let q = 0; q < arrays.length; q++) {
        const arr = arrays[q];
        for (let r = n - 1; r >= from; r--) arr[r + 2] = arr[r];
      }
    }
    // rebuild the intervals that depend on the new point, and the tails
    const i0 = Math.max(0, p - (this.tangent ? 1 : 2));
    const i1 = Math.min(kk - 2, p + (this.tangent ? 0 : 1));
    for (let i = i0; i <= i1; i++) this.buildInterval(i);
    // a tail depends on its end point (tangents) or on the chord of the two end points (secants): rebuilt only
    // when the new point is one of those; otherwise the shift above has moved it unchanged
    const reach = this.tangent ? 0 : 1;
    if (p <= reach || p >= kk - 1 - reach) this.buildTails();
  }

  /** Largest relative log height of the hull over pieces of positive width. */
  maxRelativeHeight(): number {
    let h = -Infinity;
    for (let j = 0; j < 2 * this.k; j++) {
      if (!(this.width[j] > 0)) continue;
      const v = logHeight(this.kind, this.highValue[j]);
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

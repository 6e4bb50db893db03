/**
 * Cells of a certified envelope: a partition of the support, each cell with
 * an envelope and a squeeze proven from the target's interval bounds. @internal
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { expm1, log } from '../../vendor/math.js';

/** A bounds function of the target: guaranteed `[lo, hi]` over `[a, b]`. @internal */
export type BoundsFn = (a: number, b: number) => readonly [number, number];

/**
 * Relative widening of every envelope height (and narrowing of every squeeze
 * height) in log space, on top of the proven bounds: it covers the rounding
 * of this module's own arithmetic (a line `H + s·(x − c)`, the log of a width).
 * @internal
 */
export const CELL_LOG_SLACK = 1e-12;

/** Below this |rate·width| a cell's envelope is drawn as flat (the exponential's curvature is lost in rounding). @internal */
const FLAT = 1e-12;

/** log((e^z − 1)/z), stable for every z (0 at z = 0). @internal */
export function logExprel(z: number): number {
  if (z === 0 || Math.abs(z) < 1e-300) return 0;
  if (z > 0) return z + log(-expm1(-z)) - log(z);
  return log(-expm1(z)) - log(-z);
}

/** log(e^x − e^y) for x ≥ y (−Infinity when equal). @internal */
export function logDiffExp(x: number, y: number): number {
  if (x === Infinity) return Infinity;
  if (!(x > y)) return -Infinity;
  if (y === -Infinity) return x;
  return x + log(-expm1(y - x));
}

/**
 * Struct-of-arrays store of the cells, with everything the kernel and the
 * refinement need. Capacity grows by doubling (setup and refinement only;
 * never inside a draw that does not split).
 * @internal
 */
export class CellStore {
  n = 0;
  capacity: number;
  /** Ends. */
  lo: Float64Array;
  hi: Float64Array;
  /** Bounds of log f over the cell. */
  bLo: Float64Array;
  bHi: Float64Array;
  /** Bounds of log f at the ends (from bounds(x, x)); NaN at an infinite end. */
  aLo: Float64Array;
  aHi: Float64Array;
  zLo: Float64Array;
  zHi: Float64Array;
  /** Bounds of (log f)' over the cell (±Infinity when unknown). */
  dLo: Float64Array;
  dHi: Float64Array;
  /** Envelope: peak end p, log height there (widened), decay rate r ≥ 0 away from p: log g(x) = eH − eR·|x − p|. */
  eP: Float64Array;
  eH: Float64Array;
  eR: Float64Array;
  /** 1 − e^(−eR·width) (1 on an infinite cell; unused when eR = 0): the inversion constant. */
  eQ: Float64Array;
  /** Squeeze: log s(x) = sH + sS·(x − sA) (sH = −Infinity: none). */
  sA: Float64Array;
  sH: Float64Array;
  sS: Float64Array;
  /** Natural logs of the envelope's and the squeeze's area over the cell. */
  logEnv: Float64Array;
  logSq: Float64Array;
  /** 1: the cell cannot be split any further (width at rounding level). */
  stuck: Uint8Array;

  constructor(capacity: number) {
    this.capacity = capacity;
    this.lo = new Float64Array(capacity);
    this.hi = new Float64Array(capacity);
    this.bLo = new Float64Array(capacity);
    this.bHi = new Float64Array(capacity);
    this.aLo = new Float64Array(capacity);
    this.aHi = new Float64Array(capacity);
    this.zLo = new Float64Array(capacity);
    this.zHi = new Float64Array(capacity);
    this.dLo = new Float64Array(capacity);
    this.dHi = new Float64Array(capacity);
    this.eP = new Float64Array(capacity);
    this.eH = new Float64Array(capacity);
    this.eR = new Float64Array(capacity);
    this.eQ = new Float64Array(capacity);
    this.sA = new Float64Array(capacity);
    this.sH = new Float64Array(capacity);
    this.sS = new Float64Array(capacity);
    this.logEnv = new Float64Array(capacity);
    this.logSq = new Float64Array(capacity);
    this.stuck = new Uint8Array(capacity);
  }

  /** Makes room for at least `need` cells. */
  reserve(need: number): void {
    if (need <= this.capacity) return;
    let c = this.capacity;
    while (c < need) c *= 2;
    const f = (a: Float64Array): Float64Array => {
      const b = new Float64Array(c);
      b.set(a.subarray(0, this.n));
      return b;
    };
    this.lo = f(this.lo);
    this.hi = f(this.hi);
    this.bLo = f(this.bLo);
    this.bHi = f(this.bHi);
    this.aLo = f(this.aLo);
    this.aHi = f(this.aHi);
    this.zLo = f(this.zLo);
    this.zHi = f(this.zHi);
    this.dLo = f(this.dLo);
    this.dHi = f(this.dHi);
    this.eP = f(this.eP);
    this.eH = f(this.eH);
    this.eR = f(this.eR);
    this.eQ = f(this.eQ);
    this.sA = f(this.sA);
    this.sH = f(this.sH);
    this.sS = f(this.sS);
    this.logEnv = f(this.logEnv);
    this.logSq = f(this.logSq);
    const s = new Uint8Array(c);
    s.set(this.stuck.subarray(0, this.n));
    this.stuck = s;
    this.capacity = c;
  }
}

/** The target's bound functions with counters and checks of what they return. @internal */
export class BoundsOracle {
  boundEvaluations = 0;
  derivativeBoundEvaluations = 0;
  private readonly f: BoundsFn;
  private readonly d: BoundsFn | undefined;
  private readonly api: string;
  /** Last result (a pair without allocation for the caller). */
  lo = 0;
  hi = 0;

  constructor(api: string, f: BoundsFn, d: BoundsFn | undefined) {
    this.api = api;
    this.f = f;
    this.d = d;
  }

  get hasDerivative(): boolean {
    return this.d !== undefined;
  }

  /** Bounds of log f over [a, b] into (lo, hi). */
  value(a: number, b: number): void {
    this.boundEvaluations++;
    const r = this.f(a, b);
    // at a single point, a pole may be reported as [Infinity, Infinity]: no finite value, so no lower bound
    if (a === b && r !== null && typeof r === 'object' && r[0] === Infinity && r[1] === Infinity) {
      this.lo = -Infinity;
      this.hi = Infinity;
      return;
    }
    this.read('logDensityBounds', r, a, b, false);
  }

  /** Bounds of (log f)' over [a, b] into (lo, hi); (−Inf, Inf) without dLogDensityBounds. */
  derivative(a: number, b: number): void {
    if (this.d === undefined) {
      this.lo = -Infinity;
      this.hi = Infinity;
      return;
    }
    this.derivativeBoundEvaluations++;
    this.read('dLogDensityBounds', this.d(a, b), a, b, true);
  }

  private read(name: string, r: readonly [number, number], a: number, b: number, derivative: boolean): void {
    const where = `target.${name}(${a}, ${b})`;
    if (r === null || typeof r !== 'object' || typeof r[0] !== 'number' || typeof r[1] !== 'number') {
      throw new InvalidTargetError(`${this.api}: ${where} must return a pair [lo, hi] of numbers, got ${String(r)}`);
    }
    const lo = r[0];
    const hi = r[1];
    if (lo !== lo || hi !== hi || lo > hi || lo === Infinity || (derivative ? hi === -Infinity : false)) {
      throw new InvalidTargetError(`${this.api}: ${where} returned [${lo}, ${hi}]; it must be [lo, hi] with lo <= hi, no NaN${derivative ? ', lo < Infinity and hi > -Infinity' : ' and lo < Infinity'}`);
    }
    this.lo = lo;
    this.hi = hi;
  }
}

/** Widened (upward) log height. */
function up(h: number): number {
  return h === -Infinity || h === Infinity ? h : h + CELL_LOG_SLACK * (1 + Math.abs(h));
}

/** Narrowed (downward) log height. */
function down(h: number): number {
  return h === -Infinity || h === Infinity ? h : h - CELL_LOG_SLACK * (1 + Math.abs(h));
}

/**
 * Fills cell `j` (ends and end bounds already set): bounds over the cell,
 * derivative bounds, then the envelope of least area among the constant
 * (from the upper bound) and the two exponentials from the ends (from the
 * upper bound at an end and the derivative bound, by the mean value theorem),
 * and the squeeze of largest area among the constant (lower bound) and the
 * two exponentials from the ends (lower bound at an end and the other
 * derivative bound). Throws when the pieces contradict each other (the
 * squeeze above the envelope at an end: the bounds cannot all be true).
 * @internal
 */
export function fillCell(api: string, c: CellStore, j: number, o: BoundsOracle): void {
  const a = c.lo[j];
  const b = c.hi[j];
  o.value(a, b);
  const bl = o.lo;
  const bh = o.hi;
  c.bLo[j] = bl;
  c.bHi[j] = bh;
  let dl = -Infinity;
  let dh = Infinity;
  if (o.hasDerivative && bh > -Infinity) {
    o.derivative(a, b);
    dl = o.lo;
    dh = o.hi;
  }
  c.dLo[j] = dl;
  c.dHi[j] = dh;
  const w = b - a;
  if (c.aLo[j] > bh || c.zLo[j] > bh) {
    const x = c.aLo[j] > bh ? a : b;
    throw new InvalidTargetError(
      `${api}: the bounds of the target contradict each other on the cell [${a}, ${b}]: logDensityBounds(${x}, ${x}) gives log f >= ${c.aLo[j] > bh ? c.aLo[j] : c.zLo[j]} but logDensityBounds(${a}, ${b}) gives log f <= ${bh}`,
    );
  }
  const aH = c.aHi[j];
  const aL = c.aLo[j];
  const zH = c.zHi[j];
  const zL = c.zLo[j];
  // envelope candidates: (peak end, height at it, rate, log area)
  let bestP = a;
  let bestH = Infinity;
  let bestR = 0;
  let best = Infinity;
  if (bh === -Infinity) {
    bestP = Number.isFinite(a) ? a : b;
    bestH = -Infinity;
    best = -Infinity;
  } else {
    if (w < Infinity && bh < Infinity) {
      best = bh + log(w);
      bestP = a;
      bestH = bh;
      bestR = 0;
    }
    // from a with slope dh: log f(x) <= aH + dh (x − a)
    if (Number.isFinite(a) && aH < Infinity && Number.isFinite(dh) && (w < Infinity || dh < 0)) {
      const area = aH === -Infinity ? -Infinity : w === Infinity ? aH - log(-dh) : aH + log(w) + logExprel(dh * w);
      if (area < best) {
        best = area;
        if (dh <= 0) {
          bestP = a;
          bestH = aH;
          bestR = -dh;
        } else {
          bestP = b;
          bestH = aH + dh * w;
          bestR = dh;
        }
      }
    }
    // from b with slope dl: log f(x) <= zH + dl (x − b)
    if (Number.isFinite(b) && zH < Infinity && Number.isFinite(dl) && (w < Infinity || dl > 0)) {
      const area = zH === -Infinity ? -Infinity : w === Infinity ? zH - log(dl) : zH + log(w) + logExprel(-dl * w);
      if (area < best) {
        best = area;
        if (dl >= 0) {
          bestP = b;
          bestH = zH;
          bestR = dl;
        } else {
          bestP = a;
          bestH = zH - dl * w;
          bestR = -dl;
        }
      }
    }
  }
  if (best === -Infinity) bestH = -Infinity;
  if (bestR * (w < Infinity ? w : 1) < FLAT && w < Infinity) bestR = 0;
  const eH = up(bestH);
  c.eP[j] = bestP;
  c.eH[j] = eH;
  c.eR[j] = bestR;
  c.eQ[j] = bestR === 0 ? 0 : w === Infinity ? 1 : -expm1(-bestR * w);
  // area of the widened envelope
  let logEnv: number;
  if (eH === -Infinity) logEnv = -Infinity;
  else if (eH === Infinity) logEnv = Infinity;
  else if (w === Infinity) logEnv = bestR > 0 ? eH - log(bestR) : Infinity;
  else logEnv = eH + log(w) + logExprel(-bestR * w);
  if (logEnv !== logEnv) logEnv = Infinity;
  c.logEnv[j] = logEnv;

  // squeeze candidates
  let sA = Number.isFinite(a) ? a : b;
  let sH = -Infinity;
  let sS = 0;
  let sq = -Infinity;
  if (bl > -Infinity && w < Infinity) {
    sq = bl + log(w);
    sA = a;
    sH = bl;
    sS = 0;
  }
  if (Number.isFinite(a) && aL > -Infinity && Number.isFinite(dl) && (w < Infinity || dl < 0)) {
    const area = w === Infinity ? aL - log(-dl) : aL + log(w) + logExprel(dl * w);
    if (area > sq) {
      sq = area;
      sA = a;
      sH = aL;
      sS = dl;
    }
  }
  if (Number.isFinite(b) && zL > -Infinity && Number.isFinite(dh) && (w < Infinity || dh > 0)) {
    const area = w === Infinity ? zL - log(dh) : zL + log(w) + logExprel(-dh * w);
    if (area > sq) {
      sq = area;
      sA = b;
      sH = zL;
      sS = dh;
    }
  }
  const sHd = down(sH);
  c.sA[j] = sA;
  c.sH[j] = sHd;
  c.sS[j] = sHd === -Infinity ? 0 : sS;
  let logSq: number;
  if (sHd === -Infinity) logSq = -Infinity;
  else if (w === Infinity) logSq = sHd - log(Math.abs(sS));
  else logSq = sHd + log(w) + logExprel(sA === a ? sS * w : -sS * w);
  c.logSq[j] = logSq;
  // consistency: squeeze <= envelope at the finite ends (both are log-linear on the cell)
  if (sHd > -Infinity && eH < Infinity) {
    for (const x of [a, b]) {
      if (!Number.isFinite(x)) continue;
      const ge = eH - bestR * Math.abs(x - bestP);
      const gs = sHd + sS * (x - sA);
      if (gs > ge) {
        throw new InvalidTargetError(
          `${api}: the bounds of the target contradict each other on the cell [${a}, ${b}]: at x = ${x} the lower bounds give log f >= ${gs} and the upper bounds log f <= ${ge}; target.logDensityBounds (or dLogDensityBounds) is wrong there`,
        );
      }
    }
  }
}

/**
 * Point where cell `[a, b]` is split: the midpoint of a finite cell; on an
 * infinite side, a step as long as the distance to 0 (at least 1), so that
 * tail cells grow geometrically. NaN when the cell cannot be split.
 * @internal
 */
export function splitPoint(a: number, b: number): number {
  let m: number;
  if (a === -Infinity && b === Infinity) m = 0;
  else if (b === Infinity) m = a + Math.max(1, Math.abs(a));
  else if (a === -Infinity) m = b - Math.max(1, Math.abs(b));
  else m = 0.5 * a + 0.5 * b;
  return m > a && m < b && Number.isFinite(m) ? m : NaN;
}

/**
 * Splits cell `j` at `m` (from {@link splitPoint}): cell `j` becomes the left
 * part, a new cell `n` the right part. Three interval evaluations (point
 * bounds at m and the two halves) and two derivative ones. Returns the index
 * of the new cell.
 * @internal
 */
export function splitCell(api: string, c: CellStore, j: number, m: number, o: BoundsOracle): number {
  c.reserve(c.n + 1);
  const k = c.n;
  o.value(m, m);
  const mL = o.lo;
  const mH = o.hi;
  c.lo[k] = m;
  c.hi[k] = c.hi[j];
  c.aLo[k] = mL;
  c.aHi[k] = mH;
  c.zLo[k] = c.zLo[j];
  c.zHi[k] = c.zHi[j];
  c.stuck[k] = 0;
  c.hi[j] = m;
  c.zLo[j] = mL;
  c.zHi[j] = mH;
  c.n = k + 1;
  fillCell(api, c, j, o);
  fillCell(api, c, k, o);
  return k;
}

/** Sets up a cell [a, b] at index n with its end bounds (NaN at infinite ends). @internal */
export function addCell(c: CellStore, a: number, b: number, aL: number, aH: number, zL: number, zH: number): number {
  c.reserve(c.n + 1);
  const k = c.n;
  c.lo[k] = a;
  c.hi[k] = b;
  c.aLo[k] = aL;
  c.aHi[k] = aH;
  c.zLo[k] = zL;
  c.zHi[k] = zH;
  c.stuck[k] = 0;
  c.n = k + 1;
  return k;
}

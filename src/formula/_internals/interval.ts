/**
 * Interval arithmetic with outward rounding on slots of a Float64Array.
 * @internal
 *
 * @remarks
 * A slot `i` of an array `S` is the closed interval `[S[2i], S[2i+1]]` of
 * extended reals (ends may be infinite). The empty set (every point value
 * is NaN there, for example `log` of a negative interval) is `[NaN, NaN]`
 * and propagates; no operation ever returns an interval with one NaN end.
 *
 * Contract of every operation `op(S, d, a, …)`: for any doubles `u` in the
 * argument slots at which the engine's point value `v = f(u)` is not NaN,
 * both the exact real `f(u)` and the engine value `v` lie in slot `d`. So a
 * chain of operations encloses the engine's evaluation of the whole
 * formula (rounding errors included), which is what `logDensity` returns.
 *
 * Domains: arguments outside a function's domain are dropped (the result
 * encloses the defined values only; the points outside give NaN point
 * values, which samplers reject as non-finite). Conventions for ends:
 * `0 * ±Infinity = 0` (the point value there is NaN, the neighbours are
 * finite), division by an interval that touches or contains zero follows
 * the evaluator's `+0` normalization of denominators (see `program.ts`).
 *
 * Widening: basic operations are rounded outward exactly (one ulp at most,
 * none when exact); elementary functions by {@link widenDn}/{@link widenUp}
 * (relative `2^-40`); see `rounding.ts` for why that suffices.
 *
 * @packageDocumentation
 */
import { gammaln } from '../../vendor/stdlib.js';
import {
  addDn,
  addUp,
  divDn,
  divUp,
  mulDn,
  mulUp,
  nextDown,
  nextUp,
  sqrtBounds,
  subDn,
  subUp,
  widenDn,
  widenUp,
  MAX,
} from './rounding.js';
import { digammaValue, trigammaValue, specialMagnitude } from './special.js';
import { atan, cos, cosh, exp, expm1, log, log1p, pow, sin, sinh, tan, tanh } from '../../vendor/math.js';

const PI = Math.PI;
const HALF_PI = 1.5707963267948966; // Math.PI / 2 (a literal: a bundle drops an unused one)
/** Below this magnitude the period index of sin/cos/tan is computed; above it the range is the full period. */
const PERIOD_LIMIT = /* @__PURE__ */ pow(2, 40);
const TMP = /* @__PURE__ */ new Float64Array(2);

/** Sets slot `d` to `[lo, hi]`. @internal */
export function setI(S: Float64Array, d: number, lo: number, hi: number): void {
  S[2 * d] = lo;
  S[2 * d + 1] = hi;
}

function empty(S: Float64Array, d: number): void {
  S[2 * d] = NaN;
  S[2 * d + 1] = NaN;
}

/** Copies slot `a` to slot `d`. @internal */
export function copyI(S: Float64Array, d: number, a: number): void {
  S[2 * d] = S[2 * a];
  S[2 * d + 1] = S[2 * a + 1];
}

/** True when slot `a` is empty. @internal */
export function isEmptyI(S: Float64Array, a: number): boolean {
  const lo = S[2 * a];
  return lo !== lo;
}

/** Hull of slots `a` and `b` (empty slots are ignored). @internal */
export function hullI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const ahi = S[2 * a + 1];
  const blo = S[2 * b];
  const bhi = S[2 * b + 1];
  if (alo !== alo) {
    S[2 * d] = blo;
    S[2 * d + 1] = bhi;
  } else if (blo !== blo) {
    S[2 * d] = alo;
    S[2 * d + 1] = ahi;
  } else {
    S[2 * d] = alo < blo ? alo : blo;
    S[2 * d + 1] = ahi > bhi ? ahi : bhi;
  }
}

/** `-a`. @internal */
export function negI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  const hi = S[2 * a + 1];
  S[2 * d] = -hi;
  S[2 * d + 1] = -lo;
}

/** `a + b`. @internal */
export function addI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const ahi = S[2 * a + 1];
  const blo = S[2 * b];
  const bhi = S[2 * b + 1];
  if (alo !== alo || blo !== blo) return empty(S, d);
  const lo = addDn(alo, blo);
  const hi = addUp(ahi, bhi);
  S[2 * d] = lo !== lo ? -Infinity : lo;
  S[2 * d + 1] = hi !== hi ? Infinity : hi;
}

/** `a - b`. @internal */
export function subI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const ahi = S[2 * a + 1];
  const blo = S[2 * b];
  const bhi = S[2 * b + 1];
  if (alo !== alo || blo !== blo) return empty(S, d);
  const lo = subDn(alo, bhi);
  const hi = subUp(ahi, blo);
  S[2 * d] = lo !== lo ? -Infinity : lo;
  S[2 * d + 1] = hi !== hi ? Infinity : hi;
}

/** `a * b` with `0 * ±Infinity = 0` at the ends. @internal */
export function mulI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const ahi = S[2 * a + 1];
  const blo = S[2 * b];
  const bhi = S[2 * b + 1];
  if (alo !== alo || blo !== blo) return empty(S, d);
  let lo: number;
  let hi: number;
  if (alo >= 0 && blo >= 0) {
    lo = mulDn(alo, blo);
    hi = mulUp(ahi, bhi);
  } else if (ahi <= 0 && bhi <= 0) {
    lo = mulDn(ahi, bhi);
    hi = mulUp(alo, blo);
  } else {
    const p1 = mulDn(alo, blo);
    const p2 = mulDn(alo, bhi);
    const p3 = mulDn(ahi, blo);
    const p4 = mulDn(ahi, bhi);
    lo = Math.min(p1, p2, p3, p4);
    const q1 = mulUp(alo, blo);
    const q2 = mulUp(alo, bhi);
    const q3 = mulUp(ahi, blo);
    const q4 = mulUp(ahi, bhi);
    hi = Math.max(q1, q2, q3, q4);
  }
  S[2 * d] = lo;
  S[2 * d + 1] = hi;
}

/** `a * a` (tighter than `mulI(a, a)` when `a` straddles zero). @internal */
export function sqrI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo) return empty(S, d);
  if (lo >= 0) {
    S[2 * d] = mulDn(lo, lo);
    S[2 * d + 1] = mulUp(hi, hi);
  } else if (hi <= 0) {
    S[2 * d] = mulDn(hi, hi);
    S[2 * d + 1] = mulUp(lo, lo);
  } else {
    const m = -lo > hi ? -lo : hi;
    S[2 * d] = 0;
    S[2 * d + 1] = mulUp(m, m);
  }
}

function minQ(a: number, b: number, c: number, e: number): number {
  // minimum ignoring NaN candidates (an Infinity/Infinity corner)
  let m = Infinity;
  let seen = false;
  if (a === a) { m = a; seen = true; }
  if (b === b && (!seen || b < m)) { m = b; seen = true; }
  if (c === c && (!seen || c < m)) { m = c; seen = true; }
  if (e === e && (!seen || e < m)) { m = e; seen = true; }
  return seen ? m : NaN;
}

function maxQ(a: number, b: number, c: number, e: number): number {
  return -minQ(-a, -b, -c, -e);
}

/**
 * `a / b`. Denominators are `+0`-normalized by the point evaluator, so a
 * zero denominator gives `numerator * +Infinity`: `a / [0, h]` with
 * `h > 0` is `a * [1/h, +Infinity]`; any other denominator containing 0
 * gives `[-Infinity, Infinity]` (or a signed infinity for `b = [0, 0]`).
 * @internal
 */
export function divI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const ahi = S[2 * a + 1];
  const blo = S[2 * b];
  const bhi = S[2 * b + 1];
  if (alo !== alo || blo !== blo) return empty(S, d);
  if (blo > 0 || bhi < 0) {
    const lo = minQ(divDn(alo, blo), divDn(alo, bhi), divDn(ahi, blo), divDn(ahi, bhi));
    const hi = maxQ(divUp(alo, blo), divUp(alo, bhi), divUp(ahi, blo), divUp(ahi, bhi));
    if (lo !== lo) return empty(S, d);
    S[2 * d] = lo;
    S[2 * d + 1] = hi;
    return;
  }
  if (blo === 0 && bhi === 0) {
    if (alo > 0) setI(S, d, Infinity, Infinity);
    else if (ahi < 0) setI(S, d, -Infinity, -Infinity);
    else if (alo === 0 && ahi === 0) empty(S, d);
    else setI(S, d, -Infinity, Infinity);
    return;
  }
  if (blo === 0) {
    // b = [0, bhi], bhi > 0: a * [1/bhi, +Infinity]
    if (alo >= 0) {
      if (ahi === 0) setI(S, d, 0, 0);
      else setI(S, d, alo === 0 ? 0 : divDn(alo, bhi), Infinity);
    } else if (ahi <= 0) setI(S, d, -Infinity, ahi === 0 ? 0 : divUp(ahi, bhi));
    else setI(S, d, -Infinity, Infinity);
    return;
  }
  if (alo === 0 && ahi === 0) setI(S, d, 0, 0);
  else setI(S, d, -Infinity, Infinity);
}

/** Increasing elementary function on a domain; ends are widened unless exact. */
function monoInc(
  S: Float64Array,
  d: number,
  lo: number,
  hi: number,
  f: (t: number) => number,
  rangeLo: number,
  rangeHi: number,
): void {
  const fl = f(lo);
  const fh = f(hi);
  let l = lo === -Infinity && (fl === rangeLo || fl - fl !== 0) ? fl : widenDn(fl);
  let h = hi === Infinity && (fh === rangeHi || fh - fh !== 0) ? fh : widenUp(fh);
  if (lo === hi && lo - lo !== 0) {
    l = fl;
    h = fh;
  }
  if (l < rangeLo) l = rangeLo;
  if (h > rangeHi) h = rangeHi;
  if (l !== l || h !== h) return empty(S, d);
  S[2 * d] = l;
  S[2 * d + 1] = h;
}

/** `exp(a)`. @internal */
export function expI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  if (lo !== lo) return empty(S, d);
  monoInc(S, d, lo, S[2 * a + 1], exp, 0, Infinity);
}

/** `expm1(a)`. @internal */
export function expm1I(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  if (lo !== lo) return empty(S, d);
  monoInc(S, d, lo, S[2 * a + 1], expm1, -1, Infinity);
}

/** `log(a)` on `[0, Infinity]` (`log(0) = -Infinity`). @internal */
export function logI(S: Float64Array, d: number, a: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo || hi < 0) return empty(S, d);
  if (lo < 0) lo = 0;
  const l = lo === 0 ? -Infinity : lo === Infinity ? Infinity : widenDn(log(lo));
  const h = hi === 0 ? -Infinity : hi === Infinity ? Infinity : widenUp(log(hi));
  setI(S, d, l, h);
}

/** `log1p(a)` on `[-1, Infinity]`. @internal */
export function log1pI(S: Float64Array, d: number, a: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo || hi < -1) return empty(S, d);
  if (lo < -1) lo = -1;
  const l = lo === -1 ? -Infinity : lo === Infinity ? Infinity : widenDn(log1p(lo));
  const h = hi === -1 ? -Infinity : hi === Infinity ? Infinity : widenUp(log1p(hi));
  setI(S, d, l, h);
}

/** `sqrt(a)` on `[0, Infinity]`. @internal */
export function sqrtI(S: Float64Array, d: number, a: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo || hi < 0) return empty(S, d);
  if (lo < 0) lo = 0;
  sqrtBounds(lo, TMP);
  const l = TMP[0] < 0 ? 0 : TMP[0];
  sqrtBounds(hi, TMP);
  setI(S, d, l, TMP[1]);
}

/** `abs(a)`. @internal */
export function absI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo) return empty(S, d);
  if (lo >= 0) setI(S, d, lo, hi);
  else if (hi <= 0) setI(S, d, -hi, -lo);
  else setI(S, d, 0, -lo > hi ? -lo : hi);
}

/** `atan(a)`. @internal */
export function atanI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  if (lo !== lo) return empty(S, d);
  const hi = S[2 * a + 1];
  const l = widenDn(atan(lo));
  const h = widenUp(atan(hi));
  setI(S, d, l, h);
}

/** `tanh(a)`. @internal */
export function tanhI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  if (lo !== lo) return empty(S, d);
  monoInc(S, d, lo, S[2 * a + 1], tanh, -1, 1);
}

/** `sinh(a)`. @internal */
export function sinhI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  if (lo !== lo) return empty(S, d);
  monoInc(S, d, lo, S[2 * a + 1], sinh, -Infinity, Infinity);
}

/** `cosh(a)`: decreasing then increasing, minimum 1 at 0. @internal */
export function coshI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo) return empty(S, d);
  let l: number;
  let h: number;
  if (lo >= 0) {
    l = cosh(lo);
    h = cosh(hi);
  } else if (hi <= 0) {
    l = cosh(hi);
    h = cosh(lo);
  } else {
    l = 1;
    h = cosh(-lo > hi ? lo : hi);
  }
  l = l === Infinity ? MAX : l === 1 ? 1 : widenDn(l);
  if (l < 1) l = 1;
  h = h === Infinity ? Infinity : widenUp(h);
  setI(S, d, l, h);
}

/**
 * Which of the points `offset + k·π` (k integer) may lie in `[lo, hi]`:
 * bit 1 for some even k, bit 2 for some odd k. Errs on the side of "may"
 * (the caller then includes an extremum that is the sup anyway, or a
 * pole), with a margin far above the rounding error of the quotient.
 */
function periodPoints(lo: number, hi: number, offset: number): number {
  if (!(hi - lo < 6)) return 3;
  const m = Math.max(-lo, hi, lo, -hi);
  if (!(m < PERIOD_LIMIT)) return 3;
  const tlo = (lo - offset) / PI;
  const thi = (hi - offset) / PI;
  const margin = 1e-14 * (Math.abs(tlo) + Math.abs(thi) + 1);
  const kLo = Math.ceil(tlo - margin);
  const kHi = Math.floor(thi + margin);
  let bits = 0;
  for (let k = kLo; k <= kHi && k <= kLo + 4; k++) bits |= k % 2 === 0 ? 1 : 2;
  return bits;
}

function trig(S: Float64Array, d: number, a: number, f: (t: number) => number, offset: number): void {
  const lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo) return empty(S, d);
  if (lo - lo !== 0 || hi - hi !== 0) {
    if (lo === hi) return empty(S, d); // sin(±Infinity) is NaN
    return setI(S, d, -1, 1);
  }
  const fl = f(lo);
  const fh = f(hi);
  let l = widenDn(fl < fh ? fl : fh);
  let h = widenUp(fl < fh ? fh : fl);
  if (lo !== hi) {
    const bits = periodPoints(lo, hi, offset);
    if (bits & 1) h = 1;
    if (bits & 2) l = -1;
  }
  if (l < -1) l = -1;
  if (h > 1) h = 1;
  setI(S, d, l, h);
}

/** `sin(a)`: maxima at π/2 + 2kπ, minima at −π/2 + 2kπ found exactly (with a safe margin). @internal */
export function sinI(S: Float64Array, d: number, a: number): void {
  trig(S, d, a, sin, HALF_PI);
}

/** `cos(a)`: maxima at 2kπ, minima at (2k+1)π. @internal */
export function cosI(S: Float64Array, d: number, a: number): void {
  trig(S, d, a, cos, 0);
}

/** `tan(a)`: increasing between poles at π/2 + kπ; an interval that may hold a pole gives `[-Infinity, Infinity]`. @internal */
export function tanI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo) return empty(S, d);
  if (lo - lo !== 0 || hi - hi !== 0) {
    if (lo === hi) return empty(S, d);
    return setI(S, d, -Infinity, Infinity);
  }
  if (lo !== hi && periodPoints(lo, hi, HALF_PI) !== 0) return setI(S, d, -Infinity, Infinity);
  setI(S, d, widenDn(tan(lo)), widenUp(tan(hi)));
}

/** Left end of the increasing branch of lgamma (the double just above the minimum point 1.46163214496836234126…, mpmath). */
const LGAMMA_INC_FROM = 1.4616321449683625;
/** Right end of the decreasing branch (the double just below the minimum point). */
const LGAMMA_DEC_TO = 1.4616321449683622;
/** A lower bound of min lgamma = −0.12148629053584960809551… (mpmath 1.3.0, 40 digits), widened like every function value. */
const LGAMMA_MIN = /* @__PURE__ */ widenDn(-0.12148629053584961);

/** lgamma point value on the library's domain: `x > 0`, `lgamma(0) = +Infinity`, NaN for `x < 0`. @internal */
export function lgammaValue(x: number): number {
  if (x > 0) return gammaln(x);
  if (x === 0) return Infinity;
  return NaN;
}

/** `lgamma(a)` on `[0, Infinity]`: decreasing to its minimum near 1.4616, then increasing. @internal */
export function lgammaI(S: Float64Array, d: number, a: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo || hi < 0) return empty(S, d);
  if (lo < 0) lo = 0;
  const gl = lgammaValue(lo);
  const gh = lgammaValue(hi);
  let l: number;
  let h: number;
  if (hi <= LGAMMA_DEC_TO) {
    l = gh === Infinity ? (hi === 0 ? Infinity : MAX) : widenDn(gh);
    h = gl === Infinity ? Infinity : widenUp(gl);
  } else if (lo >= LGAMMA_INC_FROM) {
    l = gl === Infinity ? (lo === Infinity ? Infinity : MAX) : widenDn(gl);
    h = gh === Infinity ? Infinity : widenUp(gh);
  } else {
    l = LGAMMA_MIN;
    const ul = gl === Infinity ? Infinity : widenUp(gl);
    const uh = gh === Infinity ? Infinity : widenUp(gh);
    h = ul > uh ? ul : uh;
  }
  if (l < LGAMMA_MIN) l = LGAMMA_MIN;
  setI(S, d, l, h);
}

/** digamma (the derivative of lgamma) on `[0, Infinity]`, increasing. @internal */
export function digammaI(S: Float64Array, d: number, a: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo || hi < 0) return empty(S, d);
  if (lo < 0) lo = 0;
  let l: number;
  if (lo === 0) l = -Infinity;
  else if (lo === Infinity) l = Infinity;
  else {
    const v = digammaValue(lo);
    l = v === -Infinity ? -Infinity : nextDown(v - specialMagnitude());
  }
  let h: number;
  if (hi === 0) h = -Infinity;
  else if (hi === Infinity) h = Infinity;
  else {
    const v = digammaValue(hi);
    h = v === -Infinity ? -MAX : nextUp(v + specialMagnitude());
  }
  setI(S, d, l, h);
}

/** trigamma (the second derivative of lgamma) on `[0, Infinity]`, decreasing and positive. @internal */
export function trigammaI(S: Float64Array, d: number, a: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (lo !== lo || hi < 0) return empty(S, d);
  if (lo < 0) lo = 0;
  let h: number;
  if (lo === 0) h = Infinity;
  else {
    const v = trigammaValue(lo);
    h = v === Infinity ? Infinity : nextUp(v + specialMagnitude());
  }
  let l: number;
  if (hi === Infinity) l = 0;
  else if (hi === 0) l = Infinity;
  else {
    const v = trigammaValue(hi);
    l = v === Infinity ? MAX : nextDown(v - specialMagnitude());
  }
  if (l < 0) l = 0;
  setI(S, d, l, h);
}

function powDn(x: number, k: number): number {
  const v = pow(x, k);
  if (x === 0 || x === 1 || x - x !== 0 || k === 0) return v;
  if (v === 0) return (x > 0 || k % 2 === 0) ? 0 : -Number.MIN_VALUE;
  return widenDn(v);
}

function powUp(x: number, k: number): number {
  const v = pow(x, k);
  if (x === 0 || x === 1 || x - x !== 0 || k === 0) return v;
  if (v === 0) return (x > 0 || k % 2 === 0) ? Number.MIN_VALUE : 0;
  return widenUp(v);
}

/** True when `k` is an integer and odd. */
function isOdd(k: number): boolean {
  return Number.isInteger(k) && Math.abs(k % 2) === 1;
}

/**
 * `a ^ k` for a constant `k` (bases `+0`-normalized by the evaluator):
 * integer `k` on any base (even: through |a|; odd: monotone), non-integer
 * `k` on the base's non-negative part only (a negative base gives NaN).
 * @internal
 */
export function powConstI(S: Float64Array, d: number, a: number, k: number): void {
  let lo = S[2 * a];
  const hi = S[2 * a + 1];
  if (k === 0) return setI(S, d, 1, 1); // x^0 = 1 for every x, NaN included (as Math.pow)
  if (lo !== lo) return empty(S, d);
  if (k === 1) return copyI(S, d, a);
  if (k === 2) return sqrI(S, d, a);
  if (!Number.isInteger(k)) {
    if (hi < 0) return empty(S, d);
    if (lo < 0) lo = 0;
  }
  if (k > 0) {
    if (lo >= 0) return setI(S, d, powDn(lo, k), powUp(hi, k));
    if (isOdd(k)) return setI(S, d, powDn(lo, k), powUp(hi, k));
    // even, lo < 0
    if (hi <= 0) return setI(S, d, powDn(hi, k), powUp(lo, k));
    const m = -lo > hi ? -lo : hi;
    return setI(S, d, 0, powUp(m, k));
  }
  // k < 0
  if (lo > 0 || hi < 0) {
    if (lo > 0 || isOdd(k)) return setI(S, d, powDn(hi, k), powUp(lo, k));
    return setI(S, d, powDn(lo, k), powUp(hi, k)); // even k, negative base: increasing
  }
  if (lo === 0) {
    // [0, hi]: decreasing from +Infinity
    if (hi === 0) return setI(S, d, Infinity, Infinity);
    return setI(S, d, powDn(hi, k), Infinity);
  }
  // lo < 0 <= hi
  if (isOdd(k)) return setI(S, d, -Infinity, Infinity);
  const m = -lo > hi ? -lo : hi;
  setI(S, d, powDn(m, k), Infinity);
}

/**
 * `a ^ b` for a non-constant exponent: the non-negative part of the base
 * through `exp(b · log a)`; a negative base contributes `±|a|^b` when `b`'s
 * interval holds an integer (elsewhere it is NaN). @internal
 */
export function powI(S: Float64Array, d: number, a: number, b: number, t0: number, t1: number): void {
  const alo = S[2 * a];
  const ahi = S[2 * a + 1];
  const blo = S[2 * b];
  const bhi = S[2 * b + 1];
  if (blo !== blo) return empty(S, d);
  if (blo === bhi) return powConstI(S, d, a, blo);
  if (alo !== alo) return blo <= 0 && bhi >= 0 ? setI(S, d, 1, 1) : empty(S, d); // NaN^0 = 1
  // positive part
  if (ahi >= 0) {
    setI(S, t0, alo < 0 ? 0 : alo, ahi);
    logI(S, t0, t0);
    mulI(S, t0, b, t0);
    expI(S, t0, t0);
  } else empty(S, t0);
  const hasInt = Math.ceil(blo) <= Math.floor(bhi);
  if (alo < 0 && hasInt) {
    setI(S, t1, ahi > 0 ? 0 : -ahi, -alo);
    logI(S, t1, t1);
    mulI(S, t1, b, t1);
    expI(S, t1, t1);
    const l = S[2 * t1];
    const h = S[2 * t1 + 1];
    if (h === h) setI(S, t1, -h, h);
    else setI(S, t1, l, h);
    hullI(S, d, t0, t1);
  } else copyI(S, d, t0);
}

/** `min(a, b)`. @internal */
export function minI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const blo = S[2 * b];
  if (alo !== alo || blo !== blo) return empty(S, d);
  const ahi = S[2 * a + 1];
  const bhi = S[2 * b + 1];
  setI(S, d, alo < blo ? alo : blo, ahi < bhi ? ahi : bhi);
}

/** `max(a, b)`. @internal */
export function maxI(S: Float64Array, d: number, a: number, b: number): void {
  const alo = S[2 * a];
  const blo = S[2 * b];
  if (alo !== alo || blo !== blo) return empty(S, d);
  const ahi = S[2 * a + 1];
  const bhi = S[2 * b + 1];
  setI(S, d, alo > blo ? alo : blo, ahi > bhi ? ahi : bhi);
}

/** Widens slot `a` by the elementary-function margin (used after composite kernels). @internal */
export function widenI(S: Float64Array, d: number, a: number): void {
  const lo = S[2 * a];
  if (lo !== lo) return empty(S, d);
  const hi = S[2 * a + 1];
  setI(S, d, lo - lo !== 0 ? lo : widenDn(lo), hi - hi !== 0 ? hi : widenUp(hi));
}

export { addDn, addUp, mulDn, mulUp, divDn, divUp, subDn, subUp };

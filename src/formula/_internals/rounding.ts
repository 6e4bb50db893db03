/**
 * Directed rounding emulated on doubles. @internal
 *
 * @remarks
 * JavaScript only rounds to nearest. The basic operations below return a
 * double that is guaranteed to lie below (`…Dn`) or above (`…Up`) the exact
 * real result of the operation on the given doubles:
 *
 * - `+ - * /` and `sqrt` use error-free transformations (TwoSum; Dekker's
 *   product with Veltkamp splitting; the exact division and square-root
 *   remainders) to learn the sign of the rounding error, and step one ulp
 *   (`nextUp`/`nextDown`) only when the result was rounded the wrong way.
 *   Exact results (for example `1 - 1`, `2 * 0.5`, `sqrt(4)`) stay exact.
 *   Where the transformation is not valid (overflow of the split above
 *   2^995, results below 2^-969 where the error is not representable) the
 *   result is widened by one ulp unconditionally, which is enough because
 *   round-to-nearest is within half an ulp.
 * - The elementary functions (`exp`, `log`, `sin`, … from `src/vendor/math.ts`,
 *   deterministic ports of fdlibm / Cephes in pure JavaScript, so that the
 *   bounds are the same bits on every engine) are not correctly rounded.
 *   {@link widenDn}/{@link widenUp} move such a result by a relative
 *   `2^-40` (about 4096 ulps) plus an absolute `2^-1040`, then one more
 *   ulp. The vendored functions are within 2 ulps of the engine's `Math.*`
 *   on 20,000 inputs each (test/vendor/math.test.ts), and those are within
 *   about 1 ulp of the true value (fdlibm-derived; documented error below
 *   1 ulp), so their error is at most a few ulps; the margin is three
 *   orders of magnitude above that, and the absolute term covers underflow
 *   to subnormals, where an ulp error is absolute. A bound stays valid where
 *   a computed function is not monotone in its last bits, since each end is
 *   widened from its own value.
 *
 * @packageDocumentation
 */
import { pow } from '../../vendor/math.js';

const F = /* @__PURE__ */ new Float64Array(1);
const U = /* @__PURE__ */ (() => new Uint32Array(F.buffer))();
/** Index of the low and high 32-bit words of a double (endianness); pure, so that bundles without the formula code drop it. */
const HI = /* @__PURE__ */ (() => {
  F[0] = 1;
  return U[1] === 0x3ff00000 ? 1 : 0;
})();
const LO = /* @__PURE__ */ (() => 1 - HI)();

/** Largest finite double. @internal */
export const MAX = 1.7976931348623157e308; // Number.MAX_VALUE (a literal: a bundle drops an unused one)

/** Next double above `x` (`NaN` and `+Infinity` unchanged). @internal */
export function nextUp(x: number): number {
  if (x !== x || x === Infinity) return x;
  if (x === -Infinity) return -MAX;
  if (x === 0) return Number.MIN_VALUE;
  F[0] = x;
  if (x > 0) {
    if (U[LO] === 0xffffffff) {
      U[LO] = 0;
      U[HI] = U[HI] + 1;
    } else U[LO] = U[LO] + 1;
  } else if (U[LO] === 0) {
    U[LO] = 0xffffffff;
    U[HI] = U[HI] - 1;
  } else U[LO] = U[LO] - 1;
  return F[0];
}

/** Next double below `x` (`NaN` and `-Infinity` unchanged). @internal */
export function nextDown(x: number): number {
  return -nextUp(-x);
}

const SPLIT = 134217729; // 2^27 + 1 (Veltkamp)
const SPLIT_MAX = /* @__PURE__ */ pow(2, 995);
const TINY_PRODUCT = /* @__PURE__ */ pow(2, -969);

/**
 * Exact error `e` of the rounded product `p = fl(a * b)`, so that
 * `a * b = p + e` exactly; `NaN` where Dekker's algorithm is not valid.
 * @internal
 */
export function productError(a: number, b: number, p: number): number {
  const aa = a < 0 ? -a : a;
  const ab = b < 0 ? -b : b;
  const ap = p < 0 ? -p : p;
  if (aa > SPLIT_MAX || ab > SPLIT_MAX || ap < TINY_PRODUCT || ap === Infinity) return NaN;
  let t = SPLIT * a;
  const ah = t - (t - a);
  const al = a - ah;
  t = SPLIT * b;
  const bh = t - (t - b);
  const bl = b - bh;
  return ah * bh - p + ah * bl + al * bh + al * bl;
}

/** Lower bound of the exact sum `a + b` (`NaN` for `Inf - Inf`). @internal */
export function addDn(a: number, b: number): number {
  const s = a + b;
  if (s - s !== 0) {
    // s is ±Infinity or NaN
    if (s === Infinity && a !== Infinity && b !== Infinity) return MAX; // overflow of finite operands
    return s;
  }
  const bb = s - a;
  const err = a - (s - bb) + (b - bb);
  if (err !== err) return nextDown(s);
  return err < 0 ? nextDown(s) : s;
}

/** Upper bound of the exact sum `a + b` (`NaN` for `Inf - Inf`). @internal */
export function addUp(a: number, b: number): number {
  return -addDn(-a, -b);
}

/** Lower bound of the exact difference `a - b`. @internal */
export function subDn(a: number, b: number): number {
  return addDn(a, -b);
}

/** Upper bound of the exact difference `a - b`. @internal */
export function subUp(a: number, b: number): number {
  return -addDn(-a, b);
}

/** Lower bound of the exact product, with the interval convention `0 * ±Infinity = 0`. @internal */
export function mulDn(a: number, b: number): number {
  if (a === 0 || b === 0) return 0;
  const p = a * b;
  if (p === Infinity || p === -Infinity) {
    if (a - a === 0 && b - b === 0) return p === Infinity ? MAX : -Infinity; // finite overflow
    return p;
  }
  const e = productError(a, b, p);
  if (e !== e) return nextDown(p);
  return e < 0 ? nextDown(p) : p;
}

/** Upper bound of the exact product, with `0 * ±Infinity = 0`. @internal */
export function mulUp(a: number, b: number): number {
  return -mulDn(-a, b);
}

/**
 * Lower bound of the exact quotient `a / b` for `b !== 0`
 * (`finite / ±Infinity = 0`; `NaN` for `Infinity / Infinity`). @internal
 */
export function divDn(a: number, b: number): number {
  if (a === 0) return 0;
  const q = a / b;
  if (q !== q) return q;
  if (q === Infinity || q === -Infinity) {
    if (a - a === 0 && b - b === 0) return q === Infinity ? MAX : -Infinity; // overflow
    return q;
  }
  if (b === Infinity || b === -Infinity) return q; // finite / infinite = 0 exactly
  if (q === 0) return (a > 0) === (b > 0) ? 0 : -Number.MIN_VALUE; // underflow to zero
  if ((q < 0 ? -q : q) < TINY_PRODUCT) return nextDown(q); // remainder may not be representable
  const p = q * b;
  const e = productError(q, b, p);
  const r = a - p - e;
  if (r !== r) return nextDown(q);
  if (r === 0) return q;
  // exact a / b = q + r / b
  return (r > 0) === (b > 0) ? q : nextDown(q);
}

/** Upper bound of the exact quotient `a / b` for `b !== 0`. @internal */
export function divUp(a: number, b: number): number {
  return -divDn(-a, b);
}

/**
 * Lower and upper bounds of `sqrt(a)` for `a >= 0` written to `out[0..1]`:
 * exact for perfect squares (the residual `a - s*s` is zero), otherwise
 * one ulp either side of the engine's value. @internal
 */
export function sqrtBounds(a: number, out: Float64Array): void {
  const s = Math.sqrt(a);
  if (a === 0 || a === Infinity) {
    out[0] = s;
    out[1] = s;
    return;
  }
  const p = s * s;
  const e = productError(s, s, p);
  const r = a - p - e;
  if (r === 0) {
    out[0] = s;
    out[1] = s;
    return;
  }
  out[0] = nextDown(s);
  out[1] = nextUp(s);
}

/** Relative widening for results of the (not correctly rounded) elementary functions. @internal */
export const FN_REL = /* @__PURE__ */ pow(2, -40);
/** Absolute widening for results of the elementary functions (covers subnormal results). @internal */
export const FN_ABS = /* @__PURE__ */ pow(2, -1040);

/**
 * Lower bound of the exact value of an elementary function whose engine
 * result is `v` (relative `2^-40` plus absolute `2^-1040`, then one ulp).
 * `+Infinity` from a finite argument (overflow) gives `MAX`. @internal
 */
export function widenDn(v: number): number {
  if (v === Infinity) return MAX;
  if (v === -Infinity) return v;
  const m = v < 0 ? -v : v;
  return nextDown(v - (m * FN_REL + FN_ABS));
}

/** Upper bound counterpart of {@link widenDn}. @internal */
export function widenUp(v: number): number {
  return -widenDn(-v);
}

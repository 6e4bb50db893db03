/**
 * e^x − 1, accurate near 0: the algorithm of `@stdlib/math-base-special-expm1`
 * (FDLIBM's s_expm1.c) step for step, the same bits for every x, with its
 * word-level constructions of powers of two read from a table.
 * @internal @packageDocumentation
 */
import polyvalQ from '@stdlib/math-base-special-expm1/lib/polyval_q.js';
import { POW2 } from './pow2-table.js';

const OVERFLOW_THRESHOLD = 7.09782712893383973096e2;
const LN2_HI = 6.9314718036912381649e-1;
const LN2_LO = 1.90821492927058770002e-10;
const LN2_INV = 1.442695040888963387e0;
const LN2x56 = 3.88162421113569373274e1;
const LN2_HALFX3 = 1.03972077083991796413e0;
const HALF_LN2 = 0.34657359027997264;
const TWO_M54 = 5.551115123125783e-17; // 2^-54

/** Scratch slot of the full algorithm's results (see {@link expm1}). */
const SLOT = /* @__PURE__ */ new Float64Array(1);

/**
 * e^x − 1, accurate near 0, the same bits on every engine: bit for bit
 * `@stdlib/math-base-special-expm1`.
 *
 * @remarks
 * The same operations in the same order as the package; where it builds a
 * double from words — 2^k, 1 − 2^−k, 2^−k (each exact, all with a zero low
 * word) and the test |x| < 2^−54 on the high word — this function takes
 * the same exact values from a table of powers of two, or compares with
 * 2^−54; where it adds k = 1024 to an exponent field, it multiplies by
 * 2 and 2^1023 (exact there). Checked bit for bit against the package in
 * test/vendor/exp.test.ts. Why: the package's word helpers were most of the
 * cost of the e^x − 1 every hull piece's area needs. The build gives this
 * function to the bundled @stdlib functions that import the package
 * (scripts/esbuild-stdlib.mjs).
 * @internal
 */
export function expm1(x: number): number {
  // the common arguments of the hull's areas: −56·ln 2 < x ≤ 0.5·ln 2, away from 0 (k ≤ 0 below)
  if (x > -LN2x56 && x <= HALF_LN2 && (x >= TWO_M54 || x <= -TWO_M54)) {
    let k = 0;
    let c = 0;
    let r = x;
    if (x < -HALF_LN2) {
      let hi: number;
      let lo: number;
      if (x > -LN2_HALFX3) {
        hi = x + LN2_HI;
        lo = -LN2_LO;
        k = -1;
      } else {
        k = (LN2_INV * x - 0.5) | 0;
        hi = x - k * LN2_HI;
        lo = k * LN2_LO;
      }
      r = hi - lo;
      c = hi - r - lo;
    }
    const halfX = 0.5 * r;
    const z = r * halfX;
    const r1 = 1.0 + z * polyvalQ(z);
    const t = 3.0 - r1 * halfX;
    let e = z * ((r1 - t) / (6.0 - r * t));
    if (k === 0) return r - (r * e - z);
    e = r * (e - c) - c;
    e -= z;
    if (k === -1) return 0.5 * (r - e) - 0.5;
    return (1.0 - (e - r)) * POW2[k + 1022] - 1.0;
  }
  // every other argument (special values, tiny |x|, x > 0.5·ln 2, x ≤ −56·ln 2) through a float64
  // slot: returned directly, the call's (boxed) result would make the engine box every result
  SLOT[0] = expm1Rest(x);
  return SLOT[0];
}

/**
 * The package's other branches, for the arguments {@link expm1} does not
 * take itself: NaN, ±Infinity, ±0 and |x| < 2^−54 (returned as they are),
 * x ≤ −56·ln 2 (−1), and x > 0.5·ln 2 (k ≥ 1, up to the overflow).
 */
function expm1Rest(x0: number): number {
  if (x0 === Infinity || x0 !== x0) return x0;
  if (x0 <= -LN2x56) return -1;
  // what is left below 0.5·ln 2 is ±0 and |x| < 2^-54, where e^x − 1 rounds to x
  if (!(x0 > HALF_LN2)) return x0;
  if (x0 >= OVERFLOW_THRESHOLD) return Infinity;
  let k: number;
  let hi: number;
  let lo: number;
  if (x0 < LN2_HALFX3) {
    hi = x0 - LN2_HI;
    lo = LN2_LO;
    k = 1;
  } else {
    k = (LN2_INV * x0 + 0.5) | 0;
    hi = x0 - k * LN2_HI;
    lo = k * LN2_LO;
  }
  const x = hi - lo;
  const c = hi - x - lo;
  const halfX = 0.5 * x;
  const z = x * halfX;
  const r1 = 1.0 + z * polyvalQ(z);
  let t = 3.0 - r1 * halfX;
  let e = z * ((r1 - t) / (6.0 - x * t));
  e = x * (e - c) - c;
  e -= z;
  if (k === 1) {
    if (x < -0.25) return -2.0 * (e - (x + 0.5));
    return 1.0 + 2.0 * (x - e);
  }
  if (k > 56) {
    const y = 1.0 - (e - x);
    // the package adds 1024 to y's exponent field; y ≤ 1 here (x < 1024·ln 2), so y·2·2^1023 is
    // that value exactly (Infinity when y = 1, as the field's overflow gives)
    if (k === 1024) return y * 2 * POW2[2045] - 1.0;
    return y * POW2[k + 1022] - 1.0;
  }
  let y: number;
  if (k < 20) {
    t = 1 - POW2[1022 - k]; // 1 − 2^−k, exact
    y = t - (e - x);
  } else {
    t = POW2[1022 - k]; // 2^−k
    y = x - (e + t);
    y += 1.0;
  }
  return y * POW2[k + 1022];
}

export default expm1;

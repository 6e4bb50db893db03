/**
 * frac·2^exp: the algorithm of `@stdlib/math-base-special-ldexp` 0.2
 * (FreeBSD msun's scalbn in its stdlib form), step for step, on one
 * DataView instead of the package's word helpers (normalize, exponent,
 * toWords, fromWords, copysign and the endianness check, each a module of
 * its own). The build (scripts/esbuild-stdlib.mjs) gives it to the @stdlib
 * functions that import that package (exp, pow, the argument reduction of
 * sin/cos/tan), so that a bundle takes one small function;
 * test/vendor/math.test.ts compares the two bit for bit. @internal
 *
 * @packageDocumentation
 */

/** One double's bytes (big-endian access: the high word first). */
const VIEW = /* @__PURE__ */ new DataView(new ArrayBuffer(8));

/**
 * frac·2^exp, the same bits as `@stdlib/math-base-special-ldexp`: ±0, NaN,
 * ±Infinity and exp = 0 give frac; a subnormal frac is normalised first
 * (×2^52); a result exponent below −1074 gives ±0 and above 1023 ±Infinity;
 * a subnormal result is made with the exponent + 52 and one multiplication
 * by 2^−52 (one rounding). @internal
 */
export function ldexp(frac: number, exp: number): number {
  if (exp === 0 || frac === 0 || frac !== frac || frac - frac !== 0) return frac;
  let x = frac;
  let e = exp;
  if (Math.abs(x) < 2.2250738585072014e-308) {
    x *= 4503599627370496; // 2^52
    e -= 52;
  }
  VIEW.setFloat64(0, x);
  const high = VIEW.getUint32(0);
  e += ((high & 0x7ff00000) >>> 20) - 1023;
  if (e < -1074) return frac < 0 ? -0 : 0;
  if (e > 1023) return frac < 0 ? -Infinity : Infinity;
  let m = 1;
  if (e <= -1023) {
    e += 52;
    m = 2.220446049250313e-16; // 2^-52
  }
  VIEW.setUint32(0, ((high & 0x800fffff) | ((e + 1023) << 20)) >>> 0);
  return m * VIEW.getFloat64(0);
}

export default ldexp;

/** 2^k for an integer k, exactly (IEEE basic arithmetic only). @internal @packageDocumentation */

/**
 * 2^k for an integer k: the double `pow(2, k)` returns (exact for k in
 * [−1074, 1023], 0 below and Infinity above; NaN for a k that is not an
 * integer), without the general power function, so that a bundle needing
 * only powers of two does not take it (test/vendor/math.test.ts compares
 * the two for every k in [−1200, 1200]). @internal
 *
 * @remarks
 * Binary exponentiation of 2 or 1/2: every partial product is a power of
 * two no smaller (in magnitude of the exponent, no larger) than the result,
 * so each multiplication is exact while the result is a double, and the
 * one that leaves the range rounds to 0 or Infinity as IEEE 754 says.
 */
export const twoTo = (k: number): number => {
  if (!Number.isInteger(k)) return NaN;
  if (k > 1023) return Infinity;
  if (k < -1075) return 0;
  let b = k < 0 ? 0.5 : 2;
  let n = k < 0 ? -k : k;
  let r = 1;
  // n < 2^11: at most 11 rounds
  for (let i = 0; i < 11 && n > 0; i++) {
    if (n % 2 === 1) r *= b;
    b *= b;
    n = (n - (n % 2)) / 2;
  }
  return r;
};

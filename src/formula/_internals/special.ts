/**
 * digamma and trigamma (first and second derivative of lgamma) on x > 0,
 * with a rigorous bound of their own rounding error. @internal
 *
 * @remarks
 * Both use the recurrence ψ(x) = ψ(x + 1) − 1/x (ψ'(x) = ψ'(x + 1) + 1/x²)
 * until x ≥ 10, then the asymptotic series (Abramowitz & Stegun 6.3.18 and
 * 6.4.12) truncated after the x^-14 (resp. x^-15) term; at x ≥ 10 the first
 * omitted term is below 5e-17 (resp. 8e-18), far below the error bound.
 * The error bound returned by {@link specialMagnitude} is
 * `2^-40 · (sum of the magnitudes of every term)` plus `2^-1040`: each of
 * the at most ~40 roundings contributes at most 2^-53 of a partial result
 * that never exceeds that sum, and `log` (src/vendor/math.ts) is within a few ulps, so the
 * bound holds with a margin of about 100.
 *
 * @packageDocumentation
 */
import { log, pow } from '../../vendor/math.js';

let lastError = 0;
const ERR = /* @__PURE__ */ pow(2, -40);
const ABS = /* @__PURE__ */ pow(2, -1040);

/** Error bound of the last {@link digammaValue} or {@link trigammaValue} call. @internal */
export function specialMagnitude(): number {
  return lastError;
}

/** ψ(x) for x > 0 (`-Infinity` when 1/x overflows). @internal */
export function digammaValue(x: number): number {
  let r = 0;
  let mag = 0;
  for (let i = 0; i < 10 && x < 10; i++) {
    const t = 1 / x;
    r -= t;
    mag += t;
    x += 1;
  }
  if (r === -Infinity) {
    lastError = 0;
    return -Infinity;
  }
  const lx = log(x);
  const z = 1 / (x * x);
  // A&S 6.3.18: ln x − 1/(2x) − Σ B_2k / (2k x^2k)
  const series =
    z * (1 / 12 - z * (1 / 120 - z * (1 / 252 - z * (1 / 240 - z * (1 / 132 - z * (691 / 32760 - z * (1 / 12)))))));
  const v = r + lx - 0.5 / x - series;
  mag += Math.abs(lx) + 0.5 / x + Math.abs(series) + Math.abs(v);
  lastError = mag * ERR + ABS;
  return v;
}

/** ψ'(x) for x > 0 (`+Infinity` when 1/x² overflows). @internal */
export function trigammaValue(x: number): number {
  let r = 0;
  for (let i = 0; i < 10 && x < 10; i++) {
    r += 1 / (x * x);
    x += 1;
  }
  if (r === Infinity) {
    lastError = 0;
    return Infinity;
  }
  const z = 1 / (x * x);
  // A&S 6.4.12: 1/x + 1/(2x²) + Σ B_2k / x^(2k+1)
  const series =
    (1 + z * (1 / 6 - z * (1 / 30 - z * (1 / 42 - z * (1 / 30 - z * (5 / 66 - z * (691 / 2730 - z * (7 / 6)))))))) / x;
  const v = r + series + 0.5 * z;
  lastError = (r + Math.abs(series) + 0.5 * z + v) * ERR + ABS;
  return v;
}

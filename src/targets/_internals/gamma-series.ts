/**
 * Regularized incomplete gamma functions P(a, x) and Q(a, x) = 1 − P(a, x),
 * accurate at large shapes where `@stdlib/stats-base-dists-gamma-cdf` is not
 * (measured in this project: off by up to 2e-2 near the centre at shape ≥ 1000,
 * e.g. P(1e4, 1e4) given as 0.49734 where the power series of Abramowitz &
 * Stegun 6.5.29 gives 0.50133; see test/reference/README.md).
 * @internal
 *
 * @packageDocumentation
 */
import { gammaln } from '../../vendor/stdlib.js';
import { exp, log } from '../../vendor/math.js';

const EPS = 2.220446049250313e-16;
/** Smallest magnitude kept by the modified Lentz recurrence (common practice). */
const TINY = 1e-300;

/**
 * Iteration cap of the series and of the continued fraction for shape `a`.
 * Both need O(√a) terms near x ≈ a (the terms of the series fall like
 * exp(−n²/2a)); the cap leaves a wide margin and bounds every loop.
 */
function maxIterations(a: number): number {
  return 1000 + 60 * Math.ceil(Math.sqrt(a));
}

/**
 * Power series of P(a, x) (Abramowitz & Stegun 1964, 6.5.29):
 * P(a, x) = x^a e^(−x) / Γ(a + 1) · Σ_{n ≥ 0} x^n / ((a + 1)…(a + n)),
 * Kahan-summed. Used for 0 < x ≤ a + 1, where all terms are positive and the
 * sum converges quickly. Returns NaN if the iteration cap is reached.
 */
function seriesP(a: number, x: number): number {
  const cap = maxIterations(a);
  let sum = 1;
  let comp = 0;
  let term = 1;
  let converged = false;
  for (let n = 1; n <= cap; n++) {
    term *= x / (a + n);
    // Kahan (compensated) summation.
    const y = term - comp;
    const t = sum + y;
    comp = t - sum - y;
    sum = t;
    if (term <= sum * EPS) {
      converged = true;
      break;
    }
  }
  if (!converged) return NaN;
  return exp(a * log(x) - x - gammaln(a + 1) + log(sum));
}

/**
 * Continued fraction of Q(a, x) = Γ(a, x) / Γ(a), evaluated by the modified
 * Lentz method (Lentz 1976; the arrangement is common practice, as in
 * Numerical Recipes `gcf`). Used for x > a + 1. Returns NaN if the iteration
 * cap is reached.
 */
function continuedFractionQ(a: number, x: number): number {
  const cap = maxIterations(a);
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  let converged = false;
  for (let i = 1; i <= cap; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) <= EPS) {
      converged = true;
      break;
    }
  }
  if (!converged) return NaN;
  return exp(a * log(x) - x - gammaln(a) + log(h));
}

/**
 * Regularized lower incomplete gamma function P(a, x) = γ(a, x) / Γ(a).
 *
 * @remarks
 * Series (A&S 6.5.29) for x ≤ a + 1, `1 − Q` from the continued fraction
 * otherwise. Relative accuracy is about `1e-16 · a · |log x|` from the
 * prefactor `a log x − x − lnΓ(a + 1)`, i.e. better than 1e-10 for a ≤ 1e5.
 * Returns NaN for a ≤ 0, NaN input, or when the iteration cap is reached
 * (shapes far beyond 1e9), so that a caller's check fails loudly rather than
 * silently.
 *
 * @param a - shape, > 0
 * @param x - argument
 * @internal
 */
export function lowerRegularizedGamma(a: number, x: number): number {
  if (!(a > 0) || x !== x || a === Infinity) return NaN;
  if (x <= 0) return 0;
  if (x === Infinity) return 1;
  if (x > a + 1) return 1 - continuedFractionQ(a, x);
  return seriesP(a, x);
}

/**
 * Regularized upper incomplete gamma function Q(a, x) = Γ(a, x) / Γ(a) = 1 − P(a, x).
 *
 * @remarks
 * Continued fraction for x > a + 1 (accurate in the far upper tail), `1 − P`
 * from the series otherwise. Same NaN conventions as
 * {@link lowerRegularizedGamma}.
 *
 * @param a - shape, > 0
 * @param x - argument
 * @internal
 */
export function upperRegularizedGamma(a: number, x: number): number {
  if (!(a > 0) || x !== x || a === Infinity) return NaN;
  if (x <= 0) return 1;
  if (x === Infinity) return 0;
  if (x > a + 1) return continuedFractionQ(a, x);
  return 1 - seriesP(a, x);
}

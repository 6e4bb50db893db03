/**
 * Second-source log-pmfs for the discrete families, independent of @stdlib's
 * formulas: Loader's saddle-point forms (C. Loader, "Fast and accurate
 * computation of binomial probabilities", 2000; from memory), with the
 * Stirling-series remainder stirlerr and the deviance term bd0 computed
 * without cancellation. Used to check @stdlib pointwise before the
 * statistical tests lean on it.
 */

const LN_2PI = Math.log(2 * Math.PI);

/** log(n!) − [(n + 1/2) log n − n + log(2π)/2]: exact log-sum for n ≤ 15, Stirling series beyond (coefficients 1/12, 1/360, 1/1260, 1/1680, 1/1188, from memory). */
export function stirlerr(n: number): number {
  if (n <= 15) {
    let lf = 0;
    for (let i = 2; i <= n; i++) lf += Math.log(i);
    return lf - ((n + 0.5) * Math.log(n) - n + 0.5 * LN_2PI);
  }
  const n2 = 1 / (n * n);
  return (1 / 12 - (1 / 360 - (1 / 1260 - (1 / 1680 - n2 / 1188) * n2) * n2) * n2) / n;
}

/** x log(x/m) + m − x, by a series when x is close to m. */
export function bd0(x: number, m: number): number {
  if (Math.abs(x - m) < 0.1 * (x + m)) {
    const v = (x - m) / (x + m);
    let s = (x - m) * v;
    let ej = 2 * x * v;
    const v2 = v * v;
    for (let j = 1; j < 1000; j++) {
      ej *= v2;
      const s1 = s + ej / (2 * j + 1);
      if (s1 === s) return s1;
      s = s1;
    }
    return s;
  }
  return x * Math.log(x / m) + m - x;
}

/** Poisson(λ) log-pmf at the integer k ≥ 0. */
export function poissonLogPmfRef(k: number, lambda: number): number {
  if (k === 0) return -lambda;
  return -stirlerr(k) - bd0(k, lambda) - 0.5 * (LN_2PI + Math.log(k));
}

/** Binomial(n, p) log-pmf at the integer 0 ≤ k ≤ n. */
export function binomialLogPmfRef(k: number, n: number, p: number): number {
  const q = 1 - p;
  if (k === 0) return n * Math.log1p(-p);
  if (k === n) return n * Math.log(p);
  return stirlerr(n) - stirlerr(k) - stirlerr(n - k) - bd0(k, n * p) - bd0(n - k, n * q) + 0.5 * (Math.log(n / (k * (n - k))) - LN_2PI);
}

/** Normalized pmf over [lo, hi] by Neumaier summation of exp(logPmf − max) (hi finite). */
export function normalizedPmf(logPmf: (k: number) => number, lo: number, hi: number): (k: number) => number {
  const n = hi - lo + 1;
  const lp = new Float64Array(n);
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    lp[i] = logPmf(lo + i);
    if (lp[i] > max) max = lp[i];
  }
  let s = 0;
  let c = 0;
  for (let i = 0; i < n; i++) {
    const x = Math.exp(lp[i] - max);
    const t = s + x;
    c += Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s;
    s = t;
  }
  s += c;
  const logZ = max + Math.log(s);
  return (k: number) => (k >= lo && k <= hi ? Math.exp(lp[k - lo] - logZ) : 0);
}

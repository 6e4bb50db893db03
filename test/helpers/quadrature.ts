/**
 * Numerical-integration references for targets without a closed-form CDF.
 * Independent of the code under test: plain composite Simpson rules.
 */

/** Composite Simpson integral of exp(logf) over [a, b] with n (even) cells. */
export function simpson(logf: (x: number) => number, a: number, b: number, n = 20000): number {
  const h = (b - a) / n;
  let s = Math.exp(logf(a)) + Math.exp(logf(b));
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * Math.exp(logf(a + i * h));
  return (s * h) / 3;
}

/**
 * A CDF of exp(logf) on [a, b] (mass outside [a, b] must be negligible),
 * tabulated by Simpson's rule on cells of width h, with Simpson's rule from the
 * cell's left node to x inside a cell.
 */
export function quadratureCdf(logf: (x: number) => number, a: number, b: number, h = 1e-3): { cdf: (x: number) => number; total: number } {
  const n = Math.ceil((b - a) / h);
  const step = (b - a) / n;
  const cum = new Float64Array(n + 1);
  const f = (x: number): number => Math.exp(logf(x));
  for (let i = 0; i < n; i++) {
    const x0 = a + i * step;
    cum[i + 1] = cum[i] + (step / 6) * (f(x0) + 4 * f(x0 + step / 2) + f(x0 + step));
  }
  const total = cum[n];
  const cdf = (x: number): number => {
    if (x <= a) return 0;
    if (x >= b) return 1;
    const i = Math.min(n - 1, Math.floor((x - a) / step));
    const x0 = a + i * step;
    const d = x - x0;
    const part = (d / 6) * (f(x0) + 4 * f(x0 + d / 2) + f(x));
    return Math.min(1, (cum[i] + part) / total);
  };
  return { cdf, total };
}

/**
 * The one-sample Kolmogorov-Smirnov test of `@stdlib/stats-kstest`, for a
 * cdf function: the statistic computed as that package's `main.js` computes
 * it, and its exact p-value routine (`lib/marsaglia.js`, Marsaglia, Tsang &
 * Wang 2003) imported alone. Why not the package entry: it loads the cdf of
 * every distribution it can name (about 40 KB minified), none used here. @internal
 *
 * @packageDocumentation
 */
import pKolmogorovImpl from '@stdlib/stats-kstest/lib/marsaglia.js';

/** Result of the @stdlib one-sample Kolmogorov-Smirnov test. @internal */
export interface StdlibKsResult {
  /** The statistic D. */
  readonly statistic: number;
  /** The p-value. */
  readonly pValue: number;
}

const pKolmogorov: (d: number, n: number) => number = pKolmogorovImpl;

/** One-sample Kolmogorov-Smirnov test against a cdf, exact p-value (Marsaglia, Tsang & Wang 2003); `x` must be sorted. @internal */
export const kstest = (x: Float64Array, cdf: (x: number) => number, options: { sorted: boolean }): StdlibKsResult => {
  const n = x.length;
  const y = options.sorted ? x : Float64Array.from(x).sort();
  // as @stdlib/stats-kstest main.js (two-sided): d_i = F(x_i) − i/n, D = max(max d_i, max(1/n − d_i)); NaN propagates
  let hi = -Infinity;
  let lo = -Infinity;
  let nan = false;
  for (let i = 0; i < n; i++) {
    const d = cdf(y[i]) - i / n;
    if (d !== d) nan = true;
    if (d > hi) hi = d;
    const e = 1 / n - d;
    if (e > lo) lo = e;
  }
  const statistic = nan ? NaN : Math.max(hi, lo);
  return { statistic, pValue: 1 - pKolmogorov(statistic, n) };
};

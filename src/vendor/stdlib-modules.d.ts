/** Deep imports of @stdlib package files that have no declarations of their own. @internal */
declare module '@stdlib/stats-kstest/lib/marsaglia.js' {
  /** P(D_n < d) for the one-sample Kolmogorov-Smirnov statistic (Marsaglia, Tsang & Wang 2003). */
  const pKolmogorov: (d: number, n: number) => number;
  export default pKolmogorov;
}

/** Deep imports of @stdlib package files that have no declarations of their own. @internal */
declare module '@stdlib/stats-kstest/lib/marsaglia.js' {
  /** P(D_n < d) for the one-sample Kolmogorov-Smirnov statistic (Marsaglia, Tsang & Wang 2003). */
  const pKolmogorov: (d: number, n: number) => number;
  export default pKolmogorov;
}
/**
 * The main function of a `@stdlib/stats-base-dists-*` package, without the
 * package index (which attaches a `factory` the library never uses, so a
 * bundle would take it too). Each wrapper in src/vendor/stdlib/ declares
 * its own signature.
 */
declare module '@stdlib/stats-base-dists-*/lib/main.js' {
  const main: (...args: number[]) => number;
  export default main;
}
/** FDLIBM log1p's polynomial in s² (the evaluator `@stdlib/math-base-special-log1p` itself calls), shared by `log1pFast`. */
declare module '@stdlib/math-base-special-log1p/lib/polyval_lp.js' {
  const polyval: (z: number) => number;
  export default polyval;
}
/** FDLIBM exp's polynomial in r² (the evaluator `@stdlib/math-base-special-exp` itself calls), shared by `exp`. */
declare module '@stdlib/math-base-special-exp/lib/polyval_p.js' {
  const polyval: (t: number) => number;
  export default polyval;
}
/** FDLIBM expm1's polynomial (the evaluator `@stdlib/math-base-special-expm1` itself calls), shared by `expm1`. */
declare module '@stdlib/math-base-special-expm1/lib/polyval_q.js' {
  const polyval: (z: number) => number;
  export default polyval;
}

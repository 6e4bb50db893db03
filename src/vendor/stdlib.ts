/**
 * The `@stdlib` functions the library core uses, in one module. @internal
 *
 * @remarks
 * Why one module: each `@stdlib` package is split into many small CommonJS
 * packages (importing the core used to load 913 modules from 317 packages,
 * about 170 ms in a fresh process and 250 ms in a worker thread). The build
 * (scripts/build.mjs) bundles the library with esbuild, these packages
 * included, so the published library has no runtime dependencies and loads
 * a few files; the licenses of the bundled packages are collected in
 * `dist/THIRD_PARTY_LICENSES.md`. In the
 * source tree (tests, typecheck) the packages are imported as usual. The
 * signatures are declared here so that no emitted declaration refers to a
 * `@stdlib` type.
 *
 * @packageDocumentation
 */
import betalnImpl from '@stdlib/math-base-special-betaln';
import gammalnImpl from '@stdlib/math-base-special-gammaln';
import mt19937Impl from '@stdlib/random-base-mt19937';
import betaCdfImpl from '@stdlib/stats-base-dists-beta-cdf';
import gammaCdfImpl from '@stdlib/stats-base-dists-gamma-cdf';
import logisticCdfImpl from '@stdlib/stats-base-dists-logistic-cdf';
import normalCdfImpl from '@stdlib/stats-base-dists-normal-cdf';
import tCdfImpl from '@stdlib/stats-base-dists-t-cdf';
import kstestImpl from '@stdlib/stats-kstest';

/** ln B(a, b). @internal */
export const betaln: (a: number, b: number) => number = betalnImpl;
/** ln Γ(x). @internal */
export const gammaln: (x: number) => number = gammalnImpl;
/** Beta(a, b) cdf at x. @internal */
export const betaCdf: (x: number, a: number, b: number) => number = betaCdfImpl;
/** Gamma(shape, rate) cdf at x. @internal */
export const gammaCdf: (x: number, shape: number, rate: number) => number = gammaCdfImpl;
/** Logistic(mu, s) cdf at x. @internal */
export const logisticCdf: (x: number, mu: number, s: number) => number = logisticCdfImpl;
/** Normal(mu, sigma) cdf at x. @internal */
export const normalCdf: (x: number, mu: number, sigma: number) => number = normalCdfImpl;
/** Student-t(v) cdf at x. @internal */
export const tCdf: (x: number, v: number) => number = tCdfImpl;

/** The parts of an `@stdlib/random-base-mt19937` generator that exactdraw uses. @internal */
export interface StdlibMt19937 {
  /** Next 32-bit output. */
  (): number;
  /** Next 53-bit uniform on [0, 1). */
  normalized: () => number;
  /** A copy of the generator state (the layout of `MersenneTwisterState.words`). */
  readonly state: Uint32Array;
}

/** Options of the @stdlib MT19937 factory used here. @internal */
export interface StdlibMt19937Options {
  /** A seed (integer in [1, 2^32 − 1]) or an `init_by_array` key. */
  seed?: number | readonly number[];
  /** A saved state. */
  state?: Uint32Array;
  /** Copy the given state (always true here). */
  copy: boolean;
}

/** Makes an @stdlib MT19937 generator. @internal */
export const mt19937Factory: (options: StdlibMt19937Options) => StdlibMt19937 = (options) =>
  (mt19937Impl.factory as unknown as (o: StdlibMt19937Options) => StdlibMt19937)(options);

/** Result of the @stdlib one-sample Kolmogorov-Smirnov test. @internal */
export interface StdlibKsResult {
  /** The statistic D. */
  readonly statistic: number;
  /** The p-value. */
  readonly pValue: number;
}

/** One-sample Kolmogorov-Smirnov test against a cdf, exact p-value (Marsaglia, Tsang & Wang 2003). @internal */
export const kstest: (x: Float64Array, cdf: (x: number) => number, options: { sorted: boolean }) => StdlibKsResult = (x, cdf, options) =>
  (kstestImpl as unknown as (x: Float64Array, cdf: (x: number) => number, o: { sorted: boolean }) => StdlibKsResult)(x, cdf, options);

// Discrete families (src/targets/discrete/).
import poissonLogpmfImpl from '@stdlib/stats-base-dists-poisson-logpmf';
import poissonCdfImpl from '@stdlib/stats-base-dists-poisson-cdf';
import binomialLogpmfImpl from '@stdlib/stats-base-dists-binomial-logpmf';
import binomialCdfImpl from '@stdlib/stats-base-dists-binomial-cdf';
import negativeBinomialLogpmfImpl from '@stdlib/stats-base-dists-negative-binomial-logpmf';
import negativeBinomialCdfImpl from '@stdlib/stats-base-dists-negative-binomial-cdf';
import geometricLogpmfImpl from '@stdlib/stats-base-dists-geometric-logpmf';
import geometricCdfImpl from '@stdlib/stats-base-dists-geometric-cdf';
/** Poisson(λ) log-pmf at k. @internal */
export const poissonLogpmf: (k: number, lambda: number) => number = poissonLogpmfImpl;
/** Poisson(λ) cdf at k. @internal */
export const poissonCdf: (k: number, lambda: number) => number = poissonCdfImpl;
/** Binomial(n, p) log-pmf at k. @internal */
export const binomialLogpmf: (k: number, n: number, p: number) => number = binomialLogpmfImpl;
/** Binomial(n, p) cdf at k. @internal */
export const binomialCdf: (k: number, n: number, p: number) => number = binomialCdfImpl;
/** Negative binomial(r, p) log-pmf at k (failures before the r-th success, success probability p). @internal */
export const negativeBinomialLogpmf: (k: number, r: number, p: number) => number = negativeBinomialLogpmfImpl;
/** Negative binomial(r, p) cdf at k. @internal */
export const negativeBinomialCdf: (k: number, r: number, p: number) => number = negativeBinomialCdfImpl;
/** Geometric(p) log-pmf at k (failures before the first success). @internal */
export const geometricLogpmf: (k: number, p: number) => number = geometricLogpmfImpl;
/** Geometric(p) cdf at k. @internal */
export const geometricCdf: (k: number, p: number) => number = geometricCdfImpl;
// Families added with issue 11 (exponential … Gumbel).
import exponentialCdfImpl from '@stdlib/stats-base-dists-exponential-cdf';
import laplaceCdfImpl from '@stdlib/stats-base-dists-laplace-cdf';
import weibullCdfImpl from '@stdlib/stats-base-dists-weibull-cdf';
import lognormalCdfImpl from '@stdlib/stats-base-dists-lognormal-cdf';
import chisquareCdfImpl from '@stdlib/stats-base-dists-chisquare-cdf';
import invgammaCdfImpl from '@stdlib/stats-base-dists-invgamma-cdf';
import paretoType1CdfImpl from '@stdlib/stats-base-dists-pareto-type1-cdf';
import gumbelCdfImpl from '@stdlib/stats-base-dists-gumbel-cdf';
/** Exponential(rate) cdf at x. @internal */
export const exponentialCdf: (x: number, rate: number) => number = exponentialCdfImpl;
/** Laplace(mu, b) cdf at x. @internal */
export const laplaceCdf: (x: number, mu: number, b: number) => number = laplaceCdfImpl;
/** Weibull(shape k, scale lambda) cdf at x. @internal */
export const weibullCdf: (x: number, k: number, lambda: number) => number = weibullCdfImpl;
/** Lognormal(mu, sigma) cdf at x. @internal */
export const lognormalCdf: (x: number, mu: number, sigma: number) => number = lognormalCdfImpl;
/** Chi-square(k) cdf at x. @internal */
export const chisquareCdf: (x: number, k: number) => number = chisquareCdfImpl;
/** Inverse-gamma(shape alpha, scale beta) cdf at x. @internal */
export const invgammaCdf: (x: number, alpha: number, beta: number) => number = invgammaCdfImpl;
/** Pareto type I(shape alpha, scale beta) cdf at x. @internal */
export const paretoType1Cdf: (x: number, alpha: number, beta: number) => number = paretoType1CdfImpl;
/** Gumbel(mu, beta) cdf at x. @internal */
export const gumbelCdf: (x: number, mu: number, beta: number) => number = gumbelCdfImpl;

/**
 * Shared public types of exactdraw.
 *
 * @packageDocumentation
 */

/**
 * A source of uniform random numbers on the half-open interval [0, 1).
 *
 * @remarks
 * Any function with this signature can be injected into a sampler through
 * {@link SamplerOptions.uniform}. The default source is {@link mersenneTwister}.
 */
export type Uniform = () => number;

/**
 * A distribution to draw from, described by its (possibly unnormalized)
 * log-density.
 *
 * @remarks
 * Only {@link Target.logDensity} is required. The other members are hints
 * that methods use when present: `dLogDensity` enables tangent hulls, `mode`
 * speeds up bound and start-point searches, `cdf` is used by the checks only.
 */
export interface Target {
  /** Unnormalized log-density; must return `-Infinity` outside the support and never `NaN` or `+Infinity`. */
  logDensity(x: number): number;
  /** Optional derivative of {@link Target.logDensity}, used by tangent-based envelopes. */
  dLogDensity?(x: number): number;
  /** Support `[lower, upper]`; defaults to `[-Infinity, Infinity]`. */
  readonly support?: readonly [number, number];
  /** Optional location of the mode (a hint; it is verified where it matters). */
  readonly mode?: number;
  /** Optional normalized cumulative distribution function, used by checks only. */
  cdf?(x: number): number;
  /**
   * Optional known locations of local maxima (hints). Methods use them as
   * touch points and cell edges; each must be a finite number inside the
   * support.
   */
  readonly modes?: readonly number[];
  /**
   * Optional guaranteed bounds of {@link Target.logDensity} over the closed
   * interval `[lower, upper]` (ends may be infinite): returns `[lo, hi]` with
   * `lo <= logDensity(x) <= hi` for every x in the interval. `lo` may be
   * `-Infinity`; `hi = +Infinity` means "no finite bound on this interval".
   * Methods that use it never trust it blindly: every point evaluation made
   * while sampling is still checked against the envelope built from it.
   */
  logDensityBounds?(lower: number, upper: number): readonly [number, number];
  /**
   * Optional guaranteed bounds of the derivative of {@link Target.logDensity}
   * over `[lower, upper]` (used to build exponential envelopes on infinite
   * cells and to prove monotonicity). Same conventions as
   * {@link Target.logDensityBounds}; `-Infinity`/`+Infinity` mean no bound.
   */
  dLogDensityBounds?(lower: number, upper: number): readonly [number, number];
  /**
   * Optional guaranteed bounds of the second derivative of
   * {@link Target.logDensity} over `[lower, upper]` (used to prove
   * log-concavity). Same conventions as {@link Target.logDensityBounds}.
   */
  d2LogDensityBounds?(lower: number, upper: number): readonly [number, number];
}

/**
 * Counters kept by every sampler. Read through {@link Sampler.stats}, which
 * returns a fresh snapshot on each access.
 */
export interface SamplerStats {
  /** Draws returned. */
  samples: number;
  /** Candidates generated (accepted or not). */
  proposals: number;
  /** Calls of `logDensity` made while sampling. */
  densityEvaluations: number;
  /** Calls of `logDensity` made while building the envelope. */
  setupEvaluations: number;
  /** `samples / proposals` (0 before the first proposal). */
  acceptanceRate: number;
}

/**
 * An exact random variate generator.
 */
export interface Sampler {
  /** Returns one draw from the target. */
  sample(): number;
  /** Fills `out` with independent draws and returns it. This is the fast path. */
  fill(out: Float64Array): Float64Array;
  /** Live snapshot of the sampler's counters. */
  readonly stats: SamplerStats;
}

/**
 * Options shared by every sampler factory.
 */
export interface SamplerOptions {
  /**
   * Seed of the default MT19937 source. Ignored when `uniform` is given.
   * @defaultValue a fixed default seed (5489, the MT19937 reference seed), so runs are reproducible by default
   */
  seed?: number;
  /**
   * Stream index: with it the sampler draws from its own
   * `substream(seed, stream)` (seed defaulting as above) instead of
   * `mersenneTwister(seed)`. The values are exactly those of
   * `substream(seed, stream)` called in order, so
   * `{ seed: s, stream: k }` and `{ uniform: substream(s, k) }` give the same
   * draws; the difference is ownership: a sampler that owns its source (from
   * `seed`, with or without `stream`) may read it in blocks, which is faster
   * for the table-driven fast path. An integer in [0, 2^53 − 1]; not
   * allowed together with `uniform`. Since 0.1.0.
   */
  stream?: number;
  /** A uniform source on [0, 1) to use instead of the default MT19937. */
  uniform?: Uniform;
}

/**
 * The stream handed to a sampler factory by {@link partitionedFill}, by
 * `fillParallel` and by the `exactdraw` command: the seed and stream index
 * of the `substream` that the factory's `uniform` argument is. Spread it into
 * a sampler's options (`{ ...own }`) to let the sampler own that stream
 * instead of calling `uniform` (same draws, see {@link SamplerOptions.stream}).
 */
export interface OwnedStream {
  /** Seed of the substream. */
  readonly seed: number;
  /** Index of the substream. */
  readonly stream: number;
}

/**
 * An easy-to-sample proposal distribution for rejection sampling.
 */
export interface Proposal {
  /** Draws one value using only the injected uniform source. */
  sample(u: Uniform): number;
  /** Normalized log-density of the proposal (`-Infinity` outside its support). */
  logDensity(x: number): number;
  /** Support `[lower, upper]` of the proposal. */
  readonly support: readonly [number, number];
}

/**
 * A distribution on the integers to draw from, described by its (possibly
 * unnormalized) log-probability-mass function.
 *
 * @remarks
 * Only {@link DiscreteTarget.logPmf} is required; it is called at integers
 * only. The support ends are integers or infinite; the default support is
 * `[0, Infinity]` (counts). `mode` is a hint (an integer inside the
 * support), verified by the sampler; `cdf` is used by checks only.
 *
 * @example
 * ```ts
 * import { discreteSampler, type DiscreteTarget } from 'exactdraw';
 * // an unnormalized Poisson(3.5) log-pmf: k ln 3.5 − ln k!
 * const lp: DiscreteTarget = {
 *   logPmf: (k) => { let s = k * Math.log(3.5); for (let i = 2; i <= k; i++) s -= Math.log(i); return s; },
 *   support: [0, Infinity],
 *   mode: 3,
 * };
 * discreteSampler(lp, { seed: 1 }).sample();
 * ```
 */
export interface DiscreteTarget {
  /** Unnormalized log-pmf at the integer k; `-Infinity` outside the support, never `NaN` or `+Infinity`. */
  logPmf(k: number): number;
  /** Support `[lower, upper]`: integers, `lower` may be `-Infinity` and `upper` may be `Infinity`; defaults to `[0, Infinity]`. */
  readonly support?: readonly [number, number];
  /** Optional integer location of a mode (a hint; it is verified). */
  readonly mode?: number;
  /** Optional normalized cdf P(X ≤ k), used by checks only. */
  cdf?(k: number): number;
  /**
   * Optional promise that the pmf is log-concave on its support (discrete
   * second differences of logPmf ≤ 0). With {@link DiscreteTarget.normalized}
   * and `mode` it lets {@link reusableDiscreteSampler} (and
   * `discreteSampler` with `method: 'log-concave-universal'`) draw with one
   * setup evaluation; a broken promise shows as an
   * {@link EnvelopeViolationError} where the sampler evaluates.
   */
  readonly logConcave?: boolean;
  /**
   * Optional promise that logPmf sums to at most 1 over the support (a
   * normalized pmf; a truncation of one also qualifies, though a small
   * remaining mass makes the universal hat slow).
   */
  readonly normalized?: boolean;
}

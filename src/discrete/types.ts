/**
 * Types of the discrete samplers.
 *
 * @packageDocumentation
 */
import type { Sampler, SamplerOptions } from '../core/types.js';

/**
 * An exact generator of integers. Like {@link Sampler}, and `fill` also
 * accepts an `Int32Array`.
 *
 * @example
 * ```ts
 * import { discreteSampler, poissonTarget } from 'exactdraw';
 * const s = discreteSampler(poissonTarget(4), { seed: 7 });
 * const counts = s.fill(new Int32Array(1000));
 * ```
 */
export interface DiscreteSampler extends Sampler {
  /** Returns one draw (an integer inside the support). */
  sample(): number;
  /**
   * Fills `out` with independent draws and returns it. An `Int32Array`
   * receives the integers directly; a draw outside the 32-bit range throws
   * {@link InvalidOptionError} (never a wrapped value).
   */
  fill<T extends Float64Array | Int32Array>(out: T): T;
}

/** Names of the discrete methods. */
export type DiscreteMethod = 'table' | 'log-concave-rejection' | 'ratio-of-uniforms' | 'log-concave-universal';

/** A method {@link discreteSampler} tried and refused. */
export interface DiscreteRefusal {
  /** The method refused. */
  readonly method: DiscreteMethod;
  /** Why (the message of the shape error). */
  readonly message: string;
}

/** The method {@link discreteSampler} picked, and why. */
export interface DiscreteChoice {
  /** The method used. */
  readonly method: DiscreteMethod;
  /** A sentence saying why, with the numbers that decided it. */
  readonly reason: string;
  /** Methods tried first and refused, with the refusal message. */
  readonly refused: readonly DiscreteRefusal[];
}

/** A {@link DiscreteSampler} built by {@link discreteSampler}. */
export interface ChosenDiscreteSampler extends DiscreteSampler {
  /** The method picked and why. */
  readonly choice: DiscreteChoice;
  /** The mode the sampler located (an integer). */
  readonly mode: number;
}

/** Options of {@link discreteSampler}. */
export interface DiscreteSamplerOptions extends SamplerOptions {
  /**
   * Force a method instead of choosing one. A forced method that does not
   * fit the target throws (the automatic choice would fall back instead).
   * @defaultValue `'auto'`
   */
  method?: DiscreteMethod | 'auto';
  /**
   * How many draws you expect to take from this sampler. A table costs one
   * logPmf evaluation per point at setup, so it is chosen for a
   * many-point support only when at least that many draws are expected;
   * a fresh target per draw (a Gibbs step) should leave the default.
   * @defaultValue 1
   */
  expectedDraws?: number;
  /**
   * Consecutive rejections before {@link StalledSamplerError}.
   * @defaultValue 1,000,000 (DEFAULT_MAX_REJECTIONS)
   */
  maxRejections?: number;
}

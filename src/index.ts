/**
 * exactdraw: exact random variate generation from log-densities.
 *
 * @packageDocumentation
 */
export type { Uniform, Target, SamplerStats, Sampler, SamplerOptions, Proposal } from './core/types.js';
export {
  ExactDrawError,
  InvalidTargetError,
  NonFiniteDensityError,
  ShapeViolationError,
  EnvelopeViolationError,
  ImproperDensityError,
  StalledSamplerError,
} from './core/errors.js';
export type { ExactDrawErrorCode } from './core/errors.js';
export { mersenneTwister, restoreMersenneTwister, DEFAULT_SEED } from './random/mersenne-twister.js';
export type { MersenneTwister, MersenneTwisterState } from './random/mersenne-twister.js';
export { substream } from './random/substream.js';
export { ksCheck } from './checks/ks.js';
export type { CheckResult } from './checks/ks.js';
export { andersonDarlingCheck } from './checks/anderson-darling.js';
export { chiSquareCheck } from './checks/chi-square.js';
export type { ChiSquareResult } from './checks/chi-square.js';

/**
 * Resolution of the uniform source of a sampler. @internal
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import { InvalidOptionError } from '../core/errors.js';
import { showValue } from '../core/validate.js';
import type { SamplerOptions, Uniform } from '../core/types.js';
import { DEFAULT_SEED, mersenneTwister } from './mersenne-twister.js';
import { substream } from './substream.js';

/**
 * Returns the uniform source selected by `opts`: the injected `uniform`
 * (wrapped so that a value outside [0, 1) throws instead of biasing draws), or
 * a fresh MT19937 seeded with `opts.seed`, or `substream(seed, opts.stream)`
 * when a stream index is given.
 * @internal
 */
export function resolveUniform(api: string, opts: SamplerOptions | undefined): Uniform {
  const given = opts?.uniform;
  if (given !== undefined) {
    if (typeof given !== 'function') {
      throw new InvalidOptionError(`${api}: options.uniform must be a function returning numbers in [0, 1), got ${typeof given}`);
    }
    if (opts?.seed !== undefined) {
      throw new InvalidOptionError(`${api}: give either options.seed or options.uniform, not both (seed = ${String(opts.seed)})`);
    }
    if (opts?.stream !== undefined) {
      throw new InvalidOptionError(`${api}: give either options.stream or options.uniform, not both (stream = ${String(opts.stream)})`);
    }
    return checkedUniform(api, given);
  }
  const seed = opts?.seed === undefined ? DEFAULT_SEED : opts.seed; // null is refused below, not taken for the default
  if (typeof seed !== 'number' || !Number.isInteger(seed) || seed < 0 || seed > Number.MAX_SAFE_INTEGER) {
    throw new InvalidOptionError(`${api}: options.seed must be an integer in [0, 2^53 - 1], got ${showValue(seed)}`);
  }
  const stream = opts?.stream;
  if (stream === undefined) return mersenneTwister(seed);
  if (typeof stream !== 'number' || !Number.isInteger(stream) || stream < 0 || stream > Number.MAX_SAFE_INTEGER) {
    throw new InvalidOptionError(`${api}: options.stream must be an integer in [0, 2^53 - 1], got ${showValue(stream)}`);
  }
  return substream(seed, stream);
}

/** Wraps an injected uniform so that values outside [0, 1) throw. @internal */
export function checkedUniform(api: string, u: Uniform): Uniform {
  return () => {
    const v = u();
    if (!(v >= 0 && v < 1)) {
      throw new InvalidOptionError(`${api}: options.uniform returned ${String(v)}; it must return numbers in [0, 1)`);
    }
    return v;
  };
}

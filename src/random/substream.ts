/**
 * Independent reproducible streams derived from (seed, index).
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import type { MersenneTwister } from './mersenne-twister.js';
import { generatorFromState, seededState } from './mersenne-twister.js';

const TWO32 = 4294967296;

/** MurmurHash3 32-bit finalizer (Appleby, public domain; common practice as an avalanche mixer). */
function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/**
 * The MT19937 `init_by_array` key used for substream `(seed, index)`.
 * Exposed so that other runtimes can reproduce a substream. @internal
 */
export function substreamKey(seed: number, index: number): number[] {
  const sLo = seed % TWO32;
  const sHi = Math.floor(seed / TWO32);
  const iLo = index % TWO32;
  const iHi = Math.floor(index / TWO32);
  // Domain tag 'exds' keeps substream keys disjoint from plain seeds.
  const tag = 0x65786473;
  const k0 = fmix32((sLo ^ tag) >>> 0);
  const k1 = fmix32((sHi + 0x9e3779b9) >>> 0);
  const k2 = fmix32((iLo ^ k0 ^ 0x7f4a7c15) >>> 0);
  const k3 = fmix32((iHi + k1 + 0x3c6ef372) >>> 0);
  return [k0, k1, k2, k3, sLo, sHi, iLo, iHi, tag];
}

/**
 * An independent, reproducible uniform stream derived from `(seed, index)` alone.
 *
 * @remarks
 * The stream is MT19937 initialised by `init_by_array` with a nine-word key:
 * four words from the MurmurHash3 finalizer applied to the 32-bit halves of
 * `seed` and `index` (chained so every key word depends on both), followed
 * by the raw halves and a domain tag. Distinct `(seed, index)` pairs give
 * distinct keys, and `init_by_array` spreads the key over all 624 state
 * words, so streams for neighbouring indices are not shifted copies of each
 * other. The derivation needs no shared state: worker `k` of any job engine
 * can call `substream(seed, k)` on its own machine and get the same stream.
 * Not cryptographically secure.
 *
 * @param seed - integer in [0, 2^53 − 1]
 * @param index - integer in [0, 2^53 − 1], e.g. a worker, replicate or chain number
 * @throws {@link InvalidTargetError} when `seed` or `index` is out of range
 * @example
 * ```ts
 * const chains = [0, 1, 2, 3].map((k) => substream(2026, k));
 * ```
 */
export function substream(seed: number, index: number): MersenneTwister {
  for (const [name, v] of [['seed', seed], ['index', index]] as const) {
    if (typeof v !== 'number' || !Number.isInteger(v) || v < 0 || v > Number.MAX_SAFE_INTEGER) {
      throw new InvalidTargetError(`substream: ${name} must be an integer in [0, 2^53 - 1], got ${String(v)}`);
    }
  }
  return generatorFromState(seededState(substreamKey(seed, index)));
}

/**
 * Seeded MT19937 uniform source with 53-bit resolution, wrapping
 * `@stdlib/random-base-mt19937`.
 *
 * @packageDocumentation
 */
import { mt19937Factory } from '../vendor/stdlib.js';
import type { StdlibMt19937 } from '../vendor/stdlib.js';
import { InvalidTargetError } from '../core/errors.js';
import type { Uniform } from '../core/types.js';

/** Default seed: 5489, the reference seed of MT19937 (ISO/IEC 14882:2011 [rand.predef]). */
export const DEFAULT_SEED = 5489;

const STATE_FORMAT = 'exactdraw/mt19937-state';
const MAX_SEED = Number.MAX_SAFE_INTEGER;
const TWO32 = 4294967296;

/**
 * A plain, JSON-safe snapshot of an MT19937 stream. Produced by
 * {@link MersenneTwister.saveState} and consumed by {@link restoreMersenneTwister}.
 */
export interface MersenneTwisterState {
  /** Format tag, always `'exactdraw/mt19937-state'`. */
  readonly format: typeof STATE_FORMAT;
  /** Format version (1). */
  readonly version: 1;
  /** The generator's internal state words (unsigned 32-bit integers). */
  readonly words: readonly number[];
}

/**
 * A seeded MT19937 uniform source on [0, 1) with 53-bit resolution
 * (two 32-bit outputs per draw).
 *
 * @remarks
 * MT19937 is a statistical generator: it is **not cryptographically secure**.
 */
export interface MersenneTwister extends Uniform {
  /** Returns the next raw 32-bit output (an unsigned integer). */
  readonly uint32: () => number;
  /** Saves the current state as a plain JSON-safe value. */
  saveState(): MersenneTwisterState;
}

type StdlibPrng = StdlibMt19937;

/** The raw state of each generator made here (a fresh copy per call), for the block reader. */
const RAW_STATE = new WeakMap<MersenneTwister, () => Uint32Array>();

/**
 * A copy of the raw @stdlib state array of `u` (the layout of
 * {@link MersenneTwisterState.words}), or undefined when `u` was not made by
 * this module. Cheaper than `saveState()` (no conversion to a plain array).
 * @internal
 */
export function rawStateOf(u: MersenneTwister): Uint32Array | undefined {
  const f = RAW_STATE.get(u);
  return f === undefined ? undefined : f();
}

/** Wraps an @stdlib MT19937 generator as a {@link MersenneTwister}. @internal */
export function wrapStdlibMt(prng: StdlibPrng): MersenneTwister {
  // The stdlib generator function itself is the uniform (no extra call per
  // draw); the exactdraw members are attached to it.
  const u = prng.normalized as unknown as MersenneTwister;
  Object.defineProperty(u, 'uint32', { value: () => prng(), enumerable: true });
  Object.defineProperty(u, 'saveState', {
    value: (): MersenneTwisterState => ({ format: STATE_FORMAT, version: 1, words: Array.from(prng.state) }),
    enumerable: true,
  });
  RAW_STATE.set(u, () => prng.state);
  return u;
}

/** Splits a safe integer seed into MT19937 seed material. @internal */
export function seedWords(seed: number): number | number[] {
  if (seed >= 1 && seed < TWO32) return seed;
  if (seed === 0) return [0, 0]; // [0] alone is refused by @stdlib; no other seed maps to [0, 0]
  return [seed % TWO32, Math.floor(seed / TWO32)];
}

/**
 * Creates a seeded MT19937 uniform source on [0, 1) with 53-bit resolution.
 *
 * @param seed - integer in [0, 2^53 − 1]; seeds in [1, 2^32 − 1] use the
 *   standard `init_genrand` initialisation, so seed 5489 reproduces the
 *   ISO C++ `mt19937` stream; other seeds use `init_by_array`.
 * @returns a uniform source with `uint32()` and `saveState()`
 * @throws {@link InvalidTargetError} when `seed` is not an integer in range
 * @defaultValue seed 5489
 * @example
 * ```ts
 * const u = mersenneTwister(42);
 * const x = u();              // in [0, 1)
 * const saved = u.saveState(); // JSON-safe
 * const v = restoreMersenneTwister(saved);
 * u() === v();                // true
 * ```
 * @remarks Not cryptographically secure. Since 0.1.0
 */
export function mersenneTwister(seed: number = DEFAULT_SEED): MersenneTwister {
  if (typeof seed !== 'number' || !Number.isInteger(seed) || seed < 0 || seed > MAX_SEED) {
    throw new InvalidTargetError(`mersenneTwister: seed must be an integer in [0, 2^53 - 1], got ${String(seed)}`);
  }
  const prng = mt19937Factory({ seed: seedWords(seed), copy: true });
  return wrapStdlibMt(prng);
}

/**
 * Recreates an MT19937 source from a state saved by
 * {@link MersenneTwister.saveState}; it continues the saved stream exactly.
 *
 * @param state - a saved state (possibly after a JSON round trip)
 * @throws {@link InvalidTargetError} when the state is malformed
 */
export function restoreMersenneTwister(state: MersenneTwisterState): MersenneTwister {
  const s = state as Partial<MersenneTwisterState> | null;
  if (s === null || typeof s !== 'object' || s.format !== STATE_FORMAT || !Array.isArray(s.words)) {
    const f = s !== null && typeof s === 'object' ? s.format : undefined;
    throw new InvalidTargetError(`restoreMersenneTwister: state is not an exactdraw MT19937 state (format ${typeof f === 'string' ? `'${f}'` : String(f)}, expected '${STATE_FORMAT}' with a words array)`);
  }
  if (s.version !== 1) {
    throw new InvalidTargetError(`restoreMersenneTwister: state version ${typeof s.version === 'string' ? `'${s.version}'` : String(s.version)} is not supported by this exactdraw (it reads version 1)`);
  }
  const expected = mt19937Factory({ seed: 1, copy: true }).state.length;
  if (s.words.length !== expected) {
    throw new InvalidTargetError(`restoreMersenneTwister: state.words has ${s.words.length} words, expected ${expected} (a truncated or edited state)`);
  }
  const words = s.words;
  for (let i = 0; i < words.length; i++) {
    const w = words[i];
    if (typeof w !== 'number' || !Number.isInteger(w) || w < 0 || w >= TWO32) {
      throw new InvalidTargetError(`restoreMersenneTwister: state.words[${i}] must be an unsigned 32-bit integer, got ${String(w)}`);
    }
  }
  let prng: StdlibPrng;
  try {
    prng = mt19937Factory({ state: new Uint32Array(words), copy: true });
  } catch (e) {
    void e; // the bundled generator's own message names its internals, not this API
    throw new InvalidTargetError('restoreMersenneTwister: state.words is not a valid MT19937 state (its header words do not match; a state edited by hand?)');
  }
  return wrapStdlibMt(prng);
}

/**
 * Seeded MT19937 uniform source with 53-bit resolution: the reference
 * generator of Matsumoto & Nishimura (1998), `init_genrand` and
 * `init_by_array` seeding, written here over one `Uint32Array`.
 *
 * @remarks
 * The state array has the layout of `@stdlib/random-base-mt19937`'s state
 * (| version 1 | 3 sections | 624 | 624 words | 1 | index | seed length | seed words |),
 * so states saved by earlier versions (which wrapped that package) restore
 * here and the reverse. The package stays in the project as the test oracle:
 * test/random/mt19937-oracle.test.ts checks this generator against it output
 * for output over many seeds, keys and saved states. Own code because the
 * package's state serialisation pulls complex-number array packages into
 * every bundle (about 60 KB minified).
 *
 * @packageDocumentation
 */
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

const N = 624;
const TWO_26 = 67108864;
const TWO_M53 = 1 / 9007199254740992;
/** | version | sections | 624 | ...state | 1 | index | seed length | ...seed | */
const STATE_OFFSET = 3;
const INDEX_OFFSET = N + 4;
const SEED_LENGTH_OFFSET = N + 5;
const FIXED_LENGTH = N + 6;

/** The raw state of each generator made here (a fresh copy per call), for the block reader. */
const RAW_STATE = new WeakMap<MersenneTwister, () => Uint32Array>();

/**
 * A copy of the raw state array of `u` (the layout of
 * {@link MersenneTwisterState.words}), or undefined when `u` was not made by
 * this module. Cheaper than `saveState()` (no conversion to a plain array).
 * @internal
 */
export function rawStateOf(u: MersenneTwister): Uint32Array | undefined {
  const f = RAW_STATE.get(u);
  return f === undefined ? undefined : f();
}

/** MT19937's tempering of one state word (as an int32; `>>> 0` makes it the 32-bit output). @internal */
export function temper(y: number): number {
  y ^= y >>> 11;
  y ^= (y << 7) & 0x9d2c5680;
  y ^= (y << 15) & 0xefc60000;
  return y ^ (y >>> 18);
}

/**
 * The MT19937 state transition (Matsumoto & Nishimura 1998), in place on the
 * 624 words, viewed as an Int32Array (the same bits as the unsigned words:
 * shifts and masks give the same results, and `>>>` yields the unsigned
 * values; the engine keeps every word in a register as a 32-bit integer).
 * The constants (N = 624, M = 397, the masks, MATRIX_A = 0x9908b0df) are
 * literals: the bundle turns module constants into `var`s, which the engine
 * reloads on every use. Shared by the generator and the block generator of
 * uniform-block.ts. @internal
 */
export function twist(mt: Int32Array): void {
  let kk = 0;
  for (; kk < 227; kk++) twistWord(mt, kk, kk + 1, kk + 397);
  for (; kk < 623; kk++) twistWord(mt, kk, kk + 1, kk - 227);
  twistWord(mt, 623, 0, 396);
}

/**
 * One word of the MT19937 state transition, in place: word `kk` from its own
 * upper bit, the lower bits of word `next` and word `far` (M = 397 ahead,
 * cyclically). Returns the new word. Used by {@link twist} and by the block
 * generator of uniform-block.ts (small enough for the engine to inline). @internal
 */
export function twistWord(mt: Int32Array, kk: number, next: number, far: number): number {
  const y = (mt[kk] & 0x80000000) | (mt[next] & 0x7fffffff);
  const w = mt[far] ^ (y >>> 1) ^ (-(y & 1) & 0x9908b0df);
  mt[kk] = w;
  return w;
}

/** `init_genrand(s)` on the 624 words (Matsumoto & Nishimura's reference seeding). */
function initGenrand(mt: Uint32Array, s: number): void {
  mt[0] = s >>> 0;
  for (let i = 1; i < N; i++) {
    const p = mt[i - 1] ^ (mt[i - 1] >>> 30);
    mt[i] = (Math.imul(p, 1812433253) + i) >>> 0;
  }
}

/** `init_by_array(key)` on the 624 words (the reference seeding by a key of 32-bit words). */
function initByArray(mt: Uint32Array, key: ArrayLike<number>): void {
  initGenrand(mt, 19650218);
  let i = 1;
  let j = 0;
  for (let k = Math.max(N, key.length); k > 0; k--) {
    const p = mt[i - 1] ^ (mt[i - 1] >>> 30);
    mt[i] = ((mt[i] ^ Math.imul(p, 1664525)) + key[j] + j) >>> 0;
    i++;
    j++;
    if (i >= N) {
      mt[0] = mt[N - 1];
      i = 1;
    }
    if (j >= key.length) j = 0;
  }
  for (let k = N - 1; k > 0; k--) {
    const p = mt[i - 1] ^ (mt[i - 1] >>> 30);
    mt[i] = ((mt[i] ^ Math.imul(p, 1566083941)) - i) >>> 0;
    i++;
    if (i >= N) {
      mt[0] = mt[N - 1];
      i = 1;
    }
  }
  mt[0] = 0x80000000;
}

/** A fresh state array seeded by one word (`init_genrand`) or by a key of two or more words (`init_by_array`). @internal */
export function seededState(seed: number | ArrayLike<number>): Uint32Array {
  const key = typeof seed === 'number' ? null : seed;
  const len = key === null ? 1 : key.length;
  const state = new Uint32Array(FIXED_LENGTH + len);
  state[0] = 1;
  state[1] = 3;
  state[2] = N;
  state[N + 3] = 1;
  state[INDEX_OFFSET] = N;
  state[SEED_LENGTH_OFFSET] = len;
  const mt = state.subarray(STATE_OFFSET, STATE_OFFSET + N);
  if (key === null) {
    state[FIXED_LENGTH] = seed as number;
    initGenrand(mt, seed as number);
  } else {
    state.set(key, FIXED_LENGTH);
    initByArray(mt, key);
  }
  return state;
}

/** The generator over a state array (owned: nothing else may hold it). @internal */
export function generatorFromState(state: Uint32Array): MersenneTwister {
  const mt = state.subarray(STATE_OFFSET, STATE_OFFSET + N);
  const words = new Int32Array(state.buffer, state.byteOffset + STATE_OFFSET * 4, N);
  let i = state[INDEX_OFFSET];
  const uint32 = (): number => {
    if (i >= N) {
      twist(words);
      i = 0;
    }
    return temper(words[i++]) >>> 0;
  };
  // ((a >> 5)·2^26 + (b >> 6))/2^53 for two consecutive outputs a, b (as @stdlib's normalized()).
  const u = ((): number => (((uint32() >>> 5) * TWO_26 + (uint32() >>> 6)) * TWO_M53)) as MersenneTwister;
  const copy = (): Uint32Array => {
    state[INDEX_OFFSET] = i;
    return state.slice();
  };
  Object.defineProperty(u, 'uint32', { value: uint32, enumerable: true });
  Object.defineProperty(u, 'saveState', {
    value: (): MersenneTwisterState => ({ format: STATE_FORMAT, version: 1, words: Array.from(copy()) }),
    enumerable: true,
  });
  RAW_STATE.set(u, copy);
  return u;
}

/** Splits a safe integer seed into MT19937 seed material. @internal */
export function seedWords(seed: number): number | number[] {
  if (seed >= 1 && seed < TWO32) return seed;
  if (seed === 0) return [0, 0]; // kept from the @stdlib-backed version, which refused the key [0]; no other seed maps to [0, 0]
  return [seed % TWO32, Math.floor(seed / TWO32)];
}

/** The problem with a state array, or null when it has the layout above. */
function stateProblem(s: Uint32Array): string | null {
  if (s.length < FIXED_LENGTH + 1) return `state.words has ${s.length} words, at least ${FIXED_LENGTH + 1} are needed`;
  if (s[0] !== 1) return `words[0] (schema version) is ${s[0]}, expected 1`;
  if (s[1] !== 3) return `words[1] (section count) is ${s[1]}, expected 3`;
  if (s[2] !== N) return `words[2] (state length) is ${s[2]}, expected ${N}`;
  if (s[N + 3] !== 1) return `words[${N + 3}] (section length) is ${s[N + 3]}, expected 1`;
  if (s[INDEX_OFFSET] > N) return `words[${INDEX_OFFSET}] (state index) is ${s[INDEX_OFFSET]}, expected at most ${N}`;
  if (s[SEED_LENGTH_OFFSET] !== s.length - FIXED_LENGTH) return `words[${SEED_LENGTH_OFFSET}] (seed length) is ${s[SEED_LENGTH_OFFSET]}, expected ${s.length - FIXED_LENGTH}`;
  return null;
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
  return generatorFromState(seededState(seedWords(seed)));
}

/**
 * Recreates an MT19937 source from a state saved by
 * {@link MersenneTwister.saveState}; it continues the saved stream exactly.
 *
 * @param state - a saved state (possibly after a JSON round trip)
 * @returns a source that continues the saved stream
 * @throws {@link InvalidTargetError} when the state is malformed
 * @example
 * ```ts
 * const u = mersenneTwister(7);
 * const saved = JSON.stringify(u.saveState()); // e.g. written to a checkpoint file
 * const v = restoreMersenneTwister(JSON.parse(saved));
 * v() === u(); // true
 * ```
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
  const words = s.words;
  for (let i = 0; i < words.length; i++) {
    const w = words[i];
    if (typeof w !== 'number' || !Number.isInteger(w) || w < 0 || w >= TWO32) {
      throw new InvalidTargetError(`restoreMersenneTwister: state.words[${i}] must be an unsigned 32-bit integer, got ${String(w)}`);
    }
  }
  const raw = new Uint32Array(words);
  const problem = stateProblem(raw);
  if (problem !== null) throw new InvalidTargetError(`restoreMersenneTwister: state rejected (${problem}; a truncated or edited state)`);
  return generatorFromState(raw);
}

/**
 * `@stdlib/random-base-mt19937` (not bundled: the library's generator is its
 * own, src/random/mersenne-twister.ts; this package is the test oracle). @internal
 *
 * @packageDocumentation
 */
import mt19937Impl from '@stdlib/random-base-mt19937';

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

/**
 * The shared method suite: the checks every sampler must pass, written once
 * and run for every method from a `(seed) => Sampler` (test/methods/shared/methods.test.ts).
 *
 * - fit: KS and Anderson–Darling accept n draws at ALPHA, and the biased
 *   twin (the same method on a slightly wrong target) is rejected at the same n;
 * - stream: the first draws at seed 5489 (a regression guard: recorded from the
 *   build before the refactor of issue 15, not a correctness check);
 * - reproducibility: same seed, same draws; `sample()` one at a time and
 *   `fill()` give the same stream; `{ seed, stream }` equals
 *   `{ uniform: substream(seed, stream) }`;
 * - errors: `fill` of a non-Float64Array and an unknown option are typed
 *   errors naming the API.
 */
import { describe, expect, it } from 'vitest';
import { ExactDrawError, substream } from '../../src/index.js';
import type { Sampler, Uniform } from '../../src/index.js';
import { expectFits, expectRejects } from './statistical.js';

/** Options a suite case passes to its factory. */
export interface SuiteOptions {
  seed?: number;
  stream?: number;
  uniform?: Uniform;
  [unknownOption: string]: unknown;
}

/** One method under the shared suite. */
export interface MethodCase {
  /** Name of the public API (as it appears in error messages). */
  readonly api: string;
  /** Label of the case (method and target). */
  readonly label: string;
  /** The sampler for `cdf`, built with the given options. */
  readonly make: (options: SuiteOptions) => Sampler;
  /** The same method on a biased target (the twin). */
  readonly biased: (seed: number) => Sampler;
  /** The target's normalized cdf (an independent reference, source named by the caller). */
  readonly cdf: (x: number) => number;
  /** Draws of the fit test and of its twin. */
  readonly n: number;
  /** Regression guard: the first five draws of make({ seed: 5489 }). */
  readonly firstDraws: readonly number[];
}

/** Registers the shared checks for one method. */
export function methodSuite(c: MethodCase): void {
  describe(`${c.label} (shared method suite)`, () => {
    it(`fits at n = ${c.n}; its biased twin is rejected at the same n`, () => {
      expectFits(c.make({ seed: 20261202 }).fill(new Float64Array(c.n)), c.cdf, c.label);
      expectRejects(c.biased(20261202).fill(new Float64Array(c.n)), c.cdf, `${c.label} (biased twin)`);
    });

    it('stream regression guard: the first five draws at seed 5489 are those recorded before the refactor', () => {
      expect(Array.from(c.make({ seed: 5489 }).fill(new Float64Array(5)))).toEqual(c.firstDraws);
    });

    it('same seed, same draws; sample() and fill() give one stream; { seed, stream } is { uniform: substream(seed, stream) }', () => {
      const a = c.make({ seed: 11 }).fill(new Float64Array(300));
      const b = c.make({ seed: 11 }).fill(new Float64Array(300));
      const other = c.make({ seed: 12 }).fill(new Float64Array(300));
      expect(Array.from(a)).toEqual(Array.from(b));
      expect(Array.from(a)).not.toEqual(Array.from(other));
      const s = c.make({ seed: 11 });
      const mixed: number[] = [];
      for (let i = 0; i < 100; i++) mixed.push(s.sample());
      mixed.push(...s.fill(new Float64Array(150)));
      for (let i = 0; i < 50; i++) mixed.push(s.sample());
      expect(mixed).toEqual(Array.from(a));
      const owned = c.make({ seed: 7, stream: 3 }).fill(new Float64Array(300));
      const injected = c.make({ uniform: substream(7, 3) }).fill(new Float64Array(300));
      expect(Array.from(owned)).toEqual(Array.from(injected));
    });

    it('errors: fill of a non-Float64Array and an unknown option are typed errors naming the API', () => {
      const s = c.make({ seed: 1 });
      expect(() => s.fill([0, 0] as unknown as Float64Array)).toThrow(ExactDrawError);
      expect(() => s.fill([0, 0] as unknown as Float64Array)).toThrow(`${c.api}.fill: out must be a Float64Array`);
      expect(() => c.make({ seed: 1, bogusOption: 1 })).toThrow(ExactDrawError);
      expect(() => c.make({ seed: 1, bogusOption: 1 })).toThrow(`${c.api}: unknown option 'bogusOption'`);
      // a sampler that threw on a bad fill argument still draws
      expect(Number.isFinite(s.sample())).toBe(true);
    });
  });
}

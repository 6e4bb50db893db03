/**
 * The shared method suite: the checks every sampler must pass, written once
 * and registered for every method and target from a description
 * ({@link MethodSuiteCase}), instead of copied fit/twin pairs.
 *
 * - fit: KS and Anderson–Darling accept n draws of `make(seed)` at ALPHA =
 *   1e-4 (test/helpers/statistical.ts, where the suite-wide false-positive
 *   rate is stated beside it: at most about 4.4 % per fresh choice of all
 *   seeds, by the union bound), and the deliberately biased twin is rejected by the
 *   same checks at the same n;
 * - stream (unless `stream: false`): same seed, same draws; different seeds,
 *   different draws; `sample()` one at a time and `fill()` give one stream;
 * - snapshot (optional): the first draws at a seed, recorded from the
 *   implementation (a regression guard under the stream-stability policy,
 *   not a correctness check);
 * - options (optional): `{ seed, stream }` equals `{ uniform: substream(seed, stream) }`,
 *   and `fill` of a non-Float64Array and an unknown option are typed errors
 *   naming the API;
 * - errors (optional): each listed bad input throws its typed error and message.
 *
 * Each case registers its own `describe` block, so a failure names the
 * method, the target and the check.
 */
import { describe, expect, it } from 'vitest';
import { ExactDrawError, substream } from '../../src/index.js';
import type { Sampler, Uniform } from '../../src/index.js';
import { draw, expectFits, expectInSupport, expectRejects } from './statistical.js';

/** Options a case's `options.make` receives. */
export interface SuiteOptions {
  seed?: number;
  stream?: number;
  uniform?: Uniform;
  [unknownOption: string]: unknown;
}

/** Anything that fills a Float64Array with draws (a sampler, or a hand-written biased generator). */
export interface Fills {
  fill(out: Float64Array): Float64Array;
}

/** A bad input and the typed error it must raise. */
export interface SuiteError {
  /** What is wrong (the test name). */
  readonly name: string;
  /** Builds or draws with the bad input. */
  readonly run: () => unknown;
  /** The error class (ExactDrawError or a subclass). */
  readonly error: abstract new (...args: never[]) => Error;
  /** Text or pattern of the message (naming the API, the parameter and the value). */
  readonly message: string | RegExp;
}

/** One method on one target under the shared suite. */
export interface MethodSuiteCase<S extends Sampler = Sampler> {
  /** Label (method, target and options), used in test names and messages. */
  readonly name: string;
  /** The sampler under test, seeded. */
  readonly make: (seed: number) => S;
  /** Further checks on the fit test's sampler before its draws (setup results). */
  readonly beforeFit?: (sampler: S) => void;
  /** Further checks on the fit test's sampler and its n draws (after `map`) once they are drawn (acceptance rate, envelope, …). */
  readonly afterFit?: (sampler: S, draws: Float64Array) => void;
  /** The deliberately biased twin (the same method on a slightly wrong target, or a wrong generator), seeded. */
  readonly biased: (seed: number) => Fills;
  /** The target's normalized cdf: an independent reference, source named by the caller. */
  readonly cdf: (x: number) => number;
  /** Draws of the fit test and of its twin. */
  readonly n: number;
  /** Seed of the fit test (fixed; never changed to make a test pass). */
  readonly seed: number;
  /** Seed of the twin (default: `seed`). */
  readonly twinSeed?: number;
  /** The cdf the twin's draws are tested against (default: `cdf`). */
  readonly twinCdf?: (x: number) => number;
  /** Every fit draw (after `map`) must lie in this closed interval. */
  readonly support?: readonly [number, number];
  /** Transform of the draws before the fit test (e.g. exp of draws made on a log scale). */
  readonly map?: (x: number) => number;
  /** Register the stream checks (default true). */
  readonly stream?: boolean;
  /** Regression guard: the first draws of make(seed). */
  readonly snapshot?: { readonly seed: number; readonly draws: readonly number[] };
  /** The option checks: the API name in messages and a factory taking options. */
  readonly options?: { readonly api: string; readonly make: (options: SuiteOptions) => Sampler };
  /** Bad inputs and their typed errors. */
  readonly errors?: readonly SuiteError[];
}

/**
 * A hand-written generator (a proposal on its uniform source, reference draws,
 * an engine's kernel called directly) as a {@link Sampler} for the suite:
 * `fill` is the generator, `sample()` fills one value; `stats` counts samples only.
 */
export function generatorSampler(fill: (out: Float64Array) => void): Sampler {
  const stats = { samples: 0, proposals: 0, densityEvaluations: 0, setupEvaluations: 0, acceptanceRate: 0 };
  const one = new Float64Array(1);
  return {
    sample(): number {
      fill(one);
      stats.samples++;
      return one[0];
    },
    fill(out: Float64Array): Float64Array {
      fill(out);
      stats.samples += out.length;
      return out;
    },
    stats,
  };
}

/** Draws n values of a sampler or generator with `fill`. */
function fillN(source: Fills, n: number): Float64Array {
  return source.fill(new Float64Array(n));
}

/** Registers the shared checks for one method on one target. */
export function methodSuite<S extends Sampler>(c: MethodSuiteCase<S>): void {
  describe(`${c.name} (method suite)`, () => {
    it(`fits at n = ${c.n} (seed ${c.seed}); its biased twin is rejected at the same n`, () => {
      const sampler = c.make(c.seed);
      if (c.beforeFit !== undefined) c.beforeFit(sampler);
      let xs = draw(sampler, c.n);
      if (c.map !== undefined) xs = xs.map(c.map);
      if (c.support !== undefined) expectInSupport(xs, c.support[0], c.support[1]);
      expectFits(xs, c.cdf, c.name);
      if (c.afterFit !== undefined) c.afterFit(sampler, xs);
      let ys = fillN(c.biased(c.twinSeed ?? c.seed), c.n);
      if (c.map !== undefined) ys = ys.map(c.map);
      expectRejects(ys, c.twinCdf ?? c.cdf, `${c.name} (biased twin)`);
    });

    if (c.stream !== false) {
      it('same seed, same draws; different seeds differ; sample() and fill() give one stream', () => {
        const a = draw(c.make(11), 300);
        expect(Array.from(draw(c.make(11), 300))).toEqual(Array.from(a));
        expect(Array.from(draw(c.make(12), 300))).not.toEqual(Array.from(a));
        const s = c.make(11);
        const mixed: number[] = [];
        for (let i = 0; i < 100; i++) mixed.push(s.sample());
        mixed.push(...draw(s, 150));
        for (let i = 0; i < 50; i++) mixed.push(s.sample());
        expect(mixed).toEqual(Array.from(a));
      });
    }

    const snap = c.snapshot;
    if (snap !== undefined) {
      it(`stream regression guard: the first ${snap.draws.length} draws at seed ${snap.seed} are the recorded ones`, () => {
        expect(Array.from(draw(c.make(snap.seed), snap.draws.length))).toEqual(snap.draws);
      });
    }

    const o = c.options;
    if (o !== undefined) {
      it(`{ seed, stream } is { uniform: substream(seed, stream) }; bad fill argument and unknown option are typed errors naming ${o.api}`, () => {
        const owned = o.make({ seed: 7, stream: 3 }).fill(new Float64Array(300));
        const injected = o.make({ uniform: substream(7, 3) }).fill(new Float64Array(300));
        expect(Array.from(owned)).toEqual(Array.from(injected));
        const s = o.make({ seed: 1 });
        expect(() => s.fill([0, 0] as unknown as Float64Array)).toThrow(ExactDrawError);
        expect(() => s.fill([0, 0] as unknown as Float64Array)).toThrow(`${o.api}.fill: out must be a Float64Array`);
        expect(() => o.make({ seed: 1, bogusOption: 1 })).toThrow(ExactDrawError);
        expect(() => o.make({ seed: 1, bogusOption: 1 })).toThrow(`${o.api}: unknown option 'bogusOption'`);
        // a sampler that threw on a bad fill argument still draws
        expect(Number.isFinite(s.sample())).toBe(true);
      });
    }

    for (const e of c.errors ?? []) {
      it(`error: ${e.name}`, () => {
        expect(e.run).toThrow(e.error);
        expect(e.run).toThrow(e.message);
      });
    }
  });
}

/** Registers {@link methodSuite} for each case under one heading. */
export function methodSuites<S extends Sampler>(title: string, cases: readonly MethodSuiteCase<S>[]): void {
  describe(title, () => {
    for (const c of cases) methodSuite(c);
  });
}

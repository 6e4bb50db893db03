/**
 * The own MT19937 (src/random/mersenne-twister.ts) against the oracle
 * `@stdlib/random-base-mt19937` (an independent implementation of the same
 * reference generator): output for output over many seeds, seed keys and
 * saved states, with saved-state round trips in both directions.
 */
import { describe, expect, it } from 'vitest';
import { mersenneTwister, restoreMersenneTwister, substream } from '../../src/index.js';
import type { MersenneTwisterState } from '../../src/index.js';
import { seedWords } from '../../src/random/mersenne-twister.js';
import { substreamKey } from '../../src/random/substream.js';
import { mt19937Factory } from '../../src/vendor/stdlib.js';
import type { StdlibMt19937 } from '../../src/vendor/stdlib.js';

const asState = (words: ArrayLike<number>): MersenneTwisterState => ({ format: 'exactdraw/mt19937-state', version: 1, words: Array.from(words) });

/** Number of positions where the two streams differ over n raw outputs and n uniforms. */
function mismatches(own: { uint32: () => number; (): number }, oracle: StdlibMt19937, n: number): number {
  let bad = 0;
  for (let i = 0; i < n; i++) {
    if (own.uint32() !== oracle()) bad++;
    if (own() !== oracle.normalized()) bad++;
  }
  return bad;
}

/** Seeds spread over [0, 2^53 - 1] by a fixed LCG (plus the edges). */
function seeds(count: number): number[] {
  const out = [0, 1, 2, 5489, 2 ** 31, 2 ** 32 - 1, 2 ** 32, 2 ** 32 + 1, 2 ** 53 - 1];
  let x = 12345;
  while (out.length < count) {
    x = (Math.imul(x, 1103515245) + 12345) >>> 0;
    out.push(out.length % 2 === 0 ? x : x * 2097151 + (x % 997)); // 32-bit and wider seeds
  }
  return out;
}

describe('own MT19937 matches @stdlib/random-base-mt19937', () => {
  it('mersenneTwister(seed): the same raw outputs and uniforms as the oracle over 200 seeds (1,300 outputs each, across two twists)', () => {
    let bad = 0;
    for (const s of seeds(200)) {
      const w = seedWords(s);
      bad += mismatches(mersenneTwister(s), mt19937Factory({ seed: w, copy: true }), 650);
    }
    expect(bad).toBe(0);
  });

  it('substream(seed, k): the oracle seeded with the same nine-word key gives the same stream (100 pairs)', () => {
    let bad = 0;
    for (const [j, s] of seeds(25).entries()) {
      for (const k of [0, 1, j + 2, 2 ** 53 - 1]) bad += mismatches(substream(s, k), mt19937Factory({ seed: substreamKey(s, k), copy: true }), 400);
    }
    expect(bad).toBe(0);
  });

  it('a state saved here restores in the oracle, and an oracle state restores here, at every position of a block', () => {
    let bad = 0;
    for (const skip of [0, 1, 2, 311, 312, 313, 623, 624, 625, 777, 1247, 1248]) {
      for (const s of [5489, 2 ** 40 + 7]) {
        // own -> oracle
        const own = mersenneTwister(s);
        for (let i = 0; i < skip; i++) own.uint32();
        const saved = JSON.parse(JSON.stringify(own.saveState())) as MersenneTwisterState;
        bad += mismatches(own, mt19937Factory({ state: new Uint32Array(saved.words), copy: true }), 700);
        // oracle -> own
        const oracle = mt19937Factory({ seed: seedWords(s), copy: true });
        for (let i = 0; i < skip; i++) oracle();
        const words = oracle.state;
        const mine = restoreMersenneTwister(asState(words));
        bad += mismatches(mine, oracle, 700);
        // and the saved words are the oracle's, word for word
        const o2 = mt19937Factory({ seed: seedWords(s), copy: true });
        const m2 = mersenneTwister(s);
        for (let i = 0; i < skip; i++) bad += o2() === m2.uint32() ? 0 : 1;
        expect(m2.saveState().words).toEqual(Array.from(o2.state));
      }
    }
    expect(bad).toBe(0);
  });

  it('twin: the comparison sees a one-bit change of the state (so the checks above can fail)', () => {
    const oracle = mt19937Factory({ seed: 5489, copy: true });
    const words = Array.from(oracle.state);
    words[3 + 100] ^= 1; // flip one bit of state word 100
    expect(mismatches(restoreMersenneTwister(asState(words)), oracle, 700)).toBeGreaterThan(0);
  });

  it('restoreMersenneTwister refuses a state whose layout the oracle also refuses (wrong version, wrong seed length)', () => {
    const good = mersenneTwister(3).saveState().words;
    const badVersion = [2, ...good.slice(1)];
    const badSeedLength = [...good.slice(0, 629), 5, ...good.slice(630)];
    for (const w of [badVersion, badSeedLength]) {
      expect(() => mt19937Factory({ state: new Uint32Array(w), copy: true })).toThrow();
      expect(() => restoreMersenneTwister(asState(w))).toThrow(/restoreMersenneTwister: state rejected/);
    }
  });
});

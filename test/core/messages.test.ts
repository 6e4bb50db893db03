/**
 * Error codes and messages: options get INVALID_OPTION, messages name the
 * public API the user called, strings are quoted, seed: null is refused.
 */
import { describe, expect, it } from 'vitest';
import {
  InvalidOptionError,
  InvalidTargetError,
  StalledSamplerError,
  exactSampler,
  mersenneTwister,
  normalTarget,
  partitionedFill,
  rejectionSampler,
  restoreMersenneTwister,
  tableSampler,
  uniformProposal,
} from '../../src/index.js';
import type { MersenneTwisterState } from '../../src/index.js';

const caught = (f: () => unknown): Error => {
  try {
    f();
  } catch (e) {
    return e as Error;
  }
  throw new Error('did not throw');
};

describe('error codes and messages', () => {
  it('option errors carry INVALID_OPTION; target errors keep INVALID_TARGET', () => {
    const o = caught(() => exactSampler(normalTarget(0, 1), { sed: 5 } as never));
    expect(o).toBeInstanceOf(InvalidOptionError);
    expect((o as InvalidOptionError).code).toBe('INVALID_OPTION');
    expect(o.message).toMatch(/^exactSampler: unknown option 'sed' \(known: .*'seed'/);
    const t = caught(() => normalTarget(0, -1));
    expect(t).toBeInstanceOf(InvalidTargetError);
    expect((t as InvalidTargetError).code).toBe('INVALID_TARGET');
  });

  it("strings are quoted: got '42', not got 42", () => {
    expect(caught(() => tableSampler(normalTarget(0, 1), { strips: '42' as never })).message).toContain("got '42'");
    expect(caught(() => normalTarget('42' as never, 1)).message).toContain("got '42'");
    // twin: a number is shown bare
    expect(caught(() => tableSampler(normalTarget(0, 1), { strips: 1 })).message).toContain('got 1');
  });

  it('seed: null is refused, not taken for the default seed 5489', () => {
    const e = caught(() => tableSampler(normalTarget(0, 1), { seed: null as never }));
    expect(e).toBeInstanceOf(InvalidOptionError);
    expect(e.message).toContain('options.seed must be an integer in [0, 2^53 - 1], got null');
    // twin: no seed at all is the documented default 5489
    const a = tableSampler(normalTarget(0, 1)).fill(new Float64Array(5));
    const b = tableSampler(normalTarget(0, 1), { seed: 5489 }).fill(new Float64Array(5));
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('messages name the API the user called: exactSampler.fill, partitionedFill', () => {
    const s = exactSampler(normalTarget(0, 1), { seed: 1 });
    const f = caught(() => s.fill([] as never));
    expect(f).toBeInstanceOf(InvalidTargetError);
    expect(f.message).toMatch(/^exactSampler\.fill: out must be a Float64Array/);
    const p = caught(() => partitionedFill((u) => tableSampler(normalTarget(0, 1), { uniform: u }), new Float64Array(4), 2, -1));
    expect(p.message).toBe('partitionedFill: seed must be an integer in [0, 2^53 - 1], got -1');
  });

  it('a stall names options.maxRejections', () => {
    // invented: a target with mass only in [0.999, 1] under a uniform proposal on [0, 1] with a loose bound
    const t = { logDensity: (x: number) => (x >= 0.999 && x <= 1 ? 0 : -Infinity), support: [0, 1] as const };
    const e = caught(() => rejectionSampler(t, { proposal: uniformProposal(0, 1), logBound: 5, maxRejections: 3, seed: 1 }).fill(new Float64Array(10)));
    expect(e).toBeInstanceOf(StalledSamplerError);
    expect(e.message).toContain('3 consecutive rejections, the limit options.maxRejections');
  });

  it('restoring a state names the version, a truncated state says so (not the bundled generator)', () => {
    const saved = mersenneTwister(3).saveState();
    expect(caught(() => restoreMersenneTwister({ ...saved, version: 2 } as unknown as MersenneTwisterState)).message).toBe(
      'restoreMersenneTwister: state version 2 is not supported by this exactdraw (it reads version 1)',
    );
    const cut = caught(() => restoreMersenneTwister({ ...saved, words: saved.words.slice(0, 100) }));
    expect(cut.message).toContain(`state.words has 100 words, at least ${624 + 7} are needed; a truncated or edited state`); // 624 words of MT19937 state (Matsumoto & Nishimura 1998) plus the format's 6 fixed words and at least one seed word
    expect(caught(() => restoreMersenneTwister({ format: 'other' } as never)).message).toContain("format 'other'");
    // twin: the intact state restores
    expect(restoreMersenneTwister(saved)()).toBe(mersenneTwister(3)());
  });
});

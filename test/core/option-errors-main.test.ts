/**
 * Option errors of the factories added after issue 16 was started (discrete
 * samplers, the discrete chi-square check, certified envelopes, poleAt,
 * envelopeSvg): unknown keys and bad values are InvalidOptionError
 * (code 'INVALID_OPTION') naming the API, the option and the value; bad
 * arguments stay InvalidTargetError (the twin of each option check).
 */
import { describe, expect, it } from 'vitest';
import {
  InvalidOptionError,
  InvalidTargetError,
  adaptiveRejectionSampler,
  discreteChiSquareCheck,
  discreteSampler,
  gammaTarget,
  poissonTarget,
  ratioOfUniformsSampler,
  weightedIndexSampler,
} from '../../src/index.js';

function caught(f: () => unknown): Error & { code?: string } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected a throw');
}

describe('option errors of the discrete and pole APIs', () => {
  it('discreteSampler: unknown key lists the known ones; bad method / maxRejections are INVALID_OPTION; a bad target is INVALID_TARGET', () => {
    const e = caught(() => discreteSampler(poissonTarget(3), { sed: 1 } as never));
    expect(e).toBeInstanceOf(InvalidOptionError);
    expect(e.code).toBe('INVALID_OPTION');
    expect(e.message).toMatch(/^discreteSampler: unknown option 'sed' \(known: .*'seed'/);
    expect(caught(() => discreteSampler(poissonTarget(3), { method: 'alias' as never }))).toBeInstanceOf(InvalidOptionError);
    const m = caught(() => discreteSampler(poissonTarget(3), { maxRejections: 0 }));
    expect(m).toBeInstanceOf(InvalidOptionError);
    expect(m.message).toContain('options.maxRejections must be an integer in [1, 9007199254740991], got 0');
    expect(caught(() => discreteSampler({} as never))).toBeInstanceOf(InvalidTargetError);
  });

  it('weightedIndexSampler: unknown key and bad method are INVALID_OPTION; weights that are not an array are INVALID_TARGET', () => {
    const e = caught(() => weightedIndexSampler([1, 2], { methd: 'alias' } as never));
    expect(e).toBeInstanceOf(InvalidOptionError);
    expect(e.message).toMatch(/^weightedIndexSampler: unknown option 'methd' \(known: /);
    expect(caught(() => weightedIndexSampler([1, 2], { method: 'guide' as never })).message).toContain("got 'guide'");
    const w = caught(() => weightedIndexSampler(null as never));
    expect(w).toBeInstanceOf(InvalidTargetError);
    expect(w.code).toBe('INVALID_TARGET');
  });

  it('discreteChiSquareCheck: unknown key and bad minExpected are INVALID_OPTION; a bad support is INVALID_TARGET', () => {
    const pmf = (k: number): number => (k === 0 || k === 1 ? 0.5 : 0);
    const draws = new Int32Array(100).map((_, i) => i % 2);
    const e = caught(() => discreteChiSquareCheck(draws, pmf, [0, 1], { minExpect: 5 } as never));
    expect(e).toBeInstanceOf(InvalidOptionError);
    expect(e.message).toBe("discreteChiSquareCheck: unknown option 'minExpect' (known: 'minExpected')");
    expect(caught(() => discreteChiSquareCheck(draws, pmf, [0, 1], { minExpected: '5' as never })).message).toContain("options.minExpected must be a finite number > 0, got '5'");
    expect(caught(() => discreteChiSquareCheck(draws, pmf, [1, 0]))).toBeInstanceOf(InvalidTargetError);
  });

  it("poleAt: a bad value is INVALID_OPTION in the hull and ratio-of-uniforms samplers", () => {
    for (const f of [() => adaptiveRejectionSampler(gammaTarget(0.5), { poleAt: 'left' as never }), () => ratioOfUniformsSampler(gammaTarget(0.5), { poleAt: 'left' as never })]) {
      const e = caught(f);
      expect(e).toBeInstanceOf(InvalidOptionError);
      expect(e.message).toContain("options.poleAt must be 'lower', 'upper', 'both' or 'auto', got 'left'");
    }
  });

  it('tableSampler-style options through the fast hull: tailMass out of range is INVALID_OPTION with the value', () => {
    const e = caught(() => adaptiveRejectionSampler(gammaTarget(2.5), { fast: true, tailMass: 0.5 }));
    expect(e).toBeInstanceOf(InvalidOptionError);
    expect(e.message).toBe('adaptiveRejectionSampler: options.tailMass must be a number in (0, 0.01], got 0.5');
  });
});

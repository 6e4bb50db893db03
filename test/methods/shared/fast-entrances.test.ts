/**
 * The entrances to the table fast path take the same options and give the
 * same draws; exactSampler says when a table serves.
 */
import { describe, expect, it } from 'vitest';
import { InvalidOptionError, InvalidTargetError, adaptiveRejectionSampler, exactSampler, gammaTarget, normalTarget, studentTTarget, tableSampler } from '../../../src/index.js';

describe('fast-path entrances', () => {
  it('adaptiveRejectionSampler({ fast: true, strips, tailMass }) draws exactly as tableSampler with the same options', () => {
    for (const [t, o] of [
      [gammaTarget(2), { seed: 2, strips: 50, tailMass: 1e-4 }],
      [studentTTarget(3), { seed: 5, transform: 'inverse-sqrt' as const, strips: 1000 }],
      [normalTarget(0, 1), { seed: 9, stream: 4, derivativeFree: true, tailMass: 1e-3 }],
    ] as const) {
      const a = adaptiveRejectionSampler(t, { ...o, fast: true }).fill(new Float64Array(5000));
      const b = tableSampler(t, o).fill(new Float64Array(5000));
      expect(Array.from(a)).toEqual(Array.from(b));
    }
  });

  it('strips and tailMass without fast: true are refused, and bad values are refused by both entrances alike', () => {
    expect(() => adaptiveRejectionSampler(normalTarget(0, 1), { strips: 50 })).toThrow(InvalidOptionError);
    expect(() => adaptiveRejectionSampler(normalTarget(0, 1), { tailMass: 1e-3 })).toThrow(/apply only with options.fast: true/);
    for (const bad of [{ strips: 1 }, { strips: 2.5 }, { tailMass: 0.5 }, { tailMass: 0 }]) {
      let e1 = '';
      let e2 = '';
      try {
        adaptiveRejectionSampler(normalTarget(0, 1), { ...bad, fast: true });
      } catch (e) {
        e1 = (e as Error).message.replace('adaptiveRejectionSampler', 'API');
      }
      try {
        tableSampler(normalTarget(0, 1), bad);
      } catch (e) {
        e2 = (e as Error).message.replace('tableSampler', 'API');
      }
      expect(e1, JSON.stringify(bad)).not.toBe('');
      expect(e1).toBe(e2);
    }
  });

  it('ExactChoice.table is true exactly when a strip table serves the draws', () => {
    expect(exactSampler(normalTarget(0, 1), { seed: 1 }).choice.table).toBe(false);
    const many = exactSampler(normalTarget(0, 1), { seed: 1, expectedDraws: 1_000_000 });
    expect(many.choice.table).toBe(true);
    expect('table' in many.sampler).toBe(true); // the sampler doing the work has a strip table
    const bimodal = { logDensity: (x: number) => Math.log(Math.exp(-0.5 * (x + 2) ** 2) + Math.exp(-0.5 * (x - 2) ** 2)) };
    const pw = exactSampler(bimodal, { seed: 1, expectedDraws: 1_000_000 });
    expect(pw.choice.method).toBe('piecewise');
    expect(pw.choice.table).toBe(true);
    expect('table' in pw.sampler).toBe(true);
    const heavy = exactSampler(studentTTarget(0.8), { seed: 1, expectedDraws: 1_000_000 });
    expect(heavy.choice.method).toBe('ratio-of-uniforms');
    expect(heavy.choice.table).toBe(false);
  });
});

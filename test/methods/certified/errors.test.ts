/**
 * certifiedSampler: bad input gives typed errors, never a draw.
 */
import { describe, expect, it } from 'vitest';
import {
  EnvelopeViolationError,
  ImproperDensityError,
  InvalidOptionError,
  InvalidTargetError,
  NonFiniteDensityError,
  ShapeViolationError,
  certifiedSampler,
  normalTarget,
} from '../../../src/index.js';
import type { Target } from '../../../src/index.js';
import { mixture } from './hand-bounds.js';

const normal01 = mixture([1], [0], [1]);

describe('certifiedSampler refuses bad targets and options', () => {
  it('certifiedSampler(target without logDensityBounds) throws InvalidTargetError naming certifiedSampler and the member', () => {
    expect(() => certifiedSampler(normalTarget(0, 1))).toThrow(InvalidTargetError);
    expect(() => certifiedSampler(normalTarget(0, 1))).toThrow(/certifiedSampler: target\.logDensityBounds must be a function/);
  });

  it('certifiedSampler refuses unknown options and bad option values with InvalidOptionError naming the option', () => {
    expect(() => certifiedSampler(normal01, { maxCell: 10 } as never)).toThrow(/certifiedSampler: unknown option 'maxCell' \(known: /);
    expect(() => certifiedSampler(normal01, { maxCell: 10 } as never)).toThrow(InvalidOptionError);
    expect(() => certifiedSampler(normal01, { targetAcceptance: 1 })).toThrow(/options\.targetAcceptance/);
    expect(() => certifiedSampler(normal01, { targetAcceptance: Number.NaN })).toThrow(InvalidOptionError);
    expect(() => certifiedSampler(normal01, { maxCells: 1 })).toThrow(/options\.maxCells/);
    expect(() => certifiedSampler(normal01, { refine: 'yes' as never })).toThrow(/options\.refine must be a boolean, got 'yes'/);
    expect(() => certifiedSampler(normal01, { refine: 'yes' as never })).toThrow(InvalidOptionError);
    expect(() => certifiedSampler(normal01, { seed: 1, uniform: Math.random })).toThrow(InvalidOptionError);
  });

  it('certifiedSampler throws InvalidTargetError when logDensityBounds returns a non-pair, NaN, or lo > hi (the call is named)', () => {
    const base = { logDensity: (x: number) => -x * x, support: [0, 1] as const };
    expect(() => certifiedSampler({ ...base, logDensityBounds: () => 3 as never })).toThrow(/target\.logDensityBounds\(0, 0\) must return a pair/);
    expect(() => certifiedSampler({ ...base, logDensityBounds: () => [Number.NaN, 0] })).toThrow(InvalidTargetError);
    expect(() => certifiedSampler({ ...base, logDensityBounds: () => [1, 0] })).toThrow(/returned \[1, 0\]/);
    expect(() => certifiedSampler({ ...base, logDensityBounds: () => [-1, 0], dLogDensityBounds: () => [2, 1] })).toThrow(/dLogDensityBounds/);
  });

  it('certifiedSampler throws ShapeViolationError naming the cell when the upper bound stays +Infinity on a finite cell (a pole x^(−1/2) at 0)', () => {
    // log f = −½ log x on (0, 1]: bounds [−½ log b, −½ log a], +Infinity on every cell [0, w]
    const pole: Target = {
      logDensity: (x) => (x > 0 ? -0.5 * Math.log(x) : -Infinity),
      support: [0, 1],
      logDensityBounds: (a, b) => [-0.5 * Math.log(b), a > 0 ? -0.5 * Math.log(a) : Infinity],
    };
    let err: unknown;
    try {
      certifiedSampler(pole, { maxCells: 200 });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(ShapeViolationError);
    expect(String(err)).toMatch(/certifiedSampler: the density has no finite bound on the cell \[0, [0-9.e-]+\]/);
    expect((err as ShapeViolationError).interval?.[0]).toBe(0);
    // with the default budget the cell is split down to rounding width, then refused
    expect(() => certifiedSampler(pole)).toThrow(/\[0, 5e-324\]/);
  });

  it('certifiedSampler throws ImproperDensityError naming the infinite cell when no decay can be proven', () => {
    const flat: Target = { logDensity: () => 0, logDensityBounds: () => [0, 0], dLogDensityBounds: () => [0, 0] };
    expect(() => certifiedSampler(flat, { maxCells: 100 })).toThrow(ImproperDensityError);
    expect(() => certifiedSampler(flat, { maxCells: 100 })).toThrow(/infinite cell \[/);
    // bounds but no derivative bounds: tails cannot be proven to decay
    const noDeriv: Target = { logDensity: normal01.logDensity, logDensityBounds: normal01.logDensityBounds };
    expect(() => certifiedSampler(noDeriv, { maxCells: 100 })).toThrow(ImproperDensityError);
  });

  it('certifiedSampler catches a lying logDensityBounds as EnvelopeViolationError when a draw exposes it', () => {
    // the bounds leave out the narrow component N(1.5, 0.01²) of weight 0.3: the envelope misses a real mode
    const liar = mixture([0.7, 0.3], [0, 1.5], [1, 0.01], [1]);
    const s = certifiedSampler(liar, { seed: 1 });
    let err: unknown;
    try {
      s.fill(new Float64Array(200_000));
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EnvelopeViolationError);
    const v = err as EnvelopeViolationError;
    expect(Math.abs(v.x - 1.5)).toBeLessThan(0.1); // inside the hidden mode (5 of its sd... 10 sd)
    expect(v.logTarget).toBeGreaterThan(v.logEnvelope);
    // the sampler stays unusable: the same error again, never a draw
    expect(() => s.sample()).toThrow(EnvelopeViolationError);
  });

  it('certifiedSampler catches a lower bound that lies (the target below the squeeze) as EnvelopeViolationError', () => {
    const t = mixture([1], [0], [1]);
    const liar: Target = {
      ...t,
      support: [-1, 1],
      logDensity: (x) => (Math.abs(x - 0.3) < 0.05 ? -30 : t.logDensity(x)),
    };
    const s = certifiedSampler(liar, { seed: 2 });
    expect(() => s.fill(new Float64Array(200_000))).toThrow(/below the squeeze/);
  });

  it('certifiedSampler throws NonFiniteDensityError when logDensity returns NaN at a candidate', () => {
    const t = mixture([1], [0], [1]);
    const bad: Target = { ...t, support: [-1, 1], logDensity: () => Number.NaN };
    expect(() => certifiedSampler(bad, { seed: 1 }).fill(new Float64Array(1000))).toThrow(NonFiniteDensityError);
  });

  it('certifiedSampler throws InvalidTargetError when bounds contradict each other (squeeze above envelope at an end)', () => {
    const contra: Target = {
      logDensity: () => 0,
      support: [0, 1],
      logDensityBounds: (a, b) => (a === b ? [5, 6] : [0, 1]),
    };
    expect(() => certifiedSampler(contra)).toThrow(/contradict each other/);
  });
});

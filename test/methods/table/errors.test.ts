/**
 * Typed errors of tableSampler: bad options, shape violations at setup and
 * while drawing, non-finite log-densities, stalls, bad injected uniforms.
 */
import { describe, expect, it } from 'vitest';
import {
  EnvelopeViolationError,
  InvalidOptionError,
  InvalidTargetError,
  NonFiniteDensityError,
  ShapeViolationError,
  StalledSamplerError,
} from '../../../src/core/errors.js';
import type { Target } from '../../../src/core/types.js';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import { tableSampler } from '../../../src/methods/table-sampler.js';
import type { TableSamplerOptions } from '../../../src/methods/table-sampler.js';
import { normalTarget } from '../../../src/targets/normal.js';

/** 0.5·N(−3, 1) + 0.5·N(3, 1), unnormalized: clearly bimodal. */
const bimodal: Target = {
  logDensity: (x) => {
    const a = -0.5 * (x + 3) * (x + 3);
    const b = -0.5 * (x - 3) * (x - 3);
    const m = Math.max(a, b);
    return m + Math.log(Math.exp(a - m) + Math.exp(b - m));
  },
};

/** A standard normal that changes after `switchAfter` calls (to `after`): the table is built from the first. */
function changing(switchAfter: () => boolean, after: (x: number) => number): Target {
  const n = normalTarget(0, 1);
  return {
    logDensity: (x) => (switchAfter() ? after(x) : n.logDensity(x)),
    support: [-Infinity, Infinity],
    mode: 0,
  };
}

describe('tableSampler option errors', () => {
  const t = normalTarget(0, 1);
  for (const [opts, text] of [
    [{ strips: 1 }, 'options.strips'],
    [{ strips: 2.5 }, 'options.strips'],
    [{ strips: 2 ** 21 }, 'options.strips'],
    [{ tailMass: 0 }, 'options.tailMass'],
    [{ tailMass: 0.5 }, 'options.tailMass'],
    [{ tailMass: Number.NaN }, 'options.tailMass'],
    [{ transform: 'sqrt' }, 'options.transform'],
    [{ maxPieces: 10 }, "unknown option 'maxPieces'"],
    [{ seed: 1, uniform: () => 0.5 }, 'options.seed'],
  ] as Array<[TableSamplerOptions, string]>) {
    it(`tableSampler(normal, ${JSON.stringify(opts)}) throws InvalidOptionError naming ${text}`, () => {
      let e: unknown;
      try {
        tableSampler(t, opts);
      } catch (err) {
        e = err;
      }
      expect(e).toBeInstanceOf(InvalidOptionError);
      expect((e as Error).message).toContain('tableSampler');
      expect((e as Error).message).toContain(text);
    });
  }

  it("adaptiveRejectionSampler(normal, { fast: 'yes' }) throws InvalidOptionError naming options.fast", () => {
    expect(() => adaptiveRejectionSampler(t, { fast: 'yes' as unknown as boolean })).toThrow(/adaptiveRejectionSampler: options.fast must be a boolean, got 'yes'/);
    expect(() => adaptiveRejectionSampler(t, { fast: 'yes' as unknown as boolean })).toThrow(InvalidOptionError);
  });

  it('tableSampler(...).fill(not a Float64Array) throws InvalidTargetError', () => {
    const s = tableSampler(t, { seed: 1 });
    expect(() => s.fill([] as unknown as Float64Array)).toThrow(InvalidTargetError);
  });

  it('tableSampler with an injected uniform that returns 1 throws InvalidOptionError, and the sampler stays usable', () => {
    let calls = 0;
    const s = tableSampler(t, { uniform: () => (++calls === 3 ? 1 : 0.25) });
    expect(() => s.fill(new Float64Array(5))).toThrow(InvalidOptionError);
    expect(Number.isFinite(s.sample())).toBe(true);
  });
});

describe('tableSampler shape and density errors', () => {
  it('tableSampler(bimodal mixture) throws ShapeViolationError naming an interval (setup)', () => {
    for (const derivativeFree of [false, true]) {
      let e: unknown;
      try {
        tableSampler(bimodal, { seed: 1, derivativeFree });
      } catch (err) {
        e = err;
      }
      expect(e).toBeInstanceOf(ShapeViolationError);
      expect((e as ShapeViolationError).interval).toBeDefined();
    }
  });

  it('tableSampler: a target that rises above the table after setup throws ShapeViolationError or EnvelopeViolationError while drawing, and keeps throwing it', () => {
    let built = false;
    // after setup the density gets a bump of e^2 on [0.5, 1.5], between strip boundaries the table trusted
    const target = changing(() => built, (x) => -0.5 * x * x + (x > 0.5 && x < 1.5 ? 2 : 0));
    const s = tableSampler(target, { seed: 2, strips: 10 });
    built = true;
    let e: unknown;
    try {
      s.fill(new Float64Array(100_000));
    } catch (err) {
      e = err;
    }
    expect(e instanceof ShapeViolationError || e instanceof EnvelopeViolationError).toBe(true);
    expect((e as Error).message).toContain('tableSampler');
    expect(() => s.sample()).toThrow(e as Error);
  });

  it('tableSampler: a target that drops below the squeeze after setup is caught (below the squeeze)', () => {
    let built = false;
    const target = changing(() => built, (x) => -0.5 * x * x - (x > -1 && x < 1 ? 3 : 0));
    const s = tableSampler(target, { seed: 3, strips: 10 });
    built = true;
    expect(() => s.fill(new Float64Array(100_000))).toThrow(/below the squeeze/);
  });

  it('tableSampler: logDensity returning NaN while drawing throws NonFiniteDensityError', () => {
    let built = false;
    const s = tableSampler(changing(() => built, () => Number.NaN), { seed: 4, strips: 10 });
    built = true;
    expect(() => s.fill(new Float64Array(10_000))).toThrow(NonFiniteDensityError);
  });

  it('tableSampler: logDensity NaN at setup throws NonFiniteDensityError', () => {
    const t: Target = { logDensity: (x) => (x > 2.5 ? Number.NaN : -0.5 * x * x), mode: 0 };
    expect(() => tableSampler(t, { seed: 1 })).toThrow(NonFiniteDensityError);
  });

  it('tableSampler: maxRejections: 1 throws StalledSamplerError at the first rejection, with the figures', () => {
    const s = tableSampler(normalTarget(0, 1), { seed: 5, strips: 4, maxRejections: 1 });
    expect(() => s.fill(new Float64Array(100_000))).toThrow(StalledSamplerError);
    // a stall is not a defect of the sampler: it can go on
    expect(s.stats.proposals).toBeGreaterThan(s.stats.samples);
  });
});

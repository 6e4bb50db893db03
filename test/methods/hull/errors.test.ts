/**
 * Typed errors of adaptiveRejectionSampler: shape violations, improper
 * targets, non-finite log-densities, bad options.
 */
import { describe, expect, it } from 'vitest';
import {
  EnvelopeViolationError,
  ImproperDensityError,
  InvalidOptionError,
  InvalidTargetError,
  NonFiniteDensityError,
  ShapeViolationError,
  StalledSamplerError,
} from '../../../src/core/errors.js';
import type { Target } from '../../../src/core/types.js';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import type { AdaptiveRejectionOptions } from '../../../src/methods/adaptive-rejection.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { studentTTarget } from '../../../src/targets/student-t.js';

/** Builds the sampler and draws n values; returns the error thrown (or undefined). */
function failure(target: Target, opts: AdaptiveRejectionOptions, n = 20_000): unknown {
  try {
    const s = adaptiveRejectionSampler(target, opts);
    s.fill(new Float64Array(n));
  } catch (e) {
    return e;
  }
  return undefined;
}

/** 0.5·N(−3, 1) + 0.5·N(3, 1), unnormalized: clearly bimodal (density at 0 is 2e^(−4.5) of the peaks). */
const bimodal: Target = {
  logDensity: (x) => {
    const a = -0.5 * (x + 3) * (x + 3);
    const b = -0.5 * (x - 3) * (x - 3);
    const m = Math.max(a, b);
    return m + Math.log(Math.exp(a - m) + Math.exp(b - m));
  },
  dLogDensity: (x) => {
    const a = -0.5 * (x + 3) * (x + 3);
    const b = -0.5 * (x - 3) * (x - 3);
    const m = Math.max(a, b);
    const wa = Math.exp(a - m);
    const wb = Math.exp(b - m);
    return (wa * -(x + 3) + wb * -(x - 3)) / (wa + wb);
  },
};

describe('adaptiveRejectionSampler shape violations', () => {
  for (const [label, opts] of [
    ['tangents', {}],
    ['secants', { derivativeFree: true }],
    ['tangents, inverse-sqrt', { transform: 'inverse-sqrt' }],
    ['mode hint at one peak', {}],
  ] as Array<[string, AdaptiveRejectionOptions]>) {
    it(`adaptiveRejectionSampler(bimodal mixture) throws ShapeViolationError naming the interval (${label})`, () => {
      const target = label.startsWith('mode hint') ? { ...bimodal, mode: 3 } : bimodal;
      const e = failure(target, { ...opts, seed: 3 });
      expect(e).toBeInstanceOf(ShapeViolationError);
      const iv = (e as ShapeViolationError).interval as readonly [number, number];
      expect(iv[0]).toBeLessThan(iv[1]);
      expect((e as Error).message).toContain(`[${iv[0]}, ${iv[1]}]`);
      expect((e as ShapeViolationError).code).toBe('SHAPE_VIOLATION');
    });
  }

  it("adaptiveRejectionSampler(studentT(3), transform 'log') throws ShapeViolationError while adapting", () => {
    // log f = −2·log(1 + x²/3) is not concave for |x| > √3 (common practice)
    for (const derivativeFree of [false, true]) {
      const e = failure(studentTTarget(3), { seed: 5, derivativeFree });
      expect(e).toBeInstanceOf(ShapeViolationError);
      expect((e as Error).message).toContain('log-concave');
    }
  });

  it("adaptiveRejectionSampler(studentT(3), transform 'log') with start points in the tails throws at setup", () => {
    expect(() => adaptiveRejectionSampler(studentTTarget(3), { startPoints: [-6, -1, 0, 1, 6] })).toThrow(ShapeViolationError);
  });

  it("adaptiveRejectionSampler(studentT(0.5), transform 'inverse-sqrt') throws ShapeViolationError (not T-concave for df < 1)", () => {
    const e = failure(studentTTarget(0.5), { transform: 'inverse-sqrt', seed: 8 });
    expect(e).toBeInstanceOf(ShapeViolationError);
  });

  it('adaptiveRejectionSampler: after a ShapeViolationError every later call throws the same error', () => {
    const s = adaptiveRejectionSampler(studentTTarget(3), { seed: 5 });
    let first: unknown;
    try {
      s.fill(new Float64Array(20_000));
    } catch (e) {
      first = e;
    }
    expect(first).toBeInstanceOf(ShapeViolationError);
    expect(() => s.sample()).toThrow(first as Error);
  });

  it('adaptiveRejectionSampler: a wrong dLogDensity is caught (tangents do not bound the target)', () => {
    const wrong: Target = { ...normalTarget(0, 1), dLogDensity: (x) => -2 * x };
    const e = failure(wrong, { seed: 1 });
    expect(e instanceof ShapeViolationError || e instanceof EnvelopeViolationError).toBe(true);
  });
});

describe('adaptiveRejectionSampler improper targets', () => {
  const expUp: Target = { logDensity: (x) => (x >= 0 ? x : -Infinity), dLogDensity: () => 1, support: [0, Infinity] };
  it('adaptiveRejectionSampler(exp(+x) on [0, ∞)) throws ImproperDensityError (tangents, secants, mode hint)', () => {
    expect(() => adaptiveRejectionSampler(expUp)).toThrow(ImproperDensityError);
    expect(() => adaptiveRejectionSampler(expUp, { derivativeFree: true })).toThrow(ImproperDensityError);
    expect(() => adaptiveRejectionSampler({ ...expUp, mode: 0 })).toThrow(ImproperDensityError);
    expect(() => adaptiveRejectionSampler(expUp, { startPoints: [1, 2] })).toThrow(ImproperDensityError);
  });

  it('adaptiveRejectionSampler(flat density on the whole line) throws ImproperDensityError', () => {
    expect(() => adaptiveRejectionSampler({ logDensity: () => 0, dLogDensity: () => 0 })).toThrow(ImproperDensityError);
  });

  it('adaptiveRejectionSampler counts the setup evaluations spent before giving up on exp(+x)', () => {
    let calls = 0;
    const t: Target = { logDensity: (x) => (calls++, x >= 0 ? x : -Infinity), dLogDensity: () => 1, support: [0, Infinity] };
    expect(() => adaptiveRejectionSampler(t)).toThrow(ImproperDensityError);
    expect(calls).toBeLessThan(500);
  });
});

describe('adaptiveRejectionSampler non-finite densities', () => {
  it('adaptiveRejectionSampler throws NonFiniteDensityError when logDensity is NaN at setup', () => {
    expect(() => adaptiveRejectionSampler({ logDensity: () => NaN })).toThrow(NonFiniteDensityError);
    expect(() => adaptiveRejectionSampler({ logDensity: () => Infinity })).toThrow(NonFiniteDensityError);
  });

  it('adaptiveRejectionSampler throws NonFiniteDensityError when logDensity is NaN or +Infinity in a tail, at draw time', () => {
    for (const bad of [NaN, Infinity]) {
      const t: Target = { logDensity: (x) => (x > 2.5 ? bad : -0.5 * x * x), dLogDensity: (x) => -x, mode: 0 };
      const e = failure(t, { seed: 2 });
      expect(e).toBeInstanceOf(NonFiniteDensityError);
      expect((e as NonFiniteDensityError).x).toBeGreaterThan(2.5);
      expect((e as Error).message).toContain('adaptiveRejectionSampler');
    }
  });

  it('adaptiveRejectionSampler throws NonFiniteDensityError naming dLogDensity when it returns NaN', () => {
    const t: Target = { logDensity: (x) => -0.5 * x * x, dLogDensity: (x) => (x > 2 ? NaN : -x), mode: 0 };
    const e = failure(t, { seed: 2 });
    expect(e).toBeInstanceOf(NonFiniteDensityError);
    expect((e as Error).message).toContain('dLogDensity');
  });
});

describe('adaptiveRejectionSampler bad inputs', () => {
  const n01 = normalTarget(0, 1);
  const bad: Array<[string, unknown]> = [
    ['unknown option', { maxPices: 10 }],
    ['maxPieces 0', { maxPieces: 0 }],
    ['maxPieces 2.5', { maxPieces: 2.5 }],
    ["maxPieces '8'", { maxPieces: '8' }],
    ["transform 'sqrt'", { transform: 'sqrt' }],
    ["derivativeFree 'yes'", { derivativeFree: 'yes' }],
    ['empty startPoints', { startPoints: [] }],
    ['NaN start point', { startPoints: [0, NaN] }],
    ['duplicate start point', { startPoints: [1, 0, 1] }],
    ['startPoints not an array', { startPoints: 3 }],
    ['maxRejections 0', { maxRejections: 0 }],
    ['seed -1', { seed: -1 }],
    ['seed and uniform', { seed: 1, uniform: () => 0.5 }],
  ];
  for (const [label, opts] of bad) {
    it(`adaptiveRejectionSampler rejects ${label} with InvalidOptionError (code INVALID_OPTION) naming the API`, () => {
      let err: unknown;
      try {
        adaptiveRejectionSampler(n01, opts as AdaptiveRejectionOptions);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(InvalidOptionError);
      expect((err as InvalidOptionError).code).toBe('INVALID_OPTION');
      expect((err as Error).message).toMatch(/^adaptiveRejectionSampler: /);
    });
  }

  it('adaptiveRejectionSampler rejects a start point outside the support', () => {
    expect(() => adaptiveRejectionSampler({ logDensity: (x) => -x, support: [0, Infinity] }, { startPoints: [-1, 1] })).toThrow(/outside the support/);
  });

  it('adaptiveRejectionSampler rejects a malformed target', () => {
    expect(() => adaptiveRejectionSampler(null as unknown as Target)).toThrow(InvalidTargetError);
    expect(() => adaptiveRejectionSampler({} as Target)).toThrow(InvalidTargetError);
    expect(() => adaptiveRejectionSampler({ logDensity: (x: number) => -x * x, support: [1, 0] } as Target)).toThrow(InvalidTargetError);
  });

  it('adaptiveRejectionSampler rejects a target whose density is 0 at every probed point', () => {
    expect(() => adaptiveRejectionSampler({ logDensity: () => -Infinity })).toThrow(InvalidTargetError);
  });

  it('adaptiveRejectionSampler.fill rejects a non-Float64Array', () => {
    const s = adaptiveRejectionSampler(n01);
    expect(() => s.fill([] as unknown as Float64Array)).toThrow(InvalidTargetError);
  });

  it('adaptiveRejectionSampler throws StalledSamplerError after maxRejections consecutive rejections', () => {
    // a uniform source stuck near 1 puts every candidate deep in a tail piece, where it is rejected
    const s = adaptiveRejectionSampler(n01, { uniform: () => 0.999999, maxRejections: 3 });
    expect(() => s.sample()).toThrow(StalledSamplerError);
  });
});

describe('adaptiveRejectionSampler envelope violations', () => {
  it('adaptiveRejectionSampler throws EnvelopeViolationError when the target changes its value at a touch point', () => {
    // a target that rises by 1 after setup; the injected uniforms pick the left tail (u1 = 0), whose
    // position is the rest of u1 (the tail holds more than 2^-12 of the envelope: checked below), 0, which
    // puts the candidate on the tail's touch point, and do not accept (u3 = 0.5)
    let calls = 0;
    let setup = Infinity;
    const t: Target = {
      logDensity: (x) => (calls++ >= setup ? 1 : 0) - 0.5 * x * x,
      dLogDensity: (x) => -x,
      mode: 0,
    };
    const seq = [0, 0.5];
    let i = 0;
    const s = adaptiveRejectionSampler(t, { uniform: () => seq[i++ % 2] });
    const e = s.envelope;
    expect(e.pieces[0].logArea - e.logEnvelopeArea).toBeGreaterThan(-12 * Math.LN2);
    setup = calls;
    let err: unknown;
    try {
      s.sample();
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EnvelopeViolationError);
    const ev = err as EnvelopeViolationError;
    expect(ev.x).toBe(s.envelope.touchPoints[0]);
    expect(ev.logTarget).toBeGreaterThan(ev.logEnvelope);
    expect(ev.message).toContain('above the envelope');
  });
});

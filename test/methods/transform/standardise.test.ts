/**
 * Scale-free internals (issue 17 item 1): every method samples in the
 * standardised coordinate z = (x − loc)/2^k found at setup, so targets far
 * from unit scale or far from 0 are sampled as N(0, 1) is.
 *
 * References: the normal cdf is @stdlib/stats-base-dists-normal-cdf, taken
 * in standardised units (x − μ)/σ; the exponential cdf is the closed form
 * 1 − exp(−rate·(x − a)) (common practice). The scale rule is checked
 * against the normal density's definition: log f(μ ± σ) − log f(μ) = −1/2
 * exactly, so the smallest power of two at which the log-density has
 * dropped by 1/2 is the one in [σ, 2σ).
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ksCheck } from '../../../src/checks/ks.js';
import { ShapeViolationError } from '../../../src/core/errors.js';
import type { Target } from '../../../src/core/types.js';
import { checkTarget } from '../../../src/core/validate.js';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import { exactSampler } from '../../../src/methods/auto.js';
import { evaluateEnvelope } from '../../../src/methods/envelope/description.js';
import { piecewiseSampler } from '../../../src/methods/piecewise.js';
import { ratioOfUniformsSampler } from '../../../src/methods/ratio-of-uniforms.js';
import { tableSampler } from '../../../src/methods/table-sampler.js';
import { findStandardisation, xOf } from '../../../src/methods/transform/standardise.js';
import { exponentialTarget } from '../../../src/targets/exponential.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { ALPHA, draw, expectFits, expectInSupport, expectRejects } from '../../helpers/statistical.js';

/** The N(μ, σ²) cdf in standardised units (@stdlib). */
const normalCdfOf = (mu: number, sd: number) => (x: number): number => normalCdf((x - mu) / sd, 0, 1);
/** The exponential cdf on [a, ∞) with the given rate (closed form). */
const expCdfOf = (a: number, rate: number) => (x: number): number => (x <= a ? 0 : -Math.expm1(-(x - a) * rate));
/** An exponential on [a, b] (b = ∞: the whole tail) with rate 1/scale, written in x (no mode hint). */
const shiftedExp = (a: number, scale: number, b = Infinity): Target => ({
  logDensity: (x: number) => (x >= a && x <= b ? -(x - a) / scale : -Infinity),
  support: [a, b],
});
/** Fewest distinct values among n draws: a point mass (the old failure) has 1. */
const distinct = (xs: Float64Array): number => new Set(xs).size;

describe('the standardisation', () => {
  it('finds loc = the mode and the power of two in [σ, 2σ) for N(μ, σ²) across the double range; ordinary targets get the identity', () => {
    // [μ, σ, expected loc]: the mode μ (normal density's definition), or 0 where |μ| ≤ 64σ (the rule
    // documented in standardise.ts: x = 2^k·z is then exact); |μ|/σ is 0, 1e10, 1e-600, 5e5, 3.3e4.
    const cases = [[0, 1e-300, 0], [1e300, 1e290, 1e300], [-1e-300, 1e300, 0], [5e-195, 1e-200, 5e-195], [1e150, 3e145, 1e150]] as const;
    for (const [mu, sd, loc] of cases) {
      const st = findStandardisation('test', checkTarget('test', normalTarget(mu, sd)));
      expect(st.identity, `${mu}, ${sd}`).toBe(false);
      expect(st.scale >= sd && st.scale < 2 * sd, `${mu}, ${sd}: scale ${st.scale}`).toBe(true);
      expect(st.scale).toBe(2 ** st.log2Scale);
      expect(st.loc).toBe(loc);
    }
    for (const [mu, sd] of [[0, 1], [3, 2], [1e5, 10]] as const) {
      expect(findStandardisation('test', checkTarget('test', normalTarget(mu, sd))).identity).toBe(true);
    }
  });

  it('maps back exactly when loc = 0 (a power-of-two scale) and clamps into the support', () => {
    const st = findStandardisation('test', checkTarget('test', normalTarget(0, 1e-200)));
    // 2^-664 ≈ 1.30e-200 is the power of two in [1e-200, 2e-200) (log2(1e-200) = -664.4)
    expect(st.log2Scale).toBe(-664);
    const toX = xOf(st);
    for (const z of [0.1, -1.7, 3.3333333333333335, 1e-5]) expect(toX(z)).toBe(z * 2 ** -664); // z·2^k: exact, no rounding
    const e = findStandardisation('test', checkTarget('test', shiftedExp(1e300, 1e300)));
    expect(xOf(e)(-5)).toBe(1e300); // below the support: the lower end
  });
});

describe('issue 17 item 1: the reproduced failures, at fixed seeds', () => {
  it('ratioOfUniformsSampler(normal(0, s)) for s = 1e-96 and 1e-99 (were: EnvelopeViolationError, every draw 0) fits; a sampler of sd 1.1·s is rejected', () => {
    for (const s of [1e-96, 1e-99]) {
      const xs = draw(ratioOfUniformsSampler(normalTarget(0, s), { seed: 17 }), 20_000);
      expect(distinct(xs)).toBeGreaterThan(19_000);
      expectFits(xs, normalCdfOf(0, s), `rou sd ${s}`);
      expectRejects(draw(ratioOfUniformsSampler(normalTarget(0, 1.1 * s), { seed: 17 }), 20_000), normalCdfOf(0, s), `rou sd ${s}, twin`);
    }
  });

  it('an exponential of rate 1e200: ratio-of-uniforms (was all 0), tableSampler, piecewise fast and exactSampler({ expectedDraws }) (were stalls) fit; rate 1.1e200 is rejected', () => {
    const cdf = expCdfOf(0, 1e200);
    const makers = [
      (r: number) => ratioOfUniformsSampler(exponentialTarget(r), { seed: 5 }),
      (r: number) => tableSampler(exponentialTarget(r), { seed: 5 }),
      (r: number) => piecewiseSampler(exponentialTarget(r), { seed: 5, fast: true }),
      (r: number) => exactSampler(exponentialTarget(r), { seed: 5, expectedDraws: 100_000 }),
    ];
    for (const [i, make] of makers.entries()) {
      const xs = draw(make(1e200), 20_000);
      expectInSupport(xs, 0, Infinity);
      expectFits(xs, cdf, `exp(1e200), maker ${i}`);
      expectRejects(draw(make(1.1e200), 20_000), cdf, `exp(1.1e200) twin, maker ${i}`);
    }
  });

  it('normal(1e300, 1e290) (was ImproperDensityError "no decay found" from exactSampler, "found no mass" from ratio-of-uniforms) fits; μ + 0.1σ is rejected', () => {
    const cdf = normalCdfOf(1e300, 1e290);
    for (const make of [(m: number) => exactSampler(normalTarget(m, 1e290), { seed: 3 }), (m: number) => ratioOfUniformsSampler(normalTarget(m, 1e290), { seed: 3 })]) {
      const xs = draw(make(1e300), 20_000);
      expect(distinct(xs)).toBeGreaterThan(19_000);
      expectFits(xs, cdf, 'normal(1e300, 1e290)');
      expectRejects(draw(make(1e300 + 1e289), 20_000), cdf, 'normal(1e300 + 0.1σ, 1e290) twin');
    }
  });

  it('an exponential on [1e300, ∞) (was ImproperDensityError from exactSampler and piecewise, "found no mass" from ratio-of-uniforms) with those and the hull and on [1e300, 1e301] (was "still increasing towards -Infinity") fit; scale 1.1e300 is rejected', () => {
    const cdf = expCdfOf(1e300, 1e-300);
    const b = 1e301;
    const cdfB = (x: number): number => cdf(x) / cdf(b);
    const cases: [string, (scale: number) => Target, (x: number) => number][] = [
      ['[1e300, ∞)', (sc) => shiftedExp(1e300, sc), cdf],
      ['[1e300, 1e301]', (sc) => shiftedExp(1e300, sc, b), cdfB],
    ];
    for (const [name, target, c] of cases) {
      for (const make of [
        (t: Target) => exactSampler(t, { seed: 8 }),
        (t: Target) => adaptiveRejectionSampler(t, { seed: 8 }),
        (t: Target) => ratioOfUniformsSampler(t, { seed: 8 }),
        (t: Target) => piecewiseSampler(t, { seed: 8 }),
      ]) {
        const xs = draw(make(target(1e300)), 20_000);
        expectInSupport(xs, 1e300, name.endsWith('∞)') ? Infinity : b);
        expectFits(xs, c, name);
        expectRejects(draw(make(target(1.1e300)), 20_000), c, `${name} twin`);
      }
    }
  });

  it('normal(0, 1e-200) (was "positive density at only 1 point" from exactSampler, "no start point" from the hull) fits with exactSampler, the hull and piecewise; sd 1.1e-200 is rejected', () => {
    const cdf = normalCdfOf(0, 1e-200);
    for (const make of [
      (s: number) => exactSampler(normalTarget(0, s), { seed: 4 }),
      (s: number) => adaptiveRejectionSampler(normalTarget(0, s), { seed: 4 }),
      (s: number) => piecewiseSampler(normalTarget(0, s), { seed: 4 }),
    ]) {
      expectFits(draw(make(1e-200), 20_000), cdf, 'normal(0, 1e-200)');
      expectRejects(draw(make(1.1e-200), 20_000), cdf, 'normal(0, 1.1e-200) twin');
    }
  });

  it('where the doubles are coarse on the target scale (2^-40 to 2^-10 of σ), the hulls and piecewise refuse with a ShapeViolationError naming the staircase; exactSampler samples with ratio-of-uniforms and fits', () => {
    const t = normalTarget(3e-290, 1e-300); // doubles at 3e-290 (in [2^-962, 2^-961)) are 2^-1014 ≈ 5.8e-306 apart: 5.8e-6 σ ≈ 2^-17.4 σ
    expect(() => adaptiveRejectionSampler(t)).toThrow(ShapeViolationError);
    expect(() => tableSampler(t)).toThrow(/staircase/);
    expect(() => piecewiseSampler(normalTarget(1e300, 1e290))).toThrow(/staircase/);
    const s = exactSampler(t, { seed: 6 });
    expect(s.choice.method).toBe('ratio-of-uniforms');
    expect(s.choice.reason).toMatch(/staircase/);
    expectFits(draw(s, 20_000), normalCdfOf(3e-290, 1e-300), 'coarse normal');
    expectRejects(draw(exactSampler(normalTarget(3e-290 + 1e-301, 1e-300), { seed: 6 }), 20_000), normalCdfOf(3e-290, 1e-300), 'coarse normal twin');
  });

  it('descriptions are in x: the hull of normal(0, 1e290), built in z, has envelope ≥ target ≥ squeeze at points of x', () => {
    const t = normalTarget(0, 1e290);
    const s = adaptiveRejectionSampler(t, { seed: 2 });
    s.fill(new Float64Array(1000));
    const env = s.envelope;
    expect(env.touchPoints.some((x) => Math.abs(x) > 1e289)).toBe(true);
    for (const z of [-5, -1.3, -0.2, 0, 0.7, 2.2, 6]) {
      const x = z * 1e290;
      const { logEnvelope, logSqueeze } = evaluateEnvelope(env, x);
      const lf = t.logDensity(x);
      const tol = 1e-9 + 1e-12 * (Math.abs(lf) + Math.abs(logEnvelope));
      expect(logEnvelope, `envelope at ${x}`).toBeGreaterThanOrEqual(lf - tol);
      expect(logSqueeze, `squeeze at ${x}`).toBeLessThanOrEqual(lf + tol);
    }
  });
});

describe('large-n fixed cases', () => {
  it('exactSampler at n = 1e5: normal(1e300, 1e290), normal(0, 1e-300), normal(-1e-300, 1e300) fit; a 0.05σ shift is rejected', () => {
    for (const [mu, sd] of [[1e300, 1e290], [0, 1e-300], [-1e-300, 1e300]] as const) {
      const cdf = normalCdfOf(mu, sd);
      expectFits(draw(exactSampler(normalTarget(mu, sd), { seed: 11 }), 100_000), cdf, `normal(${mu}, ${sd})`);
      expectRejects(draw(exactSampler(normalTarget(mu + 0.05 * sd, sd), { seed: 11 }), 100_000), cdf, `normal(${mu} + 0.05σ, ${sd}) twin`);
    }
  });
});

/** The spacing of the doubles at x. */
const ulp = (x: number): number => Math.max(Math.abs(x) * 2 ** -52, 2 ** -1074);

describe('property (fast-check): exactSampler on normal(μ, σ) for μ in ±1e300 and σ from 1e-300 to 1e300', () => {
  it('fits in standardised units (KS at 1e-4, n = 300) and the same sampler on μ + σ is rejected, wherever μ ± 10σ is finite and σ spans at least 2^10 doubles at μ', () => {
    const arb = fc
      .record({ sign: fc.constantFrom(-1, 1), a: fc.double({ min: -300, max: 300, noNaN: true }), zero: fc.boolean(), b: fc.double({ min: -300, max: 300, noNaN: true }), seed: fc.integer({ min: 1, max: 1e6 }) })
      .map(({ sign, a, zero, b, seed }) => ({ mu: zero ? 0 : sign * Math.pow(10, a), sd: Math.pow(10, b), seed }))
      .filter(({ mu, sd }) => Number.isFinite(Math.abs(mu) + 10 * sd) && ulp(mu) / sd <= 2 ** -10);
    fc.assert(
      fc.property(arb, ({ mu, sd, seed }) => {
        const xs = draw(exactSampler(normalTarget(mu, sd), { seed }), 300);
        const cdf = normalCdfOf(mu, sd);
        expect(ksCheck(xs, cdf).pValue, `normal(${mu}, ${sd}) seed ${seed}`).toBeGreaterThan(ALPHA);
        const shifted = draw(exactSampler(normalTarget(mu + sd, sd), { seed }), 300);
        expect(ksCheck(shifted, cdf).pValue, `twin normal(${mu} + σ, ${sd})`).toBeLessThan(ALPHA);
      }),
      { numRuns: 40, seed: 1717 },
    );
  });
});

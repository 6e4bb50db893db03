import betaCdf from '@stdlib/stats-base-dists-beta-cdf';
import erfc from '@stdlib/math-base-special-erfc';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  EnvelopeViolationError,
  ImproperDensityError,
  InvalidOptionError,
  InvalidTargetError,
  NonFiniteDensityError,
  StalledSamplerError,
  betaTarget,
  gammaTarget,
  logisticTarget,
  mersenneTwister,
  normalTarget,
  ratioOfUniformsSampler,
  studentTTarget,
  truncate,
} from '../../src/index.js';
import type { RatioOfUniformsOptions, RatioOfUniformsSampler, Target, Uniform } from '../../src/index.js';
import { DEFAULT_MAX_REJECTIONS } from '../../src/core/counters.js';
import { methodSuite, methodSuites } from '../helpers/method-suite.js';
import { draw, expectFits, expectInSupport, expectRate, expectRejects, expectReproducible } from '../helpers/statistical.js';

const N = 20_000;

/** Inline targets (written here, not from src/targets). */
const exponential: Target = { logDensity: (x: number) => (x >= 0 ? -x : -Infinity), support: [0, Infinity], mode: 0 };
const cauchy: Target = { logDensity: (x: number) => -Math.log1p(x * x), mode: 0 };
/** Cauchy(0, 1) cdf, 1/2 + atan(x)/π (closed form; common practice). */
const cauchyCdf = (x: number): number => 0.5 + Math.atan(x) / Math.PI;

/**
 * A lognormal-shaped custom target: density ∝ exp(−(log x − mu)²/(2 sigma²)) / x on (0, ∞),
 * deliberately given without a mode hint (the shift is found numerically).
 */
function lognormalShaped(mu: number, sigma: number): Target {
  return {
    logDensity: (x: number) => {
      if (!(x > 0) || x === Infinity) return -Infinity;
      const z = (Math.log(x) - mu) / sigma;
      return -0.5 * z * z - Math.log(x);
    },
    support: [0, Infinity],
  };
}
/** Its cdf: @stdlib normal cdf of (log x − mu)/sigma. */
const lognormalCdf = (mu: number, sigma: number) => (x: number): number => (x > 0 ? normalCdf((Math.log(x) - mu) / sigma, 0, 1) : 0);

/**
 * Y = log X for a target with an integrable power singularity at 0: density f(e^y)·e^y on
 * (−∞, log upper], which is bounded. This is the route the refusal message recommends.
 */
function logTransformed(t: Target, upper = Infinity): Target {
  return {
    logDensity: (y: number) => (y === Infinity ? -Infinity : t.logDensity(Math.exp(y)) + y),
    support: [-Infinity, Math.log(upper)],
  };
}

/**
 * The failure the automatic rectangle prevents: a hand-written Kinderman–Monahan loop
 * (r = 1, shift 0) for the standard normal whose v-bound is guessed 20% too small,
 * so the region is silently clipped. Used as a "deliberately wrong envelope" twin.
 */
function clippedNormalRoU(u: Uniform, n: number): Float64Array {
  const vMax = 0.8 * Math.SQRT2 * Math.exp(-0.5); // true bound is √2·e^(−1/2) (Kinderman & Monahan 1977)
  const out = new Float64Array(n);
  for (let i = 0; i < n; ) {
    const uu = 1 - u();
    const v = -vMax + 2 * vMax * u();
    const x = v / uu;
    if (2 * Math.log(uu) <= -0.5 * x * x) out[i++] = x;
  }
  return out;
}

describe('ratioOfUniformsSampler: acceptance against closed forms (r = 1, shift at the mode)', () => {
  // Derivation (Kinderman & Monahan 1977; Devroye 1986, IV.7): the region
  // A = {(u, v): 0 < u ≤ f(v/u + s)^(1/2)} has area Z_f/2 (substitute x = v/u + s, dv = u dx,
  // ∫ dx ∫_0^√f(x) u du = ∫ f/2). The rectangle is u ≤ sup √f, v ∈ [inf, sup] of (x − s)√f(x).
  // Acceptance = (Z_f/2) / rectangle area.
  //  normal f = e^(−x²/2): sup √f = 1, sup |x|e^(−x²/4) = √2·e^(−1/2) at x = √2,
  //    rate = (√(2π)/2) / (2√2·e^(−1/2)) = √(πe)/4 = 0.73057.
  //  exponential f = e^(−x) on [0, ∞): v ∈ [0, sup x e^(−x/2) = 2/e], rate = (1/2)/(2/e) = e/4 = 0.67957.
  //  Cauchy f = 1/(1 + x²): sup |x|/√(1 + x²) = 1 (as |x| → ∞), rate = (π/2)/2 = π/4 = 0.78540.
  // Check values: the closed forms above (Kinderman & Monahan 1977); listed in test/reference/README.md.
  const cases: Array<[string, Target, number, number, number]> = [
    // [label, target, closed-form rate, closed-form log sup f, closed-form scaled vMax − vMin]
    ['standard normal', normalTarget(0, 1), 0.73057, -0.5 * Math.log(2 * Math.PI), 2 * Math.SQRT2 * Math.exp(-0.5)],
    ['exponential', exponential, 0.67957, 0, 2 / Math.E],
    ['Cauchy', cauchy, 0.7854, 0, 2],
  ];
  for (const [label, target, rate, logSup, width] of cases) {
    it(`ratioOfUniformsSampler(${label}) accepts ≈ ${rate} of proposals`, () => {
      const s = ratioOfUniformsSampler(target, { seed: 401 });
      s.fill(new Float64Array(50_000));
      const st = s.stats;
      expectRate(st.samples, st.proposals, rate, label);
      // The rectangle itself is the closed-form one (up to the documented 1e-9 margin).
      const reg = s.region;
      expect(reg.shift).toBe(0);
      expect(Math.abs(reg.logDensityMax - logSup)).toBeLessThan(1e-12);
      expect(Math.abs((reg.scaledVMax - reg.scaledVMin) / width - 1)).toBeLessThan(1e-8);
      expect(reg.estimatedAcceptance).toBe(st.acceptanceRate);
    });
  }

  it('ratioOfUniformsSampler(standard normal, power 2) accepts √(2πe)·√r / (2(r+1)^(3/2)) of proposals', () => {
    // Derived here from the region area Z/(r+1) (Wakefield, Gelfand & Smith 1991): for f = e^(−x²/2),
    // sup f^(1/(r+1)) = 1 and sup |x|·f^(r/(r+1)) = √((r+1)/r)·e^(−1/2), so the rate is
    // (√(2π)/(r+1)) / (2√((r+1)/r)·e^(−1/2)); r = 2 gives 0.56237.
    const r = 2;
    const rate = (Math.sqrt(2 * Math.PI * Math.E) * Math.sqrt(r)) / (2 * Math.pow(r + 1, 1.5));
    const s = ratioOfUniformsSampler(normalTarget(0, 1), { power: r, seed: 402 });
    s.fill(new Float64Array(50_000));
    expectRate(s.stats.samples, s.stats.proposals, rate, 'normal r=2');
  });

  it('ratioOfUniformsSampler(uniform(0, 1)) uses the support to bound v and accepts exactly 1/2 in expectation', () => {
    // f = 1 on [0, 1], shift 1/2: rectangle (0, 1] × [−1/2, 1/2] (capped by the support), region area 1/2.
    const s = ratioOfUniformsSampler(betaTarget(1, 1), { seed: 403 });
    const xs = draw(s, N);
    expect(s.region.scaledVMax).toBe(0.5);
    expect(s.region.scaledVMin).toBe(-0.5);
    expectRate(s.stats.samples, s.stats.proposals, 0.5, 'uniform');
    expectInSupport(xs, 0, 1);
  });
});

const p1 = normalCdf(1, 0, 1);
const p3 = normalCdf(3, 0, 1);
const rate105: Target = { logDensity: (x: number) => (x >= 0 ? -1.05 * x : -Infinity), support: [0, Infinity] };
const tinyNormal: Target = {
  logDensity: (x: number) => {
    const z = (x - 1e4) / 1e-9;
    return -0.5 * z * z - 700;
  },
};
const tinyNormalTwin: Target = { logDensity: (x: number) => -0.5 * ((x - 1e4) / 1.08e-9) ** 2 - 700 };
const wideCauchy: Target = { logDensity: (x: number) => -Math.log1p((x / 1.1) ** 2) };

methodSuites<RatioOfUniformsSampler>('ratioOfUniformsSampler: goodness of fit (KS + AD at ALPHA, fixed seeds) with biased twins', [
  {
    // twin: a hand-written ratio-of-uniforms with a clipped v-bound
    name: 'ratioOfUniformsSampler(normal(0, 1)) (cdf: @stdlib normal; twin: a clipped rectangle)',
    make: (seed) => ratioOfUniformsSampler(normalTarget(0, 1), { seed }),
    biased: (seed) => ({
      fill: (out: Float64Array): Float64Array => {
        out.set(clippedNormalRoU(mersenneTwister(seed), out.length));
        return out;
      },
    }),
    cdf: (x) => normalCdf(x, 0, 1),
    n: N,
    seed: 411,
  },
  {
    name: 'ratioOfUniformsSampler(normal(3, 2)) with a shift away from the mode is still exact (twin: sd 2.1)',
    make: (seed) => ratioOfUniformsSampler(normalTarget(3, 2), { shift: 5, seed }),
    afterFit: (s) => expect(s.region.shift).toBe(5),
    biased: (seed) => ratioOfUniformsSampler(normalTarget(3, 2.1), { shift: 5, seed }),
    cdf: (x) => normalCdf(x, 3, 2),
    n: N,
    seed: 412,
  },
  ...([
    [2, 1.6, 413],
    [5, 3.5, 414],
  ] as const).map(([df, twinDf, seed]) => ({
    name: `ratioOfUniformsSampler(studentT(${df})) fits the @stdlib t cdf; t(${twinDf}) does not`,
    make: (sd: number) => ratioOfUniformsSampler(studentTTarget(df), { seed: sd }),
    biased: (sd: number) => ratioOfUniformsSampler(studentTTarget(twinDf), { seed: sd }),
    cdf: (x: number) => tCdf(x, df),
    n: N,
    seed,
  })),
  {
    // Tail ~ |x|^(−1.5) needs r ≥ 1/(1.5 − 1) = 2 (Wakefield, Gelfand & Smith 1991; see the bound derivation in the source).
    name: 'ratioOfUniformsSampler(studentT(0.5), power 3) samples a tail too heavy for r = 1 (twin: t(0.4))',
    make: (seed) => ratioOfUniformsSampler(studentTTarget(0.5), { power: 3, seed }),
    biased: (seed) => ratioOfUniformsSampler(studentTTarget(0.4), { power: 3, seed }),
    cdf: (x) => tCdf(x, 0.5), // @stdlib t cdf, checked at df 0.5 in test/reference/README.md
    n: N,
    seed: 415,
  },
  {
    name: 'ratioOfUniformsSampler(Cauchy) fits 1/2 + atan(x)/π; scale 1.1 does not',
    make: (seed) => ratioOfUniformsSampler(cauchy, { seed }),
    biased: (seed) => ratioOfUniformsSampler(wideCauchy, { seed }),
    cdf: cauchyCdf,
    n: N,
    seed: 416,
  },
  ...([
    [0.5, 0.6, 1, 0.64, 417],
    [0, 1.5, 2, 1.6, 418],
  ] as const).map(([mu, sigma, power, twinSigma, seed]) => ({
    name: `ratioOfUniformsSampler(lognormal-shaped mu=${mu} sigma=${sigma}, power ${power}) fits; sigma ${twinSigma} does not`,
    make: (sd: number) => ratioOfUniformsSampler(lognormalShaped(mu, sigma), { power, seed: sd }),
    // The numerically found shift is the mode exp(mu − sigma²) (closed form of the lognormal mode).
    afterFit: (s: RatioOfUniformsSampler) => expect(Math.abs(s.region.shift / Math.exp(mu - sigma * sigma) - 1)).toBeLessThan(1e-6),
    biased: (sd: number) => ratioOfUniformsSampler(lognormalShaped(mu, twinSigma), { power, seed: sd }),
    cdf: lognormalCdf(mu, sigma),
    n: N,
    seed,
    support: [0, Infinity] as const,
  })),
  {
    name: 'ratioOfUniformsSampler(truncate(normal(0, 1), 1, 3)) stays in [1, 3] and fits the truncated @stdlib cdf (twin: sd 1.2)',
    make: (seed) => ratioOfUniformsSampler(truncate(normalTarget(0, 1), 1, 3), { seed }),
    biased: (seed) => ratioOfUniformsSampler(truncate(normalTarget(0, 1.2), 1, 3), { seed }),
    cdf: (x) => (x <= 1 ? 0 : x >= 3 ? 1 : (normalCdf(x, 0, 1) - p1) / (p3 - p1)),
    n: N,
    seed: 419,
    support: [1, 3],
  },
  {
    name: 'ratioOfUniformsSampler(exponential) with the shift outside the support is still exact (twin: rate 1.05)',
    make: (seed) => ratioOfUniformsSampler(exponential, { shift: -1, seed }),
    afterFit: (s) => expect(s.region.scaledVMin).toBe(0), // no support below the shift
    biased: (seed) => ratioOfUniformsSampler(rate105, { shift: -1, seed }),
    cdf: (x) => (x > 0 ? -Math.expm1(-x) : 0), // 1 − e^(−x), closed form
    n: N,
    seed: 420,
    support: [0, Infinity],
  },
  {
    name: 'ratioOfUniformsSampler works in log space: sd 1e-9 at location 1e4 with densities near 1e-304 (twin: sd 1.08e-9)',
    make: (seed) => ratioOfUniformsSampler(tinyNormal, { seed }),
    afterFit: (s) => expect(s.region.logDensityMax).toBe(-700),
    biased: (seed) => ratioOfUniformsSampler(tinyNormalTwin, { seed }),
    cdf: (x) => normalCdf((x - 1e4) / 1e-9, 0, 1),
    n: N,
    seed: 421,
  },
]);

it('ratioOfUniformsSampler(studentT(0.5)) with the default power 1 is refused (the tail is too heavy for r = 1)', () => {
  expect(() => ratioOfUniformsSampler(studentTTarget(0.5))).toThrow(InvalidTargetError);
});

describe('ratioOfUniformsSampler: densities unbounded at an end are refused (no power r bounds sup f)', () => {
  // gamma(0.5) ~ x^(−1/2) and beta(0.7, 3) ~ x^(−0.3) at 0: sup f^(1/(r+1)) is infinite for every r.
  for (const [label, make] of [
    ['gamma(0.5)', () => gammaTarget(0.5)],
    ['beta(0.7, 3)', () => betaTarget(0.7, 3)],
    ['beta(2, 0.5) (unbounded at 1)', () => betaTarget(2, 0.5)],
  ] as const) {
    for (const power of [0.5, 1, 3]) {
      it(`ratioOfUniformsSampler(${label}, power ${power}) throws InvalidTargetError naming the end`, () => {
        expect(() => ratioOfUniformsSampler(make(), { power })).toThrow(InvalidTargetError);
        expect(() => ratioOfUniformsSampler(make(), { power })).toThrow(/density is unbounded at the (lower end x = 0|upper end x = 1)/);
      });
    }
  }

  methodSuites('the recommended routes, and finite maxima at an end', [
    {
      // P(1/2, x) = erf(√x) = 1 − erfc(√x) (standard identity, from memory; Abramowitz & Stegun ch. 6),
      // computed with @stdlib erfc: independent of the @stdlib gamma cdf, which test/reference/README.md checked only at shape ≥ 2.5.
      name: 'the recommended route for gamma(0.5): sample Y = log X with ratio-of-uniforms, X = e^Y fits P(1/2, x) = erf(√x) (twin: gamma(0.56))',
      make: (seed) => ratioOfUniformsSampler(logTransformed(gammaTarget(0.5)), { seed }),
      biased: (seed) => ratioOfUniformsSampler(logTransformed(gammaTarget(0.56)), { seed }),
      map: Math.exp,
      cdf: (x) => (x > 0 ? 1 - erfc(Math.sqrt(x)) : 0),
      n: N,
      seed: 431,
    },
    {
      name: 'the recommended route for beta(0.7, 3): Y = log X fits the @stdlib beta cdf (twin: beta(0.77, 3))',
      make: (seed) => ratioOfUniformsSampler(logTransformed(betaTarget(0.7, 3), 1), { seed }),
      biased: (seed) => ratioOfUniformsSampler(logTransformed(betaTarget(0.77, 3), 1), { seed }),
      map: Math.exp,
      cdf: (x) => (x <= 0 ? 0 : x >= 1 ? 1 : betaCdf(x, 0.7, 3)),
      n: N,
      seed: 432,
      support: [0, 1],
    },
    ...([
      [1, 3, 1, 3.3],
      [3, 1, 3.3, 1],
    ] as const).map(([a, b, ta, tb]) => ({
      name: `beta(${a}, ${b}) (finite maximum at an end) is sampled within [0, 1]; the beta(${ta}, ${tb}) twin is not`,
      make: (seed: number) => ratioOfUniformsSampler(betaTarget(a, b), { seed }),
      biased: (seed: number) => ratioOfUniformsSampler(betaTarget(ta, tb), { seed }),
      cdf: (x: number) => betaCdf(x, a, b),
      n: N,
      seed: 433,
      support: [0, 1] as const,
    })),
  ]);
});

describe('ratioOfUniformsSampler: tails too heavy for the power', () => {
  it('Cauchy with power 0.5 throws InvalidTargetError naming the tail and the condition', () => {
    let err: unknown;
    try {
      ratioOfUniformsSampler(cauchy, { power: 0.5 });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InvalidTargetError);
    const msg = (err as Error).message;
    expect(msg).toMatch(/as x → \+Infinity/);
    expect(msg).toMatch(/power r = 0\.5/);
    // tail exponent 2 (Cauchy), so power ≥ 1/(2 − 1) = 1
    expect(msg).toMatch(/\|x\|\^\(−2\.00\)/);
    expect(msg).toMatch(/choose power >= 1\/\(α − 1\) ≈ 1\.00/);
  });

  methodSuite({
    name: 'Cauchy with power 2 is exact (larger r bounds heavier tails); scale 1.1 is rejected',
    make: (seed) => ratioOfUniformsSampler(cauchy, { power: 2, seed }),
    biased: (seed) => ratioOfUniformsSampler(wideCauchy, { power: 2, seed }),
    cdf: cauchyCdf,
    n: N,
    seed: 441,
  });

  it('a lower tail too heavy is named as such', () => {
    const leftHeavy: Target = { logDensity: (x: number) => (x < 0 ? -0.75 * Math.log1p(x * x) : -x * x), mode: 0 };
    expect(() => ratioOfUniformsSampler(leftHeavy)).toThrow(/as x → -Infinity/);
  });

  it('densities that do not decay throw ImproperDensityError', () => {
    expect(() => ratioOfUniformsSampler({ logDensity: (x: number) => x, support: [0, Infinity] })).toThrow(ImproperDensityError);
    expect(() => ratioOfUniformsSampler({ logDensity: (x: number) => -0.9 * Math.log1p(Math.abs(x)) })).toThrow(ImproperDensityError);
  });
});

describe('ratioOfUniformsSampler: fast-check, the rectangle contains the region', () => {
  /** Checks u ≤ umax and vmin ≤ (x − s)·f^(r/(r+1)) ≤ vmax at x, in logs, from the region's fields. */
  function contains(target: Target, opts: RatioOfUniformsOptions, xs: number[]): boolean {
    const s = ratioOfUniformsSampler(target, { ...opts, seed: 1 });
    const reg = s.region;
    const r = reg.power;
    const k = r / (r + 1);
    for (const x of xs) {
      const lf = target.logDensity(x);
      if (lf === -Infinity) continue;
      if (lf / (r + 1) > reg.logUMax) return false;
      const d = x - reg.shift;
      if (d === 0) continue;
      const logAbsV = Math.log(Math.abs(d)) + k * lf;
      if (logAbsV > (d > 0 ? reg.logVMax : reg.logVMinAbs)) return false;
    }
    return true;
  }
  const zs = fc.array(fc.oneof(fc.double({ min: -8, max: 8, noNaN: true }), fc.double({ min: -1e6, max: 1e6, noNaN: true })), {
    minLength: 20,
    maxLength: 40,
  });

  it('normal(mean, sd), power r', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e3, max: 1e3, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 0.2, max: 5, noNaN: true }), zs, (m, sd, r, z) =>
        contains(normalTarget(m, sd), { power: r }, z.map((t) => m + sd * t)),
      ),
      { numRuns: 40, seed: 451 },
    );
  });

  it('gamma(shape ≥ 1, rate), power r', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 60, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0.2, max: 5, noNaN: true }), zs, (a, rate, r, z) =>
        contains(gammaTarget(a, rate), { power: r }, z.map((t) => Math.abs(a / rate + (Math.sqrt(a) / rate) * t))),
      ),
      { numRuns: 40, seed: 452 },
    );
  });

  it('beta(a ≥ 1, b ≥ 1), power r', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 40, noNaN: true }), fc.double({ min: 1, max: 40, noNaN: true }), fc.double({ min: 0.2, max: 5, noNaN: true }), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 20, maxLength: 40 }), (a, b, r, xs) =>
        contains(betaTarget(a, b), { power: r }, xs),
      ),
      { numRuns: 40, seed: 453 },
    );
  });

  it('studentT(df, location, scale) with power r ≥ 1.2/df', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.4, max: 40, noNaN: true }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        fc.double({ min: 1, max: 3, noNaN: true }),
        zs,
        (df, loc, sc, f, z) => contains(studentTTarget(df, loc, sc), { power: Math.max(0.5, (1.2 * f) / df) }, z.map((t) => loc + sc * t)),
      ),
      { numRuns: 40, seed: 454 },
    );
  });

  it('logistic(location, scale) with a random shift', () => {
    fc.assert(
      fc.property(fc.double({ min: -100, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), zs, (loc, sc, sh, z) =>
        contains(logisticTarget(loc, sc), { shift: loc + sc * sh }, z.map((t) => loc + sc * t)),
      ),
      { numRuns: 40, seed: 455 },
    );
  });
});

describe('ratioOfUniformsSampler: evaluation-time checks', () => {
  /** A target that changes after `setupCalls` evaluations: it lies to the rectangle search. */
  function lyingTarget(base: Target, after: (x: number, lf: number) => number): { target: Target; arm: () => void } {
    let armed = false;
    return {
      target: { logDensity: (x: number) => (armed ? after(x, base.logDensity(x)) : base.logDensity(x)), mode: base.mode },
      arm: () => {
        armed = true;
      },
    };
  }

  it('a target above the u-bound (sup f underestimated) throws EnvelopeViolationError', () => {
    // Raised only for |x| < 0.5 < vMax, where the v-bounds cannot be exceeded: this is the u-check.
    const { target, arm } = lyingTarget(normalTarget(0, 1), (x, lf) => (Math.abs(x) < 0.5 ? lf + 0.1 : lf));
    const s = ratioOfUniformsSampler(target, { seed: 461 });
    arm();
    let err: unknown;
    try {
      draw(s, 10_000);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EnvelopeViolationError);
    const ev = err as EnvelopeViolationError;
    expect(ev.logTarget).toBeGreaterThan(ev.logEnvelope);
    expect(ev.logEnvelope).toBe(s.region.logDensityBound);
  });

  it('a target outside the v-bounds (but below the u-bound) throws EnvelopeViolationError', () => {
    // After setup, f/M = e^(−1) on 2.5 ≤ |x| ≤ 4: |x|·(f/M)^(1/2) ≥ 1.5 > vMax = 0.858 (closed form √2·e^(−1/2)).
    const n = normalTarget(0, 1);
    const LM = n.logDensity(0);
    const { target, arm } = lyingTarget(n, (x, lf) => (Math.abs(x) >= 2.5 && Math.abs(x) <= 4 ? LM - 1 : lf));
    const s = ratioOfUniformsSampler(target, { seed: 462 });
    arm();
    let err: unknown;
    try {
      draw(s, 50_000);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EnvelopeViolationError);
    const ev = err as EnvelopeViolationError;
    expect(Math.abs(ev.x)).toBeGreaterThanOrEqual(2.5);
    expect(ev.logTarget).toBeLessThan(s.region.logDensityBound);
    expect(ev.logEnvelope).toBeCloseTo(s.logEnvelope(ev.x), 12);
  });

  it('NaN or +Infinity from logDensity while sampling throws NonFiniteDensityError', () => {
    for (const bad of [NaN, Infinity]) {
      const { target, arm } = lyingTarget(normalTarget(0, 1), (x, lf) => (x > 1 ? bad : lf));
      const s = ratioOfUniformsSampler(target, { seed: 463 });
      arm();
      expect(() => draw(s, 10_000)).toThrow(NonFiniteDensityError);
    }
  });

  it('a valid squeeze saves density evaluations and keeps the draws exact', () => {
    // e^t ≥ 1 + t gives φ_sd(x) ≥ φ_sd(0)·(1 − x²/(2sd²)) for |x| < √2·sd (common practice).
    const withSqueeze = (sd: number, seed: number) => {
      const n = normalTarget(0, sd);
      const c = n.logDensity(0);
      const squeeze = (x: number) => (x * x < 2 * sd * sd ? c + Math.log1p((-0.5 * x * x) / (sd * sd)) : -Infinity);
      return ratioOfUniformsSampler(n, { squeeze, seed });
    };
    const cdf = (x: number) => normalCdf(x, 0, 1);
    const s = withSqueeze(1, 464);
    expectFits(draw(s, N), cdf, 'normal with squeeze');
    const st = s.stats;
    // regression guard: 0.45 of the proposals are evaluated with this squeeze (observed at seed 464,
    // n = 20,000, 2026-12-02); 0.6 is a margin above it
    expect(st.densityEvaluations).toBeLessThan(0.6 * st.proposals);
    expectRate(st.samples, st.proposals, 0.73057, 'squeeze does not change acceptance'); // √(πe)/4, test/reference/README.md
    expectRejects(draw(withSqueeze(1.08, 464), N), cdf, 'normal sd 1.08 with squeeze');
  });

  it('a squeeze above the target throws EnvelopeViolationError (squeeze)', () => {
    const n = normalTarget(0, 1);
    const s = ratioOfUniformsSampler(n, { squeeze: (x) => n.logDensity(x) + 0.01, seed: 465 });
    expect(() => draw(s, 1000)).toThrow(/below the squeeze/);
    const s2 = ratioOfUniformsSampler(n, { squeeze: () => NaN, seed: 465 });
    expect(() => s2.sample()).toThrow(NonFiniteDensityError);
  });

  it('consecutive rejections are bounded: StalledSamplerError', () => {
    // u = 1 − 0.999999 = 1e-6 and v ≈ vMax every time: x ≈ 8.6e5, always rejected.
    const stuck = () => 0.999999;
    const s = ratioOfUniformsSampler(normalTarget(0, 1), { uniform: stuck, maxRejections: 1000 });
    expect(() => s.sample()).toThrow(StalledSamplerError);
    const d = ratioOfUniformsSampler(normalTarget(0, 1), { uniform: stuck });
    let err: unknown;
    try {
      d.sample();
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(StalledSamplerError);
    expect((err as StalledSamplerError).rejections).toBe(DEFAULT_MAX_REJECTIONS);
  });
});

describe('ratioOfUniformsSampler: counts', () => {
  it('counts setup and sampling evaluations, proposals and samples', () => {
    let calls = 0;
    const n = normalTarget(0, 1);
    const target: Target = { logDensity: (x: number) => (calls++, n.logDensity(x)), mode: 0 };
    const s = ratioOfUniformsSampler(target, { seed: 471 });
    const setup = calls;
    expect(s.stats.setupEvaluations).toBe(setup);
    expect(s.stats).toMatchObject({ samples: 0, proposals: 0, densityEvaluations: 0, acceptanceRate: 0 });
    expect(Number.isNaN(s.region.estimatedAcceptance)).toBe(true);
    draw(s, 1000);
    const st = s.stats;
    expect(st.samples).toBe(1000);
    expect(st.densityEvaluations).toBe(calls - setup);
    expect(st.densityEvaluations).toBe(st.proposals); // infinite support, no squeeze: every candidate is evaluated
    expect(st.acceptanceRate).toBe(1000 / st.proposals);
  });

  it('candidates outside the support are rejected without evaluation', () => {
    const s = ratioOfUniformsSampler(gammaTarget(3), { seed: 472 });
    const xs = draw(s, N);
    expectInSupport(xs, 0, Infinity);
    expect(s.stats.densityEvaluations).toBeLessThan(s.stats.proposals);
  });
});

describe('ratioOfUniformsSampler: bad inputs give typed errors, never draws', () => {
  const n = normalTarget(0, 1);
  const bad: Array<[string, () => unknown, new (...a: never[]) => Error]> = [
    ['power 0', () => ratioOfUniformsSampler(n, { power: 0 }), InvalidOptionError],
    ['power −1', () => ratioOfUniformsSampler(n, { power: -1 }), InvalidOptionError],
    ['power NaN', () => ratioOfUniformsSampler(n, { power: NaN }), InvalidOptionError],
    ['power Infinity', () => ratioOfUniformsSampler(n, { power: Infinity }), InvalidOptionError],
    ['power "1"', () => ratioOfUniformsSampler(n, { power: '1' as unknown as number }), InvalidOptionError],
    ['shift NaN', () => ratioOfUniformsSampler(n, { shift: NaN }), InvalidOptionError],
    ['shift Infinity', () => ratioOfUniformsSampler(n, { shift: Infinity }), InvalidOptionError],
    ['unknown option', () => ratioOfUniformsSampler(n, { powr: 2 } as unknown as RatioOfUniformsOptions), InvalidOptionError],
    ['squeeze not a function', () => ratioOfUniformsSampler(n, { squeeze: 1 as unknown as () => number }), InvalidOptionError],
    ['maxRejections 0', () => ratioOfUniformsSampler(n, { maxRejections: 0 }), InvalidOptionError],
    ['seed and uniform', () => ratioOfUniformsSampler(n, { seed: 1, uniform: Math.random }), InvalidOptionError],
    ['seed −1', () => ratioOfUniformsSampler(n, { seed: -1 }), InvalidOptionError],
    ['no logDensity', () => ratioOfUniformsSampler({} as Target), InvalidTargetError],
    ['reversed support', () => ratioOfUniformsSampler({ logDensity: () => 0, support: [1, 0] }), InvalidTargetError],
    ['mode hint that is not a mode', () => ratioOfUniformsSampler({ ...n, mode: 1 }), InvalidTargetError],
    ['logDensity NaN', () => ratioOfUniformsSampler({ logDensity: () => NaN }), NonFiniteDensityError],
    ['logDensity +Infinity inside', () => ratioOfUniformsSampler({ logDensity: (x: number) => (Math.abs(x - 0.3) < 0.2 ? Infinity : -x * x) }), NonFiniteDensityError],
    ['no mass', () => ratioOfUniformsSampler({ logDensity: () => -Infinity }), InvalidTargetError],
  ];
  for (const [label, make, type] of bad) {
    it(`ratioOfUniformsSampler with ${label} throws ${type.name}`, () => {
      expect(make).toThrow(type);
      try {
        make();
      } catch (e) {
        expect((e as Error).message).toMatch(/^ratioOfUniformsSampler/);
      }
    });
  }

  it('a wrong mode hint is accepted when options.shift is given (the hint is then not used as the shift)', () => {
    const s = ratioOfUniformsSampler({ ...n, mode: 1 }, { shift: 1, seed: 5 });
    expect(s.region.shift).toBe(1);
    expect(s.region.logDensityMax).toBe(n.logDensity(0));
  });

  it('a uniform source returning 1 throws at draw time instead of drawing', () => {
    const s = ratioOfUniformsSampler(n, { uniform: () => 1 });
    expect(() => s.sample()).toThrow(InvalidOptionError);
  });

  it('fill requires a Float64Array', () => {
    const s = ratioOfUniformsSampler(n, { seed: 1 });
    expect(() => s.fill([0, 0] as unknown as Float64Array)).toThrow(InvalidTargetError);
  });
});

describe('ratioOfUniformsSampler: streams', () => {
  it('same seed, same draws; different seed, different draws', () => {
    expectReproducible((seed) => ratioOfUniformsSampler(studentTTarget(5), { seed }));
    expectReproducible((seed) => ratioOfUniformsSampler(cauchy, { seed, power: 2 }));
  });

  it('sample() and fill() consume the same stream; seed s equals an injected mersenneTwister(s)', () => {
    const a = draw(ratioOfUniformsSampler(n5(), { seed: 9 }), 200);
    const b = ratioOfUniformsSampler(n5(), { seed: 9 });
    const c = draw(ratioOfUniformsSampler(n5(), { uniform: mersenneTwister(9) }), 200);
    for (let i = 0; i < 200; i++) expect(b.sample()).toBe(a[i]);
    expect(Array.from(c)).toEqual(Array.from(a));
  });

  it('the stream is u = 1 − U₁, v = vMin + (vMax − vMin)·U₂ on the closed-form rectangle (independent re-implementation)', () => {
    // Kinderman & Monahan 1977 for the standard normal with the closed-form rectangle
    // u ∈ (0, 1], v ∈ ±√2·e^(−1/2) (f scaled by its sup): the sampler must give the same
    // draws up to the 1e-9 margin of its rectangle.
    const u = mersenneTwister(2024);
    const vMax = Math.SQRT2 * Math.exp(-0.5);
    const ref: number[] = [];
    while (ref.length < 50) {
      const uu = 1 - u();
      const v = -vMax + 2 * vMax * u();
      const x = v / uu;
      if (2 * Math.log(uu) <= -0.5 * x * x) ref.push(x);
    }
    const got = draw(ratioOfUniformsSampler(normalTarget(0, 1), { seed: 2024 }), 50);
    for (let i = 0; i < 50; i++) expect(Math.abs(got[i] - ref[i])).toBeLessThan(1e-8 * (1 + Math.abs(ref[i])));
  });

  it('golden snapshot of the first 5 draws at seed 5489 (stream regression guard, values recorded from this implementation)', () => {
    // Not a correctness check: it pins the stream so that a change to the uniforms consumed per
    // draw (a breaking change: DEVELOPERS.md, "Stream-stability policy") cannot go unnoticed.
    const normal = Array.from(draw(ratioOfUniformsSampler(normalTarget(0, 1), { seed: 5489 }), 5));
    const t5r2 = Array.from(draw(ratioOfUniformsSampler(studentTTarget(5), { seed: 5489, power: 2 }), 5));
    expect({ normal, t5r2 }).toMatchInlineSnapshot(`
      {
        "normal": [
          -1.8780034714626939,
          0.11147103199960402,
          -0.585727136321921,
          1.2334107304339088,
          1.3763110353873278,
        ],
        "t5r2": [
          0.7877354684475756,
          0.13079879979512693,
          0.9631610930904067,
          1.8058417917460465,
          -2.372293206990688,
        ],
      }
    `);
  });
});

function n5(): Target {
  return normalTarget(5, 0.5);
}

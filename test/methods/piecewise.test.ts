import betaCdf from '@stdlib/stats-base-dists-beta-cdf';
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import gammaln from '@stdlib/math-base-special-gammaln';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  EnvelopeViolationError,
  ImproperDensityError,
  InvalidOptionError,
  InvalidTargetError,
  NonFiniteDensityError,
  ShapeViolationError,
  gammaTarget,
  mersenneTwister,
  normalProposal,
  normalTarget,
  piecewiseSampler,
  rejectionSampler,
  studentTTarget,
  uniformProposal,
  exactSampler,
} from '../../src/index.js';
import type { PiecewiseOptions, PiecewiseSampler, Target } from '../../src/index.js';
import { MULTIMODAL, multimodalLogDensity, multimodalTarget, multimodalTruncated } from '../helpers/fixtures.js';
import { methodSuite, methodSuites } from '../helpers/method-suite.js';
import { quadratureCdf } from '../helpers/quadrature.js';
import { draw, expectFits, expectInSupport, expectRate, expectRejects, expectReproducible } from '../helpers/statistical.js';

const N = 20_000;
const LOG_SQRT_2PI = 0.9189385332046727; // log √(2π), common practice

function lse(v: number[]): number {
  let m = -Infinity;
  for (const x of v) if (x > m) m = x;
  if (m === -Infinity) return m;
  let s = 0;
  for (const x of v) s += Math.exp(x - m);
  return m + Math.log(s);
}

/** A mixture of normals written here (log-sum-exp), with its derivative, and its cdf from @stdlib. */
function normalMixture(ws: number[], mus: number[], sds: number[], withDerivative = true): { target: Target; cdf: (x: number) => number } {
  const total = ws.reduce((a, b) => a + b, 0);
  const comp = (x: number): number[] => ws.map((w, i) => Math.log(w / total) - Math.log(sds[i]) - LOG_SQRT_2PI - 0.5 * ((x - mus[i]) / sds[i]) ** 2);
  const target: Target = { logDensity: (x: number) => lse(comp(x)) };
  if (withDerivative) {
    target.dLogDensity = (x: number) => {
      const c = comp(x);
      const m = lse(c);
      let s = 0;
      for (let i = 0; i < c.length; i++) s += Math.exp(c[i] - m) * (-(x - mus[i]) / (sds[i] * sds[i]));
      return s;
    };
  }
  const cdf = (x: number): number => ws.reduce((a, w, i) => a + (w / total) * normalCdf(x, mus[i], sds[i]), 0);
  return { target, cdf };
}

/** The worked example shifted by `d` (a slightly wrong target for biased twins), on [−3, 3] or the line. */
function shiftedMultimodal(d: number, truncated: boolean): Target {
  const lf = (x: number): number => multimodalLogDensity(x - d);
  return truncated ? { logDensity: (x: number) => (x >= -3 && x <= 3 ? lf(x) : -Infinity), support: [-3, 3] } : { logDensity: lf };
}

describe('piecewiseSampler: the worked example f(x) = exp(−x²/2)(sin²6x + 3cos²x·sin²4x + 1)', () => {
  // Reference cdfs by Simpson quadrature (test/helpers/quadrature.ts), independent of the sampler.
  const ref3 = quadratureCdf(multimodalLogDensity, -3, 3);
  const refLine = quadratureCdf(multimodalLogDensity, -12, 12); // mass beyond |x| = 12 is below e^−72·5

  it('the quadrature references reproduce Z from test/reference/README.md (5.879611 on [−3, 3], 5.894340 on the line)', () => {
    expect(Math.abs(ref3.total / MULTIMODAL.zTruncated - 1)).toBeLessThan(2e-6);
    expect(Math.abs(refLine.total / MULTIMODAL.zLine - 1)).toBeLessThan(2e-6);
  });

  for (const [label, make, Z, ref, lo, hi] of [
    ['on [−3, 3]', multimodalTruncated, MULTIMODAL.zTruncated, ref3, -3, 3],
    ['on the whole line', multimodalTarget, MULTIMODAL.zLine, refLine, -Infinity, Infinity],
  ] as const) {
    it(`piecewiseSampler ${label}: acceptance ≥ 0.95 with no hand-given constant, and as predicted by Z/(envelope area)`, () => {
      const s = piecewiseSampler(make(), { seed: 20261201 });
      const xs = draw(s, N);
      const st = s.stats;
      // requirement (issue 5): acceptance ≥ 0.95 with no hand-given constant; the default refinement
      // goal (targetAreaRatio 1.01) aims at about 1/1.01
      expect(st.acceptanceRate).toBeGreaterThanOrEqual(0.95);
      // acceptance of rejection = Z / (envelope area) (Devroye 1986, II.3); Z by quadrature (test/reference/README.md)
      expectRate(st.samples, st.proposals, Z / Math.exp(s.envelope.logEnvelopeArea), label);
      // regression guard: only proposals above the squeeze are evaluated, about 1 − 1/1.01 ≈ 1 % by the
      // default refinement goal; 0.05 is a margin above it
      expect(st.densityEvaluations / st.samples).toBeLessThan(0.05);
      expectInSupport(xs, lo, hi);
    });

    // biased twin: the same method on the example shifted by 0.03 (cdf differs by ≈ 0.02)
    methodSuites(
      `piecewiseSampler ${label}: KS and AD accept against the quadrature cdf; a shifted target is rejected`,
      [false, true].map((derivativeFree) => ({
        name: `piecewiseSampler ${label} (${derivativeFree ? 'secant' : 'tangent'})`,
        make: (seed: number) => piecewiseSampler(make(), { seed, derivativeFree }),
        biased: (seed: number) => piecewiseSampler(shiftedMultimodal(0.03, lo === -3), { seed, derivativeFree }),
        cdf: ref.cdf,
        n: N,
        seed: 7,
        stream: lo === -3, // the build on the line is slow; its stream is checked in 'counts, stream and reproducibility'
      })),
    );
  }

  it('plain rejection for comparison: C = 25 with U(−3, 3) accepts Z/25 ≈ 0.235, C = 11 with N(0, 1) accepts Z/11 ≈ 0.536', () => {
    // acceptance Z_f/(C·Z_g) (test/reference/README.md, Devroye 1986 II.3); sup f/g = 24.8944 and 10.9403 (test/reference/README.md) are below C
    const u = rejectionSampler(multimodalTruncated(), { proposal: uniformProposal(-3, 3), logBound: Math.log(25), seed: 3 });
    draw(u, N);
    expectRate(u.stats.samples, u.stats.proposals, MULTIMODAL.zTruncated / 25, 'uniform C = 25');
    const g = rejectionSampler(multimodalTarget(), { proposal: normalProposal(0, 1), logBound: Math.log(11), seed: 3 });
    draw(g, N);
    expectRate(g.stats.samples, g.stats.proposals, MULTIMODAL.zLine / 11, 'normal C = 11');
  });

  it('piecewiseSampler finds the curvature changes: between two neighbouring modes of the example there is a convex stretch', () => {
    const e = piecewiseSampler(multimodalTruncated(), { seed: 1 }).envelope;
    expect(e.inflections.length).toBeGreaterThanOrEqual(10);
    expect(e.extrema.length).toBeGreaterThanOrEqual(7);
    expect(e.tails).toEqual({ lower: 'none', upper: 'none' });
    expect(e.areaRatio).toBeLessThanOrEqual(e.targetAreaRatio);
  });
});

describe('piecewiseSampler: mixtures, a narrow spike, heavy tails', () => {
  const cases: [string, ReturnType<typeof normalMixture>, ReturnType<typeof normalMixture>][] = [
    // [label, mixture, biased twin (weights or locations moved)]
    ['two normals, separated', normalMixture([0.5, 0.5], [-4, 4], [1, 1]), normalMixture([0.46, 0.54], [-4, 4], [1, 1])],
    ['two normals, overlapping', normalMixture([0.3, 0.7], [0, 1.2], [1, 0.7]), normalMixture([0.3, 0.7], [0, 1.35], [1, 0.7])],
    ['three normals, separated, very different widths', normalMixture([0.2, 0.5, 0.3], [-10, 0, 12], [0.5, 3, 0.2]), normalMixture([0.2, 0.47, 0.33], [-10, 0, 12], [0.5, 3, 0.2])],
    ['three normals, overlapping', normalMixture([1, 1, 1], [-1, 0, 1.5], [0.6, 0.5, 0.8]), normalMixture([1, 1, 1], [-1, 0.2, 1.5], [0.6, 0.5, 0.8])],
  ];
  methodSuites(
    'piecewiseSampler on normal mixtures: KS and AD accept (cdf: @stdlib normal); the twin is rejected',
    cases.flatMap(([label, mix, twin]) =>
      [false, true].map((derivativeFree) => ({
        name: `piecewiseSampler, ${label} (${derivativeFree ? 'secant' : 'tangent'})`,
        make: (seed: number) => piecewiseSampler(mix.target, { seed, derivativeFree }),
        afterFit: (s: PiecewiseSampler) => expect(s.stats.acceptanceRate).toBeGreaterThan(0.95), // requirement (issue 5), as above
        biased: (seed: number) => piecewiseSampler(twin.target, { seed, derivativeFree }),
        cdf: mix.cdf,
        n: N,
        seed: 11,
      })),
    ),
  );

  /** 0.4·Gamma(2, 1) + 0.6·Gamma(shape2, 1), written here. */
  function gammaMixture(shape2: number): Target {
    const gl = (x: number, k: number): number => (x > 0 && x < Infinity ? (k - 1) * Math.log(x) - x - gammaln(k) : -Infinity);
    return { logDensity: (x: number) => lse([Math.log(0.4) + gl(x, 2), Math.log(0.6) + gl(x, shape2)]), support: [0, Infinity] };
  }
  methodSuite({
    name: 'piecewiseSampler, a mixture of gamma shapes 2 and 12 (cdf: @stdlib gamma, shapes < 1000; twin: shape 12.8)',
    make: (seed) => piecewiseSampler(gammaMixture(12), { seed }),
    afterFit: (s) => expect(s.envelope.tails).toEqual({ lower: 'none', upper: 'exponential' }),
    biased: (seed) => piecewiseSampler(gammaMixture(12.8), { seed }),
    cdf: (x) => 0.4 * gammaCdf(x, 2, 1) + 0.6 * gammaCdf(x, 12, 1),
    n: N,
    seed: 5,
    support: [0, Infinity],
  });

  /** 0.8·Beta(2, 2) + 0.2·N(at, 0.001) on [0, 1]: a spike of width 1e-3 of the support. */
  function spike(at: number): Target {
    return {
      logDensity: (x: number) =>
        x >= 0 && x <= 1 ? lse([Math.log(0.8 * 6 * x * (1 - x)), Math.log(0.2) - Math.log(1e-3) - LOG_SQRT_2PI - 0.5 * ((x - at) / 1e-3) ** 2]) : -Infinity,
      support: [0, 1],
    };
  }
  const spikeCdf = (x: number): number => 0.8 * betaCdf(x, 2, 2) + 0.2 * normalCdf(x, 0.3127, 1e-3); // @stdlib; normal mass outside [0, 1] < 1e-300
  methodSuite({
    name: 'piecewiseSampler, a spike of width 1e-3 on a smooth density (twin: the spike moved by 3 widths)',
    make: (seed) => piecewiseSampler(spike(0.3127), { seed }),
    biased: (seed) => piecewiseSampler(spike(0.3157), { seed }),
    cdf: spikeCdf,
    n: N,
    seed: 9,
    support: [0, 1],
  });

  // twin: the smooth part alone (what a sampler blind to the spike would give)
  const base: Target = { logDensity: (x: number) => (x >= 0 && x <= 1 ? Math.log(6 * x * (1 - x)) : -Infinity), support: [0, 1] };
  methodSuite({
    name: 'piecewiseSampler, the spike with a coarse scan but its location as a breakpoint (twin: without the spike)',
    make: (seed) => piecewiseSampler(spike(0.3127), { seed, scanPoints: 16, breakpoints: [0.3127] }),
    biased: (seed) => piecewiseSampler(base, { seed }),
    cdf: spikeCdf,
    n: N,
    seed: 9,
  });

  methodSuite({
    name: 'piecewiseSampler, Student-t(3): inverse-sqrt tails (Hörmann 1995; cdf: @stdlib t; twin: t(2.2))',
    make: (seed) => piecewiseSampler(studentTTarget(3), { seed }),
    afterFit: (s) => expect(s.envelope.tails).toEqual({ lower: 'inverse-sqrt', upper: 'inverse-sqrt' }),
    biased: (seed) => piecewiseSampler(studentTTarget(2.2), { seed }),
    cdf: (x) => tCdf(x, 3),
    n: N,
    seed: 13,
  });
});

describe('piecewiseSampler: property (fast-check): random mixtures of 2 to 5 normals', () => {
  it('every random mixture builds, and its envelope dominates the target and its squeeze lies below it at random points', () => {
    // Ranges: weights [0.05, 1], locations [−10, 10], sds [0.05, 5] (log-uniform): a narrowest component
    // of 1/400 of the spread, within what the 1024-point scan resolves (see the sampler's Limits remark).
    const comp = fc.record({
      w: fc.double({ min: 0.05, max: 1, noNaN: true }),
      mu: fc.double({ min: -10, max: 10, noNaN: true }),
      ls: fc.double({ min: Math.log(0.05), max: Math.log(5), noNaN: true }),
    });
    let built = 0;
    fc.assert(
      fc.property(fc.array(comp, { minLength: 2, maxLength: 5 }), fc.boolean(), fc.integer({ min: 1, max: 1e9 }), (cs, withDerivative, seed) => {
        const mix = normalMixture(cs.map((c) => c.w), cs.map((c) => c.mu), cs.map((c) => Math.exp(c.ls)), withDerivative);
        // every case must build: a refusal of a bounded, smooth mixture in these ranges is a defect
        const s: PiecewiseSampler = piecewiseSampler(mix.target, { seed });
        built++;
        const u = mersenneTwister(seed);
        const pts: number[] = [];
        for (let k = 0; k < 200; k++) pts.push(-25 + 50 * u());
        for (const c of cs) for (let k = 0; k < 60; k++) pts.push(c.mu + Math.exp(c.ls) * (8 * u() - 4));
        for (const x of pts) {
          const lf = mix.target.logDensity(x);
          const tol = 1e-9 + 1e-12 * Math.abs(lf); // the sampler's check tolerance
          expect(s.logEnvelope(x), `envelope at ${x}`).toBeGreaterThanOrEqual(lf - tol);
          expect(s.logSqueeze(x), `squeeze at ${x}`).toBeLessThanOrEqual(lf + tol);
        }
      }),
      { numRuns: 60, seed: 20261201 },
    );
    expect(built).toBe(60);
  });
});

describe('piecewiseSampler: draw-time checks and adapt', () => {
  /** A standard normal whose density, once armed, is e^0.5 times higher on (c1, c2): a feature the setup never saw. */
  function hiddenStep() {
    const state = { armed: false, c1: 0, c2: 0 };
    const target: Target = {
      logDensity: (x: number) => -0.5 * x * x + (state.armed && x > state.c1 && x < state.c2 ? 0.5 : 0),
      dLogDensity: (x: number) => -x,
    };
    const arm = (s: PiecewiseSampler): void => {
      // the widest grid cell inside [−1.5, 1.5]: no setup point lies inside (c1, c2)
      const g = s.envelope.gridPoints;
      let best = -1;
      for (let i = 0; i + 1 < g.length; i++) if (g[i] >= -1.5 && g[i + 1] <= 1.5 && (best < 0 || g[i + 1] - g[i] > g[best + 1] - g[best])) best = i;
      const w = g[best + 1] - g[best];
      state.c1 = g[best] + 0.2 * w;
      state.c2 = g[best] + 0.8 * w;
      state.armed = true;
    };
    return { target, arm, state };
  }

  it('piecewiseSampler (adapt: false): a density found above the envelope throws EnvelopeViolationError with x; the sampler stays failed', () => {
    const h = hiddenStep();
    const s = piecewiseSampler(h.target, { seed: 2, scanPoints: 16, targetAreaRatio: 1.5 });
    h.arm(s);
    let err: unknown;
    try {
      draw(s, 1_000_000);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EnvelopeViolationError);
    const v = err as EnvelopeViolationError;
    expect(v.x).toBeGreaterThan(h.state.c1);
    expect(v.x).toBeLessThan(h.state.c2);
    expect(v.logTarget).toBeGreaterThan(v.logEnvelope);
    expect(() => s.sample()).toThrow(EnvelopeViolationError);
  });

  it('piecewiseSampler (adapt: true): repairs are counted, and the draws after them fit the density as it is (KS and AD); the unarmed density is rejected', () => {
    const h = hiddenStep();
    const s = piecewiseSampler(h.target, { seed: 2, scanPoints: 16, targetAreaRatio: 1.5, adapt: true });
    h.arm(s);
    draw(s, 200_000); // draws before and around the repairs are not exact (see the adapt option)
    expect(s.stats.envelopeRepairs).toBeGreaterThan(0);
    const { c1, c2 } = h.state;
    const k = Math.exp(0.5) - 1;
    const z = 1 + k * (normalCdf(c2, 0, 1) - normalCdf(c1, 0, 1));
    // cdf of the armed density from @stdlib normal cdf
    const cdf = (x: number): number => (normalCdf(x, 0, 1) + k * Math.max(0, normalCdf(Math.min(x, c2), 0, 1) - normalCdf(c1, 0, 1))) / z;
    const after = draw(s, 50_000);
    expectFits(after, cdf, 'after repairs');
    // twin at the same n: the unarmed standard normal misses the step's extra mass (≈ 0.02–0.1)
    expectRejects(after, (x: number) => normalCdf(x, 0, 1), 'unarmed normal');
  });

  it('piecewiseSampler: NaN from logDensity while sampling throws NonFiniteDensityError', () => {
    const state = { bad: false };
    const t: Target = { logDensity: (x: number) => (state.bad ? NaN : -0.5 * x * x), dLogDensity: (x: number) => -x };
    const s = piecewiseSampler(t, { seed: 1, scanPoints: 16, targetAreaRatio: 1.5 });
    state.bad = true;
    expect(() => draw(s, 100_000)).toThrow(NonFiniteDensityError);
  });
});

describe('piecewiseSampler: errors name the problem', () => {
  it('a support that is not an interval (density on [−2, −1] and [1, 2], 0 between) is refused, by piecewiseSampler and exactSampler; one interval with zeros around it is sampled', () => {
    // Without the check the scan stopped at the zeros next to the maximum at x = −1 and the
    // sampler drew from [−2, −1] only (found 2026-12-02): a silent loss of half the mass.
    const gap = { logDensity: (x: number) => (Math.abs(x) >= 1 && Math.abs(x) <= 2 ? -0.5 * x * x : -Infinity) };
    expect(() => piecewiseSampler(gap, { seed: 1 })).toThrow(/piecewiseSampler: logDensity is -Infinity on about \[-0\.99999\d*, 0\.99999\d*\] but finite on both sides .*the support is not an interval/);
    expect(() => piecewiseSampler(gap, { seed: 1, fast: true })).toThrow(InvalidTargetError);
    expect(() => exactSampler(gap, { seed: 1 })).toThrow(/not an interval/);
    // twin: the same density on [1, 2] only, zero elsewhere and no support given, is accepted and fits
    const one = { logDensity: (x: number) => (x >= 1 && x <= 2 ? -0.5 * x * x : -Infinity) };
    const z = normalCdf(2, 0, 1) - normalCdf(1, 0, 1);
    const xs = draw(piecewiseSampler(one, { seed: 2 }), 100_000);
    expectInSupport(xs, 1, 2);
    const cdf = (x: number): number => (x <= 1 ? 0 : x >= 2 ? 1 : (normalCdf(x, 0, 1) - normalCdf(1, 0, 1)) / z);
    expectFits(xs, cdf, 'one interval');
    // biased twin: the normal shifted by 0.15 on the same interval is rejected against that cdf
    const shiftedOne = { logDensity: (x: number) => (x >= 1 && x <= 2 ? -0.5 * (x - 0.15) ** 2 : -Infinity) };
    expectRejects(draw(piecewiseSampler(shiftedOne, { seed: 2 }), 100_000), cdf, 'one interval, shifted');
  });

  it('piecewiseSampler refuses bad options with InvalidOptionError', () => {
    const t = normalTarget(0, 1);
    expect(() => piecewiseSampler(t, { scanPoint: 10 } as unknown as PiecewiseOptions)).toThrow(/unknown option 'scanPoint'/);
    expect(() => piecewiseSampler(t, { breakpoints: [0, NaN] })).toThrow(/breakpoints\[1\]/);
    expect(() => piecewiseSampler(gammaTarget(2), { breakpoints: [-1] })).toThrow(/outside the support/);
    expect(() => piecewiseSampler(t, { scanPoints: 3 })).toThrow(/scanPoints/);
    expect(() => piecewiseSampler(t, { targetAreaRatio: 1 })).toThrow(/targetAreaRatio/);
    expect(() => piecewiseSampler(t, { adapt: 'yes' as unknown as boolean })).toThrow(/adapt/);
    expect(() => piecewiseSampler(t, { seed: 1, uniform: () => 0.5 })).toThrow(InvalidOptionError);
    expect(() => piecewiseSampler(t, { scanPoints: 3 })).toThrow(InvalidOptionError);
    expect(() => piecewiseSampler(t).fill([] as unknown as Float64Array)).toThrow(InvalidTargetError);
  });

  it('piecewiseSampler refuses a derivative that disagrees with logDensity', () => {
    expect(() => piecewiseSampler({ logDensity: (x: number) => -0.5 * x * x, dLogDensity: (x: number) => x })).toThrow(/dLogDensity disagrees/);
  });

  it('piecewiseSampler: no decay → ImproperDensityError; tails like |x|^−0.8 → ImproperDensityError; |x|^−1.5 → ShapeViolationError', () => {
    expect(() => piecewiseSampler({ logDensity: () => 0 })).toThrow(ImproperDensityError);
    expect(() => piecewiseSampler({ logDensity: (x: number) => -0.4 * Math.log1p(x * x) })).toThrow(ImproperDensityError);
    expect(() => piecewiseSampler(studentTTarget(0.5))).toThrow(ShapeViolationError);
    expect(() => piecewiseSampler(studentTTarget(0.5))).toThrow(/ratioOfUniformsSampler/);
  });

  it('piecewiseSampler: a density unbounded at an end of the support → InvalidTargetError', () => {
    expect(() => piecewiseSampler(gammaTarget(0.5))).toThrow(/unbounded at the lower end 0/);
  });

  it('piecewiseSampler: NaN from logDensity at setup → NonFiniteDensityError', () => {
    expect(() => piecewiseSampler({ logDensity: (x: number) => (x > 1 ? NaN : -x * x) })).toThrow(NonFiniteDensityError);
  });
});

describe('piecewiseSampler: counts, stream and reproducibility', () => {
  it('piecewiseSampler counts every logDensity call: setupEvaluations at construction, densityEvaluations while sampling', () => {
    let calls = 0;
    const base = multimodalTruncated();
    const t: Target = { ...base, logDensity: (x: number) => (calls++, base.logDensity(x)) };
    const s = piecewiseSampler(t, { seed: 4 });
    expect(s.stats.setupEvaluations).toBe(calls);
    const before = calls;
    draw(s, 5000);
    expect(s.stats.densityEvaluations).toBe(calls - before);
  });

  it('piecewiseSampler consumes two uniforms per proposal, three in a piece below 2^-12 of the area (stream contract)', () => {
    // the recorded stream is parsed with the contract: u1 selects piece j by the cumulative areas of the
    // envelope description; the position takes a fresh uniform only when area_j / total < 2^-12; then u3
    const mt = mersenneTwister(8);
    const seen: number[] = [];
    const s = piecewiseSampler(multimodalTarget(), { uniform: () => {
      const u = mt();
      seen.push(u);
      return u;
    } });
    const e = s.envelope;
    const share = e.pieces.map((p) => Math.exp(p.logArea - e.logEnvelopeArea));
    const start = seen.length;
    draw(s, 3000);
    let i = start;
    let proposals = 0;
    let fresh = 0;
    while (i < seen.length) {
      let v = seen[i];
      let j = 0;
      while (j < share.length - 1 && v >= share[j]) v -= share[j++];
      const small = share[j] < 2 ** -12;
      if (small) fresh++;
      i += small ? 3 : 2;
      proposals++;
    }
    expect(i).toBe(seen.length);
    expect(proposals).toBe(s.stats.proposals);
    expect(fresh).toBeGreaterThan(0); // both kinds of piece occur
    expect(fresh).toBeLessThan(proposals / 10);
  });

  it('piecewiseSampler: same seed, same draws; different seed, different draws', () => {
    expectReproducible((seed) => piecewiseSampler(multimodalTruncated(), { seed }));
    expectReproducible((seed) => piecewiseSampler(multimodalTarget(), { seed, derivativeFree: true }));
  });

  it('piecewiseSampler stream snapshot at seed 20261201 (regression guard: values recorded from this implementation, not a correctness check)', () => {
    const xs = Array.from(draw(piecewiseSampler(multimodalTruncated(), { seed: 20261201 }), 6));
    expect(xs.map((x) => x.toPrecision(12))).toEqual(SNAPSHOT);
  });

  it('piecewiseSampler({ fast: true }) stream snapshot at seed 20261201, truncated and on the line (regression guard under the stream-stability policy, not a correctness check)', () => {
    // Golden draws recorded on 2026-12-03 from the build before grid.ts was split (commit 8a06d4e) and
    // unchanged after it: the fast path draws from a strip table built over the piecewise envelope, so a
    // change in the grid, the pieces or the table shows here. A change is a stream change: note it in CHANGELOG.md.
    const fast = (t: Target): number[] => Array.from(draw(piecewiseSampler(t, { seed: 20261201, fast: true }), 6));
    expect(fast(multimodalTruncated())).toEqual([-1.1537994974435064, 0.26958939292910383, 1.0331362324927467, -0.5340082051145728, 0.47832813446921, -2.91341336446518]);
    expect(fast(multimodalTarget())).toEqual([-0.9869182884474069, -0.21603575211494247, 1.076460404972575, -0.4478168809560613, 0.595217321555448, -1.9582468185773232]);
  });
});

/** Recorded from this implementation (regression guard; re-recorded 2026-12-04 for the two-uniform candidate). A change here is a stream change: note it in CHANGELOG.md. */
const SNAPSHOT: string[] = ['-1.38505791205', '1.51519029436', '-2.91093202861', '0.443887444393', '1.19114430236', '-0.346224265647'];

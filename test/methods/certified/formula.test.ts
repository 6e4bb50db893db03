/**
 * certifiedSampler and exactSampler on formula targets (bounds from
 * formulaTarget's interval arithmetic): KS and Anderson–Darling at
 * ALPHA = 1e-4 with fixed seeds, each with a biased twin at the same n
 * (through the shared method suite, test/helpers/method-suite.ts).
 */
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ImproperDensityError, ShapeViolationError, certifiedSampler, exactSampler, formulaTarget } from '../../../src/index.js';
import type { CertifiedSampler, ExactSampler, Sampler } from '../../../src/index.js';
import { methodSuite, methodSuites } from '../../helpers/method-suite.js';
import { quadratureCdf } from '../../helpers/quadrature.js';
import { draw, expectFits, expectInSupport, expectRate, expectRejects } from '../../helpers/statistical.js';

const N = 20_000;
const LINE: [number, number] = [-Infinity, Infinity];

/** 0.7·N(0,1) + 0.3·N(mu, s²) as a formula (log-sum-exp of the two normal log-densities). */
function mixtureFormula(w: number, mu: number, s: number) {
  return formulaTarget('logsumexp(log(1 - w) - x^2/2, log(w) - log(s) - (x - mu)^2 / (2*s^2))', {
    support: LINE,
    parameters: { w, mu, s },
  });
}
/** Its cdf from @stdlib/stats-base-dists-normal-cdf. */
const mixtureCdf = (w: number, mu: number, s: number) => (x: number) => (1 - w) * normalCdf(x, 0, 1) + w * normalCdf(x, mu, s);

function near(xs: Float64Array, mu: number, r: number): number {
  let k = 0;
  for (const x of xs) if (Math.abs(x - mu) < r) k++;
  return k;
}

describe('certifiedSampler on formula targets', () => {
  // biased twins: weight 0.27 instead of 0.3 at the narrow component
  methodSuites(
    'certifiedSampler on formula mixtures: fits the mixture cdf, 0.3 of the draws at the narrow mode',
    ([
      [6, 1e-3, 21],
      [2.5, 1e-6, 22],
    ] as const).map(([mu, s, seed]) => ({
      name: `certifiedSampler(formula 0.7·N(0,1) + 0.3·N(${mu}, ${s}²))`,
      make: (sd: number) => certifiedSampler(mixtureFormula(0.3, mu, s), { seed: sd }),
      afterFit: (_: Sampler, xs: Float64Array) => expectRate(near(xs, mu, 10 * s), N, 0.3, 'narrow mode'), // mixture weight
      biased: (sd: number) => certifiedSampler(mixtureFormula(0.27, mu, s), { seed: sd }),
      cdf: mixtureCdf(0.3, mu, s),
      n: N,
      seed,
    })),
  );

  const worked = formulaTarget('-x^2/2 + log(sin(6*x)^2 + a*cos(x)^2*sin(4*x)^2 + 1)', { support: LINE, parameters: { a: 3 } });
  // reference cdf: composite Simpson rule on [−12, 12] (test/helpers/quadrature.ts), independent of the code under test
  const ref = quadratureCdf((x) => -0.5 * x * x + Math.log(Math.sin(6 * x) ** 2 + 3 * Math.cos(x) ** 2 * Math.sin(4 * x) ** 2 + 1), -12, 12, 1e-3);

  it('Simpson quadrature of the worked target reproduces Z = 5.894340 (test/reference/README.md, by quadrature)', () => {
    expect(ref.total).toBeCloseTo(5.89434, 5); // Z on the line, by quadrature (test/reference/README.md)
  });
  methodSuite<CertifiedSampler>({
    name: 'certifiedSampler(formula worked target) fits the Simpson cdf and accepts >= 0.99 after setup (twin: a = 2 instead of 3)',
    make: (seed) => certifiedSampler(worked, { seed }),
    beforeFit: (s) => expect(s.cells.acceptanceBound).toBeGreaterThanOrEqual(0.99),
    afterFit: (s) => expect(s.stats.acceptanceRate).toBeGreaterThanOrEqual(0.99),
    biased: (seed) => certifiedSampler(formulaTarget('-x^2/2 + log(sin(6*x)^2 + a*cos(x)^2*sin(4*x)^2 + 1)', { support: LINE, parameters: { a: 2 } }), { seed }),
    cdf: ref.cdf,
    n: N,
    seed: 23,
  });

  // A jump written with min/max: the factor 2 switches on over a ramp 1e-12 wide at x = 1 and off at x = 2
  // (the ramps change the cdf by less than 1e-11). cdf of e^−x on [0, 3] doubled on [1, 2], integrated by hand.
  const jumpText = (h: number) => `-x + log(${h}) * (min(1, max(0, 1e12*(x - 1))) - min(1, max(0, 1e12*(x - 2))))`;
  const jumpCdf = (h: number) => {
    const m = (x: number): number => {
      let v = 1 - Math.exp(-Math.min(x, 1));
      if (x > 1) v += h * (Math.exp(-1) - Math.exp(-Math.min(x, 2)));
      if (x > 2) v += Math.exp(-2) - Math.exp(-Math.min(x, 3));
      return v;
    };
    return (x: number) => (x <= 0 ? 0 : x >= 3 ? 1 : m(x) / m(3));
  };
  const gammaText = '(k - 1)*log(x) - x/theta - lgamma(k) - k*log(theta)';
  methodSuites('certifiedSampler on a formula jump and a gamma-like formula', [
    {
      name: 'certifiedSampler(formula with a jump written with min/max) fits the piecewise-exponential cdf (twin: a jump of 1.8 instead of 2)',
      make: (seed) => certifiedSampler(formulaTarget(jumpText(2), { support: [0, 3] }), { seed }),
      biased: (seed) => certifiedSampler(formulaTarget(jumpText(1.8), { support: [0, 3] }), { seed }),
      cdf: jumpCdf(2),
      n: N,
      seed: 24,
      support: [0, 3],
    },
    {
      name: 'certifiedSampler(gamma-like formula with lgamma, k = 2.5, θ = 1.5) fits the @stdlib gamma cdf (twin: k = 2.6)',
      make: (seed) => certifiedSampler(formulaTarget(gammaText, { support: [0, Infinity], parameters: { k: 2.5, theta: 1.5 } }), { seed }),
      biased: (seed) => certifiedSampler(formulaTarget(gammaText, { support: [0, Infinity], parameters: { k: 2.6, theta: 1.5 } }), { seed }),
      cdf: (x) => gammaCdf(x, 2.5, 1 / 1.5), // @stdlib gamma cdf (shape, rate), fine at small shapes
      n: N,
      seed: 25,
      support: [0, Infinity],
    },
  ]);

  it('certifiedSampler(formula −½·log(x) on [0, 1]) throws ShapeViolationError naming the cell at the pole', () => {
    const t = formulaTarget('-0.5*log(x)', { support: [0, 1] });
    expect(() => certifiedSampler(t, { maxCells: 100 })).toThrow(ShapeViolationError);
    expect(() => certifiedSampler(t, { maxCells: 100 })).toThrow(/no finite bound on the cell \[0, /);
  });
});

describe('formula mixture bounds used by certifiedSampler', () => {
  it('formulaTarget(logsumexp mixture): point derivatives lie in dLogDensityBounds, and tails are proven to decay', () => {
    const t = mixtureFormula(0.3, 6, 1e-3);
    fc.assert(
      fc.property(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: 0, max: 20, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (a, w, f) => {
        const b = a + w;
        const x = a + f * (b - a);
        const [lo, hi] = t.dLogDensityBounds(a, b);
        const d = t.dLogDensity(x);
        expect(d).toBeGreaterThanOrEqual(lo);
        expect(d).toBeLessThanOrEqual(hi);
      }),
      { seed: 7, numRuns: 300 },
    );
    // (log f)' of the mixture is a convex combination of −x and −(x − 6)/s²: > 0 left of 0, < 0 right of 6
    expect(t.dLogDensityBounds(-Infinity, -1)[0]).toBeGreaterThan(0);
    expect(t.dLogDensityBounds(7, Infinity)[1]).toBeLessThan(0);
  });
});

methodSuites<ExactSampler>('exactSampler on formula targets', [
  {
    name: 'exactSampler(formula −(x − 1)²/8) proves log-concavity and uses the hull (twin, added with the shared suite: −(x − 1.1)²/8)',
    make: (seed) => exactSampler(formulaTarget('-(x - 1)^2/8', { support: LINE }), { seed }),
    beforeFit: (s) => {
      expect(s.choice.method).toBe('adaptive-rejection');
      expect(s.choice.reason).toMatch(/^log-concave, proven/);
    },
    biased: (seed) => exactSampler(formulaTarget('-(x - 1.1)^2/8', { support: LINE }), { seed }),
    cdf: (x) => normalCdf(x, 1, 2), // @stdlib normal cdf
    n: N,
    seed: 26,
  },
  {
    name: 'exactSampler(formula mixture with the narrow mode) uses certifiedSampler and samples it exactly (twin, added with the shared suite: weight 0.27)',
    make: (seed) => exactSampler(mixtureFormula(0.3, 6, 1e-3), { seed }),
    beforeFit: (s) => {
      expect(s.choice.method).toBe('certified');
      expect(s.choice.proof?.[0].proven).toBe(false);
    },
    afterFit: (_, xs) => expectRate(near(xs, 6, 1e-2), N, 0.3, 'narrow mode'), // mixture weight
    biased: (seed) => exactSampler(mixtureFormula(0.27, 6, 1e-3), { seed }),
    cdf: mixtureCdf(0.3, 6, 1e-3),
    n: N,
    seed: 27,
  },
]);

describe('targets whose bounds cannot cover them', () => {
  const tText = '-(nu + 1)/2 * log1p(x^2/nu)';
  const t3 = formulaTarget(tText, { support: LINE, parameters: { nu: 3 } });

  it('certifiedSampler(formula Student-t(3) on the line) throws ImproperDensityError: a polynomial tail has no exponential envelope', () => {
    expect(() => certifiedSampler(t3, { maxCells: 300 })).toThrow(ImproperDensityError);
    expect(() => certifiedSampler(t3, { maxCells: 300 })).toThrow(/infinite cell/);
  });

  methodSuite<ExactSampler>({
    name: 'exactSampler(formula Student-t(3)) records the refusal, falls back to the scan (stating it) and fits the @stdlib t cdf (twin: Student-t(4))',
    make: (seed) => exactSampler(t3, { seed }),
    beforeFit: (s) => {
      expect(s.choice.rejected[0].method).toBe('certified');
      expect(s.choice.assumption).toMatch(/^black-box target \(its logDensityBounds could not cover it/);
      expect(s.choice.reason).toMatch(/tried first: certified/);
    },
    biased: (seed) => exactSampler(formulaTarget(tText, { support: LINE, parameters: { nu: 4 } }), { seed }),
    cdf: (x) => tCdf(x, 3), // @stdlib t cdf
    n: N,
    seed: 28,
    stream: false, // the fallback scan makes each build slow; exactSampler's stream is checked on the other targets
  });
});

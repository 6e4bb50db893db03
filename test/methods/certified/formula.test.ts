/**
 * certifiedSampler and exactSampler on formula targets (bounds from
 * formulaTarget's interval arithmetic): KS and Anderson–Darling at
 * ALPHA = 1e-4 with fixed seeds, each with a biased twin at the same n.
 */
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ImproperDensityError, ShapeViolationError, certifiedSampler, exactSampler, formulaTarget } from '../../../src/index.js';
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
  for (const [mu, s, seed] of [
    [6, 1e-3, 21],
    [2.5, 1e-6, 22],
  ] as const) {
    it(`certifiedSampler(formula 0.7·N(0,1) + 0.3·N(${mu}, ${s}²)) fits the mixture cdf, 0.3 of the draws at the narrow mode`, () => {
      const xs = draw(certifiedSampler(mixtureFormula(0.3, mu, s), { seed }), N);
      expectFits(xs, mixtureCdf(0.3, mu, s), 'formula mixture');
      expectRate(near(xs, mu, 10 * s), N, 0.3, 'narrow mode'); // mixture weight
    });
    it(`biased twin: weight 0.27 instead of 0.3 at N(${mu}, ${s}²) is rejected at n = ${N}`, () => {
      expectRejects(draw(certifiedSampler(mixtureFormula(0.27, mu, s), { seed }), N), mixtureCdf(0.3, mu, s), 'formula mixture, biased');
    });
  }

  const worked = formulaTarget('-x^2/2 + log(sin(6*x)^2 + a*cos(x)^2*sin(4*x)^2 + 1)', { support: LINE, parameters: { a: 3 } });
  // reference cdf: composite Simpson rule on [−12, 12] (test/helpers/quadrature.ts), independent of the code under test
  const ref = quadratureCdf((x) => -0.5 * x * x + Math.log(Math.sin(6 * x) ** 2 + 3 * Math.cos(x) ** 2 * Math.sin(4 * x) ** 2 + 1), -12, 12, 1e-3);

  it('certifiedSampler(formula worked target) fits the Simpson cdf (Z = 5.894340) and accepts >= 0.99 after setup', () => {
    expect(ref.total).toBeCloseTo(5.89434, 5); // Z on the line, by quadrature (REFERENCES.md)
    const s = certifiedSampler(worked, { seed: 23 });
    expect(s.cells.acceptanceBound).toBeGreaterThanOrEqual(0.99);
    const xs = draw(s, N);
    expectFits(xs, ref.cdf, 'formula worked');
    expect(s.stats.acceptanceRate).toBeGreaterThanOrEqual(0.99);
  });

  it('biased twin: the formula with a = 2 instead of 3 is rejected against the a = 3 cdf', () => {
    const wrong = formulaTarget('-x^2/2 + log(sin(6*x)^2 + a*cos(x)^2*sin(4*x)^2 + 1)', { support: LINE, parameters: { a: 2 } });
    expectRejects(draw(certifiedSampler(wrong, { seed: 23 }), N), ref.cdf, 'formula worked, biased');
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
  it('certifiedSampler(formula with a jump written with min/max) fits the piecewise-exponential cdf', () => {
    const xs = draw(certifiedSampler(formulaTarget(jumpText(2), { support: [0, 3] }), { seed: 24 }), N);
    expectInSupport(xs, 0, 3);
    expectFits(xs, jumpCdf(2), 'formula jump');
  });
  it('biased twin: a jump of 1.8 instead of 2 is rejected', () => {
    expectRejects(draw(certifiedSampler(formulaTarget(jumpText(1.8), { support: [0, 3] }), { seed: 24 }), N), jumpCdf(2), 'formula jump, biased');
  });

  const gammaText = '(k - 1)*log(x) - x/theta - lgamma(k) - k*log(theta)';
  it('certifiedSampler(gamma-like formula with lgamma, k = 2.5, θ = 1.5) fits the @stdlib gamma cdf', () => {
    const t = formulaTarget(gammaText, { support: [0, Infinity], parameters: { k: 2.5, theta: 1.5 } });
    const xs = draw(certifiedSampler(t, { seed: 25 }), N);
    expectInSupport(xs, 0, Infinity);
    expectFits(xs, (x) => gammaCdf(x, 2.5, 1 / 1.5), 'formula gamma'); // @stdlib gamma cdf (shape, rate), fine at small shapes
  });
  it('biased twin: k = 2.6 is rejected against the k = 2.5 cdf', () => {
    const t = formulaTarget(gammaText, { support: [0, Infinity], parameters: { k: 2.6, theta: 1.5 } });
    expectRejects(draw(certifiedSampler(t, { seed: 25 }), N), (x) => gammaCdf(x, 2.5, 1 / 1.5), 'formula gamma, biased');
  });

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

describe('exactSampler on formula targets', () => {
  it('exactSampler(formula −(x − 1)²/8) proves log-concavity and uses the hull', () => {
    const t = formulaTarget('-(x - 1)^2/8', { support: LINE });
    const s = exactSampler(t, { seed: 26 });
    expect(s.choice.method).toBe('adaptive-rejection');
    expect(s.choice.reason).toMatch(/^log-concave, proven/);
    expectFits(draw(s, N), (x) => normalCdf(x, 1, 2), 'formula normal'); // @stdlib normal cdf
  });

  it('exactSampler(formula mixture with the narrow mode) uses certifiedSampler and samples it exactly', () => {
    const t = mixtureFormula(0.3, 6, 1e-3);
    const s = exactSampler(t, { seed: 27 });
    expect(s.choice.method).toBe('certified');
    expect(s.choice.proof?.[0].proven).toBe(false);
    const xs = draw(s, N);
    expectFits(xs, mixtureCdf(0.3, 6, 1e-3), 'exactSampler formula mixture');
    expectRate(near(xs, 6, 1e-2), N, 0.3, 'narrow mode'); // mixture weight
  });
});

describe('targets whose bounds cannot cover them', () => {
  const tText = '-(nu + 1)/2 * log1p(x^2/nu)';
  const t3 = formulaTarget(tText, { support: LINE, parameters: { nu: 3 } });

  it('certifiedSampler(formula Student-t(3) on the line) throws ImproperDensityError: a polynomial tail has no exponential envelope', () => {
    expect(() => certifiedSampler(t3, { maxCells: 300 })).toThrow(ImproperDensityError);
    expect(() => certifiedSampler(t3, { maxCells: 300 })).toThrow(/infinite cell/);
  });

  it('exactSampler(formula Student-t(3)) records the refusal, falls back to the scan (stating it) and fits the @stdlib t cdf', () => {
    const s = exactSampler(t3, { seed: 28 });
    expect(s.choice.rejected[0].method).toBe('certified');
    expect(s.choice.assumption).toMatch(/^black-box target \(its logDensityBounds could not cover it/);
    expect(s.choice.reason).toMatch(/tried first: certified/);
    expectFits(draw(s, N), (x) => tCdf(x, 3), 'formula t(3)'); // @stdlib t cdf
  });

  it('biased twin: Student-t(4) drawn the same way is rejected against the t(3) cdf', () => {
    const t4 = formulaTarget(tText, { support: LINE, parameters: { nu: 4 } });
    expectRejects(draw(exactSampler(t4, { seed: 28 }), N), (x) => tCdf(x, 3), 'formula t(4) vs t(3)');
  });
});

/**
 * certifiedSampler: goodness of fit (KS and Anderson–Darling at ALPHA = 1e-4,
 * fixed seeds), each with a biased twin at the same n that the same check rejects.
 */
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import gammaln from '@stdlib/math-base-special-gammaln';
import { describe, expect, it } from 'vitest';
import { certifiedSampler } from '../../../src/index.js';
import { quadratureCdf, simpson } from '../../helpers/quadrature.js';
import { draw, expectFits, expectInSupport, expectRate, expectRejects } from '../../helpers/statistical.js';
import { gammaLike, jumpTarget, mixture, workedTarget } from './hand-bounds.js';

const N = 20_000;

describe('certifiedSampler on normal mixtures with narrow components (hand bounds)', () => {
  for (const [mu, sd, seed] of [
    [6, 1e-3, 1],
    [-7, 1e-3, 2],
    [2.5, 1e-6, 3],
  ] as const) {
    it(`certifiedSampler(0.7·N(0,1) + 0.3·N(${mu}, ${sd}²)) fits the mixture cdf and puts 0.3 of the draws at the narrow mode`, () => {
      const t = mixture([0.7, 0.3], [0, mu], [1, sd]);
      // no mode hints: the narrow mode must be found by the refinement itself
      const s = certifiedSampler({ ...t, modes: undefined }, { seed });
      const xs = draw(s, N);
      expectFits(xs, t.cdf, `narrow ${mu}, ${sd}`); // cdf: Σ wᵢ Φ from @stdlib normal cdf
      let near = 0;
      for (const x of xs) if (Math.abs(x - mu) < 10 * sd) near++;
      expectRate(near, N, 0.3, 'mass at the narrow mode'); // weight of the component (definition of the mixture)
      expect(s.stats.setupEvaluations).toBe(0);
      expect(s.cells.acceptanceBound).toBeGreaterThanOrEqual(0.99);
    });

    it(`biased twin: 0.73·N(0,1) + 0.27·N(${mu}, ${sd}²) drawn by certifiedSampler is rejected against the 0.7/0.3 cdf at n = ${N}`, () => {
      const t = mixture([0.7, 0.3], [0, mu], [1, sd]);
      const wrong = mixture([0.73, 0.27], [0, mu], [1, sd]);
      expectRejects(draw(certifiedSampler(wrong, { seed }), N), t.cdf, 'biased weights');
    });
  }
});

describe('certifiedSampler on the worked target exp(−x²/2)(sin²6x + 3cos²x·sin²4x + 1) on the line', () => {
  // Reference cdf: composite Simpson rule (test/helpers/quadrature.ts) on [−12, 12] (mass outside < e^−72),
  // independent of the code under test.
  const t = workedTarget();
  const ref = quadratureCdf(t.logDensity, -12, 12, 1e-3);

  it('Simpson quadrature of the worked target reproduces Z = 5.894340 (the reference in REFERENCES.md, by quadrature)', () => {
    expect(ref.total).toBeCloseTo(5.89434, 5); // Z on the line 5.894340 (independent quadrature)
    expect(simpson(t.logDensity, -12, 12, 200_000)).toBeCloseTo(5.89434, 5);
  });

  it('certifiedSampler(worked target) fits the quadrature cdf and accepts >= 0.99 of proposals after setup', () => {
    const s = certifiedSampler(t, { seed: 4 });
    expect(s.cells.acceptanceBound).toBeGreaterThanOrEqual(0.99); // the setup's proven bound
    const xs = draw(s, N);
    expectFits(xs, ref.cdf, 'worked');
    const st = s.stats;
    expect(st.acceptanceRate).toBeGreaterThanOrEqual(0.99); // counted: samples / proposals
    // Z/(envelope area) >= acceptanceBound and Z is known: the envelope area is at most Z/0.99
    expect(Math.exp(s.cells.logEnvelopeArea)).toBeLessThanOrEqual(5.89434 / 0.99);
    expect(Math.exp(s.cells.logEnvelopeArea)).toBeGreaterThanOrEqual(5.89434);
    expect(Math.exp(s.cells.logSqueezeArea)).toBeLessThanOrEqual(5.89434);
  });

  it('biased twin: the worked target with 2cos²x·sin²4x instead of 3cos²x·sin²4x drawn by certifiedSampler is rejected against the quadrature cdf', () => {
    expectRejects(draw(certifiedSampler(workedTarget(2), { seed: 4 }), N), ref.cdf, 'worked, biased');
  });
});

describe('certifiedSampler on a density with a jump', () => {
  it('certifiedSampler(e^−x on [0, 3], doubled on [1, 2)) fits the piecewise-exponential cdf', () => {
    const t = jumpTarget(2);
    const xs = draw(certifiedSampler(t, { seed: 5 }), N);
    expectInSupport(xs, 0, 3);
    expectFits(xs, t.cdf, 'jump'); // cdf integrated by hand piece by piece (common practice)
  });

  it('biased twin: the jump of height 1.8 instead of 2 is rejected against the height-2 cdf', () => {
    expectRejects(draw(certifiedSampler(jumpTarget(1.8), { seed: 5 }), N), jumpTarget(2).cdf, 'jump, biased');
  });
});

describe('certifiedSampler on a gamma-like density written with lgamma and parameters', () => {
  it('certifiedSampler(gamma-like, k = 2.5, θ = 1.5) fits the @stdlib gamma cdf', () => {
    const xs = draw(certifiedSampler(gammaLike(2.5, 1.5, gammaln), { seed: 6 }), N);
    expectInSupport(xs, 0, Infinity);
    // @stdlib gamma cdf takes (shape, rate); accurate at small shapes (REFERENCES.md)
    expectFits(xs, (x) => gammaCdf(x, 2.5, 1 / 1.5), 'gamma-like');
  });

  it('biased twin: k = 2.6 drawn by certifiedSampler is rejected against the k = 2.5 cdf', () => {
    const xs = draw(certifiedSampler(gammaLike(2.6, 1.5, gammaln), { seed: 6 }), N);
    expectRejects(xs, (x) => gammaCdf(x, 2.5, 1 / 1.5), 'gamma-like, biased');
  });
});

/**
 * certifiedSampler: goodness of fit (KS and Anderson–Darling at ALPHA = 1e-4,
 * fixed seeds), each with a biased twin at the same n that the same check rejects,
 * through the shared method suite (test/helpers/method-suite.ts).
 */
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import gammaln from '@stdlib/math-base-special-gammaln';
import { describe, expect, it } from 'vitest';
import { certifiedSampler } from '../../../src/index.js';
import type { CertifiedSampler } from '../../../src/index.js';
import { methodSuite, methodSuites } from '../../helpers/method-suite.js';
import { quadratureCdf, simpson } from '../../helpers/quadrature.js';
import { draw, expectFits, expectInSupport, expectRate, expectRejects } from '../../helpers/statistical.js';
import { gammaLike, jumpTarget, mixture, workedTarget } from './hand-bounds.js';

const N = 20_000;

describe('certifiedSampler on normal mixtures with narrow components (hand bounds)', () => {
  // biased twins: 0.73·N(0,1) + 0.27·N(mu, sd²) drawn by certifiedSampler, tested against the 0.7/0.3 cdf
  methodSuites(
    'certifiedSampler fits the mixture cdf (Σ wᵢ Φ from @stdlib normal cdf) and puts 0.3 of the draws at the narrow mode',
    ([
      [6, 1e-3, 1],
      [-7, 1e-3, 2],
      [2.5, 1e-6, 3],
    ] as const).map(([mu, sd, seed]) => {
      const t = mixture([0.7, 0.3], [0, mu], [1, sd]);
      return {
        name: `certifiedSampler(0.7·N(0,1) + 0.3·N(${mu}, ${sd}²))`,
        // no mode hints: the narrow mode must be found by the refinement itself
        make: (sd0: number) => certifiedSampler({ ...t, modes: undefined }, { seed: sd0 }),
        afterFit: (s: CertifiedSampler, xs: Float64Array) => {
          let near = 0;
          for (const x of xs) if (Math.abs(x - mu) < 10 * sd) near++;
          expectRate(near, N, 0.3, 'mass at the narrow mode'); // weight of the component (definition of the mixture)
          expect(s.stats.setupEvaluations).toBe(0);
          expect(s.cells.acceptanceBound).toBeGreaterThanOrEqual(0.99);
        },
        biased: (sd0: number) => certifiedSampler(mixture([0.73, 0.27], [0, mu], [1, sd]), { seed: sd0 }),
        cdf: t.cdf,
        n: N,
        seed,
      };
    }),
  );
});

describe('certifiedSampler on the worked target exp(−x²/2)(sin²6x + 3cos²x·sin²4x + 1) on the line', () => {
  // Reference cdf: composite Simpson rule (test/helpers/quadrature.ts) on [−12, 12] (mass outside < e^−72),
  // independent of the code under test.
  const t = workedTarget();
  const ref = quadratureCdf(t.logDensity, -12, 12, 1e-3);

  it('Simpson quadrature of the worked target reproduces Z = 5.894340 (test/reference/README.md, by quadrature)', () => {
    expect(ref.total).toBeCloseTo(5.89434, 5); // Z on the line 5.894340 (independent quadrature)
    expect(simpson(t.logDensity, -12, 12, 200_000)).toBeCloseTo(5.89434, 5);
  });

  // biased twin: the worked target with 2cos²x·sin²4x instead of 3cos²x·sin²4x, against the quadrature cdf
  methodSuite<CertifiedSampler>({
    name: 'certifiedSampler(worked target) fits the quadrature cdf and accepts >= 0.99 of proposals after setup',
    make: (seed) => certifiedSampler(t, { seed }),
    beforeFit: (s) => expect(s.cells.acceptanceBound).toBeGreaterThanOrEqual(0.99), // the setup's proven bound
    afterFit: (s) => {
      const st = s.stats;
      expect(st.acceptanceRate).toBeGreaterThanOrEqual(0.99); // counted: samples / proposals
      // Z/(envelope area) >= acceptanceBound and Z is known: the envelope area is at most Z/0.99
      expect(Math.exp(s.cells.logEnvelopeArea)).toBeLessThanOrEqual(5.89434 / 0.99);
      expect(Math.exp(s.cells.logEnvelopeArea)).toBeGreaterThanOrEqual(5.89434);
      expect(Math.exp(s.cells.logSqueezeArea)).toBeLessThanOrEqual(5.89434);
    },
    biased: (seed) => certifiedSampler(workedTarget(2), { seed }),
    cdf: ref.cdf,
    n: N,
    seed: 4,
  });
});

methodSuites('certifiedSampler on a density with a jump, and on a gamma-like density written with lgamma and parameters', [
  {
    name: 'certifiedSampler(e^−x on [0, 3], doubled on [1, 2)) fits the piecewise-exponential cdf (twin: a jump of height 1.8 instead of 2)',
    make: (seed) => certifiedSampler(jumpTarget(2), { seed }),
    biased: (seed) => certifiedSampler(jumpTarget(1.8), { seed }),
    cdf: jumpTarget(2).cdf, // cdf integrated by hand piece by piece (common practice)
    n: N,
    seed: 5,
    support: [0, 3],
  },
  {
    // @stdlib gamma cdf takes (shape, rate); accurate at small shapes (test/reference/README.md)
    name: 'certifiedSampler(gamma-like, k = 2.5, θ = 1.5) fits the @stdlib gamma cdf (twin: k = 2.6)',
    make: (seed) => certifiedSampler(gammaLike(2.5, 1.5, gammaln), { seed }),
    biased: (seed) => certifiedSampler(gammaLike(2.6, 1.5, gammaln), { seed }),
    cdf: (x) => gammaCdf(x, 2.5, 1 / 1.5),
    n: N,
    seed: 6,
    support: [0, Infinity],
  },
]);

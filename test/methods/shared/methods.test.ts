/**
 * Every method under the shared method suite (test/helpers/method-suite.ts), with
 * the option checks and a five-draw stream snapshot each.
 * References: the cdfs are @stdlib's (normalCdf, gammaCdf, tCdf, logisticCdf,
 * betaCdf through the family targets' `cdf`), checked pointwise against
 * independent computations in test/targets/; the two-component mixture's cdf
 * is the weighted sum of @stdlib normal cdfs. Biased twins: the same method on
 * a target shifted by 0.05 to 0.1 standard deviations, rejected at the same n.
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import {
  adaptiveRejectionSampler,
  betaTarget,
  cauchyProposal,
  exactSampler,
  gammaTarget,
  logisticTarget,
  normalTarget,
  piecewiseSampler,
  ratioOfUniformsSampler,
  rejectionSampler,
  studentTTarget,
  tableSampler,
} from '../../../src/index.js';
import type { Target } from '../../../src/index.js';
import { methodSuite } from '../../helpers/method-suite.js';

/** An invented two-bump density (weights 1 and 0.6·0.7, locations −2 and 2, sds 1 and 0.7). */
function bimodal(shift: number): Target {
  return { logDensity: (x: number) => Math.log(Math.exp(-0.5 * (x - shift + 2) ** 2) + 0.6 * Math.exp(-0.5 * ((x - shift - 2) / 0.7) ** 2)) };
}
const W1 = 1;
const W2 = 0.6 * 0.7;
const bimodalCdf = (x: number): number => (W1 * normalCdf(x, -2, 1) + W2 * normalCdf(x, 2, 0.7)) / (W1 + W2);

const cdfOf = (t: { cdf?: (x: number) => number }): ((x: number) => number) => t.cdf as (x: number) => number;

// Regression guards below: first five draws at seed 5489, recorded from the build before the
// refactor of issue 15 (commit bf47456); not correctness checks. The adaptiveRejectionSampler(gamma(2.5)),
// exactSampler(beta(2, 3)) and piecewiseSampler(two-bump) guards were re-recorded on 2026-12-04 for the two-uniform
// candidate of the hull and piecewise kernels
// (CHANGELOG.md, Stream changes).
methodSuite({
  name: 'rejectionSampler(normal(0, 1), Cauchy proposal)',
  make: (seed) => rejectionSampler(normalTarget(0, 1), { proposal: cauchyProposal(0, 1), seed }),
  biased: (seed) => rejectionSampler(normalTarget(0.05, 1), { proposal: cauchyProposal(0, 1), seed }),
  cdf: cdfOf(normalTarget(0, 1)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [1.5194784470281866, -2.3722242973080405, -0.8352500175692941, -1.8517507071972872, 1.3789353526166879] },
  options: { api: 'rejectionSampler', make: (o) => rejectionSampler(normalTarget(0, 1), { proposal: cauchyProposal(0, 1), ...o }) },
});
methodSuite({
  name: 'adaptiveRejectionSampler(gamma(2.5))',
  make: (seed) => adaptiveRejectionSampler(gammaTarget(2.5), { seed }),
  biased: (seed) => adaptiveRejectionSampler(gammaTarget(2.6), { seed }),
  cdf: cdfOf(gammaTarget(2.5)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [2.6493862404901156, 1.3751417222937792, 5.848823621889788, 5.7390365505046645, 3.6158182214876415] },
  options: { api: 'adaptiveRejectionSampler', make: (o) => adaptiveRejectionSampler(gammaTarget(2.5), o) },
});
methodSuite({
  name: 'adaptiveRejectionSampler(gamma(2.5), { fast: true })',
  make: (seed) => adaptiveRejectionSampler(gammaTarget(2.5), { seed, fast: true }),
  biased: (seed) => adaptiveRejectionSampler(gammaTarget(2.6), { seed, fast: true }),
  cdf: cdfOf(gammaTarget(2.5)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [5.303801648341884, 3.5275190448261364, 0.9625635038164917, 3.583719699036309, 2.307546935622349] },
  options: { api: 'adaptiveRejectionSampler', make: (o) => adaptiveRejectionSampler(gammaTarget(2.5), { ...o, fast: true }) },
});
methodSuite({
  name: "tableSampler(Student-t(3), { transform: 'inverse-sqrt' })",
  make: (seed) => tableSampler(studentTTarget(3), { seed, transform: 'inverse-sqrt' }),
  biased: (seed) => tableSampler(studentTTarget(3, 0.08), { seed, transform: 'inverse-sqrt' }),
  cdf: cdfOf(studentTTarget(3)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [2.396661509797858, 1.0312639782195687, -3.0762149249095154, 1.0729157915795213, 0.25104685740791655] },
  options: { api: 'tableSampler', make: (o) => tableSampler(studentTTarget(3), { ...o, transform: 'inverse-sqrt' }) },
});
methodSuite({
  name: 'piecewiseSampler(invented two-bump density)',
  make: (seed) => piecewiseSampler(bimodal(0), { seed }),
  biased: (seed) => piecewiseSampler(bimodal(0.08), { seed }),
  cdf: bimodalCdf,
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [1.7780589823584887, -2.912367951071045, -0.7298755144712356, -2.2756788567383364, 2.7448607722860876] },
  options: { api: 'piecewiseSampler', make: (o) => piecewiseSampler(bimodal(0), o) },
});
methodSuite({
  name: 'piecewiseSampler(invented two-bump density, { fast: true })',
  make: (seed) => piecewiseSampler(bimodal(0), { seed, fast: true }),
  biased: (seed) => piecewiseSampler(bimodal(0.08), { seed, fast: true }),
  cdf: bimodalCdf,
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [2.52603424861834, 1.9662111445224157, -3.2791831648007714, 2.025222007054415, -1.1519547789331528] },
  options: { api: 'piecewiseSampler', make: (o) => piecewiseSampler(bimodal(0), { ...o, fast: true }) },
});
methodSuite({
  name: 'ratioOfUniformsSampler(logistic(0, 1))',
  make: (seed) => ratioOfUniformsSampler(logisticTarget(0, 1), { seed }),
  biased: (seed) => ratioOfUniformsSampler(logisticTarget(0.1, 1), { seed }),
  cdf: cdfOf(logisticTarget(0, 1)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [-2.90204440650635, 0.17225414639408834, -0.9051134279204016, 1.9059670365746393, 2.1267882634678603] },
  options: { api: 'ratioOfUniformsSampler', make: (o) => ratioOfUniformsSampler(logisticTarget(0, 1), o) },
});
methodSuite({
  name: 'exactSampler(beta(2, 3))',
  make: (seed) => exactSampler(betaTarget(2, 3), { seed }),
  biased: (seed) => exactSampler(betaTarget(2.15, 3), { seed }),
  cdf: cdfOf(betaTarget(2, 3)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [0.6073412136412402, 0.47325915001502916, 0.2928500494837718, 0.7712520331189857, 0.5788091848833811] },
  options: { api: 'exactSampler', make: (o) => exactSampler(betaTarget(2, 3), o) },
});
methodSuite({
  name: 'exactSampler(beta(2, 3), { expectedDraws: 1e6 })',
  make: (seed) => exactSampler(betaTarget(2, 3), { seed, expectedDraws: 1_000_000 }),
  biased: (seed) => exactSampler(betaTarget(2.15, 3), { seed, expectedDraws: 1_000_000 }),
  cdf: cdfOf(betaTarget(2, 3)),
  n: 20_000,
  seed: 20261202,
  snapshot: { seed: 5489, draws: [0.6649299895390616, 0.6220072477716315, 0.15383404459663033, 0.6289763732394442, 0.4376235514229227] },
  options: { api: 'exactSampler', make: (o) => exactSampler(betaTarget(2, 3), { ...o, expectedDraws: 1_000_000 }) },
});

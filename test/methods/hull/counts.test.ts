/**
 * Counts, not times: density evaluations per draw at steady state, and the
 * Gibbs-style workload of fresh targets taking one draw each.
 */
import { describe, expect, it } from 'vitest';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import { mersenneTwister } from '../../../src/random/mersenne-twister.js';
import { gammaTarget } from '../../../src/targets/gamma.js';
import { normalTarget } from '../../../src/targets/normal.js';

describe('adaptiveRejectionSampler evaluation counts', () => {
  it('adaptiveRejectionSampler(normal(0, 1)): after 10,000 draws fewer than 0.02 density evaluations per draw', () => {
    const s = adaptiveRejectionSampler(normalTarget(0, 1), { seed: 1 });
    s.fill(new Float64Array(10_000));
    const a = s.stats;
    s.fill(new Float64Array(10_000));
    const b = s.stats;
    const overall = a.densityEvaluations / a.samples; // draws 1..10,000, adaptation included
    const steady = (b.densityEvaluations - a.densityEvaluations) / (b.samples - a.samples); // draws 10,001..20,000
    console.log(
      `normal(0,1): evaluations per draw over the first 10,000 draws ${overall.toFixed(5)}, over draws 10,001-20,000 ${steady.toFixed(5)}; setup ${a.setupEvaluations}; touch points ${s.envelope.touchPoints.length}`,
    );
    // regression guard: 0.0059 and 0.0031 were observed (seed 1, printed above; DEFAULT_MAX_PIECES
    // remarks); 0.02 is a margin above them, not a derived bound
    expect(overall).toBeLessThan(0.02);
    expect(steady).toBeLessThan(0.02);
  });

  it('adaptiveRejectionSampler(gamma): 1,000 fresh targets (shapes in [1, 50]) taking one draw each cost at most 6 evaluations per draw, setup included', () => {
    const u = mersenneTwister(2024);
    const fresh = (derivativeFree: boolean): { evals: number; derivatives: number } => {
      let evals = 0;
      let derivatives = 0;
      for (let i = 0; i < 1000; i++) {
        const shape = 1 + 49 * u();
        const s = adaptiveRejectionSampler(gammaTarget(shape, 1), { seed: i + 1, derivativeFree });
        s.sample();
        const st = s.stats;
        evals += st.setupEvaluations + st.densityEvaluations;
        derivatives += s.envelope.derivativeEvaluations;
      }
      return { evals: evals / 1000, derivatives: derivatives / 1000 };
    };
    const tangent = fresh(false);
    const secant = fresh(true);
    console.log(
      `Gibbs-style gamma workload: logDensity calls per fresh draw ${tangent.evals.toFixed(3)} with tangents (plus ${tangent.derivatives.toFixed(3)} dLogDensity calls), ${secant.evals.toFixed(3)} derivative-free`,
    );
    // regression guard: 3.57 evaluations per fresh draw were observed (printed above); 6 is a margin
    expect(tangent.evals).toBeLessThanOrEqual(6);
  });

  it('one start point far from the mode and a small maxPieces: setup probes the peak of a piece far above every touch point (acceptance 0.0017 before)', () => {
    // normal(0, 1) from startPoints [7] with maxPieces 6: setup needs touch points -4, 4, 6, 7 for a
    // valid hull, whose pieces meet at 0 sixteen log units above the highest touch point; with the cap
    // reached the kernel adds no point, so the acceptance stayed at 0.0017 (590 candidates per draw)
    const s = adaptiveRejectionSampler(normalTarget(0, 1), { startPoints: [7], maxPieces: 6, seed: 1 });
    s.fill(new Float64Array(10_000));
    const st = s.stats;
    const touch = s.envelope.touchPoints;
    console.log(`normal(0,1) from startPoints [7], maxPieces 6: touch points ${touch.join(', ')}; acceptance ${st.acceptanceRate.toFixed(4)}; setup ${st.setupEvaluations}`);
    expect(touch.some((x) => x > -4 && x < 4)).toBe(true);
    // regression guard: 0.556 observed (seed 1, printed above), 0.0017 before the quality probe
    expect(st.acceptanceRate).toBeGreaterThan(0.3);
  });
});

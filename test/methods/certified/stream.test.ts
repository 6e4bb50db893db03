/**
 * certifiedSampler: streams, counts, and the cell / envelope descriptions.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { certifiedSampler, envelopeSvg, evaluateEnvelope, substream } from '../../../src/index.js';
import { draw, expectInSupport, expectRate, expectReproducible } from '../../helpers/statistical.js';
import { jumpTarget, mixture, workedTarget } from './hand-bounds.js';

describe('certifiedSampler streams', () => {
  const t = mixture([0.7, 0.3], [0, 6], [1, 1e-3]);

  it('certifiedSampler: same seed same draws, different seed different draws; seed/stream/uniform options', () => {
    expectReproducible((seed) => certifiedSampler(t, { seed }));
    expectReproducible((seed) => certifiedSampler(t, { seed: 3, stream: seed }));
  });

  it('certifiedSampler({ seed, stream }) draws what certifiedSampler({ uniform: substream(seed, stream) }) draws', () => {
    const a = draw(certifiedSampler(t, { seed: 5, stream: 3 }), 500);
    const b = draw(certifiedSampler(t, { uniform: substream(5, 3) }), 500);
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('certifiedSampler: sample() and fill() consume the same stream', () => {
    const a = certifiedSampler(t, { seed: 9 });
    const b = certifiedSampler(t, { seed: 9 });
    const xs = draw(a, 300);
    const ys = Array.from({ length: 300 }, () => b.sample());
    expect(Array.from(xs)).toEqual(ys);
  });

  it('certifiedSampler consumes two uniforms per candidate, plus one for each candidate in a cell below 2^-12 of the area (stream contract)', () => {
    // cells are chosen in proportion to their envelope areas, so the candidates in cells below 2^-12 of the
    // total are Binomial(candidates, S) with S the summed share of those cells (order-free: the cells are
    // stored in split order, the description sorts them); rate test at z = 4.4 (two-sided p about 1e-5)
    const src = substream(11, 0);
    let calls = 0;
    const s = certifiedSampler(t, { refine: false, uniform: () => (calls++, src()) });
    const e = s.envelope;
    const shareBelow = (floor: number): number => {
      let sum = 0;
      for (const p of e.pieces) {
        const a = Math.exp(p.logArea - e.logEnvelopeArea);
        if (a < floor) sum += a;
      }
      return sum;
    };
    draw(s, 200_000);
    const candidates = s.stats.proposals;
    const fresh = calls - 2 * candidates; // 66 expected (S = 3.3e-4 on this target, measured 2026-12-04)
    expect(fresh).toBeGreaterThan(0);
    expect(fresh).toBeLessThan(candidates);
    expectRate(fresh, candidates, shareBelow(2 ** -12), 'candidates in cells below 2^-12');
    // twin: the same count is rejected against a floor of 2^-9 (a rule with another share)
    expect(shareBelow(2 ** -9)).toBeGreaterThan(1.5 * shareBelow(2 ** -12));
    expect(() => expectRate(fresh, candidates, shareBelow(2 ** -9))).toThrow();
  });

  it('certifiedSampler(0.7·N(0,1) + 0.3·N(6, 0.001²), seed 42): golden first six draws', () => {
    // Stream-stability snapshot recorded from this implementation (a regression
    // guard, not a correctness reference): a change here changes users' streams
    // and must be noted in CHANGELOG.md under "Stream changes". Re-recorded on 2026-12-04 for the
    // two-uniform candidate.
    const xs = draw(certifiedSampler(t, { seed: 42 }), 6);
    expect(Array.from(xs)).toMatchInlineSnapshot(`
      [
        0.5913484664798084,
        0.5325107116207588,
        5.999276186941063,
        -0.9915233895204287,
        -2.1843445213777177,
        0.07384848095802163,
      ]
    `);
  });

  it('certifiedSampler keeps every draw inside the support', () => {
    expectInSupport(draw(certifiedSampler(jumpTarget(2), { seed: 3 }), 20_000), 0, 3);
  });
});

describe('certifiedSampler counts', () => {
  it('certifiedSampler counts proposals, samples, evaluations and interval evaluations consistently', () => {
    const s = certifiedSampler(workedTarget(), { seed: 7 });
    const before = s.stats;
    expect(before.samples).toBe(0);
    expect(before.setupEvaluations).toBe(0); // setup evaluates no point
    expect(before.setupBoundEvaluations).toBe(before.boundEvaluations);
    expect(before.boundEvaluations).toBeGreaterThan(0);
    expect(before.derivativeBoundEvaluations).toBeGreaterThan(0);
    draw(s, 10_000);
    const st = s.stats;
    expect(st.samples).toBe(10_000);
    expect(st.proposals).toBeGreaterThanOrEqual(10_000);
    // every rejection needed an evaluation; some accepted candidates did too
    expect(st.densityEvaluations).toBeGreaterThanOrEqual(st.proposals - st.samples);
    expect(st.densityEvaluations).toBeLessThan(st.proposals);
    // refinement on rejection: rejected cells are split in batches (at most one split per rejection),
    // each split costs 3 logDensityBounds calls (the new edge, two halves) and 2 dLogDensityBounds calls
    expect(st.refinements).toBeGreaterThan(0);
    expect(st.refinements).toBeLessThanOrEqual(st.proposals - st.samples);
    expect(st.derivativeBoundEvaluations - before.derivativeBoundEvaluations).toBe(2 * st.refinements);
    expect(st.boundEvaluations - st.setupBoundEvaluations).toBe(3 * st.refinements);
    expect(st.cells).toBe(s.cells.cells.length);
  });

  it('certifiedSampler({ refine: false }) never splits after setup; maxCells caps setup and refinement', () => {
    const s = certifiedSampler(workedTarget(), { seed: 7, refine: false });
    const n0 = s.stats.cells;
    draw(s, 5000);
    expect(s.stats.cells).toBe(n0);
    expect(s.stats.refinements).toBe(0);
    const capped = certifiedSampler(workedTarget(), { seed: 7, maxCells: 300 });
    expect(capped.stats.cells).toBeLessThanOrEqual(300);
    draw(capped, 5000);
    expect(capped.stats.cells).toBeLessThanOrEqual(300);
    // a smaller budget leaves a looser (still proven) envelope
    expect(capped.cells.acceptanceBound).toBeLessThan(0.99);
  });
});

describe('certifiedSampler descriptions', () => {
  it('certifiedSampler(...).cells partition the support and their areas sum to the totals', () => {
    const s = certifiedSampler(mixture([0.7, 0.3], [0, 6], [1, 1e-3]), { seed: 1 });
    const d = s.cells;
    expect(d.cells[0].lower).toBe(-Infinity);
    expect(d.cells[d.cells.length - 1].upper).toBe(Infinity);
    for (let i = 1; i < d.cells.length; i++) expect(d.cells[i].lower).toBe(d.cells[i - 1].upper);
    let m = -Infinity;
    for (const c of d.cells) m = Math.max(m, c.logEnvelopeArea);
    let sum = 0;
    for (const c of d.cells) sum += Math.exp(c.logEnvelopeArea - m);
    expect(m + Math.log(sum)).toBeCloseTo(d.logEnvelopeArea, 10);
    // the mixture is normalized (Z = 1): log squeeze area <= 0 <= log envelope area
    expect(d.logSqueezeArea).toBeLessThanOrEqual(0);
    expect(d.logEnvelopeArea).toBeGreaterThanOrEqual(0);
    expect(d.cells[0].envelope).toBe('exponential');
  });

  it('certifiedSampler(...).envelope dominates the target and the squeeze lies below it at random points (random mixtures)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 20, noNaN: true }),
        fc.double({ min: -6, max: -1, noNaN: true }),
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        fc.array(fc.double({ min: -30, max: 30, noNaN: true }), { minLength: 20, maxLength: 20 }),
        (mu, logSd, w, xs) => {
          const t = mixture([1 - w, w], [0, mu], [1, 10 ** logSd]);
          const s = certifiedSampler(t, { seed: 1, maxCells: 2000 });
          const e = s.envelope;
          for (const x0 of [...xs, mu, mu + 10 ** logSd]) {
            const v = evaluateEnvelope(e, x0);
            const lf = t.logDensity(x0);
            expect(v.logEnvelope).toBeGreaterThanOrEqual(lf);
            expect(v.logSqueeze).toBeLessThanOrEqual(lf);
          }
        },
      ),
      { seed: 20261202, numRuns: 40 },
    );
  });

  it('envelopeSvg draws a certified sampler (construction "bounds")', () => {
    const t = workedTarget();
    const svg = envelopeSvg(certifiedSampler(t, { seed: 1, maxCells: 200 }), t, { range: [-3, 3] });
    expect(svg).toMatch(/^<svg /);
    expect(svg).toContain('log transform, proven from bounds'); // the legend names the construction
    expect(svg).toContain('class="envelope"');
  });
});

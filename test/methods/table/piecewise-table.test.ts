/**
 * The fast path over piecewise envelopes: piecewiseSampler(t, { fast: true })
 * and exactSampler({ expectedDraws }) on multimodal targets.
 *
 * References: quadrature cdfs of the worked multimodal example
 * (test/helpers/quadrature.ts; Z checked against test/reference/README.md in
 * piecewise.test.ts), and @stdlib/stats-base-dists-normal-cdf for normal
 * mixtures. Every fit has a biased twin rejected at the same n and seed.
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EnvelopeViolationError, InvalidTargetError } from '../../../src/core/errors.js';
import { InvalidOptionError } from '../../../src/core/errors.js';
import type { Target } from '../../../src/core/types.js';
import { exactSampler } from '../../../src/methods/auto.js';
import { piecewiseSampler } from '../../../src/methods/piecewise.js';
import { mersenneTwister } from '../../../src/random/mersenne-twister.js';
import { multimodalLogDensity, multimodalTarget, multimodalTruncated } from '../../helpers/fixtures.js';
import { methodSuites } from '../../helpers/method-suite.js';
import { quadratureCdf } from '../../helpers/quadrature.js';
import { draw, expectFits, expectInSupport, expectRate, expectRejects } from '../../helpers/statistical.js';

const N = 200_000;
const LOG_SQRT_2PI = 0.9189385332046727; // log √(2π), common practice

/** Mixture of normals (written here) and its cdf from @stdlib. */
function mixture(ws: number[], mus: number[], sds: number[]): { target: Target; cdf: (x: number) => number } {
  const total = ws.reduce((a, b) => a + b, 0);
  const logDensity = (x: number): number => {
    let m = -Infinity;
    const c = ws.map((w, i) => Math.log(w / total) - Math.log(sds[i]) - LOG_SQRT_2PI - 0.5 * ((x - mus[i]) / sds[i]) ** 2);
    for (const v of c) if (v > m) m = v;
    let s = 0;
    for (const v of c) s += Math.exp(v - m);
    return m + Math.log(s);
  };
  return { target: { logDensity }, cdf: (x) => ws.reduce((a, w, i) => a + (w / total) * normalCdf(x, mus[i], sds[i]), 0) };
}

const shifted = (d: number, truncated: boolean): Target => {
  const lf = (x: number): number => multimodalLogDensity(x - d);
  return truncated ? { logDensity: (x: number) => (x >= -3 && x <= 3 ? lf(x) : -Infinity), support: [-3, 3] } : { logDensity: lf };
};

const bimodalMixture = mixture([0.8, 0.2], [-2, 1.5], [1, 0.5]);
const bimodalTwin = mixture([0.8, 0.2], [-2, 1.55], [1, 0.5]);

describe('piecewiseSampler({ fast: true })', () => {
  const ref3 = quadratureCdf(multimodalLogDensity, -3, 3);
  const refLine = quadratureCdf(multimodalLogDensity, -12, 12);

  methodSuites('piecewiseSampler({ fast: true }): KS and AD accept; the biased twins are rejected at the same n and seed', [
    ...([
      ['the multimodal example on [−3, 3]', multimodalTruncated, ref3, -3, 3, true],
      ['the multimodal example on the line', multimodalTarget, refLine, -Infinity, Infinity, false],
    ] as const).map(([label, make, ref, lo, hi, truncated]) => ({
      name: `piecewiseSampler(${label}, { fast: true }) against the quadrature cdf (twin: the example shifted by 0.03)`,
      make: (seed: number) => piecewiseSampler(make(), { seed, fast: true }),
      biased: (seed: number) => piecewiseSampler(shifted(0.03, truncated), { seed, fast: true }),
      cdf: ref.cdf,
      n: N,
      seed: 41,
      support: [lo, hi] as const,
      stream: false, // a slow build; the fast path's stream is checked on the 16-strip mixture below and in the streams test
    })),
    ...[16, 500].map((strips) => ({
      name: `piecewiseSampler(bimodal normal mixture, { fast: true, strips: ${strips} }) (twin: a mixture with a shifted mode)`,
      make: (seed: number) => piecewiseSampler(bimodalMixture.target, { seed, fast: true, strips }),
      biased: (seed: number) => piecewiseSampler(bimodalTwin.target, { seed, fast: true, strips }),
      cdf: bimodalMixture.cdf,
      n: N,
      seed: 43,
      stream: strips === 16, // once is enough
    })),
  ]);

  it('acceptance is Z / (table envelope area) and the target is evaluated at under 1 % of the draws', () => {
    const m = mixture([0.8, 0.2], [-2, 1.5], [1, 0.5]); // normalized: Z = 1
    const s = piecewiseSampler(m.target, { seed: 44, fast: true });
    draw(s, N);
    const st = s.stats;
    // acceptance of rejection = Z / (envelope area) (Devroye 1986, II.3)
    expectRate(st.samples, st.proposals, 1 / Math.exp(s.table.logEnvelopeArea), 'mixture');
    // regression guard: a bound with margin above the evaluation rate seen when the test was written
    // (only caps and tails evaluate the target); not a derived bound
    expect(st.densityEvaluations / st.samples).toBeLessThan(0.01);
    expect(st.envelopeRepairs).toBe(0);
  });

  it('property (fast-check): on random mixtures, at random points, table envelope >= target >= table squeeze', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 7, maxLength: 7 }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 40, maxLength: 40 }),
        (p, u) => {
          const m = mixture([0.2 + p[0], 0.2 + p[1]], [-3 + 2 * p[2], 1 + 3 * p[3]], [0.2 + p[4], 0.2 + 2 * p[5]]);
          const s = piecewiseSampler(m.target, { seed: 5, fast: true, strips: 8 + Math.floor(600 * p[6]) });
          const b = s.table.boundaries;
          const n = s.table.strips;
          for (let k = 0; k + 1 < u.length; k += 2) {
            const i = Math.min(n - 1, Math.floor(u[k] * n));
            const x = b[i] + (b[i + 1] - b[i]) * u[k + 1];
            const lf = m.target.logDensity(x);
            const tol = 1e-9 + 1e-12 * Math.abs(lf); // the documented piecewise tolerance, restated
            expect(s.logEnvelope(x)).toBeGreaterThanOrEqual(lf - tol);
            expect(s.logSqueeze(x)).toBeLessThanOrEqual(lf + tol);
            expect(s.table.logUpper[i]).toBeGreaterThanOrEqual(lf - tol);
            expect(s.table.logLower[i]).toBeLessThanOrEqual(lf + tol);
          }
          s.fill(new Float64Array(2000)); // every evaluation while drawing is checked too
        },
      ),
      { numRuns: 40, seed: 20261202 },
    );
  });

  it('streams: same seed same draws; sample()/fill() splits give the same draws; { seed } equals { uniform: mersenneTwister(seed) }', () => {
    const t = multimodalTruncated();
    const a = draw(piecewiseSampler(t, { seed: 9, fast: true }), 3000);
    const b = piecewiseSampler(t, { seed: 9, fast: true });
    const ys: number[] = [];
    for (let i = 0; i < 1000; i++) ys.push(b.sample());
    ys.push(...draw(b, 2000));
    expect(ys).toEqual(Array.from(a));
    expect(Array.from(draw(piecewiseSampler(t, { uniform: mersenneTwister(9), fast: true }), 3000))).toEqual(Array.from(a));
    expect(Array.from(draw(piecewiseSampler(t, { seed: 10, fast: true }), 10))).not.toEqual(Array.from(a.subarray(0, 10)));
  });

  it('setup repairs a feature the scan missed: a spike of width 1e-7 at a strip boundary ends up under the table envelope; the plain sampler misses it', () => {
    // The scan's values do not see the spike (it is below 1e-300 of the peak at every scan point,
    // since it is built at a strip boundary of the spike-free target that is not a grid point), so
    // both samplers start from the same grid; the table's boundary evaluation hits the spike.
    const base = { logDensity: (x: number) => -0.5 * x * x, support: [-8, 8] as const };
    const s0 = piecewiseSampler(base, { seed: 1, fast: true });
    const grid = new Set(s0.envelope.gridPoints);
    const inner = s0.table.boundaries.filter((x) => !grid.has(x) && Math.abs(x) < 1);
    expect(inner.length).toBeGreaterThan(10);
    const c = inner[Math.floor(inner.length / 2)];
    const w = 1e-7;
    const t = { logDensity: (x: number) => -0.5 * x * x + Math.log1p(20 * Math.exp(-0.5 * ((x - c) / w) ** 2)), support: [-8, 8] as const };
    const plain = piecewiseSampler(t, { seed: 1 });
    expect(plain.logEnvelope(c)).toBeLessThan(t.logDensity(c) - 1); // missed by the scan
    const fast = piecewiseSampler(t, { seed: 1, fast: true });
    for (const d of [-3e-7, -1e-7, -3e-8, 0, 3e-8, 1e-7, 3e-7]) {
      const lf = t.logDensity(c + d);
      expect(fast.logEnvelope(c + d)).toBeGreaterThanOrEqual(lf - 1e-9);
      expect(fast.logSqueeze(c + d)).toBeLessThanOrEqual(lf + 1e-9);
    }
    expect(fast.stats.setupEvaluations).toBeGreaterThan(plain.stats.setupEvaluations);
    fast.fill(new Float64Array(50_000));
  });

  it('a target that rises above the table after setup throws EnvelopeViolationError while drawing, and keeps throwing it', () => {
    let armed = false;
    const t = { logDensity: (x: number) => -0.5 * x * x + (armed && x > 0.5 && x < 1.5 ? 3 : 0), support: [-8, 8] as const };
    const s = piecewiseSampler(t, { seed: 2, fast: true });
    armed = true;
    expect(() => s.fill(new Float64Array(200_000))).toThrow(EnvelopeViolationError);
    expect(() => s.sample()).toThrow(EnvelopeViolationError);
  });

  it('bad options: fast with adapt, strips or tailMass without fast, bad strips and tailMass, fast not a boolean', () => {
    const t = multimodalTruncated();
    expect(() => piecewiseSampler(t, { fast: true, adapt: true })).toThrow(/piecewiseSampler: options.fast and options.adapt cannot both be true/);
    expect(() => piecewiseSampler(t, { strips: 100 })).toThrow(/apply only with options.fast: true/);
    expect(() => piecewiseSampler(t, { tailMass: 1e-4 })).toThrow(InvalidOptionError);
    expect(() => piecewiseSampler(t, { fast: true, strips: 1 })).toThrow(/options.strips/);
    expect(() => piecewiseSampler(t, { fast: true, tailMass: 0.5 })).toThrow(/options.tailMass must be a number in \(0, 0.01\], got 0.5/);
    expect(() => piecewiseSampler(t, { fast: 'yes' as unknown as boolean })).toThrow(/options.fast must be a boolean/);
  });
});

describe('exactSampler({ expectedDraws }) on multimodal targets', () => {
  it('chooses piecewise with the fast path, says so, and fits; few expected draws keep the plain piecewise sampler', () => {
    const ref = quadratureCdf(multimodalLogDensity, -12, 12);
    const s = exactSampler(multimodalTarget(), { seed: 51, expectedDraws: 1e6 });
    expect(s.choice.method).toBe('piecewise');
    expect(s.choice.reason).toContain('fast path');
    expectFits(draw(s, N), ref.cdf, 'exactSampler fast multimodal');
    expectRejects(draw(exactSampler(shifted(0.03, false), { seed: 51, expectedDraws: 1e6 }), N), ref.cdf, 'shifted');
    const plain = exactSampler(multimodalTarget(), { seed: 51 });
    expect(plain.choice.method).toBe('piecewise');
    expect(plain.choice.reason).not.toContain('fast path');
  });
});

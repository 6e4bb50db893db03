import { describe, expect, it } from 'vitest';
import {
  EnvelopeViolationError,
  ImproperDensityError,
  InvalidOptionError,
  InvalidTargetError,
  NonFiniteDensityError,
  ShapeViolationError,
  discreteSampler,
  mersenneTwister,
  discreteChiSquareCheck,
  poissonTarget,
  reusableDiscreteSampler,
  substream,
} from '../../src/index.js';
import poissonLogpmf from '@stdlib/stats-base-dists-poisson-logpmf';
import { ALPHA } from '../helpers/statistical.js';

describe('discreteSampler', () => {
  it('discreteSampler: evaluations per draw for fresh Poisson targets with random λ (Gibbs-style) are bounded', () => {
    // one fresh target and one draw per step, λ log-uniform on [0.05, 1e6]
    const u = mersenneTwister(4242);
    const stream = substream(4242, 1);
    let total = 0;
    let worst = 0;
    const steps = 2000;
    for (let i = 0; i < steps; i++) {
      const lambda = 0.05 * Math.exp(u() * Math.log(2e7));
      const s = discreteSampler(poissonTarget(lambda), { uniform: stream });
      s.sample();
      const st = s.stats;
      const ev = st.setupEvaluations + st.densityEvaluations;
      total += ev;
      worst = Math.max(worst, ev);
    }
    // measured here: mean 10.58, worst 23 (setup 10.07 on average, plus about 0.7 per proposal)
    expect(total / steps).toBeLessThan(11.5);
    expect(worst).toBeLessThan(30);
  });

  it('reusableDiscreteSampler: evaluations per draw for fresh Poisson targets with random λ (Gibbs-style) are bounded, and lower', () => {
    // the same λ sequence as above; the universal hat needs logPmf at the mode only, then about 2-4 proposals
    const u = mersenneTwister(4242);
    const step = reusableDiscreteSampler({ uniform: substream(4242, 1) });
    let prev = 0;
    let worst = 0;
    const steps = 2000;
    for (let i = 0; i < steps; i++) {
      const lambda = 0.05 * Math.exp(u() * Math.log(2e7));
      step.sample(poissonTarget(lambda));
      const st = step.stats;
      const ev = st.setupEvaluations + st.densityEvaluations;
      worst = Math.max(worst, ev - prev);
      prev = ev;
      expect(step.lastMethod).toBe('log-concave-universal');
    }
    const st = step.stats;
    expect(st.samples).toBe(steps);
    expect(st.setupEvaluations).toBe(steps); // one per target: logPmf at its mode
    // measured here: mean 4.53, worst 30 (a geometric number of proposals, success rate about 1/4 to 1/2)
    expect(prev / steps).toBeLessThan(5);
    expect(worst).toBeLessThan(40);
  });

  it('reusableDiscreteSampler: a fresh Poisson(30) target per draw passes chi-square at ALPHA, and (twin) Poisson(30.4) is rejected', () => {
    const run = (lambda: number): Float64Array => {
      const step = reusableDiscreteSampler({ seed: 77 });
      const out = new Float64Array(100_000);
      for (let i = 0; i < out.length; i++) out[i] = step.sample(poissonTarget(lambda));
      return out;
    };
    const pmf = (k: number): number => Math.exp(poissonLogpmf(k, 30)); // @stdlib
    const r = discreteChiSquareCheck(run(30), pmf, [0, Infinity]);
    expect(r.pValue, `X² = ${r.statistic}, df = ${r.df}`).toBeGreaterThan(ALPHA);
    const rb = discreteChiSquareCheck(run(30.4), pmf, [0, Infinity]);
    expect(rb.pValue, `twin X² = ${rb.statistic}, df = ${rb.df}`).toBeLessThan(ALPHA);
  });

  it('reusableDiscreteSampler: targets without the promises go through the automatic choice; same seed same draws; stream snapshot', () => {
    const lp = (k: number): number => k * Math.log(3.5) - lgammaInt(k); // unnormalized Poisson(3.5), no hints
    const a = reusableDiscreteSampler({ seed: 3 });
    const b = reusableDiscreteSampler({ seed: 3 });
    const xa: number[] = [];
    const xb: number[] = [];
    for (let i = 0; i < 20; i++) {
      xa.push(a.sample({ logPmf: lp }));
      xb.push(b.sample({ logPmf: lp }));
    }
    expect(a.lastMethod).toBe('log-concave-rejection');
    expect(xa).toEqual(xb);
    expect(a.stats.samples).toBe(20);
    const g = reusableDiscreteSampler({ seed: 2026 });
    const draws = [0.5, 30, 1e4].flatMap((l) => [g.sample(poissonTarget(l)), g.sample(poissonTarget(l))]);
    expect(draws).toMatchInlineSnapshot(`
      [
        0,
        2,
        29,
        29,
        9957,
        9999,
      ]
    `);
  });

  it('reusableDiscreteSampler gives typed errors for bad options and targets, and is loud when a promise is broken', () => {
    expect(() => reusableDiscreteSampler({ sed: 1 } as never)).toThrow(/unknown option 'sed'/);
    expect(() => reusableDiscreteSampler({ maxRejections: 0 })).toThrow(/maxRejections/);
    const step = reusableDiscreteSampler({ seed: 1 });
    expect(() => step.sample({ logPmf: (k) => -k, logConcave: 'yes' as never })).toThrow(/target.logConcave must be a boolean/);
    expect(() => step.sample({ logPmf: () => 0.5, support: [0, 3], mode: 1, logConcave: true, normalized: true })).toThrow(/normalized is true but logPmf\(1\) = 0.5 > 0/);
    // a false promise: 0.5 Poisson(3) + 0.5 Poisson(30) (invented, normalized) is bimodal, not log-concave
    const mix = (k: number): number => (k < 0 ? -Infinity : Math.log(0.5 * Math.exp(poissonLogpmf(k, 3)) + 0.5 * Math.exp(poissonLogpmf(k, 30))));
    const liar = { logPmf: mix, mode: 3, logConcave: true, normalized: true };
    expect(() => {
      for (let i = 0; i < 5000; i++) step.sample(liar);
    }).toThrow(EnvelopeViolationError);
    expect(() => discreteSampler({ logPmf: mix, mode: 3 }, { method: 'log-concave-universal' })).toThrow(/needs target.mode, target.logConcave = true and target.normalized = true/);
  });

  it('discreteSampler: same seed same draws, Int32Array and Float64Array fills agree, stream option equals the injected substream', () => {
    const a = discreteSampler(poissonTarget(12.5), { seed: 9 }).fill(new Int32Array(500));
    const b = discreteSampler(poissonTarget(12.5), { seed: 9 }).fill(new Float64Array(500));
    expect(Array.from(a)).toEqual(Array.from(b));
    const c = discreteSampler(poissonTarget(12.5), { seed: 9, stream: 3 }).fill(new Float64Array(50));
    const d = discreteSampler(poissonTarget(12.5), { uniform: substream(9, 3) }).fill(new Float64Array(50));
    expect(Array.from(c)).toEqual(Array.from(d));
    expect(Array.from(c)).not.toEqual(Array.from(b.subarray(0, 50)));
  });

  it('discreteSampler stream snapshots per method (regression guard, seed 2026)', () => {
    const t = poissonTarget(30);
    const take = (o: object): number[] => Array.from(discreteSampler(t, { seed: 2026, ...o }).fill(new Int32Array(12)));
    expect({
      table: take({ method: 'table' }),
      logConcave: take({ method: 'log-concave-rejection' }),
      ratio: take({ method: 'ratio-of-uniforms' }),
      universal: take({ method: 'log-concave-universal' }),
    }).toMatchInlineSnapshot(`
      {
        "logConcave": [
          28,
          23,
          22,
          34,
          29,
          29,
          24,
          34,
          26,
          37,
          32,
          32,
        ],
        "ratio": [
          29,
          36,
          28,
          35,
          29,
          27,
          32,
          33,
          44,
          29,
          30,
          29,
        ],
        "table": [
          28,
          27,
          39,
          24,
          28,
          40,
          25,
          36,
          29,
          33,
          37,
          26,
        ],
        "universal": [
          29,
          29,
          29,
          28,
          30,
          28,
          26,
          45,
          26,
          32,
          29,
          25,
        ],
      }
    `);
  });

  it('discreteSampler gives typed errors for bad targets and options, never a draw', () => {
    const lp = (k: number): number => -k;
    expect(() => discreteSampler({ logPmf: lp, support: [0.5, 3] })).toThrow(InvalidTargetError);
    expect(() => discreteSampler({ logPmf: lp, support: [0, NaN] })).toThrow(/support\[1\] must be an integer or Infinity, got NaN/);
    expect(() => discreteSampler({ logPmf: lp, support: [3, 1] })).toThrow(InvalidTargetError);
    expect(() => discreteSampler({ logPmf: lp, mode: 1.5 })).toThrow(/target.mode must be an integer/);
    expect(() => discreteSampler({ logPmf: 'x' as never })).toThrow(InvalidTargetError);
    expect(() => discreteSampler({ logPmf: () => NaN })).toThrow(NonFiniteDensityError);
    expect(() => discreteSampler({ logPmf: () => Infinity, support: [0, 5] })).toThrow(NonFiniteDensityError);
    expect(() => discreteSampler({ logPmf: () => -Infinity, support: [0, 5] })).toThrow(/no mass/);
    expect(() => discreteSampler({ logPmf: () => -Infinity })).toThrow(InvalidTargetError);
    expect(() => discreteSampler({ logPmf: () => 0 })).toThrow(ImproperDensityError); // does not decay
    expect(() => discreteSampler({ logPmf: (k) => 0.001 * k })).toThrow(ImproperDensityError);
    expect(() => discreteSampler(poissonTarget(3), { method: 'alias' as never })).toThrow(InvalidOptionError);
    expect(() => discreteSampler(poissonTarget(3), { expectedDraws: -1 })).toThrow(InvalidOptionError);
    expect(() => discreteSampler(poissonTarget(3), { sed: 1 } as never)).toThrow(/unknown option 'sed'/);
    expect(() => discreteSampler(poissonTarget(3)).fill([] as never)).toThrow(InvalidTargetError) // an argument, not an option: INVALID_TARGET like tableSampler.fill;
    const big = { logPmf: (k: number) => -Math.abs(k - 3e9) / 10, support: [0, Infinity] as const, mode: 3e9 };
    expect(() => discreteSampler(big, { seed: 1 }).fill(new Int32Array(2))).toThrow(/does not fit an Int32Array/);
  });

  it('discreteSampler refuses or is loud on shapes a method cannot serve', () => {
    // bimodal on an unbounded support: 0.6 Poisson(3) + 0.4 Poisson(30) (invented)
    const lp = (k: number): number => (k < 0 ? -Infinity : Math.log(0.6 * Math.exp(-3 + k * Math.log(3) - lf(k)) + 0.4 * Math.exp(-30 + k * Math.log(30) - lf(k))));
    // forced log-concave rejection: refused at setup or an envelope violation at the second mode, never silent draws
    const run = (): void => {
      discreteSampler({ logPmf: lp }, { method: 'log-concave-rejection', seed: 3 }).fill(new Float64Array(20000));
    };
    expect(run).toThrow(/ShapeViolation|envelope|log-concave/);
    let err: unknown;
    try {
      run();
    } catch (e) {
      err = e;
    }
    expect(err instanceof ShapeViolationError || err instanceof EnvelopeViolationError).toBe(true);
    // log-convex pmf (negative binomial r < 1 shape) is refused by the log-concave method
    const nb = (k: number): number => (k < 0 ? -Infinity : lg(k + 0.5) - lg(0.5) - lf(k) + k * Math.log(0.95));
    expect(() => discreteSampler({ logPmf: nb, mode: 0 }, { method: 'log-concave-rejection' })).toThrow(ShapeViolationError);
    const auto = discreteSampler({ logPmf: nb, mode: 0 });
    expect(auto.choice.method).toBe('ratio-of-uniforms');
    expect(auto.choice.refused[0].method).toBe('log-concave-rejection');
  });
});

function lf(k: number): number {
  let s = 0;
  for (let i = 2; i <= k; i++) s += Math.log(i);
  return s;
}
/** ln Γ(x) by the Stirling series after shifting x above 10 (from memory: 1/12, 1/360, 1/1260). */
function lg(x: number): number {
  let acc = 0;
  while (x < 10) {
    acc -= Math.log(x);
    x += 1;
  }
  return acc + (x - 0.5) * Math.log(x) - x + 0.5 * Math.log(2 * Math.PI) + 1 / (12 * x) - 1 / (360 * x ** 3) + 1 / (1260 * x ** 5);
}

/** ln k! by summation (k a small integer). */
function lgammaInt(k: number): number {
  return k < 0 ? Infinity : lf(k);
}

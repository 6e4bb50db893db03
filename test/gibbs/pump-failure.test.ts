/**
 * The Gibbs use case end to end on published data: the pump-failure data of
 * Gaver & O'Muircheartaigh (1987), under a hierarchical Poisson–gamma model
 * whose α full conditional is not conjugate and is sampled from its
 * log-density by the library every sweep.
 *
 * Model (priors chosen here):
 *   x_i ~ Poisson(λ_i t_i),  λ_i ~ gamma(shape α, rate β)   (i = 1..10),
 *   α ~ exponential(rate 1),  β ~ gamma(shape 1, rate 1).
 * Full conditionals (conjugacy of gamma and Poisson; common practice):
 *   λ_i | α, β, x ~ gamma(α + x_i, β + t_i),
 *   β | α, λ     ~ gamma(1 + nα, 1 + Σλ_i),
 *   α | β, λ     ∝ exp(α (n log β + Σ log λ_i − 1) − n logΓ(α))   (not conjugate;
 *                  log-concave since logΓ is convex; density ∝ α^n near 0).
 * Why β ~ gamma(1, 1) and not the vaguer gamma(0.1, 1): with prior shape 0.1 the
 * β conditional has shape 0.1 + nα, below 1 (not log-concave, unbounded at 0)
 * when α < 0.09, which has posterior probability about 1e-5 (by the quadrature
 * below) and was reached in a 20,000-sweep chain.
 *
 * Reference: the exact marginal posterior of (α, β), with λ integrated out
 *   p(α, β | x) ∝ p(α) p(β) Π_i β^α Γ(α + x_i) / (Γ(α) (β + t_i)^(α + x_i)),
 * integrated by the trapezoidal rule on a grid in (log α, log β) (Jacobian αβ);
 * E[λ_i | x] = E[(α + x_i)/(β + t_i) | x]. logΓ comes from
 * `@stdlib/math-base-special-gammaln`, independent of the code under test; the
 * grid is checked for convergence (half the points) and for negligible mass at
 * its edges.
 *
 * Monte Carlo error: batch means (40 batches). The 12 posterior means are
 * tested together at the suite's significance ALPHA = 1e-4 (Bonferroni:
 * ALPHA/12 each, two-sided), with the Student-t quantile on 39 degrees of
 * freedom (the batch-means variance is itself estimated): |z| < 5.13.
 * The biased twin runs the same chain and the same check with a wrong prior
 * rate in the sampler (α ~ exponential(2) in the α conditional) and must be
 * rejected.
 */
import { describe, expect, it } from 'vitest';
import gammaln from '@stdlib/math-base-special-gammaln';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import { adaptiveRejectionSampler, conditionalSampler, gammaTarget, substream } from '../../src/index.js';
import type { Target } from '../../src/index.js';
import { ALPHA } from '../helpers/statistical.js';

// Pump-failure data, Gaver & O'Muircheartaigh (1987): failures x_i of pump i over operating
// time t_i (thousands of hours). From memory (as reprinted widely; not confirmed against a
// second reprint in this session).
const FAILURES = [5, 1, 5, 14, 3, 19, 1, 1, 4, 22];
const TIMES = [94.32, 15.72, 62.88, 125.76, 5.24, 31.44, 1.048, 1.048, 2.096, 10.48];
const N = FAILURES.length;

/** Priors chosen for this test (see the file comment). */
const ALPHA_PRIOR_RATE = 1;
const BETA_PRIOR_SHAPE = 1;
const BETA_PRIOR_RATE = 1;

const SWEEPS = 12_000;
const BURN_IN = 500;
const BATCHES = 40;
const QUANTITIES = 2 + N; // α, β, λ_1..λ_10

interface Means {
  alpha: number;
  beta: number;
  lambda: number[];
}

/** log p(α, β | x) up to a constant, λ integrated out. */
function logMarginal(a: number, b: number): number {
  let s = -ALPHA_PRIOR_RATE * a + (BETA_PRIOR_SHAPE - 1) * Math.log(b) - BETA_PRIOR_RATE * b;
  const lgA = gammaln(a);
  const logB = Math.log(b);
  for (let i = 0; i < N; i++) s += a * logB + gammaln(a + FAILURES[i]) - lgA - (a + FAILURES[i]) * Math.log(b + TIMES[i]);
  return s;
}

/** Posterior means by the trapezoidal rule over (log α, log β) in [LO, HI]², M intervals a side. */
function quadratureMeans(m: number): Means & { edgeMass: number } {
  const LO = -7;
  const HI = 4;
  const h = (HI - LO) / m;
  const logW = new Float64Array((m + 1) * (m + 1));
  let max = -Infinity;
  for (let i = 0; i <= m; i++) {
    for (let j = 0; j <= m; j++) {
      const a = Math.exp(LO + i * h);
      const b = Math.exp(LO + j * h);
      const edge = (i === 0 || i === m ? 0.5 : 1) * (j === 0 || j === m ? 0.5 : 1);
      const v = logMarginal(a, b) + Math.log(a) + Math.log(b) + Math.log(edge);
      logW[i * (m + 1) + j] = v;
      if (v > max) max = v;
    }
  }
  let z = 0;
  let ea = 0;
  let eb = 0;
  let edgeMass = 0;
  const el = new Array<number>(N).fill(0);
  for (let i = 0; i <= m; i++) {
    for (let j = 0; j <= m; j++) {
      const a = Math.exp(LO + i * h);
      const b = Math.exp(LO + j * h);
      const w = Math.exp(logW[i * (m + 1) + j] - max);
      z += w;
      ea += w * a;
      eb += w * b;
      for (let k = 0; k < N; k++) el[k] += (w * (a + FAILURES[k])) / (b + TIMES[k]);
      if (i === 0 || i === m || j === 0 || j === m) edgeMass += w;
    }
  }
  return { alpha: ea / z, beta: eb / z, lambda: el.map((v) => v / z), edgeMass: edgeMass / z };
}

/**
 * The Gibbs sampler as a user writes it: with `reuse` false one fresh adaptiveRejectionSampler per
 * conditional per sweep, all on one injected stream; with `reuse` one conditionalSampler per
 * conditional (ten λ_i, β, α: warm start from the previous sweep's hull), on the same stream.
 * `alphaPriorRate` is the rate the sampler believes (the twin gets a wrong one). Returns the
 * chains after burn-in.
 */
function runChain(seed: number, alphaPriorRate: number, reuse = false): { alpha: Float64Array; beta: Float64Array; lambda: Float64Array[] } {
  const u = substream(seed, 0);
  const lambdaSamplers = FAILURES.map(() => conditionalSampler({ uniform: u }));
  const betaSampler = conditionalSampler({ uniform: u });
  const alphaSampler = conditionalSampler({ uniform: u });
  const drawFrom = (t: Target, k: number): number => (reuse ? (k < N ? lambdaSamplers[k] : k === N ? betaSampler : alphaSampler).draw(t) : adaptiveRejectionSampler(t, { uniform: u }).sample());
  let a = 1;
  let b = 1;
  let logSumLambda = 0;
  // α | β, λ: a fresh conditional each sweep through the captured (b, logSumLambda)
  const alphaConditional: Target = {
    support: [0, Infinity],
    logDensity: (al: number) => al * (N * Math.log(b) + logSumLambda - alphaPriorRate) - N * gammaln(al),
  };
  const lambda = new Float64Array(N);
  const out = {
    alpha: new Float64Array(SWEEPS),
    beta: new Float64Array(SWEEPS),
    lambda: Array.from({ length: N }, () => new Float64Array(SWEEPS)),
  };
  for (let s = -BURN_IN; s < SWEEPS; s++) {
    let sum = 0;
    logSumLambda = 0;
    for (let i = 0; i < N; i++) {
      lambda[i] = drawFrom(gammaTarget(a + FAILURES[i], b + TIMES[i]), i);
      sum += lambda[i];
      logSumLambda += Math.log(lambda[i]);
    }
    b = drawFrom(gammaTarget(BETA_PRIOR_SHAPE + N * a, BETA_PRIOR_RATE + sum), N);
    a = drawFrom(alphaConditional, N + 1);
    if (s >= 0) {
      out.alpha[s] = a;
      out.beta[s] = b;
      for (let i = 0; i < N; i++) out.lambda[i][s] = lambda[i];
    }
  }
  return out;
}

/** Mean and batch-means standard error of a chain. */
function batchMeans(v: Float64Array, batches: number): { mean: number; se: number } {
  const len = Math.floor(v.length / batches);
  const means: number[] = [];
  for (let k = 0; k < batches; k++) {
    let s = 0;
    for (let i = k * len; i < (k + 1) * len; i++) s += v[i];
    means.push(s / len);
  }
  const mean = means.reduce((p, c) => p + c, 0) / batches;
  const variance = means.reduce((p, c) => p + (c - mean) ** 2, 0) / (batches - 1);
  return { mean, se: Math.sqrt(variance / batches) };
}

/** Upper quantile of Student-t(df) at tail probability p, by bisection on @stdlib's t cdf. */
function tUpperQuantile(p: number, df: number): number {
  let lo = 0;
  let hi = 100;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (1 - tCdf(mid, df) > p) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** z-scores (chain mean − exact mean)/batch-means SE for α, β and every λ_i. */
function zScores(chain: ReturnType<typeof runChain>, exact: Means): { label: string; mean: number; exact: number; z: number }[] {
  const rows = [
    { label: 'alpha', v: chain.alpha, e: exact.alpha },
    { label: 'beta', v: chain.beta, e: exact.beta },
    ...chain.lambda.map((v, i) => ({ label: `lambda_${i + 1}`, v, e: exact.lambda[i] })),
  ];
  return rows.map(({ label, v, e }) => {
    const r = batchMeans(v, BATCHES);
    return { label, mean: r.mean, exact: e, z: (r.mean - e) / r.se };
  });
}

describe('Gibbs sampler on the pump-failure data (Gaver & O\'Muircheartaigh 1987)', () => {
  const exact = quadratureMeans(220);
  // |z| threshold: two-sided ALPHA/12 (Bonferroni over the 12 means), Student-t on BATCHES − 1 df
  const Z = tUpperQuantile(ALPHA / (2 * QUANTITIES), BATCHES - 1);

  it('quadrature of the exact marginal posterior is converged and its grid holds the mass', () => {
    const coarse = quadratureMeans(110);
    // edge mass bounds the truncation error of every mean (times at most e^4 on this grid): far below the MC error
    expect(exact.edgeMass).toBeLessThan(1e-8);
    for (const [a, b] of [[exact.alpha, coarse.alpha], [exact.beta, coarse.beta], ...exact.lambda.map((v, i) => [v, coarse.lambda[i]])]) {
      expect(Math.abs(a - b) / a).toBeLessThan(1e-6);
    }
    expect(Z).toBeGreaterThan(5);
    expect(Z).toBeLessThan(6);
  });

  it('adaptiveRejectionSampler per conditional: posterior means of alpha, beta and every lambda_i match the quadrature within batch-means error', () => {
    const rows = zScores(runChain(2026, ALPHA_PRIOR_RATE), exact);
    for (const r of rows) expect(Math.abs(r.z), `${r.label}: chain ${r.mean}, exact ${r.exact}, z ${r.z.toFixed(2)} (limit ${Z.toFixed(2)})`).toBeLessThan(Z);
  });

  it('biased twin: a wrong prior rate in the alpha conditional (exponential(2) instead of exponential(1)) is rejected at the same n', () => {
    const rows = zScores(runChain(2026, 2), exact);
    const worst = Math.max(...rows.map((r) => Math.abs(r.z)));
    expect(worst, rows.map((r) => `${r.label} z ${r.z.toFixed(1)}`).join(', ')).toBeGreaterThan(Z);
  });

  it('conditionalSampler per conditional (storage reused, warm start): posterior means match the quadrature within batch-means error', () => {
    const rows = zScores(runChain(2027, ALPHA_PRIOR_RATE, true), exact);
    for (const r of rows) expect(Math.abs(r.z), `${r.label}: chain ${r.mean}, exact ${r.exact}, z ${r.z.toFixed(2)} (limit ${Z.toFixed(2)})`).toBeLessThan(Z);
  });

  it('conditionalSampler biased twin: the wrong alpha prior rate is rejected at the same n', () => {
    const rows = zScores(runChain(2027, 2, true), exact);
    const worst = Math.max(...rows.map((r) => Math.abs(r.z)));
    expect(worst, rows.map((r) => `${r.label} z ${r.z.toFixed(1)}`).join(', ')).toBeGreaterThan(Z);
  });
});

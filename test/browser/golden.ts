/**
 * Golden scenarios for the engine comparison: every sampling method, the
 * targets, proposals, streams, checks and the typed errors, run on the
 * library passed in (the source tree in Node; the bundled ESM build in
 * Chromium). Only arithmetic in the targets written here (no Math.exp/log),
 * so every value depends on the library alone. Values are returned as the
 * 32-bit words of their float64 encoding, so equal output means bit for bit.
 */
import type * as Lib from '../../src/index.js';

/** The outcome of {@link goldenRun}: per scenario, float64 words or a string. */
export interface GoldenResult {
  /** Scenario name → 32-bit words of the float64 values (two per value). */
  readonly values: Record<string, number[]>;
  /** Scenario name → a string (SVG, stats, error name/code/message). */
  readonly strings: Record<string, string>;
}

/** Runs every golden scenario on `lib`. */
export function goldenRun(lib: typeof Lib): GoldenResult {
  const values: Record<string, number[]> = {};
  const strings: Record<string, string> = {};
  const put = (name: string, xs: ArrayLike<number>): void => {
    values[name] = Array.from(new Uint32Array(Float64Array.from(xs).buffer));
  };
  const draws = (name: string, s: Lib.Sampler, n: number): void => {
    put(name, s.fill(new Float64Array(n)));
    const one = [s.sample(), s.sample(), s.sample()];
    put(`${name} / sample()`, one);
    const st = s.stats;
    strings[`${name} / stats`] = JSON.stringify([st.samples, st.proposals, st.densityEvaluations, st.setupEvaluations, st.acceptanceRate]);
  };
  const guard = (name: string, f: () => void): void => {
    try {
      f();
    } catch (e) {
      const err = e as { name?: string; code?: string; message?: string };
      strings[`${name} / threw`] = JSON.stringify([err.name, err.code, err.message, e instanceof lib.ExactDrawError]);
    }
  };

  // streams
  guard('mersenneTwister', () => {
    const u = lib.mersenneTwister(5489);
    put('mersenneTwister(5489) uniforms', Array.from({ length: 64 }, () => u()));
    put('mersenneTwister(5489) uint32', Array.from({ length: 64 }, () => u.uint32()));
    const v = lib.restoreMersenneTwister(JSON.parse(JSON.stringify(u.saveState())) as Lib.MersenneTwisterState);
    put('restored stream', Array.from({ length: 64 }, () => v()));
    const w = lib.substream(2026, 3);
    put('substream(2026, 3)', Array.from({ length: 64 }, () => w()));
  });

  // targets: densities and cdfs at fixed points
  const families: [string, Lib.FamilyTarget][] = [
    ['normal(0.5, 2)', lib.normalTarget(0.5, 2)],
    ['gamma(2.5, 1.5)', lib.gammaTarget(2.5, 1.5)],
    ['gamma(0.4)', lib.gammaTarget(0.4)],
    ['beta(2, 5)', lib.betaTarget(2, 5)],
    ['beta(0.6, 0.8)', lib.betaTarget(0.6, 0.8)],
    ['student-t(3)', lib.studentTTarget(3)],
    ['student-t(2.5, 1, 2)', lib.studentTTarget(2.5, 1, 2)],
    ['logistic(1, 2)', lib.logisticTarget(1, 2)],
    ['exponential(1.5)', lib.exponentialTarget(1.5)],
    ['laplace(1, 2)', lib.laplaceTarget(1, 2)],
    ['weibull(1.7, 2)', lib.weibullTarget(1.7, 2)],
    ['lognormal(0.3, 0.8)', lib.lognormalTarget(0.3, 0.8)],
    ['chi-square(5)', lib.chiSquareTarget(5)],
    ['inverse-gamma(3, 2)', lib.inverseGammaTarget(3, 2)],
    ['pareto(2.5, 1)', lib.paretoTarget(2.5, 1)],
    ['gumbel(1, 2)', lib.gumbelTarget(1, 2)],
    ['gig(0.5, 2, 3)', lib.generalizedInverseGaussianTarget(0.5, 2, 3)],
  ];
  for (const [name, t] of families) {
    guard(name, () => {
      const positive = /^(weibull|lognormal|chi-square|inverse-gamma|pareto|gig|exponential)/.test(name);
      const xs = Array.from({ length: 80 }, (_, i) => (name.startsWith('beta') ? (i + 0.5) / 80 : positive ? 0.05 + i * 0.11 : -6 + i * 0.17));
      put(`${name} logDensity`, xs.map((x) => t.logDensity(x)));
      put(`${name} cdf`, xs.map((x) => (t.cdf as (x: number) => number)(x)));
    });
  }
  const battery = lib.truncate(lib.normalTarget(62, 18), 0, 100); // invented: battery charge on return, %
  guard('truncate', () => put('truncate(normal(62, 18), 0, 100) cdf', [1, 20, 50, 62, 80, 99].map((x) => (battery.cdf as (x: number) => number)(x))));

  // user targets written with arithmetic only (invented shapes)
  const bimodal: Lib.Target = { logDensity: (x) => -0.25 * x * x * x * x + x * x, support: [-Infinity, Infinity] };
  const bump: Lib.Target = { logDensity: (x) => -0.5 * x * x - 0.1 * x * x * x * x, dLogDensity: (x) => -x - 0.4 * x * x * x, mode: 0 };

  // every method
  guard('rejection', () => {
    draws('rejection normal / cauchy proposal', lib.rejectionSampler(lib.normalTarget(0, 1), { proposal: lib.cauchyProposal(0, 1), seed: 1 }), 300);
    draws('rejection truncated normal / uniform proposal', lib.rejectionSampler(battery, { proposal: lib.uniformProposal(0, 100), seed: 2 }), 300);
    draws('rejection gamma(1.5) / exponential proposal', lib.rejectionSampler(lib.gammaTarget(1.5), { proposal: lib.exponentialProposal(0.5), seed: 3 }), 300);
    draws('rejection logistic / normal proposal', lib.rejectionSampler(lib.logisticTarget(0, 1), { proposal: lib.cauchyProposal(0, 2), seed: 4 }), 300);
    draws('rejection bump / normal proposal', lib.rejectionSampler(bump, { proposal: lib.normalProposal(0, 1), seed: 5 }), 300);
  });
  guard('bounds', () => {
    const b = lib.findLogBound(lib.gammaTarget(2.5), lib.exponentialProposal(0.5));
    put('findLogBound gamma / exponential', [b.logBound, b.argmax, b.evaluations]);
  });
  guard('ratio-of-uniforms', () => {
    draws('ratio-of-uniforms student-t(3)', lib.ratioOfUniformsSampler(lib.studentTTarget(3), { seed: 6 }), 300);
    draws('ratio-of-uniforms gamma(2.5)', lib.ratioOfUniformsSampler(lib.gammaTarget(2.5), { seed: 7 }), 300);
    draws('ratio-of-uniforms bump', lib.ratioOfUniformsSampler(bump, { seed: 8 }), 300);
  });
  guard('hull', () => {
    const g = lib.adaptiveRejectionSampler(lib.gammaTarget(2.5, 1.5), { seed: 9 });
    draws('hull gamma(2.5, 1.5)', g, 400);
    const env = g.envelope;
    put('hull gamma envelope values', [0.1, 0.5, 1, 2, 4, 8].flatMap((x) => Object.values(lib.evaluateEnvelope(env, x)).filter((v): v is number => typeof v === 'number')));
    strings['hull gamma envelope svg'] = lib.envelopeSvg(g, lib.gammaTarget(2.5, 1.5));
    draws('hull beta(2, 5)', lib.adaptiveRejectionSampler(lib.betaTarget(2, 5), { seed: 10 }), 400);
    draws('hull logistic(1, 2)', lib.adaptiveRejectionSampler(lib.logisticTarget(1, 2), { seed: 12 }), 400);
    draws('hull bump', lib.adaptiveRejectionSampler(bump, { seed: 13 }), 400);
  });
  guard('piecewise', () => {
    draws('piecewise bimodal', lib.piecewiseSampler(bimodal, { seed: 14 }), 400);
    draws('piecewise bimodal fast', lib.piecewiseSampler(bimodal, { seed: 15, fast: true }), 400);
    draws('piecewise student-t(3)', lib.piecewiseSampler(lib.studentTTarget(3), { seed: 16 }), 400);
  });
  guard('table', () => {
    draws('table normal', lib.tableSampler(lib.normalTarget(0, 1), { seed: 17 }), 2000);
    draws('table gamma(3)', lib.tableSampler(lib.gammaTarget(3), { seed: 18 }), 2000);
    draws('table beta(2, 3)', lib.tableSampler(lib.betaTarget(2, 3), { seed: 19 }), 2000);
    draws('table logistic', lib.tableSampler(lib.logisticTarget(0, 1), { seed: 20 }), 2000);
  });
  guard('exact', () => {
    draws('exact student-t(4)', lib.exactSampler(lib.studentTTarget(4), { seed: 21 }), 400);
    draws('exact bimodal', lib.exactSampler(bimodal, { seed: 22 }), 400);
    draws('exact gamma(1.7)', lib.exactSampler(lib.gammaTarget(1.7), { seed: 23 }), 400);
  });
  // certified envelopes (formula targets and hand-written bounds), families, pole transforms
  guard('certified', () => {
    // invented: a broad and a narrow normal component, written as a formula
    const mix = lib.formulaTarget('logsumexp(log(0.7) - x^2/2, log(0.3) - log(s) - (x - 3)^2 / (2*s^2))', { support: [-Infinity, Infinity], parameters: { s: 0.05 } });
    put('formula mixture logDensity', Array.from({ length: 40 }, (_, i) => mix.logDensity(-4 + i * 0.2)));
    const b = mix.logDensityBounds(-1, 0.5);
    put('formula mixture bounds on [-1, 0.5]', [b[0], b[1]]);
    draws('certified formula mixture', lib.certifiedSampler(mix, { seed: 30 }), 400);
    const trig = lib.formulaTarget('-x^2/2 + log(2 + sin(3*x) * cos(x))', { support: [-Infinity, Infinity] });
    draws('certified formula trig', lib.certifiedSampler(trig, { seed: 31 }), 400);
    draws('exact formula mixture', lib.exactSampler(mix, { seed: 32 }), 400);
  });
  guard('families', () => {
    draws('hull gumbel(1, 2)', lib.adaptiveRejectionSampler(lib.gumbelTarget(1, 2), { seed: 33 }), 300);
    draws('table weibull(1.7, 2)', lib.tableSampler(lib.weibullTarget(1.7, 2), { seed: 34 }), 1000);
    draws('exact lognormal(0.3, 0.8)', lib.exactSampler(lib.lognormalTarget(0.3, 0.8), { seed: 35 }), 300);
    draws('exact gig(0.5, 2, 3)', lib.exactSampler(lib.generalizedInverseGaussianTarget(0.5, 2, 3), { seed: 36 }), 300);
  });
  guard('poles', () => {
    draws('exact gamma(0.5) (pole transform)', lib.exactSampler(lib.gammaTarget(0.5), { seed: 37 }), 400);
    draws('hull beta(0.5, 0.5) poleAt both', lib.adaptiveRejectionSampler(lib.betaTarget(0.5, 0.5), { poleAt: 'both', seed: 38 }), 400);
    draws('ratio-of-uniforms chi-square(1) poleAt lower', lib.ratioOfUniformsSampler(lib.chiSquareTarget(1), { poleAt: 'lower', seed: 39 }), 400);
    const pt = lib.poleTransform(lib.weibullTarget(0.6), 'lower');
    put('poleTransform weibull(0.6) logDensity of Y', [-30, -5, -1, 0, 1, 2].map((y) => pt.target.logDensity(y)));
  });
  // discrete targets
  guard('discrete', () => {
    const families: [string, Lib.DiscreteFamilyTarget][] = [
      ['poisson(3.5)', lib.poissonTarget(3.5)],
      ['binomial(20, 0.3)', lib.binomialTarget(20, 0.3)],
      ['negative-binomial(3, 0.4)', lib.negativeBinomialTarget(3, 0.4)],
      ['geometric(0.2)', lib.geometricTarget(0.2)],
    ];
    for (const [name, t] of families) put(`${name} logPmf and cdf`, Array.from({ length: 20 }, (_, k) => [t.logPmf(k), t.cdf(k)]).flat());
    draws('discrete poisson(3.5) auto', lib.discreteSampler(lib.poissonTarget(3.5), { seed: 40 }), 400);
    draws('discrete poisson(1e4) log-concave', lib.discreteSampler(lib.poissonTarget(1e4), { seed: 41 }), 400);
    draws('discrete binomial(20, 0.3) table', lib.discreteSampler(lib.binomialTarget(20, 0.3), { method: 'table', seed: 42 }), 400);
    draws('discrete negative-binomial(3, 0.4) ratio-of-uniforms', lib.discreteSampler(lib.negativeBinomialTarget(3, 0.4), { method: 'ratio-of-uniforms', seed: 43 }), 400);
    // invented: hourly rentals at one station, zero-inflated counts (arithmetic only)
    const rentals: Lib.DiscreteTarget = { logPmf: (k: number) => (k < 0 || k > 40 ? -Infinity : k === 0 ? 0.5 : -0.05 * (k - 6) * (k - 6)), support: [0, 40] };
    draws('discrete invented rentals', lib.discreteSampler(rentals, { seed: 44, expectedDraws: 1e6 }), 400);
    const w = lib.weightedIndexSampler(new Float64Array([1, 0, 3, 0.5, 2.25, 1e-9]), { seed: 45 });
    draws('weightedIndex alias', w, 400);
    put('weightedIndex alias probabilities', w.probabilities());
    draws('weightedIndex inversion', lib.weightedIndexSampler([5, 1, 1, 7, 0.125], { method: 'inversion', seed: 46 }), 400);
  });
  guard('partitioned', () => {
    const out = lib.partitionedFill((u, own) => lib.tableSampler(lib.normalTarget(0, 1), { ...own }), new Float64Array(1000), 4, 2026);
    put('partitionedFill table normal 4 parts', out);
  });

  // checks on fixed data
  guard('checks', () => {
    const u = lib.substream(5, 5);
    const x = Float64Array.from({ length: 500 }, () => u() * 4 - 2);
    const cdf = lib.normalTarget(0, 1).cdf as (x: number) => number;
    const ks = lib.ksCheck(x, cdf);
    const ad = lib.andersonDarlingCheck(x, cdf);
    const cs = lib.chiSquareCheck([18, 25, 31, 26], [0.2, 0.25, 0.3, 0.25]);
    put('checks', [ks.statistic, ks.pValue, ad.statistic, ad.pValue, cs.statistic, cs.pValue]);
  });

  // typed errors: name, code, message
  const bad: [string, () => unknown][] = [
    ['seed -1', () => lib.mersenneTwister(-1)],
    ['restore bad state', () => lib.restoreMersenneTwister({ format: 'x' } as unknown as Lib.MersenneTwisterState)],
    ['normal sd 0', () => lib.normalTarget(0, 0)],
    ['gamma shape -1', () => lib.gammaTarget(-1)],
    ['table on a non-log-concave target', () => lib.tableSampler(bimodal, { seed: 1 })],
    ['hull on improper density', () => lib.adaptiveRejectionSampler({ logDensity: (x) => 0.1 * x }, { seed: 1 }).fill(new Float64Array(10))],
    ['rejection light-tailed proposal', () => lib.rejectionSampler(lib.studentTTarget(2), { proposal: lib.normalProposal(0, 1), seed: 1 })],
    ['NaN density', () => lib.exactSampler({ logDensity: () => NaN }, { seed: 1 }).sample()],
    ['uniform out of range', () => lib.tableSampler(lib.normalTarget(0, 1), { uniform: () => 1 }).sample()],
    ['ks on one value', () => lib.ksCheck([1], (x) => x)],
    ['bad option', () => lib.tableSampler(lib.normalTarget(0, 1), { seed: 1.5 })],
    ['certified without bounds', () => lib.certifiedSampler({ logDensity: (x: number) => -x * x } as unknown as Lib.FormulaTarget, { seed: 1 })],
    ['formula syntax error', () => lib.formulaTarget('x +* 2', { support: [0, 1] })],
    ['poisson negative mean', () => lib.poissonTarget(-1)],
    ['weighted index all zero', () => lib.weightedIndexSampler([0, 0, 0])],
    ['unbounded density without an integrable pole', () => lib.exactSampler({ logDensity: (x) => (x > 0 && x < 1 ? 1 / x : -Infinity), support: [0, 1] }, { seed: 1 }).sample()],
    ['gamma shape too small for the pole transform', () => lib.exactSampler(lib.gammaTarget(0.01), { seed: 1 }).sample()],
  ];
  for (const [name, f] of bad) {
    try {
      f();
      strings[`error: ${name}`] = 'did not throw';
    } catch (e) {
      const err = e as { name?: string; code?: string; message?: string };
      strings[`error: ${name}`] = JSON.stringify([err.name, err.code, err.message, e instanceof lib.ExactDrawError]);
    }
  }
  return { values, strings };
}

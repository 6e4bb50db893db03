// A sampler-suite module for CI: `exactdraw check` and `exactdraw bench` read it.
//   npx exactdraw check examples/ci-suite.mjs
//   npx exactdraw bench examples/ci-suite.mjs --json --out out/ci-bench.json
//   npx exactdraw bench examples/ci-suite.mjs --baseline out/ci-bench.json --tolerance 0.2
// Scenario (INVENTED): the generators a bike-share simulation ships.
import { cauchyProposal, discreteSampler, normalTarget, poissonTarget, rejectionSampler, tableSampler, truncate, uniformProposal, weightedIndexSampler } from 'exactdraw';

// Battery charge on return, in % (invented): normal(62, 18) truncated to [0, 100].
const charge = truncate(normalTarget(62, 18), 0, 100);
// Dock-to-dock ride speed in km/h (invented): normal(15, 3.5).
const speed = normalTarget(15, 3.5);
// Bikes returned per hour at a station (invented): Poisson(6.2).
const returns = poissonTarget(6.2);
// Share of returns per dock of a five-dock station (invented weights; dock 3 is out of service).
const dockWeights = [4, 2.5, 0, 3, 1];
const dockTotal = dockWeights.reduce((a, b) => a + b, 0);

export const samplers = [
  {
    name: 'battery charge on return',
    create: (uniform) => rejectionSampler(charge, { proposal: uniformProposal(0, 100), uniform }),
    cdf: (x) => charge.cdf(x),
    reference: 'mt19937 uniform (raw)',
  },
  {
    name: 'ride speed',
    create: (uniform) => rejectionSampler(speed, { proposal: cauchyProposal(15, 3.5), uniform }),
    cdf: (x) => speed.cdf(x),
    reference: '@stdlib improved-ziggurat normal',
  },
  {
    // Many draws from one fixed target: the table-driven fast path. The factory's
    // second argument `own` = { seed, stream } names the same substream as
    // `uniform`; passing it as options lets the sampler own the stream and read
    // it in blocks (same draws as `{ uniform }`, faster).
    name: 'ride speed (fast path)',
    create: (uniform, own) => tableSampler(speed, { ...own }),
    cdf: (x) => speed.cdf(x),
    reference: '@stdlib improved-ziggurat normal',
  },
  {
    // A sampler of integers: `discrete: true` makes `exactdraw check` run a chi-square
    // test (cells pooled to an expected count >= 5) against `pmf` (or differences of
    // `cdf` at the integers) on `support` (default [0, Infinity]).
    name: 'bike returns per hour',
    discrete: true,
    create: (uniform) => discreteSampler(returns, { uniform }),
    pmf: (k) => Math.exp(returns.logPmf(k)),
  },
  {
    name: 'dock of a return',
    discrete: true,
    create: (uniform) => weightedIndexSampler(Float64Array.from(dockWeights), { uniform }),
    pmf: (k) => dockWeights[k] / dockTotal,
    support: [0, dockWeights.length - 1],
  },
];

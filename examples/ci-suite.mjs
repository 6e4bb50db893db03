// A sampler-suite module for CI: `exactdraw check` and `exactdraw bench` read it.
//   npx exactdraw check examples/ci-suite.mjs
//   npx exactdraw bench examples/ci-suite.mjs --json --out out/ci-bench.json
//   npx exactdraw bench examples/ci-suite.mjs --baseline out/ci-bench.json --tolerance 0.2
// Scenario (INVENTED): the generators a bike-share simulation ships.
import { cauchyProposal, normalTarget, rejectionSampler, tableSampler, truncate, uniformProposal } from 'exactdraw';

// Battery charge on return, in % (invented): normal(62, 18) truncated to [0, 100].
const charge = truncate(normalTarget(62, 18), 0, 100);
// Dock-to-dock ride speed in km/h (invented): normal(15, 3.5).
const speed = normalTarget(15, 3.5);

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
];

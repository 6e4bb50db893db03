#!/usr/bin/env node
// Cost of a Gibbs step whose full conditional changes every draw: a fresh
// adaptiveRejectionSampler on the new conditional, one draw, from a shared
// injected stream (substream per chain). Against the build (dist/):
//   npm run build && node bench/gibbs.mjs [--steps 20000] [--rounds 7]
// The conditional is a gamma(a, b) log-density with (a, b) changing each step,
// so @stdlib/random-base-gamma called with (a, b) per draw is the specialised
// peer (it exists for this family only; the hull needs just the log-density).
// Reported: microseconds per step (median of rounds), evaluations per step.
import stdlibGamma from '@stdlib/random-base-gamma';
import mt19937 from '@stdlib/random-base-mt19937';
import * as ed from '../dist/index.js';

const args = process.argv.slice(2);
const opt = (name, def) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : def;
};
const STEPS = opt('--steps', 20000);
const ROUNDS = opt('--rounds', 7);
const median = (a) => [...a].sort((x, y) => x - y)[a.length >> 1];
const u = ed.substream(2026, 0);
const peer = stdlibGamma.factory({ prng: mt19937.factory({ seed: 2026 }).normalized });
let a = 2.5;
let b = 1.3;
const conditional = { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t, dLogDensity: (t) => (a - 1) / t - b };
const conditionalNoDerivative = { support: [0, Infinity], logDensity: conditional.logDensity };
let sink = 0;
const cases = {
  'hull, tangents (dLogDensity)': () => ed.adaptiveRejectionSampler(conditional, { uniform: u }),
  'hull, secants (no derivative)': () => ed.adaptiveRejectionSampler(conditionalNoDerivative, { uniform: u }),
};
const results = {};
for (const [name, make] of Object.entries(cases)) {
  const times = [];
  let evals = 0;
  for (let r = -1; r < ROUNDS; r++) {
    evals = 0;
    const t0 = performance.now();
    for (let i = 0; i < STEPS; i++) {
      a = 1.5 + (i % 11) * 0.4;
      b = 0.5 + (i % 7) * 0.25;
      const s = make();
      sink += s.sample();
      const st = s.stats;
      evals += st.setupEvaluations + st.densityEvaluations;
    }
    if (r >= 0) times.push(((performance.now() - t0) * 1000) / STEPS);
  }
  results[name] = { usPerStep: median(times), evaluationsPerStep: evals / STEPS };
}
{
  const times = [];
  for (let r = -1; r < ROUNDS; r++) {
    const t0 = performance.now();
    for (let i = 0; i < STEPS; i++) {
      a = 1.5 + (i % 11) * 0.4;
      b = 0.5 + (i % 7) * 0.25;
      sink += peer(a, b); // shape a, rate b
    }
    if (r >= 0) times.push(((performance.now() - t0) * 1000) / STEPS);
  }
  results['@stdlib gamma(a, b) per call (peer)'] = { usPerStep: median(times), evaluationsPerStep: 0 };
}
console.log(`# Gibbs steps: fresh conditional each draw, ${STEPS} steps x ${ROUNDS} rounds, node ${process.version}`);
for (const [name, r] of Object.entries(results)) console.log(`${name.padEnd(40)} ${r.usPerStep.toFixed(2).padStart(8)} us/step   ${r.evaluationsPerStep.toFixed(2)} evaluations/step`);
if (!Number.isFinite(sink)) throw new Error('non-finite draw');

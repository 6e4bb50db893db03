#!/usr/bin/env node
// Cost of Gibbs steps whose full conditional changes every draw, against the
// build (dist/):
//   npm run build && node bench/gibbs.mjs [--steps 20000] [--sweeps 2000] [--rounds 7] [--json FILE]
//
// Cases (each generator in a loop of its own, written out below as a user
// writes it; interleaved rounds after two warm-up fills; medians; NaN guard):
// - a fresh adaptiveRejectionSampler on a gamma(a, b)-shaped conditional, (a, b)
//   changing every step, one draw, from a shared injected stream: with tangents
//   (dLogDensity) and with secants (no derivative);
// - @stdlib/random-base-gamma called with the step's (a, b): the specialised
//   peer (it exists for this family only; the hull needs just the log-density);
// - one sweep of the pump-failure Gibbs sampler (Gaver & O'Muircheartaigh 1987
//   data; the model of test/gibbs/pump-failure.test.ts): ten λ_i and β from
//   fresh hulls on gammaTarget, α from a fresh hull on its non-conjugate
//   log-density (12 fresh samplers per sweep);
// - the raw MT19937 uniform, for the harness self-check: it must agree within
//   10 % with the same loop in bench/lib/raw-alone.mjs (run after every round).
// Every case runs alone in a fresh process (`--case NAME`), in interleaved
// rounds: several MT19937 instances in one process make the shared wrapper's
// call sites slower (see bench/fast-path.mjs).
// Reported: microseconds per step or sweep, evaluations per step (setup included).
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import gammaln from '@stdlib/math-base-special-gammaln';
import stdlibGamma from '@stdlib/random-base-gamma';
import * as ed from '../dist/index.js';
import { loadLine, machineLine, option, runChildIfAsked, selfCheck, timeInFreshProcesses } from './lib/harness.mjs';

const args = process.argv.slice(2);
const HERE = fileURLToPath(import.meta.url);
const STEPS = Number(option(args, '--steps', 20000));
const SWEEPS = Number(option(args, '--sweeps', 2000));
const ROUNDS = Number(option(args, '--rounds', 5));
const JSON_OUT = option(args, '--json', undefined);
const RAW_SIZE = 1_000_000;

const RAW = 'mt19937 uniform (raw)';
const TAN = 'fresh hull per step, tangents (dLogDensity)';
const SEC = 'fresh hull per step, secants (no derivative)';
const RTAN = 'conditionalSampler per step, tangents';
const RSEC = 'conditionalSampler per step, secants';
const PEER = '@stdlib gamma(a, b) per call (peer)';
const PUMP = 'pump-failure sweep (12 fresh hulls)';
const RPUMP = 'pump-failure sweep (12 conditionalSamplers)';

// pump-failure data (Gaver & O'Muircheartaigh 1987; from memory, as reprinted widely)
const X = [5, 1, 5, 14, 3, 19, 1, 1, 4, 22];
const T = [94.32, 15.72, 62.88, 125.76, 5.24, 31.44, 1.048, 1.048, 2.096, 10.48];

const CASES = {
  [RAW]: () => {
    const next = ed.mersenneTwister(101);
    return {
      size: RAW_SIZE,
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = next();
      },
    };
  },
  [TAN]: () => {
    const u = ed.substream(2026, 0);
    let a = 2.5;
    let b = 1.3;
    const conditional = { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t, dLogDensity: (t) => (a - 1) / t - b };
    let evals = 0;
    let steps = 0;
    return {
      size: STEPS,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          a = 1.5 + (i % 11) * 0.4;
          b = 0.5 + (i % 7) * 0.25;
          const s = ed.adaptiveRejectionSampler(conditional, { uniform: u });
          out[i] = s.sample();
          const st = s.stats;
          evals += st.setupEvaluations + st.densityEvaluations;
        }
        steps += out.length;
      },
      stats: () => ({ evaluationsPerStep: evals / steps }),
    };
  },
  [SEC]: () => {
    const u = ed.substream(2026, 1);
    let a = 2.5;
    let b = 1.3;
    const conditional = { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t };
    let evals = 0;
    let steps = 0;
    return {
      size: STEPS,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          a = 1.5 + (i % 11) * 0.4;
          b = 0.5 + (i % 7) * 0.25;
          const s = ed.adaptiveRejectionSampler(conditional, { uniform: u });
          out[i] = s.sample();
          const st = s.stats;
          evals += st.setupEvaluations + st.densityEvaluations;
        }
        steps += out.length;
      },
      stats: () => ({ evaluationsPerStep: evals / steps }),
    };
  },
  [RTAN]: () => {
    const u = ed.substream(2026, 0);
    let a = 2.5;
    let b = 1.3;
    const conditional = { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t, dLogDensity: (t) => (a - 1) / t - b };
    const s = ed.conditionalSampler({ uniform: u });
    return {
      size: STEPS,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          a = 1.5 + (i % 11) * 0.4;
          b = 0.5 + (i % 7) * 0.25;
          out[i] = s.draw(conditional);
        }
      },
      stats: () => {
        const st = s.stats;
        return { evaluationsPerStep: (st.setupEvaluations + st.densityEvaluations) / st.targets };
      },
    };
  },
  [RSEC]: () => {
    const u = ed.substream(2026, 1);
    let a = 2.5;
    let b = 1.3;
    const conditional = { support: [0, Infinity], logDensity: (t) => (a - 1) * Math.log(t) - b * t };
    const s = ed.conditionalSampler({ uniform: u });
    return {
      size: STEPS,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          a = 1.5 + (i % 11) * 0.4;
          b = 0.5 + (i % 7) * 0.25;
          out[i] = s.draw(conditional);
        }
      },
      stats: () => {
        const st = s.stats;
        return { evaluationsPerStep: (st.setupEvaluations + st.densityEvaluations) / st.targets };
      },
    };
  },
  [PEER]: () => {
    const gam = stdlibGamma.factory({ prng: ed.mersenneTwister(2026) });
    return {
      size: STEPS,
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = gam(1.5 + (i % 11) * 0.4, 0.5 + (i % 7) * 0.25); // shape, rate
      },
      stats: () => ({ evaluationsPerStep: 0 }),
    };
  },
  [PUMP]: () => {
    const u = ed.substream(2026, 2);
    const n = X.length;
    let alpha = 1;
    let beta = 1;
    let logSumLambda = 0;
    // α ~ exponential(1), β ~ gamma(1, 1) (the priors of the test)
    const alphaConditional = { support: [0, Infinity], logDensity: (al) => al * (n * Math.log(beta) + logSumLambda - 1) - n * gammaln(al) };
    let evals = 0;
    let sweeps = 0;
    return {
      size: SWEEPS,
      fill(out) {
        for (let s = 0; s < out.length; s++) {
          let sum = 0;
          logSumLambda = 0;
          for (let i = 0; i < n; i++) {
            const h = ed.adaptiveRejectionSampler(ed.gammaTarget(alpha + X[i], beta + T[i]), { uniform: u });
            const l = h.sample();
            evals += h.stats.setupEvaluations + h.stats.densityEvaluations;
            sum += l;
            logSumLambda += Math.log(l);
          }
          const hb = ed.adaptiveRejectionSampler(ed.gammaTarget(1 + n * alpha, 1 + sum), { uniform: u });
          beta = hb.sample();
          const ha = ed.adaptiveRejectionSampler(alphaConditional, { uniform: u });
          alpha = ha.sample();
          evals += hb.stats.setupEvaluations + hb.stats.densityEvaluations + ha.stats.setupEvaluations + ha.stats.densityEvaluations;
          out[s] = alpha;
        }
        sweeps += out.length;
      },
      stats: () => ({ evaluationsPerSweep: evals / sweeps }),
    };
  },
  [RPUMP]: () => {
    const u = ed.substream(2026, 2);
    const n = X.length;
    let alpha = 1;
    let beta = 1;
    let logSumLambda = 0;
    const alphaConditional = { support: [0, Infinity], logDensity: (al) => al * (n * Math.log(beta) + logSumLambda - 1) - n * gammaln(al) };
    // one sampler per conditional (each λ_i's conditional moves little from sweep to sweep)
    const lam = X.map(() => ed.conditionalSampler({ uniform: u }));
    const sb = ed.conditionalSampler({ uniform: u });
    const sa = ed.conditionalSampler({ uniform: u });
    return {
      size: SWEEPS,
      fill(out) {
        for (let s = 0; s < out.length; s++) {
          let sum = 0;
          logSumLambda = 0;
          for (let i = 0; i < n; i++) {
            const l = lam[i].draw(ed.gammaTarget(alpha + X[i], beta + T[i]));
            sum += l;
            logSumLambda += Math.log(l);
          }
          beta = sb.draw(ed.gammaTarget(1 + n * alpha, 1 + sum));
          alpha = sa.draw(alphaConditional);
          out[s] = alpha;
        }
      },
      stats: () => {
        let evals = 0;
        for (const c of [...lam, sb, sa]) evals += c.stats.setupEvaluations + c.stats.densityEvaluations;
        return { evaluationsPerSweep: evals / sa.stats.targets };
      },
    };
  },
};

if (runChildIfAsked(args, CASES)) process.exit(0);

const command = `node bench/gibbs.mjs --steps ${STEPS} --sweeps ${SWEEPS} --rounds ${ROUNDS}${JSON_OUT ? ` --json ${JSON_OUT}` : ''}`;
console.log(`# Gibbs steps: a fresh conditional each draw; command: ${command} (after npm run build)`);
console.log(machineLine());
console.log(loadLine('at start'));
const names = [RAW, TAN, SEC, RTAN, RSEC, PEER, PUMP, RPUMP];
const fresh = timeInFreshProcesses(HERE, names, { size: RAW_SIZE, rounds: ROUNDS, childRounds: 3, extra: ['--steps', String(STEPS), '--sweeps', String(SWEEPS)] });
const check = selfCheck(fresh.cases[RAW].runs, fresh.reference);
const rows = names.map((name) => ({ name, usPerStep: fresh.cases[name].ns / 1000, nsPerStep: fresh.cases[name].ns, runsNs: fresh.cases[name].runs, ...(fresh.cases[name].stats ?? {}) }));
for (const r of rows) {
  if (r.name === RAW) console.log(`${r.name.padEnd(46)} ${r.nsPerStep.toFixed(2).padStart(9)} ns per uniform`);
  else if (r.name === PUMP || r.name === RPUMP) console.log(`${r.name.padEnd(46)} ${r.usPerStep.toFixed(2).padStart(9)} us/sweep  ${r.evaluationsPerSweep.toFixed(2)} evaluations/sweep`);
  else console.log(`${r.name.padEnd(46)} ${r.usPerStep.toFixed(3).padStart(9)} us/step   ${r.evaluationsPerStep.toFixed(2)} evaluations/step`);
}
console.log(`# medians of ${ROUNDS} interleaved rounds, each case alone in a fresh process (3 timed fills there)`);
console.log(check.line);
console.log(loadLine('at end'));
if (JSON_OUT) writeFileSync(JSON_OUT, JSON.stringify({ schema: 'exactdraw-gibbs/1', command, node: process.version, rounds: ROUNDS, rows, selfCheck: check }, null, 2) + '\n');

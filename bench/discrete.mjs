#!/usr/bin/env node
// Discrete samplers against @stdlib peers on the same MT19937 source, against
// the build (dist/):
//   npm run build && node bench/discrete.mjs [--draws 500000] [--fresh 5000] [--rounds 5] [--json FILE]
//
// Cases (each generator in a loop of its own, written out below as a user
// writes it; harness rule of DEVELOPERS.md, bench/lib/harness.mjs):
// - Poisson(λ), λ = 0.5, 30, 1e4, from its log-pmf (discreteSampler on
//   poissonTarget, owned stream `seed`, fill) vs @stdlib/random-base-poisson
//   with prng = exactdraw's mersenneTwister (the same MT19937), fixed λ;
// - fresh λ per draw (Gibbs-style; λ moves within ±10 % every draw): a new
//   target and a new discreteSampler per draw on one injected stream, and
//   reusableDiscreteSampler.sample(new target) on its owned stream, vs the
//   peer called with the draw's λ; evaluations per draw (setup included);
// - the alias table (weightedIndexSampler fill) vs a binary search on the
//   cumulative weights, 16, 1024 and 65536 weights (invented: e^(4U));
// - the raw MT19937 uniform, for the harness self-check.
// Every case runs alone in a fresh process (`--case NAME`) in interleaved
// rounds; ratios are medians of per-round ratios (both figures from the same
// round). Figures must not be quoted when the self-check fails.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import stdlibPoisson from '@stdlib/random-base-poisson';
import * as ed from '../dist/index.js';
import { loadLine, machineLine, option, perRoundRatio, runChildIfAsked, selfCheck, timeInFreshProcesses } from './lib/harness.mjs';

const args = process.argv.slice(2);
const HERE = fileURLToPath(import.meta.url);
const DRAWS = Number(option(args, '--draws', 500000));
const FRESH = Number(option(args, '--fresh', 5000));
const ROUNDS = Number(option(args, '--rounds', 5));
const JSON_OUT = option(args, '--json', undefined);
const RAW_SIZE = 1_000_000;
const LAMBDAS = [0.5, 30, 1e4];
const SIZES = [16, 1024, 65536];

const RAW = 'mt19937 uniform (raw)';
const name = {
  fixedOurs: (l) => `Poisson(${l}) fixed: discreteSampler fill`,
  fixedPeer: (l) => `Poisson(${l}) fixed: @stdlib poisson`,
  freshOurs: (l) => `Poisson(${l}) fresh: discreteSampler per draw`,
  freshReuse: (l) => `Poisson(${l}) fresh: reusableDiscreteSampler`,
  freshPeer: (l) => `Poisson(${l}) fresh: @stdlib poisson(λ)`,
  alias: (n) => `${n} weights: alias table fill`,
  search: (n) => `${n} weights: binary search on cumulative weights`,
};

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
};

for (const lambda of LAMBDAS) {
  CASES[name.fixedOurs(lambda)] = () => {
    const s = ed.discreteSampler(ed.poissonTarget(lambda), { seed: 11, expectedDraws: DRAWS });
    return { size: DRAWS, fill: (out) => s.fill(out), stats: () => ({ method: s.choice.method, evaluationsPerDraw: s.stats.densityEvaluations / s.stats.samples }) };
  };
  CASES[name.fixedPeer(lambda)] = () => {
    const poi = stdlibPoisson.factory(lambda, { prng: ed.mersenneTwister(11) });
    return {
      size: DRAWS,
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = poi();
      },
    };
  };
  CASES[name.freshOurs(lambda)] = () => {
    const u = ed.mersenneTwister(12);
    let evals = 0;
    let draws = 0;
    return {
      size: FRESH,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          const l = lambda * (0.9 + 0.2 * ((i % 97) / 97));
          const s = ed.discreteSampler(ed.poissonTarget(l), { uniform: u });
          out[i] = s.sample();
          const st = s.stats;
          evals += st.setupEvaluations + st.densityEvaluations;
        }
        draws += out.length;
      },
      stats: () => ({ evaluationsPerDraw: evals / draws }),
    };
  };
  CASES[name.freshReuse(lambda)] = () => {
    const step = ed.reusableDiscreteSampler({ seed: 12 });
    return {
      size: 10 * FRESH,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          const l = lambda * (0.9 + 0.2 * ((i % 97) / 97));
          out[i] = step.sample(ed.poissonTarget(l));
        }
      },
      stats: () => {
        const st = step.stats;
        return { method: step.lastMethod, evaluationsPerDraw: (st.setupEvaluations + st.densityEvaluations) / st.samples };
      },
    };
  };
  CASES[name.freshPeer(lambda)] = () => {
    const poi = stdlibPoisson.factory({ prng: ed.mersenneTwister(12) });
    return {
      size: 10 * FRESH,
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = poi(lambda * (0.9 + 0.2 * ((i % 97) / 97)));
      },
    };
  };
}

const weights = (size) => {
  const g = ed.mersenneTwister(5);
  const w = new Float64Array(size);
  for (let i = 0; i < size; i++) w[i] = Math.exp(4 * g());
  return w;
};
for (const size of SIZES) {
  CASES[name.alias(size)] = () => {
    const s = ed.weightedIndexSampler(weights(size), { seed: 6 });
    return { size: DRAWS, fill: (out) => s.fill(out) };
  };
  CASES[name.search(size)] = () => {
    const w = weights(size);
    const cum = new Float64Array(size);
    let acc = 0;
    for (let i = 0; i < size; i++) cum[i] = acc += w[i];
    const u = ed.mersenneTwister(6);
    return {
      size: DRAWS,
      fill(out) {
        for (let i = 0; i < out.length; i++) {
          const x = u() * acc;
          let lo = 0;
          let hi = size - 1;
          while (lo < hi) {
            const mid = (lo + hi) >> 1;
            if (cum[mid] > x) hi = mid;
            else lo = mid + 1;
          }
          out[i] = lo;
        }
      },
    };
  };
}

if (runChildIfAsked(args, CASES)) process.exit(0);

const command = `node bench/discrete.mjs --draws ${DRAWS} --fresh ${FRESH} --rounds ${ROUNDS}${JSON_OUT ? ` --json ${JSON_OUT}` : ''}`;
console.log(`# discrete samplers vs @stdlib, same MT19937; command: ${command} (after npm run build)`);
console.log(machineLine());
console.log(loadLine('at start'));
const names = Object.keys(CASES);
const fresh = timeInFreshProcesses(HERE, names, {
  size: RAW_SIZE,
  rounds: ROUNDS,
  childRounds: 3,
  extra: ['--draws', String(DRAWS), '--fresh', String(FRESH)],
  progress: (r) => process.stderr.write(`round ${r + 1}/${ROUNDS} done\n`),
});
const check = selfCheck(fresh.cases[RAW].runs, fresh.reference);
const c = (n) => fresh.cases[n];
const rows = names.map((n) => ({ name: n, ns: c(n).ns, runsNs: c(n).runs, ...(c(n).stats ?? {}) }));
const fmt = (ns) => (ns >= 10000 ? `${(ns / 1000).toFixed(2)} us` : `${ns.toFixed(1)} ns`).padStart(10);
for (const r of rows) {
  const extra = [r.method ? `method ${r.method}` : '', r.evaluationsPerDraw !== undefined && r.evaluationsPerDraw !== null ? `${r.evaluationsPerDraw.toFixed(2)} evaluations/draw` : ''].filter(Boolean).join(', ');
  console.log(`${r.name.padEnd(58)} ${fmt(r.ns)} per draw${extra ? `  (${extra})` : ''}`);
}
console.log('# ratios (median of per-round ratios; < 1 means ours is faster):');
const ratios = {};
for (const l of LAMBDAS) {
  ratios[`Poisson(${l}) fixed: discreteSampler / @stdlib`] = perRoundRatio(c(name.fixedOurs(l)).runs, c(name.fixedPeer(l)).runs);
  ratios[`Poisson(${l}) fresh: discreteSampler / @stdlib`] = perRoundRatio(c(name.freshOurs(l)).runs, c(name.freshPeer(l)).runs);
  ratios[`Poisson(${l}) fresh: reusableDiscreteSampler / @stdlib`] = perRoundRatio(c(name.freshReuse(l)).runs, c(name.freshPeer(l)).runs);
}
for (const n of SIZES) ratios[`${n} weights: alias / binary search`] = perRoundRatio(c(name.alias(n)).runs, c(name.search(n)).runs);
for (const [k, v] of Object.entries(ratios)) console.log(`${k.padEnd(58)} ${v.toFixed(2).padStart(7)}x`);
console.log(`# medians of ${ROUNDS} interleaved rounds, each case alone in a fresh process (3 timed fills there)`);
console.log(check.line);
console.log(loadLine('at end'));
if (JSON_OUT) writeFileSync(JSON_OUT, JSON.stringify({ schema: 'exactdraw-discrete/1', command, node: process.version, rounds: ROUNDS, rows, ratios, selfCheck: check }, null, 2) + '\n');

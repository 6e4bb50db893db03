#!/usr/bin/env node
// Discrete samplers against @stdlib peers, same MT19937 source (seeded stdlib
// generator's normalized()), against the build (dist/):
//   npm run build && node bench/discrete.mjs [--n 200000] [--rounds 5]
// Cases: Poisson(λ), λ = 0.5, 30, 1e4, from its log-pmf (discreteSampler) vs
// @stdlib/random-base-poisson; fixed λ (one sampler, fill) and fresh λ per
// draw (a new target and sampler per draw, and reusableDiscreteSampler with a
// new target per draw, vs the peer called with λ); alias
// table (weightedIndexSampler) vs binary search on cumulative weights.
// Each generator has its own loop written out (no shared call site); rounds
// are interleaved; NaN guard. Reported: ns per draw, median of rounds.
import stdlibPoisson from '@stdlib/random-base-poisson';
import mt19937 from '@stdlib/random-base-mt19937';
import * as ed from '../dist/index.js';

const args = process.argv.slice(2);
const opt = (name, def) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : def;
};
const N = opt('--n', 200000);
const ROUNDS = opt('--rounds', 5);
const median = (a) => [...a].sort((x, y) => x - y)[a.length >> 1];
const guard = (x, name) => {
  if (x !== x) throw new Error(`NaN from ${name}`);
  return x;
};
const src = (seed) => mt19937.factory({ seed }).normalized;
const results = {};
const put = (name, ns) => (results[name] ??= []).push(ns);

for (const lambda of [0.5, 30, 1e4]) {
  const fixedOurs = ed.discreteSampler(ed.poissonTarget(lambda), { uniform: src(11), expectedDraws: N });
  const fixedPeer = stdlibPoisson.factory(lambda, { prng: src(11) });
  const out = new Float64Array(N);
  const fresh = Math.max(2000, N / 50);
  for (let r = 0; r < ROUNDS; r++) {
    let t = process.hrtime.bigint();
    fixedOurs.fill(out);
    put(`Poisson(${lambda}) fixed: discreteSampler fill`, Number(process.hrtime.bigint() - t) / N);
    guard(out[N - 1], 'ours');
    t = process.hrtime.bigint();
    let s = 0;
    for (let i = 0; i < N; i++) s += fixedPeer();
    put(`Poisson(${lambda}) fixed: @stdlib poisson`, Number(process.hrtime.bigint() - t) / N);
    guard(s, 'peer');
    // fresh λ per draw (Gibbs-style): λ wiggles by ±10 %
    const u1 = src(12);
    t = process.hrtime.bigint();
    s = 0;
    for (let i = 0; i < fresh; i++) {
      const l = lambda * (0.9 + 0.2 * ((i % 97) / 97));
      s += ed.discreteSampler(ed.poissonTarget(l), { uniform: u1 }).sample();
    }
    put(`Poisson(${lambda}) fresh: discreteSampler per draw`, Number(process.hrtime.bigint() - t) / fresh);
    guard(s, 'ours fresh');
    const step = ed.reusableDiscreteSampler({ uniform: src(12) });
    t = process.hrtime.bigint();
    s = 0;
    for (let i = 0; i < fresh; i++) {
      const l = lambda * (0.9 + 0.2 * ((i % 97) / 97));
      s += step.sample(ed.poissonTarget(l));
    }
    put(`Poisson(${lambda}) fresh: reusableDiscreteSampler.sample(target)`, Number(process.hrtime.bigint() - t) / fresh);
    guard(s, 'ours reusable');
    const u2 = src(12);
    const peerAny = stdlibPoisson.factory({ prng: u2 });
    t = process.hrtime.bigint();
    s = 0;
    for (let i = 0; i < fresh; i++) {
      const l = lambda * (0.9 + 0.2 * ((i % 97) / 97));
      s += peerAny(l);
    }
    put(`Poisson(${lambda}) fresh: @stdlib poisson(λ)`, Number(process.hrtime.bigint() - t) / fresh);
    guard(s, 'peer fresh');
  }
}

for (const size of [16, 1024, 65536]) {
  const w = new Float64Array(size);
  const g = src(5);
  for (let i = 0; i < size; i++) w[i] = Math.exp(4 * g());
  const alias = ed.weightedIndexSampler(w, { uniform: src(6) });
  const cum = new Float64Array(size);
  let acc = 0;
  for (let i = 0; i < size; i++) cum[i] = acc += w[i];
  const u = src(6);
  const out = new Int32Array(N);
  for (let r = 0; r < ROUNDS; r++) {
    let t = process.hrtime.bigint();
    alias.fill(out);
    put(`${size} weights: alias table fill`, Number(process.hrtime.bigint() - t) / N);
    guard(out[N - 1], 'alias');
    t = process.hrtime.bigint();
    let s = 0;
    for (let i = 0; i < N; i++) {
      const x = u() * acc;
      let lo = 0;
      let hi = size - 1;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cum[mid] > x) hi = mid;
        else lo = mid + 1;
      }
      s += lo;
    }
    put(`${size} weights: binary search on cumulative weights`, Number(process.hrtime.bigint() - t) / N);
    guard(s, 'bsearch');
  }
}

for (const [name, v] of Object.entries(results)) console.log(`${median(v).toFixed(1).padStart(9)} ns  ${name}`);

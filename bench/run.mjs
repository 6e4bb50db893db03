// exactdraw benchmark suite. Runs against the build (dist/), all cases in one
// process with the same MT19937 source type, and reports ns per draw as the
// median of several rounds after warm-up, with ratios against @stdlib peers.
// Usage: npm run bench   (writes out/bench.json)
//        node bench/run.mjs --draws 1000000 --rounds 7 [--only name-substring]
import { mkdirSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import ziggurat from '@stdlib/random-base-improved-ziggurat';
import stdGamma from '@stdlib/random-base-gamma';
import * as ed from '../dist/index.js';
import { cases } from './cases.mjs';

const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : dflt;
};
const DRAWS = Number(opt('draws', 1_000_000));
const ROUNDS = Number(opt('rounds', 7));
const ONLY = opt('only', '');

const peers = {
  'mt19937 uniform (raw)': (seed) => {
    const u = ed.mersenneTwister(seed);
    return (out) => { for (let i = 0; i < out.length; i++) out[i] = u(); return out; };
  },
  '@stdlib improved-ziggurat normal': (seed) => {
    const z = ziggurat.factory({ prng: ed.mersenneTwister(seed) });
    return (out) => { for (let i = 0; i < out.length; i++) out[i] = z(); return out; };
  },
  '@stdlib gamma(2.5)': (seed) => {
    const g = stdGamma.factory(2.5, 1, { prng: ed.mersenneTwister(seed) });
    return (out) => { for (let i = 0; i < out.length; i++) out[i] = g(); return out; };
  },
};

function time(fill) {
  const out = new Float64Array(DRAWS);
  fill(out); // warm-up
  fill(out);
  const ns = [];
  for (let r = 0; r < ROUNDS; r++) {
    const t0 = process.hrtime.bigint();
    fill(out);
    const t1 = process.hrtime.bigint();
    let s = 0;
    for (let i = 0; i < out.length; i += 997) s += out[i];
    if (!Number.isFinite(s)) throw new Error('benchmark produced NaN or Infinity');
    ns.push(Number(t1 - t0) / DRAWS);
  }
  ns.sort((a, b) => a - b);
  return ns[Math.floor(ns.length / 2)];
}

const rows = [];
for (const [name, make] of Object.entries(peers)) {
  if (ONLY && !name.includes(ONLY)) continue;
  rows.push({ name, kind: 'peer', nsPerDraw: time(make(1)) });
  process.stderr.write(`  measured ${name}\n`);
}
for (const c of cases(ed)) {
  if (ONLY && !c.name.includes(ONLY)) continue;
  const s = c.make(1);
  const ns = time((out) => s.fill(out));
  const st = s.stats;
  rows.push({
    name: c.name,
    kind: 'exactdraw',
    reference: c.reference,
    nsPerDraw: ns,
    acceptanceRate: st.acceptanceRate,
    evaluationsPerDraw: st.densityEvaluations / st.samples,
    setupEvaluations: st.setupEvaluations,
  });
  process.stderr.write(`  measured ${c.name}\n`);
}
const byName = Object.fromEntries(rows.map((r) => [r.name, r]));
for (const r of rows) {
  if (r.reference && byName[r.reference]) r.ratioToReference = r.nsPerDraw / byName[r.reference].nsPerDraw;
  if (byName['mt19937 uniform (raw)']) r.ratioToUniform = r.nsPerDraw / byName['mt19937 uniform (raw)'].nsPerDraw;
}

const pad = (s, n) => String(s).padEnd(n);
const num = (x, d = 2) => (x === undefined ? '' : x.toFixed(d));
console.log(`exactdraw bench: ${DRAWS} draws × ${ROUNDS} rounds (median), node ${process.version}, ${cpus()[0]?.model ?? 'cpu'}`);
console.log(pad('case', 52) + pad('ns/draw', 10) + pad('accept', 9) + pad('evals/draw', 12) + pad('× ref', 8) + 'reference');
for (const r of rows) {
  console.log(
    pad(r.name, 52) + pad(num(r.nsPerDraw, 1), 10) + pad(num(r.acceptanceRate, 4), 9) + pad(num(r.evaluationsPerDraw, 4), 12) +
      pad(num(r.ratioToReference), 8) + (r.reference ?? ''),
  );
}
mkdirSync('out', { recursive: true });
writeFileSync('out/bench.json', JSON.stringify({ schema: 'exactdraw-bench/1', node: process.version, draws: DRAWS, rounds: ROUNDS, rows }, null, 2) + '\n');
console.log('wrote out/bench.json');

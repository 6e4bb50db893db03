#!/usr/bin/env node
// Speed-up of parallel fills over one thread, against the build (dist/):
//   npm run build && node bench/parallel.mjs [--draws 1e8] [--rounds 3] [--name "fast normal (own stream)"] [--json FILE]
//
// Per-core speed on shared virtual machines drifts by ±25 % over minutes (measured
// here: the same fill at 14.5 and at 23 ns per draw a few minutes apart), so
// every round runs all cases back to back and the per-round ratios are
// reported next to the ratios of medians.
//
// The same n draws (the parts of substream(seed, 0) and substream(seed, 1))
// are made, in every round, in this order:
//   1. one thread:      partitionedFill(entry.create, out, 2, seed) in this process;
//   2. fillParallel     with 1 worker and with 2 workers (each call starts its
//                       threads and loads the module: end-to-end one-shot cost);
//   3. a filler         (createParallelFiller) with 1 and with 2 workers, started
//                       once before the rounds and warmed by one fill: the cost
//                       of a fill on a running pool, the case of repeated fills.
// (1) with 2 parts makes exactly the draws of the 2-worker runs; the 1-worker
// runs make one part of n draws, the same work. `out` is backed by a
// SharedArrayBuffer and touched before timing (first-touch page faults are
// expensive on virtual machines: about 3 s for 800 MB measured here), so no
// copy is made. Figures are medians over the rounds; the 2-worker results are
// compared element by element with (1), and checked for non-finite values.
//
// Harness rule (DEVELOPERS.md, benchmark policy): the generator's per-draw loop
// is the library's own fill (one generator per fill, no call site shared with
// another generator in this script). Self-check: after every round the raw
// MT19937 uniform is timed in a loop of its own in this process and alone in a
// fresh process (bench/lib/raw-alone.mjs); the two must agree within 10 %, or
// the run says so.
import os from 'node:os';
import { writeFileSync } from 'node:fs';
import { createParallelFiller, fillParallel } from '../dist/node/index.js';
import { mersenneTwister, partitionedFill } from '../dist/index.js';
import { samplers } from './parallel-suite.mjs';
import { guard, rawAlone, selfCheck, timeInterleaved } from './lib/harness.mjs';

const args = process.argv.slice(2);
const RAW = 'mt19937 uniform (raw)';
const RAW_SIZE = 1_000_000;
const CASES = {
  [RAW]: () => {
    const next = mersenneTwister(101);
    return {
      size: RAW_SIZE,
      fill(out) {
        for (let i = 0; i < out.length; i++) out[i] = next();
      },
    };
  },
};
const opt = (name, def) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : def;
};
const N = Number(opt('--draws', 1e8));
const ROUNDS = Number(opt('--rounds', 3));
const NAME = opt('--name', 'fast normal (own stream)');
const JSON_OUT = opt('--json', undefined);
const SEED = 2026;
const MODULE = new URL('./parallel-suite.mjs', import.meta.url).href;
const entry = samplers.find((e) => e.name === NAME);
if (!entry) throw new Error(`no entry '${NAME}' (have: ${samplers.map((e) => e.name).join(', ')})`);
const median = (a) => [...a].sort((x, y) => x - y)[(a.length - 1) >> 1];
const loadavg = () => os.loadavg().map((v) => v.toFixed(2)).join(', ');
const load0 = loadavg();
console.log(`# parallel fills, ${N} draws of '${NAME}', ${ROUNDS} rounds, ${os.availableParallelism()} cores, node ${process.version}, load average at start ${load0}`);

const seqOut = new Float64Array(new SharedArrayBuffer(N * 8)).fill(1);
const parOut = new Float64Array(new SharedArrayBuffer(N * 8)).fill(1);
const spec = { module: MODULE, name: NAME };
const t0 = performance.now();
const pool1 = await createParallelFiller(spec, { workers: 1 });
const pool2 = await createParallelFiller(spec, { workers: 2 });
const tStart = performance.now() - t0;
await pool1.fill(parOut, { seed: SEED });
await pool2.fill(parOut, { seed: SEED });
partitionedFill(entry.create, seqOut, 2, SEED); // warm-up of the one-thread case

const times = { oneThread: [], oneShot1: [], oneShot2: [], pool1: [], pool2: [] };
let same = true;
const compare = () => {
  guard('one thread', seqOut, 1);
  guard('parallel', parOut, 1);
  for (let i = 0; i < N; i++) if (seqOut[i] !== parOut[i]) return false;
  return true;
};
const raw = { name: RAW, ...CASES[RAW]() };
const rawHere = [];
const rawRef = [];
const time = async (key, f) => {
  const t = performance.now();
  await f();
  times[key].push(performance.now() - t);
};
for (let r = 0; r < ROUNDS; r++) {
  await time('oneThread', () => partitionedFill(entry.create, seqOut, 2, SEED));
  await time('oneShot1', () => fillParallel(spec, parOut, { workers: 1, seed: SEED }));
  await time('oneShot2', () => fillParallel(spec, parOut, { workers: 2, seed: SEED }));
  same = same && compare();
  await time('pool1', () => pool1.fill(parOut, { seed: SEED }));
  await time('pool2', () => pool2.fill(parOut, { seed: SEED }));
  same = same && compare();
  rawHere.push(timeInterleaved([raw], { rounds: 1 })[0].ns);
  rawRef.push(rawAlone(RAW_SIZE, 5));
  console.log(`round ${r + 1}: ` + Object.entries(times).map(([k, v]) => `${k} ${v[r].toFixed(0)} ms`).join(', '));
}
await pool1.close();
await pool2.close();
const med = Object.fromEntries(Object.entries(times).map(([k, v]) => [k, median(v)]));
const ns = (ms) => ((ms * 1e6) / N).toFixed(2);
const res = {
  schema: 'exactdraw-parallel/1',
  command: `node bench/parallel.mjs --draws ${N} --rounds ${ROUNDS} --name "${NAME}"`,
  node: process.version,
  cores: os.availableParallelism(),
  draws: N,
  medianMs: med,
  fillerStartMs: tStart,
  speedUp: {
    oneShotOverOneThread: med.oneThread / med.oneShot2,
    oneShotOverOneWorker: med.oneShot1 / med.oneShot2,
    fillerOverOneThread: med.oneThread / med.pool2,
    fillerOverOneWorker: med.pool1 / med.pool2,
  },
  // per-round ratios (each round's cases run back to back, so a slow phase of the machine hits both)
  perRoundSpeedUp: {
    oneShotOverOneWorker: median(times.oneShot1.map((v, r) => v / times.oneShot2[r])),
    fillerOverOneWorker: median(times.pool1.map((v, r) => v / times.pool2[r])),
    fillerOverOneThread: median(times.oneThread.map((v, r) => v / times.pool2[r])),
  },
  identical: same,
  selfCheck: selfCheck(rawHere, rawRef),
  load: { start: load0, end: loadavg() },
};
console.log(`medians: one thread ${med.oneThread.toFixed(0)} ms (${ns(med.oneThread)} ns/draw)`);
console.log(`  fillParallel (one-shot): 1 worker ${med.oneShot1.toFixed(0)} ms, 2 workers ${med.oneShot2.toFixed(0)} ms (${ns(med.oneShot2)} ns/draw)`);
console.log(`  filler (running pool):   1 worker ${med.pool1.toFixed(0)} ms, 2 workers ${med.pool2.toFixed(0)} ms (${ns(med.pool2)} ns/draw); starting both pools took ${tStart.toFixed(0)} ms`);
console.log(`speed-up with 2 workers (target >= 1.8):`);
console.log(`  one-shot fillParallel: ${res.speedUp.oneShotOverOneThread.toFixed(3)} over one thread, ${res.speedUp.oneShotOverOneWorker.toFixed(3)} over 1 worker`);
console.log(`  running filler:        ${res.speedUp.fillerOverOneThread.toFixed(3)} over one thread, ${res.speedUp.fillerOverOneWorker.toFixed(3)} over 1 worker`);
console.log(`  median of per-round ratios: one-shot ${res.perRoundSpeedUp.oneShotOverOneWorker.toFixed(3)} over 1 worker; filler ${res.perRoundSpeedUp.fillerOverOneWorker.toFixed(3)} over 1 worker, ${res.perRoundSpeedUp.fillerOverOneThread.toFixed(3)} over one thread`);
console.log(`identical to the one-thread draws: ${same}`);
console.log(res.selfCheck.line);
console.log(`# load average at end: ${res.load.end}`);
if (JSON_OUT) writeFileSync(JSON_OUT, JSON.stringify(res, null, 2) + '\n');

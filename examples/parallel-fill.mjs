// Filling a large array on all cores, reproducibly (scenario and figures INVENTED:
// ride speeds of a bike-share fleet simulation).
// Run (from the package root, after npm run build in a checkout): node examples/parallel-fill.mjs
import { createParallelFiller, fillParallel } from 'exactdraw/node';
import { partitionedFill } from 'exactdraw';
import { samplers } from './ci-suite.mjs';

const n = 4_000_000;
const spec = { module: 'examples/ci-suite.mjs', name: 'ride speed (fast path)' };
const entry = samplers.find((e) => e.name === spec.name);

// One call: starts 2 worker threads, fills, stops them.
// A SharedArrayBuffer-backed array is filled in place (a plain one costs one extra copy).
const out = new Float64Array(new SharedArrayBuffer(8 * n));
let t = performance.now();
await fillParallel(spec, out, { workers: 2, seed: 2026 });
const tOnce = performance.now() - t;

// The same draws in one thread: part k of 2 from substream(2026, k).
t = performance.now();
const seq = partitionedFill(entry.create, new Float64Array(n), 2, 2026);
const tSeq = performance.now() - t;
let same = true;
for (let i = 0; i < n; i++) if (out[i] !== seq[i]) { same = false; break; }

// Replicates: a pool started once, one fill per replicate seed.
const filler = await createParallelFiller(spec, { workers: 2 });
t = performance.now();
let mean = 0;
for (let rep = 0; rep < 5; rep++) {
  await filler.fill(out, { seed: 1000 + rep });
  let m = 0;
  for (let i = 0; i < n; i++) m += out[i];
  mean += m / n / 5;
}
const tPool = (performance.now() - t) / 5;
await filler.close();

console.log(`fillParallel (2 workers, start-up included): ${tOnce.toFixed(0)} ms; partitionedFill in one thread: ${tSeq.toFixed(0)} ms; identical: ${same}`);
console.log(`pool of 2 workers: ${tPool.toFixed(0)} ms per fill (plus the mean over the fill); mean ride speed over 5 replicates ${mean.toFixed(3)} km/h`);

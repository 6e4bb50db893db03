// Filling a large array on all cores, reproducibly.
// Run: npm run build && node examples/parallel-fill.mjs
import { fillParallel } from '../dist/node/index.js';
import { partitionedFill } from '../dist/index.js';
import { samplers } from './ci-suite.mjs';

const n = 2_000_000;
const t0 = performance.now();
const par = await fillParallel({ module: 'examples/ci-suite.mjs', name: 'ride speed' }, new Float64Array(n), { workers: 2, seed: 2026 });
const t1 = performance.now();
// The same draws in one thread: part k of 2 from substream(2026, k).
const seq = partitionedFill(samplers[1].create, new Float64Array(n), 2, 2026);
const t2 = performance.now();
let same = true;
for (let i = 0; i < n; i++) if (par[i] !== seq[i]) { same = false; break; }
console.log(`fillParallel (2 workers): ${(t1 - t0).toFixed(0)} ms; partitionedFill in one thread: ${(t2 - t1).toFixed(0)} ms; identical: ${same}`);

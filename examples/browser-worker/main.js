// EXAMPLE: splits n draws into `parts` contiguous parts (partRange), fills each in a module
// worker, and checks the result against partitionedFill in this thread: equal, value for value.
import { partRange, partitionedFill } from '../../dist/index.js';
import { createSampler } from './sampler.js';

/** Fills n draws with `parts` workers; resolves to the array. */
export function parallelFill(n, parts, seed) {
  const out = new Float64Array(n);
  const jobs = [];
  for (let part = 0; part < parts; part++) {
    const [start, end] = partRange(n, parts, part);
    const worker = new Worker(new URL('./worker.js', import.meta.url), { type: 'module' });
    jobs.push(
      new Promise((resolve, reject) => {
        worker.onmessage = (event) => {
          out.set(event.data.out, start);
          worker.terminate();
          resolve();
        };
        worker.onerror = (event) => reject(new Error(`worker ${part}: ${event.message}`));
        worker.postMessage({ seed, part, length: end - start });
      }),
    );
  }
  return Promise.all(jobs).then(() => out);
}

const n = 100_000;
const parts = 4;
const seed = 2026;
const result = parallelFill(n, parts, seed).then((parallel) => {
  const single = partitionedFill((uniform, own) => createSampler(own), new Float64Array(n), parts, seed);
  let differ = 0;
  for (let i = 0; i < n; i++) if (!Object.is(parallel[i], single[i])) differ++;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += parallel[i] / n;
  document.getElementById('status').textContent =
    `${n} draws in ${parts} workers; mean ${mean.toFixed(2)} min (gamma mean 20.00); ${differ} differ from partitionedFill in one thread`;
  return { parallel, single, differ };
});
// for the browser test (test/browser/chromium.test.ts)
globalThis.exampleResult = result;

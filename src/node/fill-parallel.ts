/**
 * Parallel fills over `worker_threads` (Node only; import from `exactdraw/node`).
 *
 * @packageDocumentation
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { InvalidTargetError } from '../core/errors.js';
import { partRange } from '../random/partition.js';

/**
 * Which sampler to run in the workers: an entry of a sampler-suite module
 * (a module exporting `samplers: [{ name, create(uniform), cdf?, reference? }]`),
 * since functions cannot be sent to worker threads.
 */
export interface ParallelSamplerSpec {
  /** Path or URL of the suite module (relative paths resolve against the current directory). */
  module: string;
  /** Name of the entry in the module's `samplers`. */
  name: string;
}

/** Options of {@link fillParallel}. */
export interface FillParallelOptions {
  /** Number of worker threads (and parts). @defaultValue the machine's available parallelism */
  workers?: number;
  /** Seed; worker k draws from `substream(seed, k)`. @defaultValue 5489 */
  seed?: number;
}

/**
 * Fills `out` with draws from the sampler `spec` using `workers` threads.
 *
 * @remarks
 * Worker k fills the k-th contiguous part of `out` (see `partRange`) with a
 * fresh sampler built on `substream(seed, k)`, so the result is identical for
 * a given seed and worker count, and equal to
 * `partitionedFill(entry.create, out, workers, seed)` run in one thread.
 * If `out` is not backed by a `SharedArrayBuffer`, the draws are made into a
 * shared buffer and copied into `out` at the end.
 *
 * @param spec - module and entry name of the sampler
 * @param out - array to fill
 * @param opts - worker count and seed
 * @returns a promise of `out`
 * @throws InvalidTargetError (from `exactdraw`) for bad arguments; a worker's error rejects the promise
 */
export async function fillParallel(spec: ParallelSamplerSpec, out: Float64Array, opts: FillParallelOptions = {}): Promise<Float64Array> {
  const api = 'fillParallel';
  if (spec === null || typeof spec !== 'object' || typeof spec.module !== 'string' || typeof spec.name !== 'string') {
    throw new InvalidTargetError(`${api}: spec must be { module: string, name: string }, got ${JSON.stringify(spec)}`);
  }
  if (!(out instanceof Float64Array)) throw new InvalidTargetError(`${api}: out must be a Float64Array`);
  const workers = opts.workers ?? availableParallelism();
  if (!Number.isInteger(workers) || workers < 1 || workers > 256) throw new InvalidTargetError(`${api}: workers must be an integer in [1, 256], got ${String(workers)}`);
  const seed = opts.seed ?? 5489;
  if (!Number.isInteger(seed) || seed < 0 || seed > Number.MAX_SAFE_INTEGER) throw new InvalidTargetError(`${api}: seed must be an integer in [0, 2^53 - 1], got ${String(seed)}`);
  const shared = out.buffer instanceof SharedArrayBuffer;
  const buffer = shared ? (out.buffer as SharedArrayBuffer) : new SharedArrayBuffer(out.length * 8);
  const offset = shared ? out.byteOffset : 0;
  const url = new URL('./fill-worker.js', import.meta.url);
  const jobs: Promise<void>[] = [];
  for (let k = 0; k < workers; k++) {
    const [start, end] = partRange(out.length, workers, k);
    if (end <= start) continue;
    jobs.push(
      new Promise<void>((resolve, reject) => {
        const w = new Worker(url, { workerData: { module: spec.module, name: spec.name, seed, part: k, buffer, byteOffset: offset + start * 8, length: end - start, cwd: process.cwd() } });
        w.once('message', (m: { ok: boolean; error?: string }) => {
          if (m.ok) resolve();
          else reject(new Error(`${api}: worker ${k} failed: ${m.error ?? 'unknown error'}`));
        });
        w.once('error', reject);
        w.once('exit', (code) => {
          if (code !== 0) reject(new Error(`${api}: worker ${k} exited with code ${code}`));
        });
      }),
    );
  }
  await Promise.all(jobs);
  if (!shared) out.set(new Float64Array(buffer, 0, out.length));
  return out;
}

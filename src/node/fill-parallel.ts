/**
 * Parallel fills over `worker_threads` (Node only; import from `exactdraw/node`).
 *
 * @packageDocumentation
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
import { checkOptionKeys, showValue } from '../core/validate.js';
import { partRange } from '../random/partition.js';

/**
 * Which sampler to run in the workers: an entry of a sampler-suite module
 * (a module exporting `samplers: [{ name, create(uniform, own), cdf?, reference? }]`),
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

/** Options of {@link createParallelFiller}. */
export interface ParallelFillerOptions {
  /** Number of worker threads (and parts of every fill). @defaultValue the machine's available parallelism */
  workers?: number;
}

/** Options of one {@link ParallelFiller.fill}. */
export interface ParallelFillOptions {
  /** Seed; part k is drawn from `substream(seed, k)`. @defaultValue 5489 */
  seed?: number;
}

/**
 * A pool of worker threads that have loaded one sampler entry, for repeated
 * parallel fills (replicates of a simulation) without paying for thread
 * start-up and module loading each time. Made by {@link createParallelFiller}.
 */
export interface ParallelFiller {
  /** Number of workers, which is also the number of parts of every fill. */
  readonly workers: number;
  /**
   * Fills `out`: part k of `workers` (see `partRange`) with a fresh sampler
   * built on `substream(seed, k)`; the result equals
   * `partitionedFill(entry.create, out, workers, seed)`. One fill at a time:
   * a call while another is running rejects.
   */
  fill(out: Float64Array, opts?: ParallelFillOptions): Promise<Float64Array>;
  /** Stops the workers; later fills reject. Idle workers do not keep the process alive, so forgetting `close()` does not hang a program. */
  close(): Promise<void>;
}

interface Reply {
  ok: boolean;
  /** Id of the job replied to (0: the start-up). */
  id: number;
  error?: string;
  /** Code of a typed start-up error (unknown entry, malformed suite). */
  code?: string;
}

const API = 'fillParallel';

const SPEC_KEYS = ['module', 'name'] as const;

function checkSpec(api: string, spec: ParallelSamplerSpec): void {
  if (spec === null || typeof spec !== 'object' || typeof spec.module !== 'string' || typeof spec.name !== 'string') {
    throw new InvalidTargetError(`${api}: spec must be { module: string, name: string }, got ${JSON.stringify(spec)}`);
  }
  for (const k of Object.keys(spec)) {
    if (!(SPEC_KEYS as readonly string[]).includes(k)) throw new InvalidOptionError(`${api}: spec has an unknown key '${k}' (known: 'module', 'name')`);
  }
}

function checkWorkers(api: string, workers: unknown): number {
  const w = workers === undefined ? availableParallelism() : workers;
  if (typeof w !== 'number' || !Number.isInteger(w) || w < 1 || w > 256) throw new InvalidOptionError(`${api}: options.workers must be an integer in [1, 256], got ${showValue(w)}`);
  return w;
}

function checkSeed(api: string, seed: unknown): number {
  const s = seed === undefined ? 5489 : seed;
  if (typeof s !== 'number' || !Number.isInteger(s) || s < 0 || s > Number.MAX_SAFE_INTEGER) throw new InvalidOptionError(`${api}: options.seed must be an integer in [0, 2^53 - 1], got ${showValue(s)}`);
  return s;
}

/** The typed error of a start-up reply that carries a code (the message already names the API). */
function startupError(m: Reply): Error | undefined {
  if (m.id !== 0 || m.error === undefined) return undefined;
  if (m.code === 'INVALID_TARGET') return new InvalidTargetError(m.error);
  if (m.code === 'INVALID_OPTION') return new InvalidOptionError(m.error);
  return undefined;
}

/** One worker thread and the promise of its current job. */
class PoolWorker {
  private readonly worker: Worker;
  private pending: { id: number; resolve: () => void; reject: (e: Error) => void } | null = null;
  private dead: Error | null = null;
  private nextId = 1;

  constructor(
    private readonly api: string,
    private readonly index: number,
    spec: ParallelSamplerSpec,
  ) {
    const url = new URL('./fill-worker.js', import.meta.url);
    this.worker = new Worker(url, { workerData: { module: spec.module, name: spec.name, cwd: process.cwd(), api } });
    this.worker.on('message', (m: Reply) => {
      if (this.pending === null || m.id !== this.pending.id) return; // not the job waited for (cannot happen while fills wait for every part); ignore it
      this.settle(m.ok ? null : startupError(m) ?? new Error(`${this.api}: worker ${this.index} failed: ${m.error ?? 'unknown error'}`));
    });
    this.worker.on('error', (e: Error) => this.fail(e));
    this.worker.on('exit', (code) => this.fail(new Error(`${this.api}: worker ${this.index} exited with code ${code}`)));
  }

  /** Resolves when the worker has loaded the module and found the entry. */
  ready(): Promise<void> {
    return this.expect(0);
  }

  /** Runs one part; resolves when the part is filled. */
  run(job: { seed: number; part: number; buffer: SharedArrayBuffer; byteOffset: number; length: number }): Promise<void> {
    const id = this.nextId++;
    const p = this.expect(id);
    if (this.dead === null) this.worker.postMessage({ ...job, id });
    return p;
  }

  async terminate(): Promise<void> {
    if (this.dead === null) this.dead = new Error(`${this.api}: the filler is closed`);
    await this.worker.terminate();
  }

  private expect(id: number): Promise<void> {
    if (this.dead !== null) return Promise.reject(this.dead);
    this.worker.ref();
    return new Promise<void>((resolve, reject) => {
      this.pending = { id, resolve, reject };
    });
  }

  private settle(err: Error | null): void {
    const p = this.pending;
    this.pending = null;
    this.worker.unref();
    if (p === null) return;
    if (err === null) p.resolve();
    else p.reject(err);
  }

  private fail(e: Error): void {
    if (this.dead === null) this.dead = e;
    this.settle(this.dead);
  }
}

/**
 * Starts `workers` threads that load the sampler entry `spec`, and returns a
 * {@link ParallelFiller} for repeated fills.
 *
 * @remarks
 * Starting a worker thread and loading a module into it costs tens of
 * milliseconds (measured here: 70–100 ms for a module that imports
 * `exactdraw`; bench/parallel.mjs), which is as long as several million draws
 * of the fast path. A filler pays it once; {@link fillParallel} pays it on every
 * call. The promise resolves when every worker has loaded the module and
 * found the entry, and rejects (after stopping the workers) when one fails.
 *
 * @param spec - module and entry name of the sampler
 * @param opts - worker count
 * @returns a promise of the filler
 * @throws InvalidTargetError (from `exactdraw`) for a bad spec or `out`, and when the module has no entry of that name (the message lists the known names)
 * @throws InvalidOptionError (from `exactdraw`) for an unknown option key (a typo such as `workerz`) or a bad option value
 * @example
 * ```ts
 * const filler = await createParallelFiller({ module: './my-samplers.mjs', name: 'service time' }, { workers: 2 });
 * for (let rep = 0; rep < 100; rep++) await filler.fill(draws, { seed: 1000 + rep });
 * await filler.close();
 * ```
 */
export async function createParallelFiller(spec: ParallelSamplerSpec, opts: ParallelFillerOptions = {}): Promise<ParallelFiller> {
  return startFiller('createParallelFiller', spec, opts);
}

async function startFiller(api: string, spec: ParallelSamplerSpec, opts: ParallelFillerOptions): Promise<ParallelFiller> {
  checkSpec(api, spec);
  checkOptionKeys(api, opts, ['workers']);
  const workers = checkWorkers(api, opts.workers);
  const pool: PoolWorker[] = [];
  for (let k = 0; k < workers; k++) pool.push(new PoolWorker(api, k, spec));
  try {
    await Promise.all(pool.map((w) => w.ready()));
  } catch (e) {
    await Promise.all(pool.map((w) => w.terminate()));
    throw e;
  }
  let busy = false;
  let closed = false;
  return {
    workers,
    async fill(out: Float64Array, fillOpts: ParallelFillOptions = {}): Promise<Float64Array> {
      if (closed) throw new Error(`${api}: the filler is closed`);
      if (busy) throw new Error(`${api}: a fill is already running on this filler; await it first`);
      if (!(out instanceof Float64Array)) throw new InvalidTargetError(`${api}(...).fill: out must be a Float64Array, got ${Object.prototype.toString.call(out)}`);
      checkOptionKeys(`${api}(...).fill`, fillOpts, ['seed']);
      const seed = checkSeed(`${api}(...).fill`, fillOpts.seed);
      busy = true;
      try {
        const shared = out.buffer instanceof SharedArrayBuffer;
        const buffer = shared ? (out.buffer as SharedArrayBuffer) : new SharedArrayBuffer(out.length * 8);
        const offset = shared ? out.byteOffset : 0;
        const jobs: Promise<void>[] = [];
        for (let k = 0; k < workers; k++) {
          const [start, end] = partRange(out.length, workers, k);
          if (end > start) jobs.push(pool[k].run({ seed, part: k, buffer, byteOffset: offset + start * 8, length: end - start }));
        }
        // wait for every part, also after a failure, so that no worker is still busy with this fill when the next starts
        const settled = await Promise.allSettled(jobs);
        for (const r of settled) if (r.status === 'rejected') throw r.reason;
        if (!shared) out.set(new Float64Array(buffer, 0, out.length));
        return out;
      } finally {
        busy = false;
      }
    },
    async close(): Promise<void> {
      closed = true;
      await Promise.all(pool.map((w) => w.terminate()));
    },
  };
}

/**
 * Fills `out` with draws from the sampler `spec` using `workers` threads.
 *
 * @remarks
 * Worker k fills the k-th contiguous part of `out` (see `partRange`) with a
 * fresh sampler built on `substream(seed, k)` (its factory gets the stream
 * as `create(substream(seed, k), { seed, stream: k })`), so the result is
 * identical for a given seed and worker count, and equal to
 * `partitionedFill(entry.create, out, workers, seed)` run in one thread.
 * If `out` is not backed by a `SharedArrayBuffer`, the draws are made into a
 * shared buffer and copied into `out` at the end (one more pass over the
 * memory; a `SharedArrayBuffer`-backed `out` avoids it). Each call starts
 * and stops its threads; for repeated fills use {@link createParallelFiller}.
 *
 * @param spec - module and entry name of the sampler
 * @param out - array to fill
 * @param opts - worker count and seed
 * @returns a promise of `out`
 * @throws InvalidTargetError (from `exactdraw`) for a bad spec or `out`, and when the module has no entry of that name (the message lists the known names)
 * @throws InvalidOptionError (from `exactdraw`) for an unknown option key (a typo such as `worker`) or a bad option value; a worker's error rejects the promise
 * @example
 * ```ts
 * const draws = new Float64Array(new SharedArrayBuffer(8 * 1e8));
 * await fillParallel({ module: './my-samplers.mjs', name: 'service time' }, draws, { workers: 2, seed: 2026 });
 * ```
 */
export async function fillParallel(spec: ParallelSamplerSpec, out: Float64Array, opts: FillParallelOptions = {}): Promise<Float64Array> {
  checkSpec(API, spec);
  if (!(out instanceof Float64Array)) throw new InvalidTargetError(`${API}: out must be a Float64Array, got ${Object.prototype.toString.call(out)}`);
  checkOptionKeys(API, opts, ['workers', 'seed']);
  const workers = checkWorkers(API, opts.workers);
  const seed = checkSeed(API, opts.seed);
  const filler = await startFiller(API, spec, { workers });
  try {
    return await filler.fill(out, { seed });
  } finally {
    await filler.close();
  }
}

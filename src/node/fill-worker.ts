/**
 * Worker body of `fillParallel` and `createParallelFiller`: loads the suite
 * entry once, then for every job builds a fresh sampler on the job's
 * substream and fills its part of the shared buffer.
 *
 * @packageDocumentation
 */
import { parentPort, workerData } from 'node:worker_threads';
import { ExactDrawError } from '../core/errors.js';
import { substream } from '../random/substream.js';
import { findSuiteEntry, suiteModuleUrl, validateSuite } from './suite.js';
import type { SuiteEntry } from './suite.js';

interface Init {
  module: string;
  name: string;
  cwd: string;
  /** Public API shown in messages. */
  api: string;
}

interface Job {
  /** Id echoed in the reply. */
  id: number;
  seed: number;
  part: number;
  buffer: SharedArrayBuffer;
  byteOffset: number;
  length: number;
}

const message = (e: unknown): string => (e instanceof Error ? e.message : String(e));

async function load(init: Init): Promise<SuiteEntry> {
  const mod = (await import(suiteModuleUrl(init.module, init.cwd))) as { samplers?: unknown; default?: unknown };
  const value = mod.samplers ?? (Array.isArray(mod.default) ? mod.default : (mod.default as { samplers?: unknown } | undefined)?.samplers);
  const entries = validateSuite(init.module, value, init.api);
  return findSuiteEntry(entries, init.name, init.module, init.api);
}

load(workerData as Init).then(
  (entry) => {
    parentPort?.on('message', (job: Job) => {
      try {
        const view = new Float64Array(job.buffer, job.byteOffset, job.length);
        entry.create(substream(job.seed, job.part), { seed: job.seed, stream: job.part }).fill(view);
        parentPort?.postMessage({ ok: true, id: job.id });
      } catch (e) {
        parentPort?.postMessage({ ok: false, id: job.id, error: message(e) });
      }
    });
    parentPort?.postMessage({ ok: true, id: 0 });
  },
  (e: unknown) => parentPort?.postMessage({ ok: false, id: 0, error: message(e), code: e instanceof ExactDrawError ? e.code : undefined }),
);

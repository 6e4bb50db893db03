/**
 * Worker body of `fillParallel` and `createParallelFiller`: loads the suite
 * entry once, then for every job builds a fresh sampler on the job's
 * substream and fills its part of the shared buffer.
 *
 * @packageDocumentation
 */
import { parentPort, workerData } from 'node:worker_threads';
import { pathToFileURL } from 'node:url';
import { isAbsolute, resolve } from 'node:path';
import { substream } from '../random/substream.js';
import { validateSuite } from '../cli/suite.js';
import type { SuiteEntry } from '../cli/suite.js';

interface Init {
  module: string;
  name: string;
  cwd: string;
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
  const spec = /^[a-z]+:/i.test(init.module) ? init.module : pathToFileURL(isAbsolute(init.module) ? init.module : resolve(init.cwd, init.module)).href;
  const mod = (await import(spec)) as { samplers?: unknown; default?: unknown };
  const entries = validateSuite(init.module, mod.samplers ?? mod.default);
  const entry = entries.find((e) => e.name === init.name);
  if (entry === undefined) throw new Error(`no sampler named '${init.name}' in ${init.module} (have: ${entries.map((e) => e.name).join(', ')})`);
  return entry;
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
  (e: unknown) => parentPort?.postMessage({ ok: false, id: 0, error: message(e) }),
);

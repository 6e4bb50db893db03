/**
 * Worker body of {@link fillParallel}: builds the sampler on its substream and
 * fills its part of the shared buffer.
 *
 * @packageDocumentation
 */
import { parentPort, workerData } from 'node:worker_threads';
import { pathToFileURL } from 'node:url';
import { isAbsolute, resolve } from 'node:path';
import { substream } from '../random/substream.js';
import { validateSuite } from '../cli/suite.js';

interface Job {
  module: string;
  name: string;
  seed: number;
  part: number;
  buffer: SharedArrayBuffer;
  byteOffset: number;
  length: number;
  cwd: string;
}

async function run(job: Job): Promise<void> {
  const spec = /^[a-z]+:/i.test(job.module) ? job.module : pathToFileURL(isAbsolute(job.module) ? job.module : resolve(job.cwd, job.module)).href;
  const mod = (await import(spec)) as { samplers?: unknown; default?: unknown };
  const entries = validateSuite(job.module, mod.samplers ?? mod.default);
  const entry = entries.find((e) => e.name === job.name);
  if (entry === undefined) throw new Error(`no sampler named '${job.name}' in ${job.module} (have: ${entries.map((e) => e.name).join(', ')})`);
  const view = new Float64Array(job.buffer, job.byteOffset, job.length);
  entry.create(substream(job.seed, job.part)).fill(view);
}

run(workerData as Job).then(
  () => parentPort?.postMessage({ ok: true }),
  (e: unknown) => parentPort?.postMessage({ ok: false, error: e instanceof Error ? e.message : String(e) }),
);

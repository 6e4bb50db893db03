/**
 * Node-only entry `exactdraw/node`: parallel fills over worker threads and the
 * sampler-suite module format shared with the `exactdraw` command.
 *
 * @packageDocumentation
 */
export { fillParallel, createParallelFiller } from './fill-parallel.js';
export type { ParallelSamplerSpec, FillParallelOptions, ParallelFiller, ParallelFillerOptions, ParallelFillOptions } from './fill-parallel.js';
export { loadSuite, validateSuite, suiteModuleUrl, findSuiteEntry } from './suite.js';
export type { SuiteEntry } from './suite.js';

/**
 * The sampler-suite module format read by `exactdraw bench`, `exactdraw check`
 * and `fillParallel`.
 *
 * A suite module is an ES module (or CommonJS module) that exports
 * `samplers`, an array of {@link SuiteEntry} (a default export of the same
 * array also works):
 *
 * ```js
 * // my-samplers.mjs
 * import { rejectionSampler, tableSampler, normalTarget, cauchyProposal } from 'exactdraw';
 * export const samplers = [
 *   {
 *     name: 'service time',                       // unique, shown in reports
 *     create: (uniform) => rejectionSampler(normalTarget(0, 1), { proposal: cauchyProposal(0, 1), uniform }),
 *     cdf: (x) => normalTarget(0, 1).cdf(x),      // optional: enables `check`
 *     reference: 'normal (stdlib ziggurat)',     // optional: a peer name for ratios
 *   },
 *   {
 *     name: 'service time (fast path)',
 *     // the second argument names the same stream: { seed, stream }
 *     create: (uniform, own) => tableSampler(normalTarget(0, 1), { ...own }),
 *   },
 * ];
 * ```
 *
 * `create(uniform, own)` receives the stream as a uniform source and as
 * `own = { seed, stream }` (the `substream` that `uniform` is): a factory
 * uses one of them. Both give the same draws.
 *
 * @packageDocumentation
 */
import { pathToFileURL } from 'node:url';
import { resolve as resolvePath } from 'node:path';
import { InvalidTargetError } from '../core/errors.js';
import type { OwnedStream, Sampler, Uniform } from '../core/types.js';

/** One sampler of a suite module. */
export interface SuiteEntry {
  /** Unique name shown in reports and used by `--baseline` matching. */
  name: string;
  /**
   * Builds a fresh sampler that draws from the given stream only: either by
   * calling `uniform`, or by passing `own` (`{ seed, stream }`, the same
   * substream) as sampler options so that the sampler owns it — same draws;
   * the table-driven fast path is faster on a stream it owns.
   */
  create(uniform: Uniform, own: OwnedStream): Sampler;
  /** Optional normalized cdf of the target; entries with one are checked by `exactdraw check`. */
  cdf?(x: number): number;
  /** Optional name of a peer (built-in or another entry) to report a time ratio against. */
  reference?: string;
}

/**
 * Validates the entries of a suite (the `samplers` export of a suite module) and returns them.
 *
 * @param source - name of the module, for the messages
 * @param value - the exported array
 * @returns the entries
 * @throws `InvalidTargetError` (from exactdraw) naming the entry and field at fault
 * @example
 * ```ts
 * const entries = validateSuite('inline suite', [
 *   { name: 'ride speed', create: (uniform) => tableSampler(normalTarget(15, 3.5), { uniform }) },
 * ]);
 * ```
 */
export function validateSuite(source: string, value: unknown): SuiteEntry[] {
  if (!Array.isArray(value)) {
    throw new InvalidTargetError(`exactdraw: ${source} must export 'samplers' (or a default export): an array of { name, create(uniform, own), cdf?, reference? }`);
  }
  const seen = new Set<string>();
  value.forEach((e: unknown, i) => {
    const entry = e as Partial<SuiteEntry> | null;
    if (entry === null || typeof entry !== 'object') throw new InvalidTargetError(`exactdraw: ${source} samplers[${i}] must be an object`);
    if (typeof entry.name !== 'string' || entry.name.length === 0) throw new InvalidTargetError(`exactdraw: ${source} samplers[${i}].name must be a non-empty string`);
    if (seen.has(entry.name)) throw new InvalidTargetError(`exactdraw: ${source} has two samplers named '${entry.name}'`);
    seen.add(entry.name);
    if (typeof entry.create !== 'function') throw new InvalidTargetError(`exactdraw: ${source} samplers[${i}].create must be a function (uniform) => Sampler`);
    if (entry.cdf !== undefined && typeof entry.cdf !== 'function') throw new InvalidTargetError(`exactdraw: ${source} samplers[${i}].cdf must be a function when given`);
    if (entry.reference !== undefined && typeof entry.reference !== 'string') throw new InvalidTargetError(`exactdraw: ${source} samplers[${i}].reference must be a string when given`);
  });
  return value as SuiteEntry[];
}

/**
 * Imports a suite module from a path or URL and validates it.
 *
 * @param spec - a file path (relative to the working directory) or a URL
 * @returns the validated entries
 * @throws `InvalidTargetError` (from exactdraw) when the module exports no valid suite
 * @example
 * ```ts
 * const entries = await loadSuite('./my-samplers.mjs');
 * const s = entries[0].create(substream(1, 0), { seed: 1, stream: 0 });
 * ```
 */
export async function loadSuite(spec: string): Promise<SuiteEntry[]> {
  const url = /^[a-z]+:/i.test(spec) ? spec : pathToFileURL(resolvePath(spec)).href;
  const mod = (await import(url)) as { samplers?: unknown; default?: unknown };
  const value = mod.samplers ?? (Array.isArray(mod.default) ? mod.default : (mod.default as { samplers?: unknown } | undefined)?.samplers);
  return validateSuite(spec, value);
}

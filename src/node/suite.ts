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
 * Module paths: a relative path is resolved against the current working
 * directory (`process.cwd()`), never against the file that names it; a
 * `file:` (or other) URL is used as is.
 *
 * `create(uniform, own)` receives the stream as a uniform source and as
 * `own = { seed, stream }` (the `substream` that `uniform` is): a factory
 * uses one of them. Both give the same draws.
 *
 * @packageDocumentation
 */
import { pathToFileURL } from 'node:url';
import { isAbsolute, resolve as resolvePath } from 'node:path';
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
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

/** The keys a suite entry may have. */
const ENTRY_KEYS: readonly string[] = ['name', 'create', 'cdf', 'reference'];

const quoted = (names: readonly string[]): string => names.map((n) => `'${n}'`).join(', ');

/**
 * Validates the entries of a suite and returns them.
 *
 * @param source - the module's path or URL, shown in messages
 * @param value - the module's `samplers` export
 * @param api - the public API shown in messages
 * @returns the entries
 * @throws InvalidTargetError (from `exactdraw`) when `value` is not an array of entries, an entry lacks a name or `create`, or two entries share a name
 * @throws InvalidOptionError (from `exactdraw`) when an entry has a key other than `name`, `create`, `cdf`, `reference` (a typo such as `cfd`)
 * @example
 * ```ts
 * import { validateSuite } from 'exactdraw/node';
 * import { normalTarget, tableSampler } from 'exactdraw';
 * const entries = validateSuite('inline', [{ name: 'n', create: (u) => tableSampler(normalTarget(0, 1), { uniform: u }) }]);
 * ```
 */
export function validateSuite(source: string, value: unknown, api = 'validateSuite'): SuiteEntry[] {
  if (!Array.isArray(value)) {
    throw new InvalidTargetError(`${api}: ${source} must export 'samplers' (or a default export): an array of { name, create(uniform, own), cdf?, reference? }, got ${value === null ? 'null' : typeof value}`);
  }
  const seen = new Set<string>();
  value.forEach((e: unknown, i) => {
    const entry = e as Partial<SuiteEntry> | null;
    if (entry === null || typeof entry !== 'object') throw new InvalidTargetError(`${api}: ${source} samplers[${i}] must be an object, got ${entry === null ? 'null' : typeof entry}`);
    for (const k of Object.keys(entry)) {
      if (!ENTRY_KEYS.includes(k)) throw new InvalidOptionError(`${api}: ${source} samplers[${i}] has an unknown key '${k}' (known: ${quoted(ENTRY_KEYS)})`);
    }
    if (typeof entry.name !== 'string' || entry.name.length === 0) throw new InvalidTargetError(`${api}: ${source} samplers[${i}].name must be a non-empty string`);
    if (seen.has(entry.name)) throw new InvalidTargetError(`${api}: ${source} has two samplers named '${entry.name}'`);
    seen.add(entry.name);
    if (typeof entry.create !== 'function') throw new InvalidTargetError(`${api}: ${source} samplers[${i}].create ('${entry.name}') must be a function (uniform, own) => Sampler`);
    if (entry.cdf !== undefined && typeof entry.cdf !== 'function') throw new InvalidTargetError(`${api}: ${source} samplers[${i}].cdf ('${entry.name}') must be a function when given`);
    if (entry.reference !== undefined && typeof entry.reference !== 'string') throw new InvalidTargetError(`${api}: ${source} samplers[${i}].reference ('${entry.name}') must be a string when given`);
  });
  return value as SuiteEntry[];
}

/**
 * The URL a suite module path stands for: URLs (`file:`, `data:`, …) as
 * given, paths resolved against `cwd` (default: the current working directory).
 *
 * @example
 * ```ts
 * import { suiteModuleUrl } from 'exactdraw/node';
 * suiteModuleUrl('ci/samplers.mjs'); // 'file:///…/ci/samplers.mjs' under process.cwd()
 * ```
 */
export function suiteModuleUrl(spec: string, cwd: string = process.cwd()): string {
  if (/^[a-z][a-z0-9+.-]+:/i.test(spec)) return spec;
  return pathToFileURL(isAbsolute(spec) ? spec : resolvePath(cwd, spec)).href;
}

/**
 * Imports a suite module and validates it.
 *
 * @param spec - path (relative paths resolve against the current working directory) or URL of the module
 * @param api - the public API shown in messages
 * @returns the entries
 * @throws InvalidTargetError / InvalidOptionError as {@link validateSuite}; the import's own error when the module cannot be loaded
 * @example
 * ```ts
 * import { loadSuite } from 'exactdraw/node';
 * const entries = await loadSuite('examples/ci-suite.mjs');
 * console.log(entries.map((e) => e.name));
 * ```
 */
export async function loadSuite(spec: string, api = 'loadSuite'): Promise<SuiteEntry[]> {
  if (typeof spec !== 'string' || spec.length === 0) throw new InvalidTargetError(`${api}: the module must be a non-empty path or URL string, got ${typeof spec === 'string' ? "''" : String(spec)}`);
  const mod = (await import(suiteModuleUrl(spec))) as { samplers?: unknown; default?: unknown };
  const value = mod.samplers ?? (Array.isArray(mod.default) ? mod.default : (mod.default as { samplers?: unknown } | undefined)?.samplers);
  return validateSuite(spec, value, api);
}

/**
 * Finds the entry named `name` in `entries`.
 *
 * @throws InvalidTargetError (from `exactdraw`) naming the known entries when there is none
 * @example
 * ```ts
 * import { findSuiteEntry, loadSuite } from 'exactdraw/node';
 * const entry = findSuiteEntry(await loadSuite('examples/ci-suite.mjs'), 'ride speed', 'examples/ci-suite.mjs');
 * ```
 */
export function findSuiteEntry(entries: readonly SuiteEntry[], name: string, source: string, api = 'findSuiteEntry'): SuiteEntry {
  const entry = entries.find((e) => e.name === name);
  if (entry === undefined) {
    throw new InvalidTargetError(`${api}: no sampler named '${name}' in ${source} (known: ${quoted(entries.map((e) => e.name))})`);
  }
  return entry;
}

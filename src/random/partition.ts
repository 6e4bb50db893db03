/**
 * Partitioned fills: the substream scheme that makes parallel and distributed
 * runs reproducible.
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import type { OwnedStream, Sampler, Uniform } from '../core/types.js';
import { substream } from './substream.js';
import { showValue } from '../core/validate.js';

/**
 * Index range `[start, end)` of part `part` when `length` draws are split into
 * `parts` contiguous parts: `start = floor(part·length/parts)`.
 *
 * @param length - total number of draws
 * @param parts - number of parts (workers, processes, machines)
 * @param part - index of the part, 0-based
 * @returns `[start, end)`
 * @example
 * ```ts
 * partRange(10, 3, 0); // [0, 3]
 * partRange(10, 3, 2); // [6, 10]
 * ```
 */
export function partRange(length: number, parts: number, part: number): [number, number] {
  return [Math.floor((part * length) / parts), Math.floor(((part + 1) * length) / parts)];
}

/**
 * Fills `out` in `parts` contiguous parts, part k drawn by a fresh sampler
 * `create(substream(seed, k), { seed, stream: k })`. This is, by definition, the result that
 * `fillParallel` from `exactdraw/node` returns for the same seed and worker
 * count, so a parallel run can be checked or replayed in one thread.
 *
 * @remarks
 * The same scheme partitions work across processes or machines in any job
 * engine: job k of K computes `partRange(n, K, k)`, builds its sampler on
 * `substream(seed, k)` and fills its range; concatenating the parts in order
 * gives the same array as a single `partitionedFill(create, out, K, seed)`.
 * The result depends on (seed, parts), not on scheduling.
 *
 * The factory gets the stream twice: as a uniform source to call, and as
 * {@link OwnedStream} `{ seed, stream }` to pass as sampler options
 * (`tableSampler(t, { ...own })`), which makes the sampler own the same
 * substream and lets the fast path read it in blocks (same draws, faster).
 *
 * @param create - builds a sampler from a uniform source (or from the stream it names)
 * @param out - array to fill
 * @param parts - number of parts (integer ≥ 1)
 * @param seed - integer seed in [0, 2^53 − 1]
 * @returns `out`
 * @throws {@link InvalidTargetError} for bad arguments
 * @example
 * ```ts
 * const out = partitionedFill((uniform, own) => tableSampler(normalTarget(0, 1), { ...own }), new Float64Array(1e6), 4, 2026);
 * // the same array as fillParallel with 4 workers and seed 2026, or as 4 jobs each filling partRange(1e6, 4, k)
 * ```
 */
export function partitionedFill(create: (uniform: Uniform, own: OwnedStream) => Sampler, out: Float64Array, parts: number, seed: number): Float64Array {
  if (typeof create !== 'function') throw new InvalidTargetError(`partitionedFill: create must be a function (uniform) => Sampler, got ${typeof create}`);
  if (!(out instanceof Float64Array)) throw new InvalidTargetError(`partitionedFill: out must be a Float64Array, got ${Object.prototype.toString.call(out)}`);
  if (!Number.isInteger(parts) || parts < 1) throw new InvalidTargetError(`partitionedFill: parts must be an integer >= 1, got ${showValue(parts)}`);
  if (typeof seed !== 'number' || !Number.isInteger(seed) || seed < 0 || seed > Number.MAX_SAFE_INTEGER) throw new InvalidTargetError(`partitionedFill: seed must be an integer in [0, 2^53 - 1], got ${showValue(seed)}`);
  for (let k = 0; k < parts; k++) {
    const [a, b] = partRange(out.length, parts, k);
    if (b > a) create(substream(seed, k), { seed, stream: k }).fill(out.subarray(a, b));
  }
  return out;
}

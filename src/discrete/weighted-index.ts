/**
 * `weightedIndexSampler`: O(1) draws of an index from a finite list of
 * non-negative weights.
 *
 * @packageDocumentation
 */
import { Counters } from '../core/counters.js';
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
import type { SamplerOptions, SamplerStats } from '../core/types.js';
import { checkOptionKeys } from '../core/validate.js';
import { resolveUniform } from '../random/resolve.js';
import { TABLE_UNITS, aliasProbabilities, buildAlias, buildGuide, guideProbabilities, quantizeWeights } from './_internals/tables.js';
import type { DiscreteSampler } from './types.js';
import { checkDiscreteFillArray } from './validate.js';

/** Options of {@link weightedIndexSampler}. */
export interface WeightedIndexOptions extends SamplerOptions {
  /**
   * `'alias'`: Walker's alias table (Walker 1977; Vose 1991), one uniform and
   * O(1) work per draw. `'inversion'`: a guide table (Chen & Asau 1974) over
   * the cumulative weights, one uniform per draw, O(1) expected work, and
   * the drawn index is a non-decreasing function of the uniform (for
   * common random numbers and antithetic pairs).
   * @defaultValue `'alias'`
   */
  method?: 'alias' | 'inversion';
}

/** A sampler built by {@link weightedIndexSampler}. */
export interface WeightedIndexSampler extends DiscreteSampler {
  /** The method in use. */
  readonly method: 'alias' | 'inversion';
  /**
   * The probability of each index implied by the table itself (read back
   * from the thresholds and aliases, or from the cumulative units): each a
   * multiple of 2^-52, summing to 1.
   */
  probabilities(): Float64Array;
}

const KNOWN = ['seed', 'stream', 'uniform', 'method'] as const;

/**
 * Draws indices 0..n−1 with probabilities proportional to `weights`.
 *
 * @remarks
 * How floating-point rounding is handled: the weights are quantized once to
 * integer units of 2^-52 that sum to exactly 1 (largest-remainder rounding,
 * so each unit count is within 1 of its exact share; a zero weight never
 * gets a unit, and a positive weight below about 2^-53 of the total may get
 * none either), and the
 * table is then built in exact integer arithmetic. With the default
 * MT19937 source (uniforms on a 2^-53 grid), index i is drawn with
 * probability exactly `probabilities()[i]`, which differs from
 * w_i / Σw by less than 2^-52 + 3·2^-53·w_i/Σw. Setup is O(n log n) (a sort
 * of the remainders), draws are O(1).
 *
 * @param weights - non-negative finite weights (at least one positive), at most 2^24 of them
 * @param options - method and uniform source
 * @returns the sampler; its draws are integers in [0, n − 1]
 * @throws {@link InvalidTargetError} for an empty array, a negative, NaN or infinite weight, or all weights 0
 * @throws {@link InvalidOptionError} for an unknown method
 * @example
 * ```ts
 * import { weightedIndexSampler } from 'exactdraw';
 * const s = weightedIndexSampler(new Float64Array([1, 0, 3]), { seed: 4 });
 * s.sample(); // 0 or 2, 2 three times as often
 * s.probabilities(); // Float64Array [0.25, 0, 0.75]
 * ```
 */
export function weightedIndexSampler(weights: ArrayLike<number>, options?: WeightedIndexOptions): WeightedIndexSampler {
  const api = 'weightedIndexSampler';
  checkOptionKeys(api, options, KNOWN);
  const method = options?.method ?? 'alias';
  if (method !== 'alias' && method !== 'inversion') {
    throw new InvalidOptionError(`${api}: options.method must be 'alias' or 'inversion', got ${typeof method === 'string' ? `'${method}'` : String(method)}`);
  }
  if (weights === null || typeof weights !== 'object' || typeof weights.length !== 'number') {
    throw new InvalidTargetError(`${api}: weights must be an array of numbers, got ${weights === null ? 'null' : typeof weights}`);
  }
  const units = quantizeWeights(api, weights, (i) => `weights[${i}]`);
  const u = resolveUniform(api, options);
  const counters = new Counters();
  const n = units.length;
  if (method === 'alias') {
    const t = buildAlias(units);
    const K = t.cells;
    const C = t.cellUnits;
    const P = t.threshold;
    const A = t.alias;
    const draw = (): number => {
      const x = u() * K;
      const j = Math.floor(x);
      return (x - j) * C < P[j] ? j : A[j];
    };
    return {
      method,
      sample(): number {
        const i = draw();
        counters.samples++;
        counters.proposals++;
        return i;
      },
      fill<T extends Float64Array | Int32Array>(out: T): T {
        checkDiscreteFillArray(api, out);
        const len = out.length;
        for (let k = 0; k < len; k++) {
          const x = u() * K;
          const j = Math.floor(x);
          out[k] = (x - j) * C < P[j] ? j : A[j];
        }
        counters.samples += len;
        counters.proposals += len;
        return out;
      },
      get stats(): SamplerStats {
        return counters.snapshot();
      },
      probabilities: () => aliasProbabilities(t, n),
    };
  }
  const g = buildGuide(units);
  const cum = g.cum;
  const guide = g.guide;
  const B = g.buckets;
  const last = n - 1;
  const invert = (v: number): number => {
    const x = v * TABLE_UNITS;
    let i = guide[Math.min(B - 1, Math.floor(v * B))];
    while (i > 0 && cum[i - 1] > x) i--;
    while (i < last && cum[i] <= x) i++;
    return i;
  };
  return {
    method,
    sample(): number {
      const i = invert(u());
      counters.samples++;
      counters.proposals++;
      return i;
    },
    fill<T extends Float64Array | Int32Array>(out: T): T {
      checkDiscreteFillArray(api, out);
      const len = out.length;
      for (let k = 0; k < len; k++) {
        const v = u();
        const x = v * TABLE_UNITS;
        let i = guide[Math.min(B - 1, Math.floor(v * B))];
        while (i > 0 && cum[i - 1] > x) i--;
        while (i < last && cum[i] <= x) i++;
        out[k] = i;
      }
      counters.samples += len;
      counters.proposals += len;
      return out;
    },
    get stats(): SamplerStats {
      return counters.snapshot();
    },
    probabilities: () => guideProbabilities(g),
  };
}


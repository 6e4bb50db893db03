/**
 * The table-driven fast path: a strip table built once from the hull of a
 * fixed T-concave target.
 *
 * @packageDocumentation
 */
import { InvalidTargetError, StalledSamplerError } from '../core/errors.js';
import type { SamplerOptions, SamplerStats, Target, Uniform } from '../core/types.js';
import type { Counters } from '../core/counters.js';
import type { AliasCells } from './table/alias.js';
import type { StripTable } from './table/build.js';
import { checkInteger, checkFillArray } from '../core/validate.js';
import type { AdaptiveRejectionSampler } from './adaptive-rejection.js';
import type { EnvelopeDescription } from './hull/describe.js';
import { setupHull } from './hull/setup.js';
import type { HullSetup } from './hull/setup.js';
import type { TransformName } from './hull/transforms.js';
import { buildAliasCells } from './table/alias.js';
import { buildStripTable } from './table/build.js';
import { describeTable, describeTableEnvelope } from './table/describe.js';
import type { TableDescription } from './table/describe.js';
import { tableFill } from './table/kernel.js';
import { UniformBlock } from '../random/uniform-block.js';
import type { MersenneTwister } from '../random/mersenne-twister.js';
import type { TableState } from './table/kernel.js';

/**
 * Default of {@link TableSamplerOptions.strips}.
 *
 * @remarks
 * With n strips (three quarters placed at equal mass of √f), the caps — the
 * part of the table that needs a second uniform — take about 7/n of the
 * area of a standard normal: 1.4 % at 500 strips; the target is evaluated at
 * a far smaller fraction of draws (about 8e-5 per draw for the normal, 8e-4
 * for gamma(2.5); see the fast-path count tests), since the caps have their
 * own chord squeeze and upper lines. 500 strips give at most 1,002 regions,
 * so the alias table has 1,024 cells of 40 bytes (40 KB, about a core's L1
 * data cache). More strips lower the cap share (1,000: 0.7 %) at no
 * measurable change of the time per draw up to a few thousand strips, but
 * setup costs about one logDensity call and a few microseconds of
 * unoptimized code per strip (measured: bench/fast-path.mjs).
 */
export const DEFAULT_TABLE_STRIPS = 500;

/** Largest accepted {@link TableSamplerOptions.strips}. */
export const MAX_TABLE_STRIPS = 1 << 20;

/**
 * Default of {@link TableSamplerOptions.tailMass}: the body of the table
 * covers the target's mass but about 1e-6 on each side (estimated from a
 * coarse look at the target); draws beyond it come from the exact tails,
 * which evaluate the target.
 */
export const DEFAULT_TABLE_TAIL_MASS = 1e-6;

/** Options of {@link tableSampler}. */
export interface TableSamplerOptions extends SamplerOptions {
  /**
   * Start points of the hull the table is planned from (see
   * {@link AdaptiveRejectionOptions.startPoints}).
   */
  startPoints?: readonly number[];
  /**
   * Build the planning hull from secants even when the target has
   * `dLogDensity` (the table itself never uses derivatives).
   * @defaultValue false
   */
  derivativeFree?: boolean;
  /**
   * The transform T under which the target is concave: `'log'` (log-concave
   * targets) or `'inverse-sqrt'` (T(f) = −1/√f, Hörmann 1995: heavier tails
   * such as Student-t with df ≥ 1). It decides the shape assumption behind
   * every bound of the table and the form of the tails.
   * @defaultValue 'log'
   */
  transform?: TransformName;
  /**
   * Consecutive rejections before {@link StalledSamplerError}.
   * @defaultValue 1,000,000
   */
  maxRejections?: number;
  /**
   * Number of strips of the body (an integer in [2, 2^20]); fewer may be
   * used when the target's scale is close to the resolution of doubles.
   * @defaultValue {@link DEFAULT_TABLE_STRIPS} (500)
   */
  strips?: number;
  /**
   * Target mass left to each exact tail (a number in (0, 0.01]).
   * @defaultValue {@link DEFAULT_TABLE_TAIL_MASS} (1e-6)
   */
  tailMass?: number;
}

/** A table-driven sampler; `envelope` describes the table as pieces (constant on strips), `table` the strips themselves. */
export interface TableSampler extends AdaptiveRejectionSampler {
  /** Snapshot of the strip table; fresh arrays on every access. */
  readonly table: TableDescription;
}

const KNOWN = ['startPoints', 'derivativeFree', 'transform', 'maxRejections', 'strips', 'tailMass', 'seed', 'stream', 'uniform'] as const;

/**
 * A table-driven exact sampler for a fixed T-concave target: after setup, a
 * draw costs one uniform and a table lookup, and the target is almost never
 * evaluated. The fast path of the hull engine (also reachable as
 * `adaptiveRejectionSampler(target, { fast: true })`).
 *
 * @remarks
 * Setup builds the hull of {@link adaptiveRejectionSampler}, plans a table of
 * `strips` vertical strips over the body of the target (the strip idea of the
 * ziggurat, Marsaglia & Tsang 2000), evaluates the target at the strip
 * boundaries and derives each strip's envelope and squeeze from T-concavity
 * alone; regions are selected through an alias table (Walker 1977; Vose 1991).
 * The boundary values are checked for T-concavity ({@link ShapeViolationError}
 * names the interval). Most draws take one uniform and no evaluation; the
 * evaluations that do happen are checked like the hull's, and after a thrown
 * error every later call throws it again. How a draw is made from one
 * uniform: DEVELOPERS.md, "Method internals".
 *
 * Stream: each candidate consumes one uniform, plus one more in a cap or a
 * tail. The table never adapts, so draws do not depend on how they are split
 * between `sample()` and `fill()`. With `seed` (or `stream`) the sampler owns
 * its MT19937 and reads it in blocks (same values as one at a time, faster);
 * an injected `uniform` is called once per value, in order.
 * `stats.setupEvaluations` counts the hull's setup, the placement (about 100)
 * and the strip boundaries (`strips + 1`); `stats.densityEvaluations` the
 * evaluations while drawing. Since 0.1.0.
 *
 * When to use it: for many draws from one target (simulation, fills of
 * large arrays). For a target that changes every few draws (Gibbs full
 * conditionals) {@link adaptiveRejectionSampler} is cheaper: its setup is a
 * handful of evaluations.
 *
 * @param target - a T-concave target (log-concave for `transform: 'log'`)
 * @param options - hull options, `strips`, `tailMass`, uniform source
 * @returns the sampler, with `envelope` and `table` descriptions
 * @throws {@link InvalidTargetError} for a malformed target or bad options
 * @throws {@link ShapeViolationError} when setup (or a later evaluation) proves the target not T-concave
 * @throws {@link ImproperDensityError} when a tail does not decay
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity
 * @throws {@link EnvelopeViolationError} at draw time, when the target is found above an envelope or below a squeeze without a shape explanation
 * @throws {@link StalledSamplerError} after `maxRejections` consecutive rejections
 * @example
 * ```ts
 * const s = tableSampler(normalTarget(0, 1), { seed: 1 });
 * const xs = s.fill(new Float64Array(1_000_000));
 * s.stats.densityEvaluations / s.stats.samples; // about 1e-4 (target evaluations are rare)
 * ```
 */
export function tableSampler(target: Target, options?: TableSamplerOptions): TableSampler {
  const api = 'tableSampler';
  const setup = setupHull(api, target, options, KNOWN);
  return createTableSampler(api, setup, options);
}

/**
 * Builds the table sampler from a hull after setup; `options` supplies
 * `strips` and `tailMass` (defaults when undefined).
 * @internal
 */
export function createTableSampler(api: string, setup: HullSetup, options: TableSamplerOptions | undefined): TableSampler {
  const strips = options?.strips === undefined ? DEFAULT_TABLE_STRIPS : checkInteger(api, 'options.strips', options.strips, 2, MAX_TABLE_STRIPS);
  const tailMass = options?.tailMass ?? DEFAULT_TABLE_TAIL_MASS;
  if (typeof tailMass !== 'number' || !(tailMass > 0 && tailMass <= 0.01)) {
    throw new InvalidTargetError(`${api}: options.tailMass must be a number in (0, 0.01], got ${String(tailMass)}`);
  }
  const { hull, counters, uniform, maxRejections } = setup;
  const logDensity = setup.target.logDensity;
  const table = buildStripTable({ api, hull, logDensity, counters, strips, tailMass });
  const cells = buildAliasCells(table);
  const draws = tableDraws(api, table, cells, logDensity, counters, uniform, setup.ownsUniform, maxRejections);
  const derivativeEvaluations = hull.derivativeEvaluations;
  return {
    sample: draws.sample,
    fill: draws.fill,
    get stats(): SamplerStats {
      return counters.snapshot();
    },
    get envelope(): EnvelopeDescription {
      return describeTableEnvelope(table, derivativeEvaluations);
    },
    get table(): TableDescription {
      return describeTable(table, cells);
    },
  };
}

/**
 * `sample` and `fill` of a table (either builder): the sampler's own MT19937
 * (from `seed`) is read in blocks, an injected uniform one value at a time;
 * an error other than a stall or a bad uniform value is kept and thrown by
 * every later call.
 * @internal
 */
export function tableDraws(
  api: string,
  table: StripTable,
  cells: AliasCells,
  logDensity: (x: number) => number,
  counters: Counters,
  uniform: Uniform,
  ownsUniform: boolean,
  maxRejections: number,
): { sample(): number; fill(out: Float64Array): Float64Array } {
  const blk = ownsUniform ? UniformBlock.fromOwnedMersenneTwister(uniform as MersenneTwister) : UniformBlock.fromUniform(uniform);
  const st: TableState = { table, cells, logDensity, accepted: false };
  let failure: unknown;
  const scratch = new Float64Array(1);
  const run = (out: Float64Array, n: number): void => {
    if (failure !== undefined) throw failure;
    try {
      tableFill(st, out, n, counters, blk, maxRejections);
    } catch (e) {
      if (!(e instanceof StalledSamplerError) && !(e instanceof InvalidTargetError)) failure = e;
      throw e;
    }
  };
  return {
    sample(): number {
      run(scratch, 1);
      return scratch[0];
    },
    fill(out: Float64Array): Float64Array {
      checkFillArray(api, out);
      run(out, out.length);
      return out;
    },
  };
}

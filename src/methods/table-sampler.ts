/**
 * The table-driven fast path: a strip table built once from the hull of a
 * fixed T-concave target.
 *
 * @packageDocumentation
 */
import type { Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import type { EnvelopeDescription } from './envelope/description.js';
import { setupHull } from './hull/setup.js';
import type { HullSetup } from './hull/setup.js';
import type { TransformName } from './envelope/transforms.js';
import { buildAliasCells } from './table/alias.js';
import { buildStripTable } from './table/build.js';
import { describeTable, describeTableEnvelope } from './table/describe.js';
import type { TableDescription } from './table/describe.js';
import { tableDraws } from './table/draws.js';
import { resolveTableOptions } from './table/options.js';
import { checkTarget } from '../core/validate.js';
import { HULL_FORWARD } from './standardised-forward.js';
import { FINE_GRAIN, isStandardised, ordinaryTouchPoints, samplerXFirst } from './transform/standardise.js';

export { DEFAULT_TABLE_STRIPS, DEFAULT_TABLE_TAIL_MASS, MAX_TABLE_STRIPS } from './table/options.js';

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
export interface TableSampler extends Sampler {
  /** Snapshot of the envelope the table draws from (constant pieces on the strips, the tails); fresh arrays on every access. */
  readonly envelope: EnvelopeDescription;
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
 * @throws {@link ShapeViolationError} when setup (or a later evaluation) proves the target not T-concave, or finds its support not an interval (the message names the gap)
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
  if (options?.startPoints === undefined && !isStandardised(target)) {
    // The hull and its table are built in the standardised coordinate (src/methods/transform/standardise.ts).
    return samplerXFirst(api, target, checkTarget(api, target), (z) => tableSampler(z, options), HULL_FORWARD, { order: 'x-first', maxGrain: FINE_GRAIN, ordinary: (s: TableSampler) => ordinaryTouchPoints(s.envelope.touchPoints) });
  }
  const setup = setupHull(api, target, options, KNOWN);
  return createTableSampler(api, setup, options);
}

/**
 * Builds the table sampler from a hull after setup; `options` supplies
 * `strips` and `tailMass` (defaults when undefined).
 * @internal
 */
export function createTableSampler(api: string, setup: HullSetup, options: TableSamplerOptions | undefined): TableSampler {
  const { strips, tailMass } = resolveTableOptions(api, options);
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


/**
 * Piecewise envelopes for multimodal and non-concave targets.
 *
 * @packageDocumentation
 */
import { Counters } from '../core/counters.js';
import { EnvelopeViolationError, InvalidTargetError, StalledSamplerError } from '../core/errors.js';
import { InvalidOptionError } from '../core/errors.js';
import type { Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import { wrapDraws } from '../core/draws.js';
import { checkInteger, checkOptionKeys, checkTarget, resolveBoolean, resolveMaxRejections } from '../core/validate.js';
import type { CheckedTarget } from '../core/validate.js';
import { resolveUniform } from '../random/resolve.js';
import { UniformBlock } from '../random/uniform-block.js';
import { GuideTable } from './envelope/guide-table.js';
import { T_LOG } from './envelope/transforms.js';
import { CLASS_NAMES, PIECEWISE_NOISE, TAIL_INV_SQRT, TAIL_LOG, TAIL_NONE } from './piecewise/cells.js';
import { Grid } from './piecewise/grid.js';
import { extrema, inflections } from './piecewise/classify.js';
import { gridTables, tails } from './piecewise/cell-envelope.js';
import { insert, refine, settle } from './piecewise/refine.js';
import type { Tables } from './envelope/piece-tables.js';
import { evaluateTables, pieceLogEnvelope } from './envelope/piece-tables.js';
import { piecewiseFill } from './piecewise/kernel.js';
import type { KernelState } from './piecewise/kernel.js';
import { Evaluator } from '../core/evaluate.js';
import { scanTarget } from './piecewise/scan.js';
import { lastAtOrBelow } from './envelope/arith.js';
import { buildAliasCells } from './table/alias.js';
import type { StripTable } from './table/strip-table.js';
import { describeTable } from './table/describe.js';
import type { TableDescription } from './table/describe.js';
import { buildPiecewiseStripTable } from './table/piecewise-build.js';
import { tableDraws } from './table/draws.js';
import { MAX_TABLE_STRIPS, resolveTableOptions } from './table/options.js';
import type { TableSamplerOptions } from './table-sampler.js';
import type { ScanPoint } from './piecewise/scan.js';
import { tableInX } from './standardised-forward.js';
import { areaX, clampX, pointX } from './transform/standardise.js';
import type { Forward, Standardisation } from './transform/standardise.js';
import { FINE_GRAIN, isStandardised, samplerZFirst } from './transform/standardise.js';
import { exp } from '../vendor/math.js';

/**
 * Default of {@link PiecewiseOptions.targetAreaRatio}: refinement stops once
 * (envelope area)/(squeeze area) ≤ 1.01.
 *
 * @remarks
 * The area ratio bounds both figures a user pays for: the acceptance rate is
 * Z/(envelope area) ≥ 1/1.01 ≈ 0.990, and the fraction of proposals that
 * evaluate the target (those above the squeeze) is
 * 1 − (squeeze area)/(envelope area) ≤ 0.0099. Going from 1.01 to 1.001
 * costs roughly √10 ≈ 3 times the pieces (the gap of a piece shrinks with
 * the square of its width), for at most 0.9 % more acceptance.
 */
export const DEFAULT_TARGET_AREA_RATIO = 1.01;

/**
 * Default of {@link PiecewiseOptions.scanPoints}: 1024 points of the uniform
 * scan grids.
 *
 * @remarks
 * The points are shared equally by five nested windows around the centre
 * (see {@link piecewiseSampler}); where windows coincide, as on a finite
 * support holding the mass, their grids interleave and the spacing is
 * (window width)/1025. A feature (a spike, a dip, a pair of inflections) is
 * seen when a scan point or a ray probe lands on it, i.e. reliably when it
 * is at least about twice the local spacing wide. 1024 points find a spike
 * of width 1e-3 of the support (see the tests), at a one-off cost of 1024
 * evaluations.
 */
export const DEFAULT_SCAN_POINTS = 1024;

/** Default of {@link PiecewiseOptions.maxPieces}: refinement stops at 20,000 pieces. */
export const DEFAULT_PIECEWISE_MAX_PIECES = 20_000;

/** Evaluations of logDensity the setup may spend before giving up with {@link ShapeViolationError}. */
export const PIECEWISE_SETUP_BUDGET = 250_000;

/** Repairs an `adapt: true` sampler may make before a violation is thrown anyway. */
export const MAX_ENVELOPE_REPAIRS = 1000;

/** Refinement rounds of the setup. */
const REFINE_ROUNDS = 60;

/** Options of {@link piecewiseSampler}. */
export interface PiecewiseOptions extends SamplerOptions {
  /**
   * Points that must be on the grid: known modes, inflection points, the
   * location of a narrow spike the scan could miss, ends of regions where
   * the density is 0. Finite, inside the support. They add to the automatic
   * scan; they do not replace it, because a list of breakpoints cannot
   * prove that the target has no other feature, and every piece's shape is
   * checked the same way whether its ends were given or found.
   * @defaultValue none
   */
  breakpoints?: readonly number[];
  /**
   * Points of the uniform scan grid (integer in [16, 1,000,000]).
   * @defaultValue {@link DEFAULT_SCAN_POINTS} (1024)
   */
  scanPoints?: number;
  /**
   * Refinement goal: (envelope area)/(squeeze area), a number in (1, 100].
   * @defaultValue {@link DEFAULT_TARGET_AREA_RATIO} (1.01)
   */
  targetAreaRatio?: number;
  /**
   * Number of pieces at which refinement stops (integer ≥ 16). It never
   * stops the work that makes the envelope valid, only the work that makes
   * it tight; {@link PiecewiseEnvelope.areaRatio} tells what was reached.
   * @defaultValue {@link DEFAULT_PIECEWISE_MAX_PIECES} (20,000)
   */
  maxPieces?: number;
  /**
   * Build from chords only, even when the target has `dLogDensity`.
   * Without `dLogDensity` chords are always used.
   * @defaultValue false
   */
  derivativeFree?: boolean;
  /**
   * What to do when a density evaluated while sampling lies above the
   * envelope (or below the squeeze). `false`: throw
   * {@link EnvelopeViolationError} with x. `true`: drop the candidate, add x
   * to the grid, rebuild the envelope and go on, counting the repair in
   * `stats.envelopeRepairs` (at most {@link MAX_ENVELOPE_REPAIRS}).
   *
   * @remarks
   * The default is `false` because a violation proves that the scan missed a
   * feature of the target, so that the envelope was below the target
   * somewhere, and the draws already returned came from the wrong
   * distribution near that place. A repair makes later draws exact (as far
   * as the checks can tell) but cannot correct the earlier ones, and
   * candidates accepted under a wrong squeeze are never evaluated, so not
   * every error is even seen. Use `true` only when an approximate early
   * stream is acceptable (for example in a burn-in) and say so in your
   * results; otherwise prefer `breakpoints` or more `scanPoints`.
   * @defaultValue false
   */
  adapt?: boolean;
  /**
   * Consecutive rejections before {@link StalledSamplerError}.
   * @defaultValue 1,000,000
   */
  maxRejections?: number;
  /**
   * Draw through the table-driven fast path built over the envelope (see
   * {@link PiecewiseTableSampler}): about one uniform and a table lookup per
   * draw, for many draws from one target. Not allowed with `adapt: true`
   * (a table does not change after setup).
   * @defaultValue false
   */
  fast?: boolean;
  /**
   * With `fast`: the number of strips to aim for (an integer in [2, 2^20]):
   * the body's envelope area is cut in about this many parts, but steep
   * pieces get more strips and a run of light pieces is merged only while
   * its envelope varies by less than e^0.5, so tables usually have more
   * (about 800–1,900 on normal mixtures, whatever is asked).
   * @defaultValue 500 (as {@link TableSamplerOptions.strips})
   */
  strips?: number;
  /**
   * With `fast`: envelope mass left to each tail region (a number in (0, 0.01]).
   * @defaultValue 1e-6 (as {@link TableSamplerOptions.tailMass})
   */
  tailMass?: number;
}

/** Counters of a {@link PiecewiseSampler}. */
export interface PiecewiseStats extends SamplerStats {
  /** Envelope repairs made while sampling (only with `adapt: true`). */
  envelopeRepairs: number;
}

/** One piece of a piecewise envelope. */
export interface PiecewisePiece {
  /** Left end (−Infinity for a lower tail). */
  readonly lower: number;
  /** Right end (+Infinity for an upper tail). */
  readonly upper: number;
  /** `'log'`: the envelope is exponential on the piece; `'inverse-sqrt'`: 1/(a + b·|x − x₀|)² (a heavy tail). */
  readonly transform: 'log' | 'inverse-sqrt';
  /** Shape class of the cell the piece belongs to, or `'tail'`. */
  readonly shape: 'concave' | 'convex' | 'linear' | 'boundary' | 'atomic' | 'monotone' | 'negligible' | 'tail';
  /** Natural log of the envelope at the lower end (at a finite end; the limit for a tail). */
  readonly logEnvelopeLower: number;
  /** Natural log of the envelope at the upper end. */
  readonly logEnvelopeUpper: number;
  /** Natural log of the envelope's area over the piece. */
  readonly logArea: number;
  /** Natural log of the squeeze's area over the piece (−Infinity: no squeeze). */
  readonly logSqueezeArea: number;
}

/** Kind of each tail of a piecewise envelope: `'none'` (a finite end), `'exponential'` or `'inverse-sqrt'` (Hörmann 1995). */
export interface PiecewiseTails {
  /** The tail below the lowest grid point. */
  readonly lower: 'none' | 'exponential' | 'inverse-sqrt';
  /** The tail above the highest grid point. */
  readonly upper: 'none' | 'exponential' | 'inverse-sqrt';
}

/** Read-only description of a piecewise envelope, for plots and audits. */
export interface PiecewiseEnvelope {
  /** `'tangent'` (from dLogDensity) or `'secant'` (chords only). */
  readonly construction: 'tangent' | 'secant';
  /** Effective support: the target's, cut where the scan found the density to be 0. */
  readonly support: readonly [number, number];
  /** Reference log height (the largest logDensity on the grid). */
  readonly logScale: number;
  /** Pieces, left to right. */
  readonly pieces: readonly PiecewisePiece[];
  /** The grid points (every piece end except tail ends and the splits inside cells is one). */
  readonly gridPoints: readonly number[];
  /** Natural log of the envelope's total area. */
  readonly logEnvelopeArea: number;
  /** Natural log of the squeeze's total area. */
  readonly logSqueezeArea: number;
  /** (envelope area)/(squeeze area) reached; the acceptance rate is at least its inverse. */
  readonly areaRatio: number;
  /** The refinement goal in use. */
  readonly targetAreaRatio: number;
  /** Approximate locations of curvature changes of log f found by the scan. */
  readonly inflections: readonly number[];
  /** Approximate locations of local extrema of the density found by the scan. */
  readonly extrema: readonly number[];
  /** Kind of each tail. */
  readonly tails: PiecewiseTails;
  /** Calls of dLogDensity so far (setup and repairs). */
  readonly derivativeEvaluations: number;
  /** Refinement points whose value contradicted the envelope of their cell (each led to a reclassification). */
  readonly setupContradictions: number;
}

/** A piecewise sampler; also describes and evaluates its envelope. */
export interface PiecewiseSampler extends Sampler {
  /** Live snapshot of the counters, with the repairs. */
  readonly stats: PiecewiseStats;
  /** A fresh description of the current envelope on each access. */
  readonly envelope: PiecewiseEnvelope;
  /**
   * Natural log of the envelope at x, with the sampler's arithmetic
   * (−Infinity outside the effective support).
   * @param x - a point
   */
  logEnvelope(x: number): number;
  /**
   * Natural log of the squeeze at x (−Infinity where there is none).
   * @param x - a point
   */
  logSqueeze(x: number): number;
}

const KNOWN = ['breakpoints', 'scanPoints', 'targetAreaRatio', 'maxPieces', 'derivativeFree', 'adapt', 'maxRejections', 'fast', 'strips', 'tailMass', 'seed', 'stream', 'uniform'] as const;

/**
 * Exact sampler for multimodal and non-concave targets: the support is cut
 * where log f changes curvature, and each cell gets an exponential upper
 * envelope and lower squeeze that are valid because of the cell's shape.
 *
 * @remarks
 * **Method.** The support is scanned (rays from the mode hint or a global
 * maximum to both ends, plus nested uniform grids of `scanPoints` points and
 * the `breakpoints`); each cell between scan points is classified as
 * concave, convex or linear in log f (from `dLogDensity`, or from second
 * divided differences) and bounded by straight lines in log space valid for
 * its class; curvature changes are located to 2^−24 of their cell; cells
 * whose data contradict both shapes are halved. The tails get an
 * exponential piece where log f is concave there, else a piece under
 * T(f) = −1/√f (Hörmann 1995) for tails decaying like |x|^−2 or faster
 * (a tail that does not decrease throws {@link ImproperDensityError}, a
 * heavier one {@link ShapeViolationError}: use
 * {@link ratioOfUniformsSampler} with a power, or truncate). Cells are
 * halved until (envelope area)/(squeeze area) ≤ `targetAreaRatio` or
 * `maxPieces`. With `dLogDensity` the setup also refuses a derivative
 * inconsistent with logDensity. The design and its rounding allowances
 * ({@link PIECEWISE_NOISE}) are described in DEVELOPERS.md, "The piecewise
 * method".
 *
 * **Sampling.** Pieces are chosen by a guide table (Chen & Asau 1974) over
 * their areas (log-sum-exp); an exponential piece is inverted exactly with
 * expm1/log1p forms (flat pieces, slope·width < 1e-15, as uniform). Each
 * proposal consumes two or three uniforms, which is part of the stream
 * contract: one selects the piece; the position is the rest of that uniform
 * when the piece holds at least 2^-12 of the envelope's area and a fresh
 * uniform otherwise; the last is the acceptance variable. A candidate under the squeeze is accepted
 * without evaluation; every evaluation is checked for NaN/+Infinity and
 * against envelope and squeeze (tolerance 1e-9 + 1e-12·|log f| in log
 * space); a violation throws {@link EnvelopeViolationError} with x unless
 * `adapt` is set (see there). After a thrown violation or non-finite
 * density the sampler is unusable: every later call throws the same error.
 *
 * **Limits.** A feature narrower than the local scan spacing that no ray
 * probe, grid point or breakpoint touches is invisible to the setup, and
 * the draw-time checks see it only where the target is evaluated (not
 * under the squeeze), so draws near it can be wrong without an error. Known
 * example: a component of width 1e-3 located 100 away from a Student-t
 * body (the windows are then hundreds wide). Give its location as a
 * breakpoint or as `target.mode`, or raise `scanPoints`. In random
 * mixtures of 2 to 5 normals with locations in [−10, 10] and sds in
 * [0.05, 5], 1500 of 1500 envelopes were checked valid (see the tests).
 * The density's zero set is taken from the scan: a cell with density 0 at
 * both ends is taken to hold no mass. Where the scan finds the density 0
 * towards an end, it probes further out (up to 2^20 times the width of the
 * positive part); a positive value there means the support is not an
 * interval, and the target is refused with {@link InvalidTargetError}
 * rather than sampled without that part. Setup costs about 1,400 to 10,000
 * evaluations of logDensity (and of dLogDensity with the tangent
 * construction); for a target that changes often and is log-concave, the
 * adaptive hull is far cheaper.
 *
 * **Fast path** (`fast: true`, returns a {@link PiecewiseTableSampler}):
 * after the envelope is built, a strip table over it (the table of
 * {@link tableSampler}, alias-selected regions, one uniform per draw in the
 * common case) is derived from the envelope and squeeze alone: both are
 * monotone on every piece, so their extremes on a strip are at its ends,
 * and the table is exact wherever the envelope is valid. Setup also
 * evaluates the target at every strip boundary (about `strips` to 2,000
 * more evaluations) and checks each value against the envelope; a value
 * outside it (a feature the scan missed) is added to the grid and the
 * envelope rebuilt before any draw is made (at most
 * {@link PIECEWISE_TABLE_REPAIR_ROUNDS} rounds, then
 * {@link EnvelopeViolationError}). Timings: bench/README.md.
 *
 * @param target - the target (bounded density; multimodal is fine)
 * @param options - breakpoints, scan size, refinement goal and cap, construction, adapt, uniform source
 * @returns the sampler, with its `envelope` description
 * @throws {@link InvalidTargetError} for bad inputs, a density unbounded at an end, or a derivative inconsistent with logDensity
 * @throws {@link ImproperDensityError} when a tail does not decay (or decays like |x|^−α with α ≤ 1)
 * @throws {@link ShapeViolationError} when a tail is too heavy for the envelopes, or a cell cannot be bounded
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity (or dLogDensity NaN)
 * @throws {@link EnvelopeViolationError} at draw time, when the target is found above the envelope or below the squeeze
 * @throws {@link StalledSamplerError} after `maxRejections` consecutive rejections
 * @example
 * ```ts
 * // an invented bimodal density: two bumps of different widths
 * const target = {
 *   logDensity: (x: number) => Math.log(Math.exp(-0.5 * (x + 2) ** 2) + 0.5 * Math.exp(-2 * (x - 1.5) ** 2)),
 * };
 * const s = piecewiseSampler(target, { seed: 1 });
 * const xs = s.fill(new Float64Array(10_000));
 * s.stats.acceptanceRate; // about 0.99
 * s.envelope.inflections; // where log f changes curvature
 * ```
 */
export function piecewiseSampler(target: Target, options: PiecewiseOptions & { fast: true }): PiecewiseTableSampler;
export function piecewiseSampler(target: Target, options?: PiecewiseOptions): PiecewiseSampler;
export function piecewiseSampler(target: Target, options?: PiecewiseOptions): PiecewiseSampler {
  const api = 'piecewiseSampler';
  const t = checkTarget(api, target);
  checkOptionKeys(api, options, KNOWN);
  const opts: PiecewiseOptions = options ?? {};
  const breakpoints = opts.breakpoints === undefined ? [] : checkBreakpoints(api, opts.breakpoints, t);
  const scanPoints = opts.scanPoints === undefined ? DEFAULT_SCAN_POINTS : checkInteger(api, 'options.scanPoints', opts.scanPoints, 16, 1_000_000);
  const ratio = opts.targetAreaRatio === undefined ? DEFAULT_TARGET_AREA_RATIO : checkRatio(api, opts.targetAreaRatio);
  const maxPieces = opts.maxPieces === undefined ? DEFAULT_PIECEWISE_MAX_PIECES : checkInteger(api, 'options.maxPieces', opts.maxPieces, 16, 10_000_000);
  const derivativeFree = resolveBoolean(api, 'options.derivativeFree', opts.derivativeFree, false);
  const adapt = resolveBoolean(api, 'options.adapt', opts.adapt, false);
  const maxRejections = resolveMaxRejections(api, opts.maxRejections);
  const fast = resolveBoolean(api, 'options.fast', opts.fast, false);
  if (fast && adapt) throw new InvalidOptionError(`${api}: options.fast and options.adapt cannot both be true (the table of the fast path does not change after setup)`);
  if (!fast && (opts.strips !== undefined || opts.tailMass !== undefined)) {
    throw new InvalidOptionError(`${api}: options.strips and options.tailMass apply only with options.fast: true (got strips ${String(opts.strips)}, tailMass ${String(opts.tailMass)})`);
  }
  const { strips, tailMass } = resolveTableOptions(api, opts);
  const uniform = resolveUniform(api, opts);
  if (opts.breakpoints === undefined && !isStandardised(target)) {
    // Scan and cells in the standardised coordinate (src/methods/transform/standardise.ts).
    return samplerZFirst(api, target, t, (z) => piecewiseSampler(z, opts), PIECEWISE_FORWARD, { order: 'z-first', maxGrain: FINE_GRAIN });
  }
  const tangent = t.dLogDensity !== undefined && !derivativeFree;

  const ev = new Evaluator(api, t.logDensity, tangent ? t.dLogDensity : undefined, PIECEWISE_SETUP_BUDGET + scanPoints);
  const scan = scanTarget(api, t, ev, scanPoints, breakpoints, tangent);
  if (tangent) checkDerivative(api, scan.points);
  const grid = new Grid(api, ev, tangent, scan.points, scan.lower, scan.upper, scan.centre);
  settle(grid);
  tails(grid);
  const tables = refine(grid, ratio, maxPieces, REFINE_ROUNDS);
  const counters = new Counters();
  counters.setupEvaluations = ev.evaluations;
  if (fast) return createPiecewiseTable(api, t, grid, ev, tables, counters, uniform, opts.uniform === undefined, maxRejections, ratio, strips, tailMass);
  const blk = UniformBlock.of(uniform, opts.uniform === undefined);
  return new Piecewise(api, t, grid, ev, tables, counters, blk, maxRejections, adapt, ratio);
}

/** Rounds of the fast path's setup repairs: boundary values outside the envelope are added to the grid and the table rebuilt. */
export const PIECEWISE_TABLE_REPAIR_ROUNDS = 8;

/**
 * A piecewise sampler drawing through a strip table (`piecewiseSampler(t, { fast: true })`).
 *
 * @remarks
 * `envelope`, `logEnvelope` and `logSqueeze` describe what the sampler
 * uses: the piecewise envelope the table was built on (`envelope`), and the
 * table's constant envelope and squeeze on each strip of the body (the
 * piecewise envelope and squeeze in the tails). `stats.envelopeRepairs` is
 * always 0 (the table does not repair while drawing); points that setup
 * added to the grid are counted in `stats.setupEvaluations`.
 */
export interface PiecewiseTableSampler extends PiecewiseSampler {
  /** Snapshot of the strip table; fresh arrays on every access. */
  readonly table: TableDescription;
}

function createPiecewiseTable(
  api: string,
  target: CheckedTarget,
  grid: Grid,
  ev: Evaluator,
  tables0: Tables,
  counters: Counters,
  uniform: () => number,
  ownsUniform: boolean,
  maxRejections: number,
  ratio: number,
  strips: number,
  tailMass: number,
): PiecewiseTableSampler {
  let tables = tables0;
  let table: StripTable | null = null;
  for (let round = 0; ; round++) {
    const r = buildPiecewiseStripTable({ api, t: tables, logDensity: target.logDensity, counters, strips, tailMass, maxStrips: MAX_TABLE_STRIPS });
    if (r.table !== null) {
      table = r.table;
      break;
    }
    if (round >= PIECEWISE_TABLE_REPAIR_ROUNDS) {
      const v = r.violations[0];
      throw new EnvelopeViolationError(api, v.x, v.logDensity, v.bound, v.what);
    }
    // a boundary value outside the envelope: the scan missed a feature there; refine before any draw
    const before = ev.evaluations;
    const seen = new Set<number>();
    for (const v of r.violations) {
      if (seen.has(v.x) || seen.size >= 64) continue;
      seen.add(v.x);
      insert(grid, v.x, v.logDensity);
    }
    tables = gridTables(grid);
    counters.setupEvaluations += ev.evaluations - before;
  }
  const built = table;
  const cells = buildAliasCells(built);
  const draws = tableDraws(api, built, cells, target.logDensity, counters, uniform, ownsUniform, maxRejections);
  const finalTables = tables;
  const stripAt = (x: number): number => {
    const xs = built.x;
    if (!(x >= xs[0] && x <= xs[built.n])) return -1;
    return lastAtOrBelow(xs, 0, built.n - 1, x);
  };
  return {
    sample: draws.sample,
    fill: draws.fill,
    get stats(): PiecewiseStats {
      return { ...counters.snapshot(), envelopeRepairs: 0 };
    },
    get envelope(): PiecewiseEnvelope {
      return describe(grid, finalTables, ratio, ev);
    },
    get table(): TableDescription {
      return describeTable(built, cells);
    },
    logEnvelope(x: number): number {
      const s = stripAt(x);
      return s >= 0 ? built.logUp[s] : evaluateTables(finalTables, x).logEnvelope;
    },
    logSqueeze(x: number): number {
      const s = stripAt(x);
      return s >= 0 ? built.logLo[s] : evaluateTables(finalTables, x).logSqueeze;
    },
  };
}

export { PIECEWISE_NOISE } from './piecewise/cells.js';

/** The sampler. */
class Piecewise implements PiecewiseSampler {
  private readonly state: KernelState;
  private repairs = 0;
  private readonly setupEvaluations: number;

  constructor(
    private readonly api: string,
    private readonly target: CheckedTarget,
    private readonly grid: Grid,
    private readonly ev: Evaluator,
    tables: Tables,
    private readonly counters: Counters,
    blk: UniformBlock,
    maxRejections: number,
    adapt: boolean,
    private readonly ratio: number,
  ) {
    const guide = new GuideTable(tables.n);
    guide.build(tables.area, tables.n);
    this.setupEvaluations = ev.evaluations;
    this.state = {
      api,
      t: tables,
      guide,
      logf: target.logDensity,
      counters,
      blk,
      maxRejections,
      adapt,
      pendingX: NaN,
      pendingL: NaN,
      pendingBound: NaN,
      pendingWhat: 'envelope',
    };
    const draws = wrapDraws(api, (out, n) => this.run(out, n));
    this.sample = draws.sample;
    this.fill = draws.fill;
  }

  get stats(): PiecewiseStats {
    return { ...this.counters.snapshot(), envelopeRepairs: this.repairs };
  }

  get envelope(): PiecewiseEnvelope {
    return describe(this.grid, this.state.t, this.ratio, this.ev);
  }

  logEnvelope(x: number): number {
    return evaluateTables(this.state.t, x).logEnvelope;
  }

  logSqueeze(x: number): number {
    return evaluateTables(this.state.t, x).logSqueeze;
  }

  readonly sample: () => number;
  readonly fill: (out: Float64Array) => Float64Array;

  /** The kernel, with the repairs in between (adapt); wrapped by {@link wrapDraws} in the constructor. */
  private run(out: Float64Array, n: number): void {
    let i = 0;
    for (;;) {
      i = piecewiseFill(this.state, out, i, n);
      if (i < 0) return;
      this.repair();
    }
  }

  /** Adds the pending violation point to the grid and rebuilds the envelope. */
  private repair(): void {
    const s = this.state;
    if (this.repairs >= MAX_ENVELOPE_REPAIRS) {
      throw new EnvelopeViolationError(this.api, s.pendingX, s.pendingL, s.pendingBound, s.pendingWhat);
    }
    this.repairs++;
    const before = this.ev.evaluations;
    insert(this.grid, s.pendingX, s.pendingL);
    const t = gridTables(this.grid);
    this.counters.densityEvaluations += this.ev.evaluations - before;
    const guide = new GuideTable(t.n);
    guide.build(t.area, t.n);
    s.t = t;
    s.guide = guide;
  }
}

function describe(grid: Grid, t: Tables, ratio: number, ev: Evaluator): PiecewiseEnvelope {
  const pieces: PiecewisePiece[] = [];
  for (let j = 0; j < t.n; j++) {
    const isTail = t.lo[j] === -Infinity || t.hi[j] === Infinity;
    const at = (x: number): number => (x === -Infinity || x === Infinity ? -Infinity : pieceLogEnvelope(t, j, x) + t.ref);
    pieces.push({
      lower: t.lo[j],
      upper: t.hi[j],
      transform: t.kind[j] === T_LOG ? 'log' : 'inverse-sqrt',
      shape: isTail ? 'tail' : (CLASS_NAMES[t.shape[j]] as PiecewisePiece['shape']),
      logEnvelopeLower: at(t.lo[j]),
      logEnvelopeUpper: at(t.hi[j]),
      logArea: t.logAreas[j] + t.ref,
      logSqueezeArea: t.logSqueezeAreas[j] + t.ref,
    });
  }
  const tailName = (k: number): 'none' | 'exponential' | 'inverse-sqrt' => (k === TAIL_LOG ? 'exponential' : k === TAIL_INV_SQRT ? 'inverse-sqrt' : 'none');
  const lower = grid.lowerTail.kind === TAIL_NONE ? grid.x[0] : -Infinity;
  const upper = grid.upperTail.kind === TAIL_NONE ? grid.x[grid.x.length - 1] : Infinity;
  return Object.freeze({
    construction: grid.tangent ? 'tangent' : 'secant',
    support: Object.freeze([lower, upper] as const),
    logScale: t.ref,
    pieces: Object.freeze(pieces),
    gridPoints: Object.freeze(grid.x.slice()),
    logEnvelopeArea: t.logEnvelopeArea,
    logSqueezeArea: t.logSqueezeArea,
    areaRatio: exp(t.logEnvelopeArea - t.logSqueezeArea),
    targetAreaRatio: ratio,
    inflections: Object.freeze(inflections(grid)),
    extrema: Object.freeze(extrema(grid)),
    tails: Object.freeze({ lower: tailName(grid.lowerTail.kind), upper: tailName(grid.upperTail.kind) }),
    derivativeEvaluations: ev.derivativeEvaluations,
    setupContradictions: grid.surprises,
  });
}

/**
 * Refuses a derivative that disagrees with logDensity: at a scan point of a
 * smooth density away from curvature changes, the derivative lies between
 * the slopes of the chords on its two sides. More than a quarter of the
 * points outside that range (with a rounding allowance) is not a smooth
 * density with that derivative.
 */
function checkDerivative(api: string, pts: readonly ScanPoint[]): void {
  let checked = 0;
  let bad = 0;
  let example = '';
  for (let j = 1; j + 1 < pts.length; j++) {
    const p = pts[j - 1];
    const q = pts[j];
    const r = pts[j + 1];
    if (!(p.l > -Infinity && q.l > -Infinity && r.l > -Infinity) || !Number.isFinite(q.g)) continue;
    const s0 = (q.l - p.l) / (q.x - p.x);
    const s1 = (r.l - q.l) / (r.x - q.x);
    const e = 1e-6 * (Math.abs(s0) + Math.abs(s1) + Math.abs(q.g)) + (PIECEWISE_NOISE * (Math.abs(p.l) + 2 * Math.abs(q.l) + Math.abs(r.l) + 4)) / Math.min(q.x - p.x, r.x - q.x);
    checked++;
    if (q.g < Math.min(s0, s1) - e || q.g > Math.max(s0, s1) + e) {
      bad++;
      if (example === '') example = `at x = ${q.x} dLogDensity is ${q.g} while the chords on either side have slopes ${s0} and ${s1}`;
    }
  }
  if (checked >= 8 && bad * 4 > checked) {
    throw new InvalidTargetError(
      `${api}: target.dLogDensity disagrees with logDensity at ${bad} of ${checked} scan points (${example}); fix the derivative or pass derivativeFree: true`,
    );
  }
}

function checkBreakpoints(api: string, pts: readonly number[], t: CheckedTarget): number[] {
  if (!Array.isArray(pts)) {
    throw new InvalidOptionError(`${api}: options.breakpoints must be an array of numbers, got ${String(pts)}`);
  }
  const out: number[] = [];
  for (let i = 0; i < pts.length; i++) {
    const x = pts[i] as unknown;
    if (typeof x !== 'number' || !Number.isFinite(x)) {
      throw new InvalidOptionError(`${api}: options.breakpoints[${i}] must be a finite number, got ${String(x)}`);
    }
    if (x < t.lower || x > t.upper) {
      throw new InvalidOptionError(`${api}: options.breakpoints[${i}] = ${x} lies outside the support [${t.lower}, ${t.upper}]`);
    }
    out.push(x);
  }
  return out;
}

function checkRatio(api: string, v: unknown): number {
  if (typeof v !== 'number' || !(v > 1) || !(v <= 100)) {
    throw new InvalidOptionError(`${api}: options.targetAreaRatio must be a number in (1, 100], got ${String(v)}`);
  }
  return v;
}

/** A piecewise envelope described in z, in x. */
function piecewiseInX(e: PiecewiseEnvelope, st: Standardisation): PiecewiseEnvelope {
  const px = (z: number): number => pointX(st, z);
  return {
    ...e,
    support: [clampX(st, px(e.support[0])), clampX(st, px(e.support[1]))],
    pieces: e.pieces.map((p) => ({ ...p, lower: px(p.lower), upper: px(p.upper), logArea: areaX(st, p.logArea), logSqueezeArea: areaX(st, p.logSqueezeArea) })),
    gridPoints: e.gridPoints.map(px),
    logEnvelopeArea: areaX(st, e.logEnvelopeArea),
    logSqueezeArea: areaX(st, e.logSqueezeArea),
    inflections: e.inflections.map(px),
    extrema: e.extrema.map(px),
  };
}

/** Forwarded members of the piecewise samplers built in the standardised coordinate. @internal */
export const PIECEWISE_FORWARD: Readonly<Record<string, Forward>> = { envelope: piecewiseInX, table: tableInX, logEnvelope: 'point', logSqueeze: 'point' };

/**
 * certifiedSampler(): exact sampling of any target whose log-density can be
 * bounded on an interval, with an envelope proven on every cell.
 *
 * @packageDocumentation
 */
import { Counters } from '../core/counters.js';
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
import { wrapDraws } from '../core/draws.js';
import type { Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import { checkInteger, checkOptionKeys, checkTarget, resolveBoolean, resolveMaxRejections, showValue } from '../core/validate.js';
import { resolveUniform } from '../random/resolve.js';
import type { EnvelopeDescription, EnvelopePiece } from './envelope/description.js';
import { buildCells } from './certified/build.js';
import { BoundsOracle } from './certified/cells.js';
import type { BoundsFn } from './certified/cells.js';
import { CertifiedState, certifiedFill } from './certified/kernel.js';
import { exp } from '../vendor/math.js';

/** Default share of the envelope area the squeeze must reach before setup stops (the acceptance rate is at least this). */
export const DEFAULT_CERTIFIED_ACCEPTANCE = 0.99;

/** Default cell budget of {@link certifiedSampler} (setup and refinement on rejection together). */
export const DEFAULT_CERTIFIED_MAX_CELLS = 10_000;

/** Largest allowed `maxCells`. */
export const MAX_CERTIFIED_CELLS = 1_000_000;

/** Options of {@link certifiedSampler}. */
export interface CertifiedOptions extends SamplerOptions {
  /**
   * Setup splits cells until (squeeze area)/(envelope area) reaches this
   * value (or the cell budget is spent); the acceptance rate is then at
   * least this value. A number in [0.5, 0.9999].
   * @defaultValue {@link DEFAULT_CERTIFIED_ACCEPTANCE} (0.99)
   */
  targetAcceptance?: number;
  /**
   * Cell budget for setup and refinement on rejection together: an integer
   * in [2, {@link MAX_CERTIFIED_CELLS}]. Setup stops at it even when the
   * acceptance target is not reached (the envelope is still proven, only
   * looser); a cell with no finite bound at the budget is an error.
   * @defaultValue {@link DEFAULT_CERTIFIED_MAX_CELLS} (10,000)
   */
  maxCells?: number;
  /**
   * Split the cells rejected candidates fell in (refinement on rejection,
   * the OS* rule of Dymetman, Bouchard & Carter 2012), until the proven
   * acceptance bound reaches 0.999 or `maxCells`. Rejected cells are
   * queued and split in batches of max(1, cells/64), so that one table
   * rebuild serves many splits. It changes the stream after rejections,
   * never the distribution.
   * @defaultValue true
   */
  refine?: boolean;
  /**
   * Consecutive rejections before {@link StalledSamplerError}.
   * @defaultValue 1,000,000
   */
  maxRejections?: number;
}

/** Counters of a {@link CertifiedSampler}: those of every sampler, plus the interval evaluations. */
export interface CertifiedStats extends SamplerStats {
  /** Calls of `target.logDensityBounds` (setup and refinement). `setupEvaluations` stays 0: setup makes no point evaluation. */
  boundEvaluations: number;
  /** Calls of `target.logDensityBounds` made by the setup alone. */
  setupBoundEvaluations: number;
  /** Calls of `target.dLogDensityBounds` (setup and refinement). */
  derivativeBoundEvaluations: number;
  /** Cells now. */
  cells: number;
  /** Cells split on rejection after setup. */
  refinements: number;
}

/** One cell of a certified envelope. */
export interface CertifiedCell {
  /** Left end (may be −Infinity). */
  readonly lower: number;
  /** Right end (may be +Infinity). */
  readonly upper: number;
  /** Lower bound of log f over the cell, from `logDensityBounds`. */
  readonly logLower: number;
  /** Upper bound of log f over the cell, from `logDensityBounds`. */
  readonly logUpper: number;
  /** Bounds of (log f)′ over the cell, from `dLogDensityBounds` (±Infinity when not given). */
  readonly derivativeBounds: readonly [number, number];
  /** `'flat'`: constant envelope from the upper bound; `'exponential'`: from an end's bound and a derivative bound. */
  readonly envelope: 'flat' | 'exponential';
  /** Natural log of the envelope's area over the cell. */
  readonly logEnvelopeArea: number;
  /** Natural log of the squeeze's area over the cell (−Infinity: no squeeze). */
  readonly logSqueezeArea: number;
}

/** Read-only description of a certified envelope (fresh arrays on each access). */
export interface CertifiedDescription {
  /** The target's support. */
  readonly support: readonly [number, number];
  /** The cells, left to right. */
  readonly cells: readonly CertifiedCell[];
  /** Natural log of the envelope's total area. */
  readonly logEnvelopeArea: number;
  /** Natural log of the squeeze's total area. */
  readonly logSqueezeArea: number;
  /** (squeeze area)/(envelope area): a proven lower bound of the acceptance rate (and of Z/(envelope area)). */
  readonly acceptanceBound: number;
  /** Branch-and-bound rounds of the setup. */
  readonly setupRounds: number;
}

/** A certified sampler; also describes its cells. */
export interface CertifiedSampler extends Sampler {
  /** Counters, with the interval evaluations. */
  readonly stats: CertifiedStats;
  /** The cells, their bounds and areas. */
  readonly cells: CertifiedDescription;
  /**
   * The same envelope as an {@link EnvelopeDescription} (transform `'log'`,
   * construction `'bounds'`, one piece per cell), for {@link envelopeSvg} and
   * {@link evaluateEnvelope}. Its touch points are the inner cell edges and
   * their "log-densities" the upper bounds `logDensityBounds(x, x)` (the
   * description evaluates nothing).
   */
  readonly envelope: EnvelopeDescription;
}

const KNOWN = ['targetAcceptance', 'maxCells', 'refine', 'maxRejections', 'seed', 'stream', 'uniform'] as const;

/**
 * An exact sampler for a target with interval bounds of its log-density:
 * the envelope is proven on every cell, so narrow modes cannot be missed.
 *
 * @remarks
 * **Method.** Region bounds with refinement (branch and bound; Dymetman,
 * Bouchard & Carter 2012, OS*; Maddison, Tarlow & Minka 2014). The support
 * is cut at its ends and at `target.mode` / `target.modes`; each cell
 * [a, b] gets an envelope proven from the bounds: the constant
 * e^U with [L, U] = `logDensityBounds(a, b)`, or, when the target has
 * `dLogDensityBounds` with [d⁻, d⁺] on the cell, the exponential
 * log f(x) ≤ U(a) + d⁺·(x − a) (or U(b) + d⁻·(x − b)), by the mean value
 * theorem, with U(a) from `logDensityBounds(a, a)`; whichever has the least
 * area. The exponential is what makes an infinite cell [a, ∞) integrable
 * (d⁺ < 0). The squeeze is the largest of e^L and the two exponentials
 * from the lower bounds. Cells whose envelope area minus squeeze area is
 * largest are split (midpoint; geometric steps on infinite cells; a max-heap
 * in typed arrays) until (squeeze area)/(envelope area) ≥
 * `targetAcceptance` or `maxCells`. Heights are widened by 1e-12·(1 + |h|)
 * in log space to cover this method's own rounding; all areas are handled as
 * logs (log-sum-exp).
 *
 * **Drawing.** A guide table (Chen & Asau 1974) picks a cell in O(1);
 * inversion gives a point in it; the candidate is accepted under the squeeze
 * without evaluating the target, else `logDensity` is evaluated and checked:
 * above the cell's envelope or below its squeeze is
 * {@link EnvelopeViolationError} (the bounds lied), NaN or +Infinity is
 * {@link NonFiniteDensityError}. With `refine`, the cells rejected
 * candidates fell in are split (three `logDensityBounds` and two
 * `dLogDensityBounds` calls each), in batches, and the table rebuilt, until
 * the acceptance bound reaches 0.999 or `maxCells`. Each candidate consumes
 * two or three uniforms: the cell; the position, which is the rest of the
 * cell-selecting uniform when the cell holds at least 2^-12 of the
 * envelope's area and a fresh uniform otherwise; the acceptance variable.
 *
 * **What is proven.** When the bounds are true, the envelope dominates the
 * density everywhere and the draws are exact. The library cannot verify the
 * bounds themselves except where it evaluates: every evaluation is checked.
 *
 * **What it cannot serve.** A density unbounded on a finite cell (a pole,
 * even an integrable one) and an infinite tail not proven to decay at
 * least exponentially (the derivative bound on [a, ∞) must be < 0): a
 * polynomial tail such as Student-t's or Cauchy's on the line has
 * sup (log f)′ = 0 on every [a, ∞) and is refused with
 * {@link ImproperDensityError}. {@link exactSampler} then falls back to its
 * scan.
 *
 * **Counts.** `stats.setupEvaluations` is 0 (setup evaluates no point);
 * interval evaluations are counted in `stats.boundEvaluations`,
 * `stats.setupBoundEvaluations` and `stats.derivativeBoundEvaluations`.
 * After an error while drawing the sampler is unusable (every later call
 * throws the same error), except after {@link StalledSamplerError} or a bad
 * value from an injected uniform source.
 * Since 0.1.0.
 *
 * @param target - a target with `logDensityBounds` (and, for infinite supports, `dLogDensityBounds`)
 * @param options - acceptance target, cell budget, refinement, uniform source
 * @returns the sampler, with its `cells` and `envelope` descriptions
 * @throws {@link InvalidTargetError} when the target has no `logDensityBounds`, or for bounds that are not pairs lo ≤ hi or contradict each other
 * @throws {@link InvalidOptionError} for an unknown option or a bad option value
 * @throws {@link ShapeViolationError} naming the cell when a finite cell keeps an upper bound of +Infinity (a pole) within the budget
 * @throws {@link ImproperDensityError} naming the cell when an infinite cell cannot be given an integrable envelope (no decay proven)
 * @throws {@link EnvelopeViolationError} at draw time, when an evaluation shows the bounds were wrong
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity
 * @throws {@link StalledSamplerError} after `maxRejections` consecutive rejections
 * @example
 * ```ts
 * // N(0, 1) with hand-written bounds: log f = −x²/2 is a parabola
 * const sq = (a: number, b: number): [number, number] => {
 *   const lo = a <= 0 && b >= 0 ? 0 : Math.min(a * a, b * b);
 *   return [lo, Math.max(a * a, b * b)];
 * };
 * const target = {
 *   logDensity: (x: number) => -0.5 * x * x,
 *   logDensityBounds: (a: number, b: number) => { const [q0, q1] = sq(a, b); return [-0.5 * q1, -0.5 * q0] as const; },
 *   dLogDensityBounds: (a: number, b: number) => [-b, -a] as const,
 * };
 * const s = certifiedSampler(target, { seed: 1 });
 * const xs = s.fill(new Float64Array(1000));
 * s.cells.acceptanceBound; // >= 0.99
 * ```
 */
export function certifiedSampler(target: Target, options?: CertifiedOptions): CertifiedSampler {
  const api = 'certifiedSampler';
  const t = checkTarget(api, target);
  checkOptionKeys(api, options, KNOWN);
  if (typeof target.logDensityBounds !== 'function') {
    throw new InvalidTargetError(
      `${api}: target.logDensityBounds must be a function (guaranteed bounds of logDensity over an interval), got ${typeof target.logDensityBounds}; without bounds use exactSampler or piecewiseSampler`,
    );
  }
  const opts: CertifiedOptions = options ?? {};
  const acc = opts.targetAcceptance ?? DEFAULT_CERTIFIED_ACCEPTANCE;
  if (typeof acc !== 'number' || !(acc >= 0.5 && acc <= 0.9999)) {
    throw new InvalidOptionError(`${api}: options.targetAcceptance must be a number in [0.5, 0.9999], got ${showValue(acc)}`);
  }
  const maxCells = opts.maxCells === undefined ? DEFAULT_CERTIFIED_MAX_CELLS : checkInteger(api, 'options.maxCells', opts.maxCells, 2, MAX_CERTIFIED_CELLS);
  const refine = resolveBoolean(api, 'options.refine', opts.refine, true);
  const maxRejections =
    resolveMaxRejections(api, opts.maxRejections);
  const uniform = resolveUniform(api, opts);

  const fb = target.logDensityBounds.bind(target) as BoundsFn;
  const fd = typeof target.dLogDensityBounds === 'function' ? (target.dLogDensityBounds.bind(target) as BoundsFn) : undefined;
  const oracle = new BoundsOracle(api, fb, fd);
  const edges: number[] = [];
  if (t.mode !== undefined) edges.push(t.mode);
  if (target.modes !== undefined) for (const m of target.modes) edges.push(m);
  const built = buildCells({ api, lower: t.lower, upper: t.upper, edges, targetAcceptance: acc, maxCells }, oracle);
  const setupBounds = oracle.boundEvaluations;
  const counters = new Counters();
  const state = new CertifiedState(api, built.cells, oracle, t.logDensity, uniform, counters, maxCells, maxRejections, refine);

  const draws = wrapDraws(api, (out, n) => certifiedFill(state, out, n));
  const support: readonly [number, number] = Object.freeze([t.lower, t.upper] as [number, number]);
  return {
    sample: draws.sample,
    fill: draws.fill,
    get stats(): CertifiedStats {
      return {
        ...counters.snapshot(),
        boundEvaluations: oracle.boundEvaluations,
        setupBoundEvaluations: setupBounds,
        derivativeBoundEvaluations: oracle.derivativeBoundEvaluations,
        cells: state.cells.n,
        refinements: state.refinements,
      };
    },
    get cells(): CertifiedDescription {
      return describeCells(state, support, built.rounds);
    },
    get envelope(): EnvelopeDescription {
      return envelopeOf(state, support);
    },
  };
}

/** Cell order left to right (cells are stored in split order). */
function order(s: CertifiedState): Int32Array {
  const c = s.cells;
  const idx = new Int32Array(c.n);
  for (let j = 0; j < c.n; j++) idx[j] = j;
  idx.sort((p, q) => c.lo[p] - c.lo[q] || c.hi[p] - c.hi[q]);
  return idx;
}

function describeCells(s: CertifiedState, support: readonly [number, number], rounds: number): CertifiedDescription {
  const c = s.cells;
  const cells: CertifiedCell[] = [];
  for (const j of order(s)) {
    cells.push(
      Object.freeze({
        lower: c.lo[j],
        upper: c.hi[j],
        logLower: c.bLo[j],
        logUpper: c.bHi[j],
        derivativeBounds: Object.freeze([c.dLo[j], c.dHi[j]] as [number, number]),
        envelope: c.eR[j] === 0 ? ('flat' as const) : ('exponential' as const),
        logEnvelopeArea: c.logEnv[j],
        logSqueezeArea: c.logSq[j],
      }),
    );
  }
  return Object.freeze({
    support,
    cells: Object.freeze(cells),
    logEnvelopeArea: s.logEnvelopeArea,
    logSqueezeArea: s.logSqueezeArea,
    acceptanceBound: exp(s.logSqueezeArea - s.logEnvelopeArea),
    setupRounds: rounds,
  });
}

function envelopeOf(s: CertifiedState, support: readonly [number, number]): EnvelopeDescription {
  const c = s.cells;
  const idx = order(s);
  let ref = -Infinity;
  for (const j of idx) if (c.eH[j] > ref && c.eH[j] < Infinity) ref = c.eH[j];
  if (!(ref > -Infinity)) ref = 0;
  const pieces: EnvelopePiece[] = [];
  const tp: number[] = [];
  const tl: number[] = [];
  for (const j of idx) {
    const a = c.lo[j];
    const p = c.eP[j];
    const anchor = p;
    const slope = p === a ? -c.eR[j] : c.eR[j];
    const sh = c.sH[j];
    pieces.push({
      lower: a,
      upper: c.hi[j],
      anchor,
      value: c.eH[j] - ref,
      slope,
      squeezeAnchor: c.sA[j],
      squeezeValue: sh === -Infinity ? -Infinity : sh - ref,
      squeezeSlope: c.sS[j],
      logArea: c.logEnv[j],
    });
    if (Number.isFinite(a) && a > support[0]) {
      tp.push(a);
      tl.push(c.aHi[j]);
    }
  }
  return {
    transform: 'log',
    construction: 'bounds',
    logScale: ref,
    support,
    touchPoints: tp,
    touchLogDensities: tl,
    pieces,
    logEnvelopeArea: s.logEnvelopeArea,
    logSqueezeArea: s.logSqueezeArea,
    derivativeEvaluations: 0,
  };
}

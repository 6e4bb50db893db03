/**
 * Setup of the hull engine shared by {@link adaptiveRejectionSampler} and
 * {@link tableSampler}: option validation, start points, refinement until the
 * envelope is valid and integrable. @internal
 *
 * @packageDocumentation
 */
import { Counters } from '../../core/counters.js';
import { ImproperDensityError, InvalidTargetError } from '../../core/errors.js';
import { InvalidOptionError } from '../../core/errors.js';
import type { SamplerOptions, Target, Uniform } from '../../core/types.js';
import type { TransformName } from '../envelope/transforms.js';
import { checkInteger, checkOptionKeys, checkTarget, evalLog, resolveBoolean, resolveMaxRejections } from '../../core/validate.js';
import type { CheckedTarget } from '../../core/validate.js';
import { resolveUniform } from '../../random/resolve.js';
import { Hull, nonFiniteDerivative } from './hull.js';
import { checkBeyondZero } from '../envelope/gaps.js';
import { SetupProbes } from './setup-probes.js';
import { automaticStartPoints, probeSlope } from './start.js';
import type { Probe, StartResult, StartSearch } from './start.js';
import { T_INV_SQRT, T_LOG } from '../envelope/transforms.js';

/**
 * Default of {@link AdaptiveRejectionOptions.maxPieces}: 100 pieces, i.e. 50
 * touch points.
 *
 * @remarks
 * The envelope has two pieces per touch point. With tangents the area
 * between envelope and target shrinks roughly like 1/k² in the number k of
 * well-placed touch points (common practice: the error of piecewise-linear
 * approximation of a smooth concave function), so that past a few dozen points
 * almost every draw is accepted under the squeeze; the cap bounds the memory
 * (about 20 numbers per piece) and the O(pieces) work each insertion costs
 * (shifting the arrays and rebuilding the guide table) for samplers that run
 * for millions of draws. A standard normal sampler reaches the 50 touch
 * points within its first 10,000 draws and from then on evaluates the target
 * at about 0.3 % of draws (measured in the tests: 0.6 % over the first
 * 10,000 draws, 0.3 % over the next 10,000).
 */
export const DEFAULT_MAX_PIECES = 100;

/** Refinement steps setup may take to make the envelope valid before giving up. */
export const SETUP_MAX_REFINEMENTS = 200;

/** A hull after setup, with what its sampler needs. @internal */
export interface HullSetup {
  /** The hull (valid, integrable, guide table built). */
  readonly hull: Hull;
  /** The checked target. */
  readonly target: CheckedTarget;
  /** Counters (setup evaluations already counted). */
  readonly counters: Counters;
  /** The resolved uniform source. */
  readonly uniform: Uniform;
  /** Consecutive rejections before a StalledSamplerError. */
  readonly maxRejections: number;
  /** True when `uniform` is a fresh MT19937 created from `seed` (not injected): nothing else draws from it. */
  readonly ownsUniform: boolean;
}

/** The hull options every hull-based sampler reads (a structural subset of their options types). @internal */
export interface HullOptionsInput extends SamplerOptions {
  readonly startPoints?: readonly number[];
  readonly maxPieces?: number;
  readonly derivativeFree?: boolean;
  readonly transform?: TransformName;
  readonly maxRejections?: number;
}

/** The hull options, resolved once: defaults applied, every value validated. @internal */
export interface ResolvedHullOptions {
  readonly target: CheckedTarget;
  /** Transform id. */
  readonly kind: number;
  /** Tangent construction (the target has dLogDensity and derivativeFree is not set). */
  readonly tangent: boolean;
  readonly maxPieces: number;
  readonly maxRejections: number;
  /** Checked start points, or undefined (automatic). */
  readonly startPoints: readonly number[] | undefined;
  readonly uniform: Uniform;
  /** True when `uniform` is a fresh MT19937 created from `seed` (not injected). */
  readonly ownsUniform: boolean;
}

/**
 * Checks the target, rejects keys not in `known`, and resolves the hull
 * options into a complete object (in this order, so that the first bad
 * input is the one reported).
 * @internal
 */
export function resolveHullOptions(api: string, target: Target, options: HullOptionsInput | undefined, known: readonly string[]): ResolvedHullOptions {
  const t = checkTarget(api, target);
  checkOptionKeys(api, options, known);
  const opts: HullOptionsInput = options ?? {};
  const transform = opts.transform ?? 'log';
  if (transform !== 'log' && transform !== 'inverse-sqrt') {
    throw new InvalidOptionError(`${api}: options.transform must be 'log' or 'inverse-sqrt', got ${String(transform)}`);
  }
  const derivativeFree = resolveBoolean(api, 'options.derivativeFree', opts.derivativeFree, false);
  const maxPieces = opts.maxPieces === undefined ? DEFAULT_MAX_PIECES : checkInteger(api, 'options.maxPieces', opts.maxPieces, 2, 1_000_000);
  const maxRejections = resolveMaxRejections(api, opts.maxRejections);
  const startPoints = opts.startPoints === undefined ? undefined : checkStartPoints(api, opts.startPoints, t.lower, t.upper);
  const uniform = resolveUniform(api, opts);
  return {
    target: t,
    kind: transform === 'log' ? T_LOG : T_INV_SQRT,
    tangent: t.dLogDensity !== undefined && !derivativeFree,
    maxPieces,
    maxRejections,
    startPoints,
    uniform,
    ownsUniform: opts.uniform === undefined,
  };
}

/**
 * Resolves the hull options ({@link resolveHullOptions}) and builds a
 * valid, integrable hull.
 * @internal
 */
export function setupHull(api: string, target: Target, options: HullOptionsInput | undefined, known: readonly string[]): HullSetup {
  return buildHull(api, resolveHullOptions(api, target, options, known));
}

/**
 * The counted, checked evaluations of hull setup (the {@link StartSearch}
 * the start-point search reads). A sampler that builds one hull after
 * another keeps one and resets it per target, so that a Gibbs step creates
 * no closures. @internal
 */
export class SetupEvaluator implements StartSearch {
  useDerivative = false;
  /** `dLogDensity` calls since the last {@link SetupEvaluator.reset}. */
  derivativeCalls = 0;
  private logf: (x: number) => number;
  private dlogf: ((x: number) => number) | undefined = undefined;

  /**
   * @param api - API name for messages
   * @param counters - where setup evaluations are counted
   */
  constructor(
    readonly api: string,
    private readonly counters: Counters,
  ) {
    this.logf = (): number => NaN;
  }

  /** Points the evaluations at a new target's functions. */
  reset(t: CheckedTarget, tangent: boolean): this {
    this.logf = t.logDensity;
    this.dlogf = t.dLogDensity;
    this.useDerivative = tangent;
    this.derivativeCalls = 0;
    return this;
  }

  /** Counted, checked log-density. */
  readonly evaluate = (x: number): number => {
    this.counters.setupEvaluations++;
    return evalLog(this.api, this.logf, x);
  };

  /** Counted, checked derivative (NaN and non-numbers are errors; ±Infinity is returned). */
  readonly derivative = (x: number): number => {
    this.derivativeCalls++;
    const g = (this.dlogf as (y: number) => number)(x);
    if (g !== g || typeof g !== 'number') nonFiniteDerivative(this.api, x, g);
    return g;
  };
}

/**
 * What a sampler that reuses one hull for a sequence of targets brings to
 * {@link buildHull}: the hull to reset (its storage is kept), the counters
 * to add to, the evaluator and probing state to reset (bound to `counters`
 * and `hull`), and optionally a start other than the automatic one. @internal
 */
export interface HullReuse {
  readonly hull: Hull;
  readonly counters: Counters;
  readonly evaluator: SetupEvaluator;
  readonly probes: SetupProbes;
  /** Start points from what is known of earlier targets; undefined: the automatic start (as a fresh hull). */
  readonly start: ((s: StartSearch, lower: number, upper: number, mode: number | undefined) => StartResult) | undefined;
}

/** True when a start probe can become a touch point (finite value, and a finite derivative with tangents). */
function usable(p: Probe, tangent: boolean): boolean {
  return p.l > -Infinity && (!tangent || Number.isFinite(p.g));
}

/**
 * Where a zero of the density cut the support during setup (the hull's
 * effective end moved inward from `checkedLower`/`checkedUpper`): look
 * beyond it (issue 17: never a one-sided sample).
 */
function checkCuts(api: string, evaluate: (x: number) => number, hull: Hull, checkedLower: number, checkedUpper: number): void {
  const k = hull.k;
  if (k === 0) return;
  const span = hull.touchX[k - 1] - hull.touchX[0];
  if (hull.lower > checkedLower) checkBeyondZero(api, evaluate, hull.lower, hull.touchX[0], checkedLower, span);
  if (hull.upper < checkedUpper) checkBeyondZero(api, evaluate, hull.upper, hull.touchX[k - 1], checkedUpper, span);
}

/**
 * Builds a valid, integrable hull from resolved options; with `reuse`, in
 * the given hull's storage (the same steps, so with the automatic start the
 * same hull as a fresh one). @internal
 */
export function buildHull(api: string, o: ResolvedHullOptions, reuse?: HullReuse): HullSetup {
  const t = o.target;
  const kind = o.kind;
  const tangent = o.tangent;
  const maxPieces = o.maxPieces;
  const start = o.startPoints;
  const counters = reuse === undefined ? new Counters() : reuse.counters;
  const ev = (reuse === undefined ? new SetupEvaluator(api, counters) : reuse.evaluator).reset(t, tangent);
  const evaluate = ev.evaluate;

  let probes: Probe[];
  let scale: number;
  if (start === undefined) {
    const r = reuse?.start !== undefined ? reuse.start(ev, t.lower, t.upper, t.mode) : automaticStartPoints(ev, t.lower, t.upper, t.mode);
    probes = r.probes;
    scale = r.scale;
  } else {
    probes = start.map((x) => {
      const l = evaluate(x);
      return { x, l, g: probeSlope(ev, x, l) };
    });
    scale = start.length > 1 ? start[start.length - 1] - start[0] : Math.max(1, Math.abs(start[0]) * 1e-8);
  }
  let ref = -Infinity;
  let nUsable = 0;
  for (let i = 0; i < probes.length; i++) {
    const p = probes[i];
    if (usable(p, tangent)) {
      if (p.l > ref) ref = p.l;
      nUsable++;
    }
  }
  if (nUsable === 0) {
    throw new InvalidTargetError(
      `${api}: no start point has a finite log-density${tangent ? ' and a finite derivative' : ''} (points tried: ${probes.map((p) => p.x).join(', ')}); give startPoints inside the support where the density is positive`,
    );
  }
  const cap = Math.max(Math.floor(maxPieces / 2), nUsable) + 4;
  // the checked target is the hull's target (its logDensity and dLogDensity are what the kernel calls)
  const hull = reuse === undefined ? new Hull(api, kind, tangent, t, t.lower, t.upper, ref, cap) : reuse.hull.reset(t, tangent, t.lower, t.upper, ref, cap, reuse.start !== undefined);
  const step = scale > 0 && scale < Infinity ? scale : 1;
  const next = reuse === undefined ? new SetupProbes(hull, step) : reuse.probes.reset(step);
  // the start points first without pieces, then every piece once (the same hull as inserting them one by one)
  for (let i = 0; i < probes.length; i++) {
    const p = probes[i];
    if (usable(p, tangent)) hull.insert(p.x, p.l, p.g, true, false);
  }
  hull.rebuildAll();
  for (let i = 0; i < probes.length; i++) {
    const p = probes[i];
    if (p.l === -Infinity) hull.insert(p.x, p.l, p.g, true);
  }
  // a zero that cuts the support: look beyond it (issue 17: never a one-sided sample)
  checkCuts(api, evaluate, hull, t.lower, t.upper);
  const checkedLower = hull.lower;
  const checkedUpper = hull.upper;
  let stuck = 0;
  let refinements = 0;
  for (;;) {
    const x = next.next();
    if (x !== x) break;
    if (++refinements > SETUP_MAX_REFINEMENTS) {
      throw new ImproperDensityError(
        `${api}: no integrable envelope after ${SETUP_MAX_REFINEMENTS} setup refinements on [${hull.lower}, ${hull.upper}] (${hull.k} touch points from ${hull.touchX[0]} to ${hull.touchX[hull.k - 1]}); the target may not be ${hull.shapeName()} or its tails may not decay`,
      );
    }
    const l = evaluate(x);
    const g = probeSlope(ev, x, l);
    if (tangent && l > -Infinity && !Number.isFinite(g)) {
      if (++stuck > 20) break;
      continue;
    }
    if (!hull.insert(x, l, g, true) && ++stuck > 20) break;
  }
  checkCuts(api, evaluate, hull, checkedLower, checkedUpper);
  const top = hull.maxRelativeHeight();
  // a warm start skips the second build where the log hull's top is near its reference (the kernel works
  // with relative values; the reference only keeps the areas in range)
  const keepRef = reuse?.start !== undefined && kind === T_LOG && Math.abs(top) <= 32;
  if (!keepRef && top > -Infinity && top < Infinity) hull.rebase(hull.ref + top);
  hull.maxK = Math.max(Math.floor(maxPieces / 2), hull.k);
  hull.derivativeEvaluations = ev.derivativeCalls;
  hull.buildGuide();
  return { hull, target: t, counters, uniform: o.uniform, maxRejections: o.maxRejections, ownsUniform: o.ownsUniform };
}

function checkStartPoints(api: string, pts: readonly number[], lower: number, upper: number): number[] {
  if (!Array.isArray(pts)) {
    throw new InvalidOptionError(`${api}: options.startPoints must be an array of numbers, got ${String(pts)}`);
  }
  if (pts.length === 0) throw new InvalidOptionError(`${api}: options.startPoints must not be empty`);
  const out: number[] = [];
  for (let i = 0; i < pts.length; i++) {
    const x = pts[i] as unknown;
    if (typeof x !== 'number' || !Number.isFinite(x)) {
      throw new InvalidOptionError(`${api}: options.startPoints[${i}] must be a finite number, got ${String(x)}`);
    }
    if (x < lower || x > upper) {
      throw new InvalidOptionError(`${api}: options.startPoints[${i}] = ${x} lies outside the support [${lower}, ${upper}]`);
    }
    out.push(x);
  }
  out.sort((a, b) => a - b);
  for (let i = 1; i < out.length; i++) {
    if (out[i] === out[i - 1]) throw new InvalidOptionError(`${api}: options.startPoints contains ${out[i]} twice`);
  }
  return out;
}

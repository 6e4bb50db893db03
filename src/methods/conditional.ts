/**
 * A hull sampler for a target that changes between draws (the full
 * conditionals of a Gibbs sampler), reusing its storage and options.
 *
 * @packageDocumentation
 */
import { Counters } from '../core/counters.js';
import { wrapDraws } from '../core/draws.js';
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
import type { Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import { CheckedTargetCache, checkInteger, checkOptionKeys, resolveBoolean, resolveMaxRejections, showValue } from '../core/validate.js';
import type { CheckedTarget } from '../core/validate.js';
import type { EnvelopeDescription } from './envelope/description.js';
import { T_INV_SQRT, T_LOG } from './envelope/transforms.js';
import type { TransformName } from './envelope/transforms.js';
import { describeHull } from './hull/describe.js';
import { Hull } from './hull/hull.js';
import { hullFill } from './hull/kernel.js';
import { DEFAULT_MAX_PIECES, SetupEvaluator, buildHull } from './hull/setup.js';
import { SetupProbes } from './hull/setup-probes.js';
import type { HullReuse, ResolvedHullOptions } from './hull/setup.js';
import { ProbePool, hullCentre, warmStartPoints } from './hull/warm-start.js';
import type { WarmCentre } from './hull/warm-start.js';
import { resolveUniform } from '../random/resolve.js';
import { UniformBlock } from '../random/uniform-block.js';

/** Options of {@link conditionalSampler}, resolved once for every target it is given. */
export interface ConditionalSamplerOptions extends SamplerOptions {
  /**
   * Place the start points of each new target from the mode and scale of
   * the previous target's hull (and the new target's `mode` hint, if any)
   * instead of searching for the mode. Set it to `false` to get, on the
   * same uniform stream, exactly the draws of a fresh
   * {@link adaptiveRejectionSampler} for every target (at the cost of its
   * search: about 9 evaluations per target instead of 3–4).
   * @defaultValue true
   */
  warmStart?: boolean;
  /** As {@link AdaptiveRejectionOptions.maxPieces}, for each target. @defaultValue {@link DEFAULT_MAX_PIECES} (100) */
  maxPieces?: number;
  /** As {@link AdaptiveRejectionOptions.derivativeFree}. @defaultValue false */
  derivativeFree?: boolean;
  /** As {@link AdaptiveRejectionOptions.transform}. @defaultValue 'log' */
  transform?: TransformName;
  /** Consecutive rejections before {@link StalledSamplerError}. @defaultValue 1,000,000 */
  maxRejections?: number;
}

/** Counts of a {@link ConditionalSampler}, summed over every target it was given. */
export interface ConditionalSamplerStats extends SamplerStats {
  /** Targets given (successful {@link ConditionalSampler.retarget} calls). */
  readonly targets: number;
  /** Calls of `dLogDensity` (setup and sampling), summed over the targets. */
  readonly derivativeEvaluations: number;
}

/** A hull sampler whose target can be replaced; see {@link conditionalSampler}. */
export interface ConditionalSampler extends Sampler {
  /**
   * Makes `target` the sampler's target: checks it (as
   * {@link adaptiveRejectionSampler} does) and builds its hull in the
   * sampler's storage. Later `sample`/`fill` calls draw from it. Returns the
   * sampler, so that `s.retarget(t).sample()` reads as one step.
   * @throws the errors of {@link adaptiveRejectionSampler}'s setup; the sampler then has no target until the next successful call
   */
  retarget(target: Target): ConditionalSampler;
  /** `retarget(target).sample()`: one draw from a new target. */
  draw(target: Target): number;
  /** Counts summed over every target given so far; fresh object on every access. */
  readonly stats: ConditionalSamplerStats;
  /** Snapshot of the current target's envelope (fresh arrays on every access); throws when there is no target. */
  readonly envelope: EnvelopeDescription;
}

const API = 'conditionalSampler';
const KNOWN = ['warmStart', 'maxPieces', 'derivativeFree', 'transform', 'maxRejections', 'seed', 'stream', 'uniform'] as const;

/**
 * Adaptive rejection sampling (Gilks & Wild 1992; secants Gilks 1992;
 * transformed density rejection, Hörmann 1995) for a sequence of targets,
 * each taking a few draws: the full conditionals of a Gibbs sampler.
 *
 * @remarks
 * One sampler serves the whole chain: options are resolved and the uniform
 * source is created once, the hull's storage is allocated once and reused,
 * and — with `warmStart` (the default) — each new target's start points are
 * placed from the previous target's mode and scale (see below) instead of
 * being searched for. The method, the checks and the errors are those of
 * {@link adaptiveRejectionSampler}: every target is validated, every
 * evaluation is checked against envelope and squeeze, every touch point
 * against its neighbours' shape, and draws are exact for every T-concave
 * target, whatever the start points.
 *
 * **Start points.** The first target, and every target after a failed
 * one, starts as a fresh {@link adaptiveRejectionSampler} does (mode hint,
 * or a search). With `warmStart`, a later target with centre c (its `mode`
 * hint, or the previous centre) and the previous scale σ is probed at
 * c ± σ with tangents and at c − σ, c, c + σ without; when these do not
 * bracket the mode, a few more probes follow where a quadratic fit puts it.
 * The centre and scale kept for the next target come from the touch points
 * of the current hull (the zero of the derivative interpolated where it
 * changes sign, or the vertex of the parabola through the highest points).
 * On the `bench/gibbs.mjs` workload (a gamma-shaped conditional whose shape
 * and rate change at every step) this takes 3–4 evaluations per one-draw
 * step instead of 9 (figures: CHANGELOG.md).
 *
 * **Stream.** Each candidate consumes two or three uniforms, as in
 * {@link adaptiveRejectionSampler}; the stream continues from target to
 * target. With `warmStart: false` the sampler gives, for every target, the
 * draws that a fresh `adaptiveRejectionSampler(target, { uniform })` would
 * give on the same stream (same options). With `warmStart` the hulls differ,
 * so the draws differ (the distribution does not); they are reproducible for
 * a given seed and sequence of targets.
 *
 * **After a failure.** An error while drawing from a target that shows
 * the sampler cannot draw from it correctly (shape or envelope violation,
 * non-finite density, an exception of the target) is thrown again by every
 * later `sample`/`fill` until the next `retarget`, which starts the new
 * target afresh (no warm start). A stall leaves the target usable. Counts:
 * `stats` sums over all targets; `setupEvaluations` are the
 * `logDensity` calls of every target's setup. Since 0.2.0.
 *
 * @param options - warm start, hull options (as {@link adaptiveRejectionSampler}), uniform source
 * @returns the sampler, without a target: call {@link ConditionalSampler.retarget} (or `draw`) first
 * @throws {@link InvalidTargetError} or {@link InvalidOptionError} for bad options
 * @example
 * ```ts
 * import { conditionalSampler, substream } from 'exactdraw';
 *
 * let a = 2.5;
 * let b = 1.3;
 * const conditional = {
 *   support: [0, Infinity] as const,
 *   logDensity: (t: number) => (a - 1) * Math.log(t) - b * t,
 *   dLogDensity: (t: number) => (a - 1) / t - b,
 * };
 * const s = conditionalSampler({ uniform: substream(2026, 0) });
 * for (let step = 0; step < 1000; step++) {
 *   a = 1.5 + (step % 11) * 0.4;   // the state of the chain changes the conditional
 *   b = 0.5 + (step % 7) * 0.25;
 *   const tau = s.draw(conditional);   // = s.retarget(conditional).sample()
 * }
 * s.stats.setupEvaluations / s.stats.targets;   // about 3 evaluations per step
 * ```
 */
export function conditionalSampler(options?: ConditionalSamplerOptions): ConditionalSampler {
  checkOptionKeys(API, options, KNOWN);
  const opts: ConditionalSamplerOptions = options ?? {};
  const warm = resolveBoolean(API, 'options.warmStart', opts.warmStart, true);
  const transform = opts.transform ?? 'log';
  if (transform !== 'log' && transform !== 'inverse-sqrt') {
    throw new InvalidOptionError(`${API}: options.transform must be 'log' or 'inverse-sqrt', got ${showValue(transform)}`);
  }
  const derivativeFree = resolveBoolean(API, 'options.derivativeFree', opts.derivativeFree, false);
  const maxPieces = opts.maxPieces === undefined ? DEFAULT_MAX_PIECES : checkInteger(API, 'options.maxPieces', opts.maxPieces, 2, 1_000_000);
  const maxRejections = resolveMaxRejections(API, opts.maxRejections);
  const uniform = resolveUniform(API, opts);
  const ownsUniform = opts.uniform === undefined;
  const blk = UniformBlock.of(uniform, ownsUniform);
  const kind = transform === 'log' ? T_LOG : T_INV_SQRT;
  const counters = new Counters();
  const nothing = (): number => NaN;
  const hull = new Hull(API, kind, false, { logDensity: nothing, dLogDensity: undefined }, -Infinity, Infinity, 0, Math.floor(maxPieces / 2) + 4);
  let hasTarget = false;
  let targets = 0;
  let derivatives = 0;
  // everything a step needs is made here, once: the checked target, the setup's evaluator and probing
  // state, the options object and the warm centre are rewritten per target (a step allocates no closures)
  const checked = new CheckedTargetCache();
  const evaluator = new SetupEvaluator(API, counters);
  const probes = new SetupProbes(hull, 1);
  const centre: WarmCentre = { centre: 0, scale: 1 };
  let warmNext = false;
  const pool = new ProbePool();
  const warmStart: HullReuse['start'] = (search, lower, upper, mode) => warmStartPoints(search, lower, upper, mode, centre, pool);
  const reuseCold: HullReuse = { hull, counters, evaluator, probes, start: undefined };
  const reuseWarm: HullReuse = { hull, counters, evaluator, probes, start: warmStart };
  const o: { -readonly [K in keyof ResolvedHullOptions]: ResolvedHullOptions[K] } = {
    target: undefined as unknown as CheckedTarget,
    kind,
    tangent: false,
    maxPieces,
    maxRejections,
    startPoints: undefined,
    uniform,
    ownsUniform,
  };
  // the one sample/fill wrapper (core/draws.ts); retarget forgets a failure of the previous target
  const draws = wrapDraws(API, (out, n) => {
    if (!hasTarget) throw new InvalidTargetError(`${API}: no target to draw from: call retarget(target) first (or the last retarget threw)`);
    hullFill(hull, out, n, counters, blk, maxRejections);
  });

  const sampler: ConditionalSampler = {
    retarget(target: Target): ConditionalSampler {
      // what the previous target's hull tells about the next one; nothing for the first target or after a failure
      if (warm && hasTarget && !draws.failed()) {
        // the first estimate falls back on centre 0, scale 1; later ones on the previous estimate
        if (!warmNext) {
          centre.centre = 0;
          centre.scale = 1;
        }
        hullCentre(hull, centre, centre);
        warmNext = true;
      } else {
        warmNext = false;
      }
      if (hasTarget) derivatives += hull.derivativeEvaluations;
      hasTarget = false;
      draws.clearFailure();
      const t = checked.check(API, target);
      o.target = t;
      o.tangent = t.dLogDensity !== undefined && !derivativeFree;
      buildHull(API, o, warmNext ? reuseWarm : reuseCold);
      hasTarget = true;
      targets++;
      return sampler;
    },
    draw(target: Target): number {
      sampler.retarget(target);
      return draws.sample();
    },
    sample: draws.sample,
    fill: draws.fill,
    get stats(): ConditionalSamplerStats {
      const s = counters.snapshot();
      return { ...s, targets, derivativeEvaluations: derivatives + (hasTarget ? hull.derivativeEvaluations : 0) };
    },
    get envelope(): EnvelopeDescription {
      if (!hasTarget) throw new InvalidTargetError(`${API}: no target: call retarget(target) first`);
      return describeHull(hull);
    },
  };
  return sampler;
}

/**
 * Ratio-of-uniforms sampler with an automatic bounding rectangle, shift and
 * power r (Kinderman & Monahan 1977; Wakefield, Gelfand & Smith 1991).
 *
 * @packageDocumentation
 */
import { Counters } from '../core/counters.js';
import { EnvelopeViolationError, InvalidOptionError, InvalidTargetError, NonFiniteDensityError, StalledSamplerError } from '../core/errors.js';
import { checkLogDensity } from '../core/evaluate.js';
import type { Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import { wrapDraws } from '../core/draws.js';
import { checkFinite, checkOptionKeys, checkPositive, checkTarget, resolveMaxRejections } from '../core/validate.js';
import { resolveUniform } from '../random/resolve.js';
import { UniformBlock, nextUniform } from '../random/uniform-block.js';
import { checkMassBeyondDoubles, computeRectangle } from './ratio-of-uniforms/bounds.js';
import { explainPole, readPoleOption, samplerAcrossPole } from './transform/sampler.js';
import { areaX, pointX } from './transform/standardise.js';
import type { Forward, Standardisation } from './transform/standardise.js';
import { cellWidthOf, isStandardised, markFinal, samplerZFirst, sourceOf, standardisationOf } from './transform/standardise.js';
import type { PoleOption } from './transform/sampler.js';
import { log, pow } from '../vendor/math.js';

/** Options of {@link ratioOfUniformsSampler}. */
export interface RatioOfUniformsOptions extends SamplerOptions {
  /**
   * The power r > 0 of the region {(u, v): 0 < u ≤ f(v/u^r + shift)^(1/(r+1))}.
   * r = 1 is the method of Kinderman & Monahan (1977); general r is from
   * Wakefield, Gelfand & Smith (1991). A larger r bounds heavier tails: a tail
   * decaying like |x|^(−α) needs r ≥ 1/(α − 1) (r ≥ 1 for the Cauchy).
   * @defaultValue 1
   */
  power?: number;
  /**
   * The shift s: candidates are x = v/u^r + s. Any finite value gives exact
   * draws; the mode gives a small rectangle.
   * @defaultValue the target's mode hint, else the maximiser of logDensity found numerically. A
   * mode hint used as the shift is verified: if the search finds logDensity larger than at the
   * hint by more than 1e-6·(1 + |sup log f|), the factory throws {@link InvalidTargetError}.
   */
  shift?: number;
  /**
   * Optional squeeze: a cheap function q with q(x) ≤ logDensity(x) (same
   * unnormalized scale). A candidate with (r+1)·log u ≤ q(x) − log M is
   * accepted without evaluating the target. There is no built-in squeeze,
   * because none is valid for every target; a squeeze found above the target
   * (by more than 1e-12·(1 + |log f|), rounding) at a point where the target is
   * evaluated anyway throws {@link EnvelopeViolationError}.
   */
  squeeze?: (x: number) => number;
  /**
   * Consecutive rejections before {@link StalledSamplerError}.
   * @defaultValue 1,000,000
   */
  maxRejections?: number;
  /**
   * The density has an integrable pole at this end of the support
   * (`'lower'`, `'upper'`, `'both'`), or `'auto'`: the target's declared
   * `poles`, else a search of the finite ends. The sampler then draws the
   * transformed variable Y = log(X − a), log(b − X) or logit((X − a)/(b − a))
   * (see {@link poleTransform}), whose density is bounded, and maps each
   * draw back; `region` and `logEnvelope` describe Y. Not allowed together
   * with `shift` or `squeeze` (given in x). Without it, a density unbounded
   * at an end is refused with a message that names the end and suggests
   * this option.
   * @defaultValue undefined (no change of variables)
   */
  poleAt?: PoleOption;
}

/**
 * Read-only description of the bounding rectangle of a
 * {@link ratioOfUniformsSampler}, for plots and audits.
 *
 * @remarks
 * Coordinates: the sampler works with f̃ = f / M, M = exp(logDensityBound),
 * so that u ranges over (0, 1] and v over [scaledVMin, scaledVMax]; a point
 * is accepted when u ≤ f̃(x)^(1/(r+1)) with x = v/u^r + shift. In the
 * coordinates of the unnormalized target itself, u ≤ exp(logUMax) and
 * v ∈ [−exp(logVMinAbs), exp(logVMax)] (logs, so that 1e-300 densities do
 * not underflow).
 *
 * The region has area Z/(r + 1), Z = ∫ f, so the acceptance rate is
 * Z / ((r + 1)·exp(logRectangleArea)); a user who knows log Z (e.g. 0 for a
 * normalized target) gets the exact expected rate from it. The fields
 * `estimatedAcceptance` and `logRegionAreaEstimate` estimate these from the
 * sampler's own counts so far.
 */
export interface RatioOfUniformsRegion {
  /** The power r. */
  readonly power: number;
  /** The shift s. */
  readonly shift: number;
  /** Estimated sup of logDensity (found by the search, no margin). */
  readonly logDensityMax: number;
  /** Where the search found that sup. */
  readonly argmax: number;
  /** `logDensityMax` plus the safety margin: log M, the log-density bound in use. */
  readonly logDensityBound: number;
  /** log of the u-bound, `logDensityBound / (r + 1)`. */
  readonly logUMax: number;
  /** log of the upper v-bound (−Infinity when the target has no mass above the shift). */
  readonly logVMax: number;
  /** log of minus the lower v-bound (−Infinity when the target has no mass below the shift). */
  readonly logVMinAbs: number;
  /** Lower v-bound with u normalised to (0, 1] (f divided by M); ≤ 0. */
  readonly scaledVMin: number;
  /** Upper v-bound with u normalised to (0, 1] (f divided by M); ≥ 0. */
  readonly scaledVMax: number;
  /** log of the rectangle's area, `logDensityBound + log(scaledVMax − scaledVMin)`. */
  readonly logRectangleArea: number;
  /** Acceptance rate so far, `samples / proposals` (NaN before the first proposal). */
  readonly estimatedAcceptance: number;
  /** Binomial standard error of `estimatedAcceptance` (NaN before the first proposal). */
  readonly acceptanceStandardError: number;
  /** log of the region's area estimated from the counts so far, `logRectangleArea + log(estimatedAcceptance)`; it estimates log(Z/(r+1)). */
  readonly logRegionAreaEstimate: number;
}

/** A ratio-of-uniforms sampler; also exposes its bounding rectangle. */
export interface RatioOfUniformsSampler extends Sampler {
  /** A fresh description of the bounding rectangle (and the acceptance so far) on each access. */
  readonly region: RatioOfUniformsRegion;
  /**
   * log of the dominating function implied by the rectangle:
   * log M + min(0, ((r+1)/r)·(log vb − log|x − s|)), with vb the v-bound on
   * x's side of the shift. The target must lie below it everywhere; this is
   * what every density evaluation checks.
   * @param x - a point
   */
  logEnvelope(x: number): number;
}

/**
 * Relative tolerance of the squeeze check, in log space: a squeeze above the
 * target by less than 1e-12·(1 + |log f|) is taken as rounding, not as a violation.
 */
const SQUEEZE_TOLERANCE = 1e-12;

const KNOWN = ['power', 'shift', 'squeeze', 'maxRejections', 'seed', 'stream', 'uniform', 'poleAt'] as const;

/**
 * Ratio-of-uniforms sampler (Kinderman & Monahan 1977) with power r
 * (Wakefield, Gelfand & Smith 1991) and an automatic bounding rectangle.
 *
 * @remarks
 * The region A = {(u, v): 0 < u ≤ f(v/u^r + s)^(1/(r+1))} has area Z/(r+1)
 * and, for (u, v) uniform on A, x = v/u^r + s has density f/Z. A is enclosed
 * in the rectangle u ∈ (0, sup f^(1/(r+1))], v ∈ [vMin, vMax] with
 * vMax = sup over x > s of (x − s)·f(x)^(r/(r+1)) and
 * vMin = −sup over x < s of (s − x)·f(x)^(r/(r+1)); points uniform on the
 * rectangle are accepted when they fall in A.
 *
 * Setup: the three suprema are found in log space by a robust global search
 * (geometric probes, a mapped grid and golden-section refinement, a few
 * thousand evaluations of logDensity, counted in `stats.setupEvaluations`)
 * on f / M with M its sup, so 1e-300 densities work; each located maximiser
 * is then polished by scanning the doubles within about ±32 ulps of it. Each
 * located sup b (a log) is enlarged to b + 1e-9 + 1e-12·|b|, i.e. each side of
 * the rectangle by a relative 1e-9 (safety margin). At a finite end of the
 * support, log f is probed at distances shrinking by factors of 256 down to
 * the closest representable one; if it is still rising there (by more than
 * 1e-3 per step, not shrinking) the density is unbounded. On a finite support the
 * v-bounds are also capped by (upper − s) and (s − lower). When a bound is
 * infinite the factory throws instead of sampling: a density unbounded at an
 * end of the support (sup f infinite for every r; e.g. gamma(0.5) or
 * beta(0.7, 3) at 0), or a tail too heavy for this r (the message gives the
 * measured tail exponent and the power that would work).
 *
 * Draws: per candidate, u = 1 − U₁ ∈ (0, 1] and v = vMin + (vMax − vMin)·U₂
 * (two uniforms, in this order; this is part of the stream contract); x is
 * rejected without evaluation when it lies outside the support or is not
 * finite, else accepted when (r+1)·log u ≤ log f(x) − log M (or, first,
 * ≤ squeeze(x) − log M). Every density evaluation checks that f(x) ≤ M and
 * that |x − s|·(f(x)/M)^(r/(r+1)) is within the v-bound of its side (the
 * rectangle contains the region's slice at x); a violation throws
 * {@link EnvelopeViolationError} — it means a sup was underestimated.
 * The equivalent dominating function is exposed as `logEnvelope(x)`. After
 * such an error or a {@link NonFiniteDensityError} the sampler is unusable:
 * every later call throws the same error; after `fill` throws, `out` holds
 * the draws completed before the failure and is unchanged beyond them.
 *
 * Squeeze: none is built in, because no squeeze inside the region is valid
 * for every target (an inscribed polygon needs the region to be convex,
 * which holds only for special shapes and cannot be verified from point
 * evaluations); a user-supplied lower bound of logDensity can be given as
 * `squeeze`.
 *
 * @param target - the target (unnormalized log-density; bounded density)
 * @param options - power, shift, optional squeeze and uniform source
 * @returns the sampler, with its `region` description
 * @throws {@link InvalidTargetError} for bad inputs, an unbounded density, a
 *   tail too heavy for the power, a mode hint that is not a mode, or more than
 *   2^−53 of the mass beyond ±1.8e308 (such draws would be ±Infinity and cannot be
 *   tested; the message gives the share — truncate the support or sample log|x|)
 * @throws {@link ImproperDensityError} when a tail does not decay
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity
 * @throws {@link EnvelopeViolationError} at draw time when the rectangle is proven too small
 * @throws {@link StalledSamplerError} after `maxRejections` consecutive rejections
 * @example
 * ```ts
 * const s = ratioOfUniformsSampler(studentTTarget(5), { seed: 7 });
 * const xs = s.fill(new Float64Array(1000));
 * s.region.logRectangleArea;
 * // Cauchy tails (|x|^−2) need power r ≥ 1; r = 0.5 throws InvalidTargetError.
 * const cauchy = { logDensity: (x: number) => -Math.log1p(x * x) };
 * ratioOfUniformsSampler(cauchy, { power: 1, seed: 1 }).sample();
 * ```
 */
export function ratioOfUniformsSampler(target: Target, options: RatioOfUniformsOptions = {}): RatioOfUniformsSampler {
  const api = 'ratioOfUniformsSampler';
  checkOptionKeys(api, options, KNOWN);
  const pole = readPoleOption(api, options);
  if (pole !== undefined) {
    if (options.shift !== undefined || options.squeeze !== undefined) {
      throw new InvalidOptionError(`${api}: options.shift and options.squeeze (given in x) cannot be combined with options.poleAt = '${pole}' (the region is built in the transformed variable)`);
    }
    return samplerAcrossPole(api, target, pole, options, ratioOfUniformsSampler, ['region', 'logEnvelope']);
  }
  const power = options.power === undefined ? 1 : checkPositive(api, 'options.power', options.power);
  const shift = options.shift === undefined ? undefined : checkFinite(api, 'options.shift', options.shift);
  const squeeze = options.squeeze;
  if (squeeze !== undefined && typeof squeeze !== 'function') {
    throw new InvalidOptionError(`${api}: options.squeeze must be a function when given, got ${typeof squeeze}`);
  }
  const maxRejections = resolveMaxRejections(api, options.maxRejections);
  const uniform = resolveUniform(api, options);
  const t = checkTarget(api, target);
  if (shift === undefined && squeeze === undefined && !isStandardised(target)) {
    // Build the rectangle in the standardised coordinate (src/methods/transform/standardise.ts).
    return samplerZFirst(api, target, t, (z) => ratioOfUniformsSampler(z, options), RATIO_FORWARD, { order: 'z-first', maxGrain: Infinity });
  }
  let rect: ReturnType<typeof computeRectangle>;
  try {
    rect = computeRectangle(api, t, power, shift, cellWidthOf(target));
  } catch (e) {
    throw explainPole(api, target, e);
  }
  // the mass beyond the largest double is judged in x, also for a rectangle built in z
  const map = standardisationOf(target);
  const source = sourceOf(target);
  rect.evaluations += map !== undefined && source !== undefined ? checkMassBeyondDoubles(api, source, rect, power, map, markFinal) : checkMassBeyondDoubles(api, t, rect, power);
  // an owned MT19937 is read in blocks (the same values in the same order as one call at a time)
  const blk = UniformBlock.of(uniform, options.uniform === undefined);
  return new RatioOfUniforms(api, t.logDensity, t.lower, t.upper, power, rect, squeeze, maxRejections, blk);
}

/** The sampler; all constants fixed at construction, one flat kernel for sample and fill. */
class RatioOfUniforms implements RatioOfUniformsSampler {
  private readonly counters = new Counters();
  private readonly r1: number;
  private readonly vWidth: number;
  private readonly ratio: number;
  private readonly regionBase: Omit<RatioOfUniformsRegion, 'estimatedAcceptance' | 'acceptanceStandardError' | 'logRegionAreaEstimate'>;

  constructor(
    private readonly api: string,
    private readonly logf: (x: number) => number,
    private readonly lower: number,
    private readonly upper: number,
    private readonly power: number,
    private readonly rect: {
      shift: number;
      logDensityMax: number;
      logDensityBound: number;
      argmax: number;
      vMax: number;
      vMin: number;
      logVMax: number;
      logVMinAbs: number;
      evaluations: number;
    },
    private readonly squeeze: ((x: number) => number) | undefined,
    private readonly maxRejections: number,
    private readonly blk: UniformBlock,
  ) {
    this.r1 = power + 1;
    this.vWidth = rect.vMax - rect.vMin;
    this.ratio = (power + 1) / power;
    this.counters.setupEvaluations = rect.evaluations;
    const LM = rect.logDensityBound;
    const k = power / (power + 1);
    this.regionBase = Object.freeze({
      power,
      shift: rect.shift,
      logDensityMax: rect.logDensityMax,
      argmax: rect.argmax,
      logDensityBound: LM,
      logUMax: LM / (power + 1),
      logVMax: rect.logVMax + k * LM,
      logVMinAbs: rect.logVMinAbs + k * LM,
      scaledVMin: rect.vMin,
      scaledVMax: rect.vMax,
      logRectangleArea: LM + log(this.vWidth),
    });
    const draws = wrapDraws(api, (out, n) => this.run(out, n));
    this.sample = draws.sample;
    this.fill = draws.fill;
  }

  get stats(): SamplerStats {
    return this.counters.snapshot();
  }

  get region(): RatioOfUniformsRegion {
    const { samples, proposals } = this.counters;
    const p = proposals > 0 ? samples / proposals : NaN;
    return Object.freeze({
      ...this.regionBase,
      estimatedAcceptance: p,
      acceptanceStandardError: proposals > 0 ? Math.sqrt((p * (1 - p)) / proposals) : NaN,
      logRegionAreaEstimate: this.regionBase.logRectangleArea + log(p),
    });
  }

  logEnvelope(x: number): number {
    const d = x - this.rect.shift;
    const LM = this.rect.logDensityBound;
    if (d === 0) return LM;
    const logV = d > 0 ? this.rect.logVMax : this.rect.logVMinAbs;
    return LM + Math.min(0, this.ratio * (logV - log(Math.abs(d))));
  }

  readonly sample: () => number;
  readonly fill: (out: Float64Array) => Float64Array;

  /** The kernel: fills out[0..n) (constants in locals, no allocation). */
  private run(out: Float64Array, n: number): void {
    const api = this.api;
    const blk = this.blk;
    const logf = this.logf;
    const squeeze = this.squeeze;
    const c = this.counters;
    const r = this.power;
    const r1 = this.r1;
    const ratio = this.ratio;
    const s = this.rect.shift;
    const LM = this.rect.logDensityBound;
    const vMin = this.rect.vMin;
    const vWidth = this.vWidth;
    const vPlus = this.rect.vMax;
    const vMinus = -this.rect.vMin;
    const logVPlus = this.rect.logVMax;
    const logVMinus = this.rect.logVMinAbs;
    const lower = this.lower;
    const upper = this.upper;
    const maxRejections = this.maxRejections;
    const unitPower = r === 1;
    for (let i = 0; i < n; i++) {
      let rejections = 0;
      for (;;) {
        const u = 1 - nextUniform(blk);
        const v = vMin + vWidth * nextUniform(blk);
        c.proposals++;
        const q = unitPower ? v / u : v / pow(u, r);
        const x = s + q;
        // x is s + q rounded to nearest: at a finite end, keep it only when s + q itself lies inside
        // (its rounding error, Knuth's TwoSum, has the sign of s + q − x); else the exact draws just
        // beyond the end, rounded onto it, would double the end's probability
        if (x >= lower && x <= upper && x > -Infinity && x < Infinity && ((x !== upper && x !== lower) || insideAtEnd(s, q, x, lower, upper))) {
          const lhs = r1 * log(u);
          let q = -Infinity;
          if (squeeze !== undefined) {
            q = checkLogDensity(`${api} (squeeze)`, x, squeeze(x));
            if (q <= LM && lhs <= q - LM) {
              c.samples++;
              out[i] = x;
              break;
            }
          }
          const raw = logf(x);
          c.densityEvaluations++;
          const lf = checkLogDensity(api, x, raw);
          if (lf > LM) throw new EnvelopeViolationError(api, x, lf, LM, 'envelope');
          const d = x - s;
          if (d > vPlus || -d > vMinus) {
            // Only here can |x − s|·(f/M)^(r/(r+1)) exceed the v-bound (f/M ≤ 1 is checked above).
            const env = LM + ratio * ((d > 0 ? logVPlus : logVMinus) - log(Math.abs(d)));
            if (lf > env) throw new EnvelopeViolationError(api, x, lf, env, 'envelope');
          }
          if (q > lf + SQUEEZE_TOLERANCE * (1 + Math.abs(lf))) throw new EnvelopeViolationError(api, x, lf, q, 'squeeze');
          if (lhs <= lf - LM) {
            c.samples++;
            out[i] = x;
            break;
          }
        }
        if (++rejections >= maxRejections) {
          throw new StalledSamplerError(api, rejections, c.samples, c.proposals);
        }
      }
    }
  }
}

/** A ratio-of-uniforms region described in z, in x (v scales with 2^k; u does not). */
function regionInX(r: RatioOfUniformsRegion, st: Standardisation): RatioOfUniformsRegion {
  return {
    ...r,
    shift: pointX(st, r.shift),
    argmax: pointX(st, r.argmax),
    logVMax: areaX(st, r.logVMax),
    logVMinAbs: areaX(st, r.logVMinAbs),
    scaledVMin: r.scaledVMin * st.scale,
    scaledVMax: r.scaledVMax * st.scale,
    logRectangleArea: areaX(st, r.logRectangleArea),
    logRegionAreaEstimate: areaX(st, r.logRegionAreaEstimate),
  };
}

/** Forwarded members of the ratio-of-uniforms sampler built in the standardised coordinate. @internal */
export const RATIO_FORWARD: Readonly<Record<string, Forward>> = { region: regionInX, logEnvelope: 'point' };

/**
 * Whether s + q (exactly) lies in [lower, upper], given x = s + q rounded to
 * nearest equals one of the ends: the rounding error of the sum (Knuth's
 * TwoSum, exact) says on which side of x the exact sum lies.
 */
function insideAtEnd(s: number, q: number, x: number, lower: number, upper: number): boolean {
  const bv = x - s;
  const e = s - (x - bv) + (q - bv);
  if (x === upper && e > 0) return false;
  if (x === lower && e < 0) return false;
  return true;
}

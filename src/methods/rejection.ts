/**
 * Plain and squeeze rejection from a proposal, with an automatic bound.
 *
 * @packageDocumentation
 */
import { findLogBound } from '../bounds/find-log-bound.js';
import { Counters } from '../core/counters.js';
import { EnvelopeViolationError, InvalidTargetError, NonFiniteDensityError, StalledSamplerError } from '../core/errors.js';
import { InvalidOptionError } from '../core/errors.js';
import { checkCovers, checkProposal } from '../core/proposal-check.js';
import { checkLogDensity } from '../core/evaluate.js';
import type { Proposal, Sampler, SamplerOptions, SamplerStats, Target } from '../core/types.js';
import { wrapDraws } from '../core/draws.js';
import { checkFinite, checkOptionKeys, checkTarget, resolveMaxRejections } from '../core/validate.js';
import { resolveUniform } from '../random/resolve.js';
import { log } from '../vendor/math.js';

/** Options of {@link rejectionSampler}. */
export interface RejectionOptions extends SamplerOptions {
  /** The proposal g to draw candidates from; its support must cover the target's. */
  proposal: Proposal;
  /**
   * log C with f ≤ C·g on the support (f the unnormalized target). Found by
   * {@link findLogBound} when omitted. A value that is too small is reported
   * by {@link EnvelopeViolationError} at the first evaluation that proves it.
   */
  logBound?: number;
  /**
   * Optional squeeze: a cheap function s with s(x) ≤ logDensity(x). A candidate
   * under exp(s) is accepted without evaluating the target. A squeeze found
   * above the target at an evaluated point throws {@link EnvelopeViolationError}.
   */
  squeeze?: (x: number) => number;
  /**
   * Consecutive rejections before {@link StalledSamplerError}.
   * @defaultValue 1,000,000
   */
  maxRejections?: number;
}

/** A rejection sampler; also exposes the constant it uses. */
export interface RejectionSampler extends Sampler {
  /** log C in use (given or found). */
  readonly logBound: number;
  /** Where the automatic search found the supremum (NaN when `logBound` was given). */
  readonly argmax: number;
}

/** Relative tolerance of the envelope check, in log space: rounding in logf − log g − log C. */
export const ENVELOPE_TOLERANCE = 1e-12;

const KNOWN = ['proposal', 'logBound', 'squeeze', 'maxRejections', 'seed', 'stream', 'uniform'] as const;

/**
 * Plain rejection (von Neumann 1951) with an optional squeeze (Marsaglia 1977),
 * entirely in log space: a candidate x ~ g is accepted when
 * log V ≤ logf(x) − log g(x) − log C with V uniform on (0, 1].
 *
 * @remarks
 * When `logBound` is omitted it is found by {@link findLogBound} and the
 * evaluations are counted in `stats.setupEvaluations`. Every evaluation of the
 * target while sampling also checks logf(x) ≤ log C + log g(x) and, when a
 * squeeze is given, s(x) ≤ logf(x). Each candidate consumes the uniforms of
 * `proposal.sample` and then one more for the acceptance test. A logDensity
 * (or squeeze) value that is NaN, +Infinity or not a number throws
 * {@link NonFiniteDensityError}. After that error or an
 * {@link EnvelopeViolationError} the sampler is unusable: every later call
 * throws the same error (a {@link StalledSamplerError} leaves it usable);
 * after `fill` throws, `out` holds the draws completed before the failure
 * and is unchanged beyond them.
 *
 * @param target - the target
 * @param options - the proposal and optional bound, squeeze and uniform source
 * @throws {@link InvalidTargetError} for bad inputs, or when no bound exists
 * @throws {@link EnvelopeViolationError} at draw time when the bound or squeeze is proven wrong
 * @throws {@link StalledSamplerError} after `maxRejections` consecutive rejections
 * @example
 * ```ts
 * const s = rejectionSampler(normalTarget(0, 1), { proposal: cauchyProposal(0, 1), seed: 7 });
 * const xs = s.fill(new Float64Array(1000));
 * s.stats.acceptanceRate; // ≈ 1 / 1.5203
 * ```
 */
export function rejectionSampler(target: Target, options: RejectionOptions): RejectionSampler {
  const api = 'rejectionSampler';
  const t = checkTarget(api, target);
  if (options === undefined || options === null || typeof options !== 'object') {
    throw new InvalidOptionError(`${api}: options with a proposal are required, got ${String(options)}`);
  }
  checkOptionKeys(api, options, KNOWN);
  const proposal = options.proposal;
  const pSupport = checkProposal(api, proposal);
  checkCovers(api, [t.lower, t.upper], pSupport);
  const squeeze = options.squeeze;
  if (squeeze !== undefined && typeof squeeze !== 'function') {
    throw new InvalidOptionError(`${api}: options.squeeze must be a function when given, got ${typeof squeeze}`);
  }
  const maxRejections = resolveMaxRejections(api, options.maxRejections);
  const uniform = resolveUniform(api, options);
  const counters = new Counters();

  let logC: number;
  let argmax = NaN;
  if (options.logBound === undefined) {
    const b = findLogBound(target, proposal);
    logC = b.logBound;
    argmax = b.argmax;
    counters.setupEvaluations = b.evaluations;
  } else {
    logC = checkFinite(api, 'options.logBound', options.logBound);
  }
  const logf = t.logDensity;
  const lower = t.lower;
  const upper = t.upper;
  const tol = ENVELOPE_TOLERANCE * (1 + Math.abs(logC));

  const one = (): number => {
    let rejections = 0;
    for (;;) {
      const x = proposal.sample(uniform);
      counters.proposals++;
      if (x >= lower && x <= upper) {
        const logEnv = logC + proposal.logDensity(x);
        const logV = log(1 - uniform());
        const threshold = logV + logEnv;
        let s = -Infinity;
        if (squeeze !== undefined) {
          s = checkLogDensity(`${api} (squeeze)`, x, squeeze(x));
          if (s > logEnv + tol) throw new EnvelopeViolationError(api, x, s, logEnv, 'envelope');
          if (threshold <= s) {
            counters.samples++;
            return x;
          }
        }
        const raw = logf(x);
        counters.densityEvaluations++;
        const lf = checkLogDensity(api, x, raw);
        if (lf > logEnv + tol) throw new EnvelopeViolationError(api, x, lf, logEnv, 'envelope');
        if (s > lf + tol) throw new EnvelopeViolationError(api, x, lf, s, 'squeeze');
        if (threshold <= lf) {
          counters.samples++;
          return x;
        }
      }
      if (++rejections >= maxRejections) {
        throw new StalledSamplerError(api, rejections, counters.samples, counters.proposals);
      }
    }
  };

  const draws = wrapDraws(api, (out, n) => {
    for (let i = 0; i < n; i++) out[i] = one();
  });
  return {
    sample: draws.sample,
    fill: draws.fill,
    get stats(): SamplerStats {
      return counters.snapshot();
    },
    logBound: logC,
    argmax,
  };
}

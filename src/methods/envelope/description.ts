/**
 * Read-only description of a T-concave envelope (a hull, or the constant
 * pieces of a strip table), for plots and audits, and its evaluation.
 *
 * @packageDocumentation
 */
import type { TransformName } from './transforms.js';
import { T_LOG, logHeight } from './transforms.js';

/**
 * One piece of a T-concave envelope: on `[lower, upper]` the envelope is the
 * back-transform of the line `value + slope·(x − anchor)` and the squeeze the
 * back-transform of `squeezeValue + squeezeSlope·(x − squeezeAnchor)`.
 *
 * @remarks
 * Lines live in the transformed space of f/e^logScale ({@link EnvelopeDescription.logScale}):
 * with T = log the log-density of the envelope is `logScale + line`; with
 * T(f) = −1/√f it is `logScale − 2·log(−line)`. `squeezeValue` is
 * `-Infinity` where there is no squeeze (the tails).
 */
export interface EnvelopePiece {
  /** Left end. */
  readonly lower: number;
  /** Right end. */
  readonly upper: number;
  /** Anchor of the envelope line (a touch point). */
  readonly anchor: number;
  /** Transformed envelope value at the anchor. */
  readonly value: number;
  /** Slope of the envelope line in transformed space. */
  readonly slope: number;
  /** Anchor of the squeeze chord. */
  readonly squeezeAnchor: number;
  /** Transformed squeeze value at its anchor (`-Infinity`: no squeeze). */
  readonly squeezeValue: number;
  /** Slope of the squeeze chord. */
  readonly squeezeSlope: number;
  /** Natural log of the envelope's area over the piece. */
  readonly logArea: number;
}

/**
 * Snapshot of a T-concave envelope (fresh arrays on every access).
 */
export interface EnvelopeDescription {
  /** The transform T. */
  readonly transform: TransformName;
  /** `'tangent'` (from `dLogDensity`) or `'secant'` (derivative-free). */
  readonly construction: 'tangent' | 'secant' | 'bounds';
  /** Reference log height: lines are those of the transformed f/e^logScale. */
  readonly logScale: number;
  /** Effective support: the target's, shrunk where the sampler found the density to be 0. */
  readonly support: readonly [number, number];
  /** Touch points, increasing. */
  readonly touchPoints: readonly number[];
  /** logDensity at the touch points. */
  readonly touchLogDensities: readonly number[];
  /** Pieces, left to right (some may be empty): two per touch point for an adaptive hull; for a {@link TableSampler} the left tail, one per strip and the right tail. */
  readonly pieces: readonly EnvelopePiece[];
  /** log of the envelope's total area. */
  readonly logEnvelopeArea: number;
  /** log of the squeeze's total area (`-Infinity` with a single touch point). */
  readonly logSqueezeArea: number;
  /** Calls of `dLogDensity` so far (setup and sampling); `logDensity` calls are in the sampler's stats. */
  readonly derivativeEvaluations: number;
}

/** Log-envelope and log-squeeze at a point; see {@link evaluateEnvelope}. */
export interface EnvelopeValue {
  /** Natural log of the envelope at x (`-Infinity` outside the support). */
  readonly logEnvelope: number;
  /** Natural log of the squeeze at x (`-Infinity` where there is none). */
  readonly logSqueeze: number;
}

/**
 * Evaluates a described envelope and its squeeze at `x`, with the same
 * arithmetic as the sampler.
 *
 * @param envelope - a description from an adaptive rejection sampler's `envelope`
 * @param x - the point
 * @returns natural logs of the envelope and of the squeeze at x
 * @example
 * ```ts
 * const s = adaptiveRejectionSampler(normalTarget(0, 1));
 * const { logEnvelope, logSqueeze } = evaluateEnvelope(s.envelope, 0.3);
 * // logSqueeze <= normalTarget(0, 1).logDensity(0.3) <= logEnvelope
 * ```
 */
export function evaluateEnvelope(envelope: EnvelopeDescription, x: number): EnvelopeValue {
  const [lower, upper] = envelope.support;
  const pieces = envelope.pieces;
  if (!(x >= lower && x <= upper) || pieces.length === 0) return { logEnvelope: -Infinity, logSqueeze: -Infinity };
  // last piece of positive width whose lower end is <= x
  let a = 0;
  let b = pieces.length - 1;
  while (a < b) {
    const m = (a + b + 1) >> 1;
    if (pieces[m].lower <= x) a = m;
    else b = m - 1;
  }
  let j = a;
  while (j > 0 && !(pieces[j].upper > pieces[j].lower) && pieces[j - 1].upper >= x) j--;
  const p = pieces[j];
  const kind = envelope.transform === 'log' ? T_LOG : 1;
  const t = p.value + p.slope * (x - p.anchor);
  const c = p.squeezeValue === -Infinity ? -Infinity : p.squeezeValue + p.squeezeSlope * (x - p.squeezeAnchor);
  const le = logHeight(kind, t) + envelope.logScale;
  const ls = c === -Infinity ? -Infinity : logHeight(kind, c) + envelope.logScale;
  return { logEnvelope: le, logSqueeze: ls };
}

/**
 * Read-only description of a hull envelope, for plots and audits.
 *
 * @packageDocumentation
 */
import type { TransformName } from './transforms.js';
import { T_LOG, logHeight, pieceLogArea } from './transforms.js';
import type { Hull } from './hull.js';
import { exp, log } from '../../vendor/math.js';

/**
 * One piece of a hull envelope: on `[lower, upper]` the envelope is the
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
 * Snapshot of a hull envelope (fresh arrays on every access).
 */
export interface EnvelopeDescription {
  /** The transform T. */
  readonly transform: TransformName;
  /** `'tangent'` (from `dLogDensity`) or `'secant'` (derivative-free). */
  readonly construction: 'tangent' | 'secant';
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

function logSumExp(v: readonly number[]): number {
  let m = -Infinity;
  for (const x of v) if (x > m) m = x;
  if (m === -Infinity || m === Infinity) return m;
  let s = 0;
  for (const x of v) s += exp(x - m);
  return m + log(s);
}

/** Builds the description of a hull. @internal */
export function describeHull(h: Hull): EnvelopeDescription {
  const k = h.k;
  const n = 2 * k;
  const pieces: EnvelopePiece[] = [];
  const areas: number[] = [];
  for (let j = 0; j < n; j++) {
    const la = h.logArea[j] + h.ref;
    pieces.push({
      lower: h.lo[j],
      upper: h.hi[j],
      anchor: h.ax[j],
      value: h.at[j],
      slope: h.sl[j],
      squeezeAnchor: h.sqx[j],
      squeezeValue: h.sqt[j],
      squeezeSlope: h.sqs[j],
      logArea: la,
    });
    areas.push(la);
  }
  const sq: number[] = [];
  for (let i = 0; i + 1 < k; i++) {
    const y0 = h.ty[i];
    const y1 = h.ty[i + 1];
    const w = h.tx[i + 1] - h.tx[i];
    sq.push(h.ref + pieceLogArea(h.kind, Math.max(y0, y1), Math.abs((y1 - y0) / w), w));
  }
  return {
    transform: h.kind === T_LOG ? 'log' : 'inverse-sqrt',
    construction: h.tangent ? 'tangent' : 'secant',
    logScale: h.ref,
    support: [h.lower, h.upper],
    touchPoints: Array.from(h.tx.subarray(0, k)),
    touchLogDensities: Array.from(h.tl.subarray(0, k)),
    pieces,
    logEnvelopeArea: logSumExp(areas),
    logSqueezeArea: logSumExp(sq),
    derivativeEvaluations: h.derivativeEvaluations,
  };
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

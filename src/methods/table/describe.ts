/**
 * Read-only descriptions of a strip table, for plots, audits and tests.
 *
 * @packageDocumentation
 */
import type { EnvelopeDescription, EnvelopePiece } from '../envelope/description.js';
import { T_LOG, pieceLogArea, transformValue } from '../envelope/transforms.js';
import type { AliasCells } from './alias.js';
import type { StripTable, TailPiece } from './strip-table.js';
import { exp, log } from '../../vendor/math.js';

/**
 * The strip table of a {@link TableSampler}: the body cut into strips, each
 * with a constant envelope (upper) and a constant squeeze (lower) value, the
 * tails, the areas of the parts and the alias table's size. Fresh arrays on
 * every access.
 *
 * @remarks
 * Areas are natural logs in the target's own (unnormalized) scale; for a
 * normalized target the envelope's total area is ≥ 0 and the sure area ≤ 0.
 * A draw lands in a sure rectangle (accepted with no further uniform and no
 * evaluation) with probability exp(logSureArea − logEnvelopeArea).
 */
export interface TableDescription {
  /** Number of strips. */
  readonly strips: number;
  /** Number of cells of the alias table (a power of two). */
  readonly cells: number;
  /** log2 of `cells`: the number of top bits of each uniform that select the cell. */
  readonly indexBits: number;
  /** Strip boundaries, increasing (`strips + 1` values). */
  readonly boundaries: readonly number[];
  /** logDensity at the boundaries. */
  readonly boundaryLogDensities: readonly number[];
  /** Per strip: log of the constant envelope value (≥ logDensity everywhere on the strip). */
  readonly logUpper: readonly number[];
  /** Per strip: log of the constant squeeze value (≤ logDensity everywhere on the strip). */
  readonly logLower: readonly number[];
  /** Effective support. */
  readonly support: readonly [number, number];
  /** log of the total area of the sure rectangles (width × squeeze value). */
  readonly logSureArea: number;
  /** log of the total area of the caps (width × (envelope − squeeze)). */
  readonly logCapArea: number;
  /** log of the area of the two tail pieces. */
  readonly logTailArea: number;
  /** log of the total area (sure + caps + tails). */
  readonly logEnvelopeArea: number;
}

/** Describes a strip table. @internal */
export function describeTable(t: StripTable, cells: AliasCells): TableDescription {
  const lg = (a: number): number => log(a) + t.ref;
  return {
    strips: t.n,
    cells: cells.K,
    indexBits: cells.bits,
    boundaries: Array.from(t.x),
    boundaryLogDensities: Array.from(t.l),
    logUpper: Array.from(t.logUp),
    logLower: Array.from(t.logLo),
    support: [t.lower, t.upper],
    logSureArea: lg(t.sureArea),
    logCapArea: lg(t.capArea),
    logTailArea: lg(t.tailArea),
    logEnvelopeArea: lg(t.sureArea + t.capArea + t.tailArea),
  };
}

function tailPiece(t: StripTable, p: TailPiece | null, at: number): EnvelopePiece {
  if (p === null) {
    return { lower: at, upper: at, anchor: at, value: -Infinity, slope: 0, squeezeAnchor: at, squeezeValue: -Infinity, squeezeSlope: 0, logArea: -Infinity };
  }
  return { lower: p.lo, upper: p.hi, anchor: p.anchor, value: p.anchorValue, slope: p.slope, squeezeAnchor: p.anchor, squeezeValue: -Infinity, squeezeSlope: 0, logArea: p.logArea + t.ref };
}

/**
 * The table as an {@link EnvelopeDescription}: the left tail, one piece per
 * strip (constant envelope, slope 0; the chord between the strip's ends as
 * squeeze) and the right tail, so that {@link evaluateEnvelope} and
 * {@link envelopeSvg} work on it. `touchPoints` are the strip boundaries.
 * @internal
 */
export function describeTableEnvelope(t: StripTable, derivativeEvaluations: number): EnvelopeDescription {
  const pieces: EnvelopePiece[] = [tailPiece(t, t.left, t.x[0])];
  const kind = t.kind;
  let sq = 0;
  for (let i = 0; i < t.n; i++) {
    const a = t.x[i];
    const b = t.x[i + 1];
    const w = b - a;
    const ci = t.chordSlope[i];
    const hasSq = ci === ci;
    const hiEnd = t.y[i] >= t.y[i + 1] ? a : b;
    const hiY = t.y[i] >= t.y[i + 1] ? t.y[i] : t.y[i + 1];
    pieces.push({
      lower: a,
      upper: b,
      anchor: a,
      value: transformValue(kind, t.logUp[i] - t.ref),
      slope: 0,
      squeezeAnchor: hiEnd,
      squeezeValue: hasSq ? hiY : -Infinity,
      squeezeSlope: hasSq ? ci : 0,
      logArea: w > 0 ? log(w) + t.logUp[i] : -Infinity,
    });
    if (hasSq && w > 0) sq += exp(pieceLogArea(kind, hiY, Math.abs(ci), w));
  }
  pieces.push(tailPiece(t, t.right, t.x[t.n]));
  return {
    transform: kind === T_LOG ? 'log' : 'inverse-sqrt',
    construction: 'secant',
    logScale: t.ref,
    support: [t.lower, t.upper],
    touchPoints: Array.from(t.x),
    touchLogDensities: Array.from(t.l),
    pieces,
    logEnvelopeArea: log(t.sureArea + t.capArea + t.tailArea) + t.ref,
    logSqueezeArea: log(sq) + t.ref,
    derivativeEvaluations,
  };
}

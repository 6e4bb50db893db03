/**
 * The flat tables of a piecewise envelope (the piecewise method's pieces,
 * also read by the table fast path built over them) and the formulas of one
 * piece: envelope, squeeze, inversion. @internal
 *
 * @remarks
 * Piece j lies on [lo[j], hi[j]] and is sampled from its high end
 * highEnd[j] in direction direction[j] (±1) over width[j]. Its envelope is
 * stored in height form (see {@link pieceLogEnvelopeAt}): relative log
 * height highLogHeight[j] at the high end, rate[j], transform kind[j];
 * inversion[j] is the inversion constant ({@link pieceConstant}). Its
 * squeeze is the line squeezeValue[j] + squeezeSlope[j]·(x − squeezeAnchor[j])
 * in log space (squeezeValue = −Infinity: none).
 * Every stored log value is relative to `ref`.
 *
 * @packageDocumentation
 */
import { lastAtOrBelow } from './arith.js';
import { invertPiece, pieceLogEnvelopeAt } from './transforms.js';

/** Flat tables of a piecewise envelope (see the module remarks). @internal */
export interface Tables {
  n: number;
  lo: Float64Array;
  hi: Float64Array;
  kind: Uint8Array;
  highEnd: Float64Array;
  direction: Float64Array;
  width: Float64Array;
  highLogHeight: Float64Array;
  rate: Float64Array;
  inversion: Float64Array;
  squeezeAnchor: Float64Array;
  squeezeValue: Float64Array;
  squeezeSlope: Float64Array;
  logAreas: Float64Array;
  logSqueezeAreas: Float64Array;
  shape: Uint8Array;
  /** Reference height: every stored log value is relative to it. */
  ref: number;
  /** log of the envelope area (absolute). */
  logEnvelopeArea: number;
  /** log of the squeeze area (absolute). */
  logSqueezeArea: number;
  /** Normalized areas for the guide table. */
  area: Float64Array;
}


/** log envelope of piece j at x, relative to t.ref (the kernels' formula). @internal */
export function pieceLogEnvelope(t: Tables, j: number, x: number): number {
  const h = t.highEnd[j];
  return pieceLogEnvelopeAt(t.kind[j], t.highLogHeight[j], t.rate[j], t.direction[j] > 0 ? x - h : h - x);
}

/** log squeeze of piece j at x, relative to t.ref (−Infinity: none). @internal */
export function pieceLogSqueeze(t: Tables, j: number, x: number): number {
  const sv = t.squeezeValue[j];
  return sv === -Infinity ? -Infinity : sv + t.squeezeSlope[j] * (x - t.squeezeAnchor[j]);
}

/**
 * The point of piece j at envelope-cdf value u in [0, 1) ({@link invertPiece}
 * from the high end), clamped to the piece. @internal
 */
export function pieceInverse(t: Tables, j: number, u: number): number {
  const x = t.highEnd[j] + t.direction[j] * invertPiece(t.kind[j], t.inversion[j], t.rate[j], t.width[j], u);
  return x < t.lo[j] ? t.lo[j] : x > t.hi[j] ? t.hi[j] : x;
}

/**
 * log envelope and log squeeze (absolute) of the tables at x, with the
 * kernels' arithmetic; −Infinity outside every piece. @internal
 */
export function evaluateTables(t: Tables, x: number): { logEnvelope: number; logSqueeze: number } {
  const n = t.n;
  const lo = t.lo;
  if (!(x === x) || n === 0 || x < lo[0]) return { logEnvelope: -Infinity, logSqueeze: -Infinity };
  const a = lastAtOrBelow(lo, 0, n - 1, x);
  // a piece that ends exactly at x may be followed by one starting there; either serves
  if (!(x <= t.hi[a])) return { logEnvelope: -Infinity, logSqueeze: -Infinity };
  return { logEnvelope: pieceLogEnvelope(t, a, x) + t.ref, logSqueeze: pieceLogSqueeze(t, a, x) + t.ref };
}

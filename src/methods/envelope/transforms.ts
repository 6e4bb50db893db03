/**
 * The two transforms of the envelope engines: T = log (Gilks & Wild 1992)
 * and T(f) = −1/√f (Hörmann 1995), and the formulas of one envelope piece
 * (area, inversion, envelope at a point). Every kernel, builder, description
 * and test uses these functions; none keeps a copy. @internal
 *
 * @remarks
 * Every function here works on densities divided by a reference height
 * e^ref (the hull's maximum), so that the transformed values stay in a
 * comfortable range whatever the scale of the target: a relative log height
 * `lr = log f − ref` is at most about 0 on the hull.
 *
 * A piece of the envelope is the back-transform of a linear function of x on
 * an interval. The kernel samples the *distance* `d ≥ 0` from the piece's
 * high end (the end where the linear function is largest), moving into the
 * piece; along that direction the transformed line decreases with slope
 * magnitude `sig ≥ 0`. Writing `tH` for the line's value at the high end and
 * `w` for the width (possibly `Infinity` for a tail piece):
 *
 * - log: density e^(tH − sig·d); area e^tH·(1 − e^(−sig·w))/sig; the inverse
 *   of the normalized cdf at u is d = −log1p(−u·q)/sig with
 *   q = −expm1(−sig·w). Both use expm1/log1p so that they keep full relative
 *   precision when sig·w is tiny; below sig·w = 1e-15 the piece is treated as
 *   flat (d = u·w, area e^tH·w), which changes the density inside the piece
 *   by a factor of at most e^(1e-15).
 * - inverse-sqrt: with a = −tH > 0 the density is 1/(a + sig·d)²; its
 *   integral over [0, d] is d/(a·(a + sig·d)) (no division by sig, so slope 0
 *   needs no special case); area w/(a²·(1 + r·w)) with r = sig/a; inverse
 *   d = u·w/(1 + (1 − u)·r·w), and for a tail (w = ∞) d = u/((1 − u)·r). The
 *   formulas only add non-negative terms, so they have no cancellation.
 *
 * Integrability. log: a finite piece always has a finite area; a tail piece
 * needs sig > 0 in the direction of the tail. inverse-sqrt: the envelope
 * 1/t(x)² is finite only while the line t stays below 0, so a finite piece
 * needs t < 0 at both ends (the line is monotone, so the ends suffice); on a
 * tail the line must go to −∞, i.e. sig > 0 pointing into the tail, which
 * gives an envelope decaying like 1/(sig·d)², integrable, with area
 * 1/(sig·a). A line with sig = 0 or rising into the tail reaches 0 (or stays
 * constant) and its integral diverges.
 *
 * @packageDocumentation
 */
import { exp, expm1, log, log1p, log1pFast } from '../../vendor/math.js';

/** Names of the transforms. */
export type TransformName = 'log' | 'inverse-sqrt';

/** Numeric id of T = log. @internal */
export const T_LOG = 0;
/** Numeric id of T(f) = −1/√f. @internal */
export const T_INV_SQRT = 1;

/** sig·w below which a log-transformed piece is sampled as flat. @internal */
export const FLAT_LIMIT = 1e-15;

/**
 * Transformed value of a relative log height `lr = log f − ref`.
 * log: lr; inverse-sqrt: −e^(−lr/2).
 * @internal
 */
export function transformValue(kind: number, lr: number): number {
  return kind === T_LOG ? lr : -exp(-0.5 * lr);
}

/**
 * Derivative in x of the transformed density at a point with transformed
 * value `y` and log-density derivative `g` (chain rule).
 * log: g; inverse-sqrt: d/dx (−e^(−l/2)) = (1/2)·e^(−l/2)·g = −y·g/2.
 * @internal
 */
export function transformSlope(kind: number, y: number, g: number): number {
  return kind === T_LOG ? g : -0.5 * y * g;
}

/**
 * Relative log height of the back-transformed value `t`.
 * log: t; inverse-sqrt: log(1/t²) = −2·log(−t), which is `+Infinity` for
 * t ≥ 0 (the envelope is not finite there).
 * @internal
 */
export function logHeight(kind: number, t: number): number {
  if (kind === T_LOG) return t;
  return t < 0 ? -2 * log(-t) : Infinity;
}

/**
 * The constant the inversion needs for a piece: log: q = −expm1(−sig·w)
 * (1 for a tail), or 0 for a flat piece (sig·w < {@link FLAT_LIMIT});
 * inverse-sqrt: r = sig/a with a = −tH.
 * @internal
 */
export function pieceConstant(kind: number, tH: number, sig: number, w: number): number {
  if (kind === T_LOG) {
    const z = sig * w;
    if (!(z >= FLAT_LIMIT)) return 0;
    return w === Infinity ? 1 : -expm1(-z);
  }
  return sig / -tH;
}

/**
 * Relative log area of a piece (see the module remarks); `+Infinity` when
 * the piece's envelope is not integrable, `-Infinity` for an empty piece.
 * @internal
 */
export function pieceLogArea(kind: number, tH: number, sig: number, w: number): number {
  if (!(w > 0)) return -Infinity;
  if (kind === T_LOG) {
    if (tH === -Infinity) return -Infinity;
    const z = sig * w;
    if (w === Infinity) return sig > 0 ? tH - log(sig) : Infinity;
    if (!(z >= FLAT_LIMIT)) return tH + log(w);
    return tH + log(-expm1(-z)) - log(sig);
  }
  if (!(tH < 0)) return Infinity;
  const a = -tH;
  const r = sig / a;
  if (w === Infinity) return r > 0 ? -log(r) - 2 * log(a) : Infinity;
  return log(w) - 2 * log(a) - log1p(r * w);
}

/**
 * Distance from the high end of a piece at which its normalized envelope cdf
 * equals `u` in [0, 1), clamped to [0, w]. `q` is {@link pieceConstant}.
 * Used by every kernel (hull, piecewise, table), the descriptions and the
 * tests.
 * @internal
 */
export function invertPiece(kind: number, q: number, sig: number, w: number, u: number): number {
  let d: number;
  if (kind === T_LOG) {
    d = q === 0 ? u * w : -log1pFast(-u * q) / sig;
  } else {
    d = w === Infinity ? u / ((1 - u) * q) : (u * w) / (1 + (1 - u) * q * w);
  }
  return d > w ? w : d;
}

/**
 * Relative log envelope of a piece stored in height form, at distance
 * `dd ≥ 0` from its high end where the relative log height is `href`:
 * log: href − sig·dd; inverse-sqrt, with the line scaled to −1 at the high
 * end (so `sig` is the rate r = sig/a of the module remarks):
 * href − 2·log1p(sig·dd). The piecewise tables store every piece this way;
 * the hull stores lines and uses {@link logHeight}.
 * @internal
 */
export function pieceLogEnvelopeAt(kind: number, href: number, sig: number, dd: number): number {
  return kind === T_LOG ? href - sig * dd : href - 2 * log1p(sig * dd);
}

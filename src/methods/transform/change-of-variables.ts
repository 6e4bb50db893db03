/**
 * The change of variables that removes a pole at an end of the support:
 * Y = log(X − a), Y = log(b − X) or Y = logit((X − a)/(b − a)).
 *
 * @packageDocumentation
 */
import { InvalidOptionError, InvalidTargetError } from '../../core/errors.js';
import type { Target } from '../../core/types.js';
import { checkTarget } from '../../core/validate.js';
import type { PoleSide, PoleTarget } from '../../targets/end-distance.js';
import { exp, log, log1p, pow } from '../../vendor/math.js';

/**
 * The smallest distance to an end that the change of variables represents:
 * 2^−1022 ≈ 2.2e-308, the smallest normal double (below it a distance loses
 * relative precision, and so would the transformed density).
 *
 * @example
 * ```ts
 * poleTransform(gammaTarget(0.5), 'lower').minDistanceLower === MIN_POLE_DISTANCE; // true: the end is 0
 * ```
 */
export const MIN_POLE_DISTANCE = /* @__PURE__ */ pow(2, -1022);

/**
 * Without a distance form (`logDensityFromLower`/`logDensityFromUpper`), at
 * an end e ≠ 0 the smallest distance represented is this many spacings of
 * the doubles at e (2^30·|e|·2^−52 ≈ 2.4e-7·|e|), so that x = e ± d carries
 * d to a relative 2^−30.
 *
 * @example
 * ```ts
 * // a pole at 2 without logDensityFromLower: distances below 2^30·2·2^−52 ≈ 4.8e-7 are not represented
 * poleTransform({ logDensity: (x) => -0.5 * Math.log(x - 2), support: [2, 3] }, 'lower').minDistanceLower;
 * ```
 */
export const POLE_ULPS_WITHOUT_DISTANCE_FORM = /* @__PURE__ */ pow(2, 30);

/**
 * Which map a {@link PoleTransform} uses.
 *
 * @example
 * ```ts
 * const m: PoleMap = poleTransform(betaTarget(0.5, 0.5), 'both').map; // 'logit'
 * ```
 */
export type PoleMap = 'log-lower' | 'log-upper' | 'logit';

/**
 * The transformed target of {@link poleTransform} and the map back to x.
 *
 * @example
 * ```ts
 * const tr: PoleTransform = poleTransform(betaTarget(2, 0.3), 'upper'); // Y = log(1 − X)
 * tr.toX(-40); // 1 − e^−40
 * ```
 */
export interface PoleTransform {
  /** The map: `'log-lower'` (Y = log(X − a)), `'log-upper'` (Y = log(b − X)) or `'logit'` (Y = logit((X − a)/(b − a))). */
  readonly map: PoleMap;
  /** The poles the map removes. */
  readonly side: PoleSide;
  /** A readable description, e.g. `'Y = log(X − 0)'`. */
  readonly description: string;
  /** The density of Y (unnormalized, with the same constant as the target), with its derivative when the target has one. */
  readonly target: Target;
  /** Support [a, b] of X. */
  readonly lower: number;
  /** Upper end b of the support of X. */
  readonly upper: number;
  /** The smallest distance to the lower end represented (NaN when the map keeps no pole there). */
  readonly minDistanceLower: number;
  /** The smallest distance to the upper end represented (NaN when the map keeps no pole there). */
  readonly minDistanceUpper: number;
  /**
   * x from y: `a + e^y`, `b − e^y`, or, for the logit, `a + (b − a)·σ(y)`
   * for y ≤ 0 and `b − (b − a)·σ(−y)` for y > 0 (the distance to the nearer
   * end is computed first). A value that rounds onto a pole is moved to the
   * nearest double inside the support.
   */
  toX(y: number): number;
}

/**
 * The change of variables that turns a density with an integrable pole at
 * an end of its support into a density without one.
 *
 * @remarks
 * For a pole at the lower end a: Y = log(X − a), with density
 * g(y) = f(a + e^y)·e^y on [log d_min, log(b − a)]; at the upper end b:
 * Y = log(b − X), g(y) = f(b − e^y)·e^y; at both (b − a finite):
 * Y = logit((X − a)/(b − a)), g(y) = f(x)·(b − a)·σ(y)·σ(−y). For a power
 * singularity f ~ |x − e|^(α−1) the transformed tail is g ~ e^(α·y):
 * bounded and log-concave far out, so hulls and ratio-of-uniforms serve it
 * (for gamma(shape < 1): log g(y) = shape·y − rate·e^y + const, concave).
 *
 * Resolution: the sampled variable is the distance d to the pole (e^y, or
 * (b − a)·σ(∓y) for the logit, each computed from y without forming
 * x first), and the log-density is evaluated from d: by the target's
 * `logDensityFromLower(d)` / `logDensityFromUpper(d)` when it has them
 * ({@link PoleTarget}), else as `logDensity(e ± d)`, which is exact when
 * the end e is 0. The Jacobian terms are computed as y, −y and
 * −2·log1p(e^(−|y|)) (no cancellation however far out). The smallest
 * distance represented is {@link MIN_POLE_DISTANCE} (2^−1022), or, at an end
 * e ≠ 0 without a distance form, {@link POLE_ULPS_WITHOUT_DISTANCE_FORM}
 * spacings of the doubles at e; Y is sampled on the corresponding finite
 * interval, i.e. from the target conditioned on a distance at least that
 * large. The mass left out is F(a + d_min) − F(a) (e.g. about 4e-16 for
 * gamma(0.05) at 0, 1e-154 for gamma(0.5)); the samplers built on a
 * transform estimate it and refuse the target when it may exceed 1e-12.
 * Draws are x = e ± d rounded to the nearest double; at e = 0 that is d
 * itself (full resolution down to 2^−1022); a draw that rounds onto the
 * pole (only possible at e ≠ 0, when d is below half the spacing of the
 * doubles at e) is returned as the nearest double inside the support. So
 * near e ≠ 0 the returned draws have the resolution of the doubles there:
 * for beta(0.1, 0.1) about 1.3 % of the mass lies within 2^−53 of 1, and
 * those draws all come back as 1 − 2^−53 (their distances to 1 were drawn
 * exactly, but a double x cannot carry them).
 *
 * @param target - the target, with a finite end at each pole
 * @param side - where the poles are: `'lower'`, `'upper'` or `'both'`
 * @returns the transformed target and the map back
 * @throws {@link InvalidTargetError} for a malformed target
 * @throws {@link InvalidOptionError} when `side` is not one of the three names or names an infinite end
 * @example
 * ```ts
 * const tr = poleTransform(gammaTarget(0.5), 'lower');   // Y = log X
 * tr.target.logDensity(-3);                               // log f(e^−3) − 3
 * tr.toX(-3);                                             // e^−3
 * ```
 */
export function poleTransform(target: PoleTarget, side: PoleSide): PoleTransform {
  return buildPoleTransform('poleTransform', target, side);
}

/** {@link poleTransform} with the caller's API name in messages. @internal */
export function buildPoleTransform(api: string, target: PoleTarget, side: PoleSide): PoleTransform {
  const t = checkTarget(api, target);
  if (side !== 'lower' && side !== 'upper' && side !== 'both') {
    throw new InvalidOptionError(`${api}: the pole side must be 'lower', 'upper' or 'both', got ${typeof side === 'string' ? `'${side}'` : String(side)}`);
  }
  const a = t.lower;
  const b = t.upper;
  if ((side === 'lower' || side === 'both') && !Number.isFinite(a)) {
    throw new InvalidOptionError(`${api}: a pole at the lower end needs a finite lower end of the support, got ${a}`);
  }
  if ((side === 'upper' || side === 'both') && !Number.isFinite(b)) {
    throw new InvalidOptionError(`${api}: a pole at the upper end needs a finite upper end of the support, got ${b}`);
  }
  const lf = t.logDensity;
  const dlf = t.dLogDensity;
  const fromLo = typeof target.logDensityFromLower === 'function' ? target.logDensityFromLower.bind(target) : undefined;
  const fromHi = typeof target.logDensityFromUpper === 'function' ? target.logDensityFromUpper.bind(target) : undefined;
  const dFromLo = typeof target.dLogDensityFromLower === 'function' ? target.dLogDensityFromLower.bind(target) : undefined;
  const dFromHi = typeof target.dLogDensityFromUpper === 'function' ? target.dLogDensityFromUpper.bind(target) : undefined;
  const minLo = minDistance(a, fromLo !== undefined);
  const minHi = minDistance(b, fromHi !== undefined);
  // log f and its x-derivative by the distance to each end
  const lfLo = fromLo ?? ((d: number): number => lf(a + d));
  const lfHi = fromHi ?? ((d: number): number => lf(b - d));
  const hasD = dlf !== undefined;
  const dLo = dFromLo ?? (dlf !== undefined ? (d: number): number => dlf(a + d) : undefined);
  const dHi = dFromHi ?? (dlf !== undefined ? (d: number): number => dlf(b - d) : undefined);
  const insideLo = nextAfter(a, +1);
  const insideHi = nextAfter(b, -1);
  const fmt = (e: number): string => String(e);

  if (side === 'lower') {
    const out = logDistanceTarget(lfLo, hasD ? dLo : undefined, 1, minLo, b - a);
    return freeze('log-lower', side, `Y = log(X − ${fmt(a)})`, out, a, b, minLo, NaN, (y: number): number => {
      const x = a + exp(y);
      return x > a ? (x <= b ? x : b) : insideLo;
    });
  }
  if (side === 'upper') {
    const out = logDistanceTarget(lfHi, hasD ? dHi : undefined, -1, minHi, b - a);
    return freeze('log-upper', side, `Y = log(${fmt(b)} − X)`, out, a, b, NaN, minHi, (y: number): number => {
      const x = b - exp(y);
      return x < b ? (x >= a ? x : a) : insideHi;
    });
  }
  // both: logit of (x − a)/w
  const w = b - a;
  if (!(w < Infinity)) throw new InvalidTargetError(`${api}: the logit map needs b − a finite, got [${a}, ${b}]`);
  const logW = log(w);
  // σ(y) ≥ d_min/w ⇔ y ≥ log(d_min/w) − log1p(−d_min/w); symmetric at the upper end
  const yLo = logit(minLo / w);
  const yHi = -logit(minHi / w);
  const out: { -readonly [K in keyof Target]: Target[K] } = {
    logDensity(y: number): number {
      if (!(y >= yLo && y <= yHi)) return y !== y ? NaN : -Infinity;
      if (y <= 0) {
        const e = exp(y);
        const l = lfLo((w * e) / (1 + e));
        return l === -Infinity ? l : l + logW + y - 2 * log1p(e);
      }
      const e = exp(-y);
      const l = lfHi((w * e) / (1 + e));
      return l === -Infinity ? l : l + logW - y - 2 * log1p(e);
    },
    support: [yLo, yHi],
  };
  if (hasD && dLo !== undefined && dHi !== undefined) {
    out.dLogDensity = (y: number): number => {
      if (y <= 0) {
        const e = exp(y);
        const s = e / (1 + e); // σ(y)
        const c = 1 / (1 + e); // σ(−y)
        return dLo(w * s) * w * s * c + (c - s);
      }
      const e = exp(-y);
      const c = e / (1 + e); // σ(−y)
      const s = 1 / (1 + e); // σ(y)
      return dHi(w * c) * w * s * c + (c - s);
    };
  }
  return freeze('logit', side, `Y = logit((X − ${fmt(a)})/${fmt(w)})`, out, a, b, minLo, minHi, (y: number): number => {
    if (y <= 0) {
      const e = exp(y);
      const x = a + (w * e) / (1 + e);
      return x > a ? x : insideLo;
    }
    const e = exp(-y);
    const x = b - (w * e) / (1 + e);
    return x < b ? x : insideHi;
  });
}

/**
 * The density of Y = log(d), d the distance to the pole's end, on
 * [log(minDistance), log(width)]: f(end ± e^y)·e^y in log form. `sign` is the
 * derivative of x with respect to d (+1 at the lower end, −1 at the upper).
 * @internal
 */
function logDistanceTarget(
  lf: (d: number) => number,
  dl: ((d: number) => number) | undefined,
  sign: 1 | -1,
  minDistance: number,
  width: number,
): { -readonly [K in keyof Target]: Target[K] } {
  const yLo = log(minDistance);
  const yHi = log(width); // +Infinity when the far end is infinite
  const out: { -readonly [K in keyof Target]: Target[K] } = {
    logDensity(y: number): number {
      if (!(y >= yLo && y <= yHi)) return y !== y ? NaN : -Infinity;
      const d = exp(y);
      if (!(d < Infinity) || d > width) return -Infinity;
      const l = lf(d);
      return l === -Infinity ? l : l + y;
    },
    support: [yLo, yHi],
  };
  if (dl !== undefined) {
    out.dLogDensity = (y: number): number => {
      const d = exp(y);
      return sign * dl(d) * d + 1;
    };
  }
  return out;
}

function freeze(
  map: PoleMap,
  side: PoleSide,
  description: string,
  target: Target,
  lower: number,
  upper: number,
  minDistanceLower: number,
  minDistanceUpper: number,
  toX: (y: number) => number,
): PoleTransform {
  return Object.freeze({ map, side, description, target, lower, upper, minDistanceLower, minDistanceUpper, toX });
}

/** log(p/(1 − p)) for small p, without cancellation. */
function logit(p: number): number {
  return log(p) - log1p(-p);
}

/** The smallest distance represented at the end e. */
function minDistance(e: number, distanceForm: boolean): number {
  if (!Number.isFinite(e)) return NaN;
  if (e === 0 || distanceForm) return MIN_POLE_DISTANCE;
  return Math.max(MIN_POLE_DISTANCE, POLE_ULPS_WITHOUT_DISTANCE_FORM * Math.abs(e) * Number.EPSILON);
}

/** The neighbouring double of x in direction dir (setup only). @internal */
export function nextAfter(x: number, dir: 1 | -1): number {
  if (!Number.isFinite(x)) return x;
  if (x === 0) return dir * Number.MIN_VALUE;
  const f = new Float64Array([x]);
  const i = new BigInt64Array(f.buffer);
  i[0] += (x > 0) === (dir > 0) ? 1n : -1n;
  return f[0];
}

/**
 * The standardised coordinate every method samples in: z = (x − loc)/2^k,
 * with loc a point of the bulk (the mode hint, else the best of a few
 * probes) and 2^k the power of two at which the log-density changes by 1/2
 * on the narrower side of loc. @internal
 *
 * @packageDocumentation
 */
import { EnvelopeViolationError, ExactDrawError, ImproperDensityError, InvalidTargetError, ShapeViolationError } from '../../core/errors.js';
import type { Sampler, SamplerStats, Target } from '../../core/types.js';
import type { CheckedTarget } from '../../core/validate.js';
import { maximizeLog } from '../../bounds/maximize.js';
import type { EnvelopeDescription, EnvelopePiece } from '../envelope/description.js';
import { twoTo } from '../../vendor/math.js';

/** Change of the log-density over one scale unit (from loc, on the narrower side). */
const SCALE_DROP = 0.5;
/** Targets whose scale 2^k has |k| ≤ this and whose |loc| ≤ 2^ORDINARY·2^k are sampled in x itself (the map would be x = z). */
const ORDINARY = 20;
/** Below |loc| ≤ this many scale units, loc is taken as 0 (x = 2^k·z is then exact). */
const LOC_TO_ZERO = 64;
/** At or above this spacing of the doubles at loc (in scale units) the target is left in x. */
const FINEST_GRAIN = /* @__PURE__ */ twoTo(-10);
/** Above this spacing of the doubles at loc (in scale units), errors say that logDensity(z) is a staircase. */
const COARSE_GRAIN = /* @__PURE__ */ twoTo(-40);
/** Smallest and largest binary exponents of a scale. */
const K_MIN = -1074;
const K_MAX = 1023;

/**
 * A change of location and scale x = loc + 2^log2Scale·z. `identity` when
 * the target is sampled in x itself (loc = 0, scale = 1). @internal
 */
export interface Standardisation {
  /** Location (0 when identity, or when |loc| was within 64 scale units of 0). */
  readonly loc: number;
  /** Scale, a power of two. */
  readonly scale: number;
  /** log2 of the scale (an integer). */
  readonly log2Scale: number;
  /** True when x = z (ordinary targets: their draws are those of the method in x). */
  readonly identity: boolean;
  /** Support of the target in x. */
  readonly lower: number;
  readonly upper: number;
  /** Support of Z (rounded outwards; x = loc + scale·z is clamped into [lower, upper]). */
  readonly zLower: number;
  readonly zUpper: number;
  /**
   * Spacing of the doubles of x at loc, in scale units (ulp(loc)/scale, an
   * upper bound within a factor 2): logDensity of Z is constant on cells
   * this wide near z = 0. Set for the identity too when that was chosen
   * because the doubles are too coarse (above 2^−10); else 0 for it.
   */
  readonly grain: number;
  /** logDensity calls spent finding loc and scale. */
  readonly evaluations: number;
  /** `z = (x − loc)/2^k`, for messages and `choice.reason`. */
  readonly description: string;
}

/** Targets built by {@link standardisedTarget} (or marked by a caller that standardised already): never standardised again. */
const done = new WeakSet<object>();

/** Marks a target as already in a standardised coordinate (its factories sample it as it is). @internal */
export function markStandardised(target: object): void {
  done.add(target);
}

/** True when `target` came from {@link standardisedTarget} or was marked. @internal */
export function isStandardised(target: object): boolean {
  return done.has(target);
}

/** The identity map (sampling in x). */
function identityOf(t: CheckedTarget, evaluations: number, grain = 0): Standardisation {
  return { loc: 0, scale: 1, log2Scale: 0, identity: true, lower: t.lower, upper: t.upper, zLower: t.lower, zUpper: t.upper, grain, evaluations, description: 'z = x' };
}

/**
 * Finds loc and the power-of-two scale of a target (about 25 evaluations).
 *
 * @remarks
 * loc is the mode hint when logDensity is finite there; else the best of
 * the finite ends (or the nearest double inside), the midpoint of a finite
 * support and 0; else (no finite value among them) the maximisation of
 * `maximizeLog`. The scale is the smallest 2^k (k from −1074 to 1023, by
 * bisection on k) such that logDensity at loc ± 2^k differs from its value
 * at loc by at least 1/2 on a side, or both loc − 2^k and loc + 2^k are out
 * of room (beyond an end of the support or where the density is 0). For N(μ, σ²) with the mode hint that is the
 * power of two in [σ, 2σ). When the scale is within 2^±20 and |loc| within
 * 2^20 scales, the map is the identity (the methods work in x as they
 * always did, so their streams are unchanged). When no finite value is
 * found or no scale exists (a density flat over the whole double range),
 * the identity is returned and the method gives its own error.
 * @internal
 */
export function findStandardisation(api: string, t: CheckedTarget, search: 'maximise' | 'probe' = 'maximise'): Standardisation {
  let evaluations = 0;
  const lower = t.lower;
  const upper = t.upper;
  // A value that is not a number, NaN or +Infinity stops the search (identity): the method's own evaluations report it where it matters.
  let bad = false;
  const f = (x: number): number => {
    evaluations++;
    const v: unknown = t.logDensity(x);
    if (typeof v !== 'number' || v !== v || v === Infinity) {
      bad = true;
      return -Infinity;
    }
    return v;
  };
  let loc = NaN;
  let l0 = -Infinity;
  const consider = (x: number): void => {
    if (!(x >= lower && x <= upper) || !Number.isFinite(x)) return;
    const l = f(x);
    if (l > l0) {
      l0 = l;
      loc = x;
    }
  };
  if (t.mode !== undefined) consider(t.mode);
  if (l0 === -Infinity && search === 'maximise') {
    // No usable mode hint: the global maximisation every method's setup uses (a few hundred evaluations).
    try {
      const r = maximizeLog(api, f, lower, upper, {});
      if (r.risingTail !== undefined) return identityOf(t, evaluations); // no decay found: nothing to locate
      if (r.value > -Infinity) {
        loc = r.x;
        l0 = r.value;
      }
    } catch (e) {
      if (!(e instanceof ExactDrawError)) throw e;
    }
  }
  if (l0 === -Infinity) {
    for (const e of [lower, upper]) {
      if (!Number.isFinite(e)) continue;
      consider(e);
      consider(nextToward(e, e === lower ? upper : lower));
    }
    if (Number.isFinite(lower) && Number.isFinite(upper)) consider(lower + (upper - lower) / 2);
    consider(0);
  }
  if (l0 === -Infinity || bad) return identityOf(t, evaluations);

  // Bisection on k for the smallest 2^k at which one side has changed enough.
  // Enough at 2^k: logDensity at loc ± 2^k differs from l0 by 1/2 on a side, or both sides are out of
  // room (beyond an end of the support, or where the density is 0: an edge is a bound, not a scale).
  const enough = (k: number): boolean => {
    const d = twoTo(k);
    let out = 0;
    for (const dir of [1, -1] as const) {
      const end = dir > 0 ? upper : lower;
      if (d >= Math.abs(end - loc)) {
        out++;
        continue;
      }
      const x = loc + dir * d;
      if (x === loc) continue;
      const l = f(x);
      if (l === -Infinity) out++;
      else if (Math.abs(l - l0) >= SCALE_DROP) return true;
    }
    return out === 2;
  };
  if (!enough(K_MAX)) return identityOf(t, evaluations);
  let lo = K_MIN - 1; // not enough (assumed: below the smallest double)
  let hi = K_MAX; // enough
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (enough(mid)) hi = mid;
    else lo = mid;
  }
  const k = Math.max(K_MIN, hi);
  const scale = twoTo(k);
  if (bad) return identityOf(t, evaluations);
  if (Math.abs(k) <= ORDINARY && Math.abs(loc) <= twoTo(ORDINARY) * scale) return identityOf(t, evaluations);
  // Fewer than 2^10 doubles per scale unit at loc (a pole, or a target only a few ulps wide): z cannot resolve more than x.
  if (ulpOf(loc) / scale > FINEST_GRAIN) return identityOf(t, evaluations, ulpOf(loc) / scale);
  if (Math.abs(loc) <= LOC_TO_ZERO * scale) loc = 0;
  const zLower = Number.isFinite(lower) ? outward(lower, loc, scale, -1) : -Infinity;
  const zUpper = Number.isFinite(upper) ? outward(upper, loc, scale, +1) : Infinity;
  return {
    loc,
    scale,
    log2Scale: k,
    identity: false,
    lower,
    upper,
    zLower,
    zUpper,
    grain: ulpOf(loc) / scale,
    evaluations,
    description: loc === 0 ? `z = x/2^${k}` : `z = (x − ${loc})/2^${k}`,
  };
}

/** (e − loc)/scale, moved outwards until loc + scale·z is beyond e (a few steps at most). */
function outward(e: number, loc: number, scale: number, dir: 1 | -1): number {
  let z = (e - loc) / scale;
  if (!Number.isFinite(z)) z = dir * Number.MAX_VALUE;
  for (let i = 0; i < 8 && (dir < 0 ? loc + scale * z > e : loc + scale * z < e); i++) z = nextToward(z, dir * Infinity);
  return z;
}

/** The double next to x towards y. */
function nextToward(x: number, y: number): number {
  if (x === y || !Number.isFinite(x)) return x;
  const dir = y > x ? 1 : -1;
  if (x === 0) return dir * Number.MIN_VALUE;
  const f = new Float64Array([x]);
  const i = new BigInt64Array(f.buffer);
  i[0] += (x > 0) === (dir > 0) ? 1n : -1n;
  return f[0];
}

/**
 * The target of Z: logDensity(z) = target.logDensity(clamp(loc + 2^k·z))
 * (the same values, so envelopes of Z compare directly with logDensity in
 * x; the constant Jacobian is left out), dLogDensity scaled by 2^k, the
 * mode hint and `modes` mapped, support [zLower, zUpper]. @internal
 */
export function standardisedTarget(st: Standardisation, t: CheckedTarget, target: Target): Target {
  const toX = xOf(st);
  const logf = t.logDensity;
  const dlogf = t.dLogDensity;
  const zOf = (x: number): number => Math.min(st.zUpper, Math.max(st.zLower, (x - st.loc) / st.scale));
  const out: { -readonly [K in keyof Target]: Target[K] } = {
    logDensity: (z: number): number => (z === z ? logf(toX(z)) : NaN),
    support: [st.zLower, st.zUpper],
  };
  if (dlogf !== undefined) {
    const s = st.scale;
    out.dLogDensity = (z: number): number => s * dlogf(toX(z));
  }
  if (t.mode !== undefined) out.mode = zOf(t.mode);
  if (target.modes !== undefined) out.modes = target.modes.map(zOf);
  done.add(out);
  origins.set(out, { st, source: t });
  return out;
}

/** Where the standardised targets came from: the map and the target in x. */
const origins = new WeakMap<object, { readonly st: Standardisation; readonly source: CheckedTarget }>();

/** The target in x a target built by {@link standardisedTarget} came from (undefined for any other target). @internal */
export function sourceOf(target: object): CheckedTarget | undefined {
  return origins.get(target)?.source;
}

/** The map a target built by {@link standardisedTarget} came from (undefined for any other target). @internal */
export function standardisationOf(target: object): Standardisation | undefined {
  return origins.get(target)?.st;
}

/**
 * For a target built by {@link standardisedTarget}: the width, in z, of the
 * set of z on which its logDensity is constant (the doubles of x near
 * loc + 2^k·z are ulp(x) apart, that is ulp(x)/2^k in z); else undefined.
 * @internal
 */
export function cellWidthOf(target: object): ((z: number) => number) | undefined {
  const o = origins.get(target);
  if (o === undefined) return undefined;
  const { loc, scale } = o.st;
  return (z: number): number => ulpOf(loc + scale * z) / scale;
}

/** Gives `to` (a wrapper of `from` with the same logDensity values) the cell widths, the map and the target in x of `from`. @internal */
export function inheritCells(from: object, to: object): void {
  const o = origins.get(from);
  if (o !== undefined) origins.set(to, o);
}

/** Spacing of the doubles at x (at least the smallest subnormal). */
function ulpOf(x: number): number {
  const a = Math.abs(x);
  if (!(a >= 2.2250738585072014e-308)) return Number.MIN_VALUE; // below the smallest normal (2^−1022)
  if (a === Infinity) return Infinity;
  // 2^(e−51) for 2^e ≤ a < 2^(e+1): twice the distance to the next double (exact), 2^972 in the top binade
  return a >= 8.98846567431158e307 ? 3.99168061906944e292 : 2 * (nextToward(a, Infinity) - a);
}

/** The map back, x = loc + 2^k·z clamped into the support. @internal */
export function xOf(st: Standardisation): (z: number) => number {
  const { loc, scale, lower, upper } = st;
  return (z: number): number => {
    const x = loc + scale * z;
    return x < lower ? lower : x > upper ? upper : x;
  };
}

/** Errors already given the note of the coordinate. */
const noted = new WeakSet<object>();

/** Adds to an error of the library (once) where it was found: in z, and how z maps to x. @internal */
export function noteCoordinate(e: unknown, st: Standardisation): unknown {
  if (st.identity || !(e instanceof ExactDrawError) || noted.has(e)) return e;
  noted.add(e);
  const coarse =
    st.grain > COARSE_GRAIN
      ? `; the doubles of x near ${st.loc} are ${st.grain.toPrecision(3)} apart in z (${Math.round(1 / st.grain)} per scale unit), so logDensity(z) is a staircase of that step, which a method checking the shape at finer spacing sees as a shape violation (ratio-of-uniforms accepts it)`
      : '';
  e.message = `${e.message} [the method worked in the standardised coordinate ${st.description}; x = ${st.loc === 0 ? '' : `${st.loc} + `}2^${st.log2Scale}·z${coarse}]`;
  return e;
}

/**
 * How a member of a sampler of Z is forwarded by the sampler of x:
 * `'point'` for a function of a point (called at z(x)), `'as-is'`, or a
 * function mapping a description in z to one in x. @internal
 */
export type Forward = 'point' | 'as-is' | ((value: never, st: Standardisation) => unknown);

/**
 * A sampler of x from a sampler of Z: `fill` fills with z and maps in
 * place (no allocation per draw); `stats` are the inner ones with
 * `extraSetup` added to `setupEvaluations`; the members in `forward` are
 * forwarded as said there. For the identity map, `sample` and `fill` are
 * the inner ones and every member is forwarded as it is. @internal
 */
export function mapStandardised<S extends Sampler>(inner: S, st: Standardisation, extraSetup: number, forward: Readonly<Record<string, Forward>>): S {
  const innerSample = inner.sample.bind(inner);
  const innerFill = inner.fill.bind(inner);
  const toX = xOf(st);
  const { loc, scale } = st;
  const out = {
    sample: st.identity
      ? innerSample
      : (): number => {
          try {
            return toX(innerSample());
          } catch (e) {
            throw noteCoordinate(e, st);
          }
        },
    fill: st.identity
      ? innerFill
      : (buffer: Float64Array): Float64Array => {
          try {
            innerFill(buffer);
          } catch (e) {
            throw noteCoordinate(e, st);
          }
          for (let i = 0; i < buffer.length; i++) buffer[i] = toX(buffer[i]);
          return buffer;
        },
    get stats(): SamplerStats {
      const s = inner.stats;
      return { ...s, setupEvaluations: s.setupEvaluations + extraSetup };
    },
  };
  for (const [key, how] of Object.entries(forward)) {
    if (!(key in inner)) continue;
    Object.defineProperty(out, key, {
      enumerable: true,
      get: () => {
        const v = (inner as unknown as Record<string, unknown>)[key];
        if (typeof v === 'function') {
          const g = (v as (z: number) => number).bind(inner);
          return st.identity || how !== 'point' ? g : (x: number): number => g((x - loc) / scale);
        }
        if (st.identity || typeof how !== 'function') return v;
        return (how as (value: unknown, st: Standardisation) => unknown)(v, st);
      },
    });
  }
  return out as unknown as S;
}

/** A point of Z as x (no clamping: descriptions keep their own ends). @internal */
export function pointX(st: Standardisation, z: number): number {
  return st.loc + st.scale * z;
}

/** A log-area over z as one over x: + k·log 2. @internal */
export function areaX(st: Standardisation, logArea: number): number {
  return logArea + st.log2Scale * Math.LN2;
}

/** The description of a T-concave envelope (hull or strip pieces) in z, as one in x. @internal */
export function envelopeInX(e: EnvelopeDescription, st: Standardisation): EnvelopeDescription {
  const px = (z: number): number => pointX(st, z);
  const sl = (g: number): number => g / st.scale;
  const pieces: EnvelopePiece[] = e.pieces.map((p) => ({
    lower: px(p.lower),
    upper: px(p.upper),
    anchor: px(p.anchor),
    value: p.value,
    slope: sl(p.slope),
    squeezeAnchor: px(p.squeezeAnchor),
    squeezeValue: p.squeezeValue,
    squeezeSlope: sl(p.squeezeSlope),
    logArea: areaX(st, p.logArea),
  }));
  return {
    ...e,
    support: [clampX(st, px(e.support[0])), clampX(st, px(e.support[1]))],
    touchPoints: e.touchPoints.map(px),
    pieces,
    logEnvelopeArea: areaX(st, e.logEnvelopeArea),
    logSqueezeArea: areaX(st, e.logSqueezeArea),
  };
}

/** x clamped into the support of the target. @internal */
export function clampX(st: Standardisation, x: number): number {
  return x < st.lower ? st.lower : x > st.upper ? st.upper : x;
}

/** Errors that building in the other coordinate cannot lift (see {@link markFinal}). */
const final = new WeakSet<object>();

/**
 * Marks a refusal as final: {@link retryable} is then false for it, so a
 * factory does not retry in x what was refused in z (e.g. mass beyond
 * ±1.8e308 in x, judged in x by a method built in z). @internal
 */
export function markFinal(e: Error): void {
  final.add(e);
}

/** Errors of a construction that a retry in the other coordinate may avoid. @internal */
export function retryable(e: unknown): boolean {
  if (typeof e === 'object' && e !== null && final.has(e)) return false;
  return e instanceof InvalidTargetError || e instanceof ImproperDensityError || e instanceof ShapeViolationError || e instanceof EnvelopeViolationError;
}

/** How a factory uses the standardised coordinate. @internal */
export interface StandardiseMode {
  /**
   * `'x-first'`: build in x; only when that construction is refused, build
   * in z (the cheap setup of the hull, e.g. one draw per fresh target in a
   * Gibbs step, costs nothing more). `'z-first'`: build in z (in x for the
   * identity); when that is refused, in x.
   */
  readonly order: 'x-first' | 'z-first';
  /** The coarsest spacing of the doubles of x at loc, in scale units, the method can work with in z. */
  readonly maxGrain: number;
  /**
   * For `'x-first'`: whether a sampler built in x is known good without
   * evaluating anything (e.g. its touch points lie in an ordinary range);
   * when it is not, the map is found and the sampler rebuilt in z, and the
   * one in x is kept only when that fails or the doubles are too coarse.
   */
  readonly ordinary?: (s: never) => boolean;
}

/**
 * For the hulls: touch points within ±2^30 and, with two or more, spread
 * over more than 2^−30 (a hull whose scale is ordinary: no extra
 * evaluations for it). @internal
 */
export function ordinaryTouchPoints(tp: readonly number[]): boolean {
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of tp) {
    if (!(Math.abs(x) <= ORDINARY_SPAN)) return false;
    if (x < lo) lo = x;
    if (x > hi) hi = x;
  }
  return tp.length < 2 || hi - lo >= 1 / ORDINARY_SPAN;
}

/** Range of the touch points of a hull built in x that counts as ordinary. */
const ORDINARY_SPAN = /* @__PURE__ */ twoTo(30);

/**
 * The one entrance of the factories: unless `target` is already
 * standardised, builds `build` on the target of Z (or on the target itself,
 * as `mode` says) and maps the draws back. When both constructions are
 * refused, the error of the construction in x is thrown (the method's own
 * message on the target as given). The factories call
 * {@link samplerXFirst} or {@link samplerZFirst} directly, so that a bundle
 * takes only the order it uses. @internal
 */
export function samplerStandardised<S extends Sampler>(
  api: string,
  target: Target,
  t: CheckedTarget,
  build: (target: Target) => S,
  forward: Readonly<Record<string, Forward>>,
  mode: StandardiseMode,
): S {
  return mode.order === 'x-first' ? samplerXFirst(api, target, t, build, forward, mode) : samplerZFirst(api, target, t, build, forward, mode);
}

/** `build` on the target itself, marked as standardised while it runs (so the factory does not standardise it again). */
function builtInX<S extends Sampler>(target: Target, build: (target: Target) => S): S {
  done.add(target);
  try {
    return build(target);
  } finally {
    done.delete(target);
  }
}

/** {@link samplerStandardised} for `order: 'x-first'`. @internal */
export function samplerXFirst<S extends Sampler>(
  api: string,
  target: Target,
  t: CheckedTarget,
  build: (target: Target) => S,
  forward: Readonly<Record<string, Forward>>,
  mode: StandardiseMode,
): S {
  let built: S;
  try {
    built = builtInX(target, build);
  } catch (ex) {
    if (!retryable(ex)) throw ex;
    const st = findStandardisation(api, t, 'probe');
    if (st.identity) throw ex;
    if (st.grain > mode.maxGrain) throw coarseError(api, st, ex);
    let inner: S;
    try {
      inner = build(standardisedTarget(st, t, target));
    } catch (ez) {
      if (retryable(ez)) throw ex;
      throw noteCoordinate(ez, st);
    }
    return mapStandardised(inner, st, st.evaluations, forward);
  }
  if (mode.ordinary === undefined || (mode.ordinary as (s: S) => boolean)(built)) return built;
  const st = findStandardisation(api, t);
  const keep = (): S => mapStandardised(built, { ...st, identity: true, loc: 0, scale: 1, log2Scale: 0 }, st.evaluations, forward);
  if (st.identity || st.grain > mode.maxGrain) return keep();
  try {
    return mapStandardised(build(standardisedTarget(st, t, target)), st, st.evaluations, forward);
  } catch (ez) {
    if (retryable(ez)) return keep();
    throw noteCoordinate(ez, st);
  }
}

/** {@link samplerStandardised} for `order: 'z-first'`. @internal */
export function samplerZFirst<S extends Sampler>(
  api: string,
  target: Target,
  t: CheckedTarget,
  build: (target: Target) => S,
  forward: Readonly<Record<string, Forward>>,
  mode: StandardiseMode,
): S {
  const st = findStandardisation(api, t);
  if (!st.identity && st.grain > mode.maxGrain) throw coarseError(api, st, undefined);
  if (st.identity) return mapStandardised(builtInX(target, build), st, st.evaluations, forward);
  let inner: S;
  try {
    inner = build(standardisedTarget(st, t, target));
  } catch (ez) {
    if (!retryable(ez)) throw noteCoordinate(ez, st);
    return builtInX(target, build);
  }
  return mapStandardised(inner, st, st.evaluations, forward);
}

/** The refusal of a target whose doubles are too coarse for the method (`inX`: its error in x, if it was tried). */
function coarseError(api: string, st: Standardisation, inX: unknown): ShapeViolationError {
  const tried = inX instanceof Error ? ` (built in x, it reported: ${inX.message})` : '';
  return new ShapeViolationError(
    `${api}: the target's scale is only about ${Math.round(1 / st.grain)} spacings of the doubles near its location (doubles ${st.grain.toPrecision(3)} scale units apart): logDensity is a staircase on the scale of the target, which this method's envelope cannot bound within its tolerance${tried}; ratioOfUniformsSampler and exactSampler sample it (as the exact draw's distribution over the doubles, up to the cell rule of the docs)`,
  );
}

/** The coarsest grain at which a hull or piecewise envelope built in z stays within its tolerance (2^−40 of a scale unit). @internal */
export const FINE_GRAIN = /* @__PURE__ */ twoTo(-40);

/**
 * Bounding rectangle of the ratio-of-uniforms region. @internal
 *
 * @packageDocumentation
 */
import { maximizeLog } from '../../bounds/maximize.js';
import { ImproperDensityError, InvalidTargetError, NonFiniteDensityError } from '../../core/errors.js';
import { checkLogDensity } from '../../core/evaluate.js';
import type { CheckedTarget } from '../../core/validate.js';
import { exp, log, log1p, pow } from '../../vendor/math.js';

/**
 * Absolute part of the safety margin of every bound, in log space. Each
 * located supremum b (of log f, of log(x − shift) + k·log f and of
 * log(shift − x) + k·log f) is enlarged to
 * `b + RECTANGLE_MARGIN_ABSOLUTE + RECTANGLE_MARGIN_RELATIVE·|b|`,
 * i.e. each side of the rectangle is widened by a relative 1e-9 (plus 1e-12
 * per unit of |b|, which absorbs rounding in large log-densities). The cost
 * is about 3e-9 of the acceptance rate. The margin absorbs the error of the
 * numerical maximisation and of floating-point rounding; it does not make up
 * for a feature the search missed, which the per-evaluation check reports.
 * @internal
 */
export const RECTANGLE_MARGIN_ABSOLUTE = 1e-9;
/** Relative part of the safety margin; see {@link RECTANGLE_MARGIN_ABSOLUTE}. @internal */
export const RECTANGLE_MARGIN_RELATIVE = 1e-12;

/**
 * Rise of log f over the last factor-256 step towards a finite end of the
 * support (at the closest representable distance) above which the density
 * is declared unbounded there. For a power singularity |x − e|^(a−1) the
 * rise is (1 − a)·8·log 2 per step; for a bounded density it tends to 0.
 * @internal
 */
const UNBOUNDED_RISE = 1e-3;

/** The bounding rectangle in normalised coordinates. @internal */
export interface Rectangle {
  /** The shift s in use. */
  shift: number;
  /** Estimated sup of log f (no margin). */
  logDensityMax: number;
  /** `logDensityMax` plus the margin: f is divided by exp(this), so u ranges over (0, 1]. */
  logDensityBound: number;
  /** Where the sup of log f was found. */
  argmax: number;
  /** Upper v-bound in normalised coordinates (0 when no mass lies above the shift). */
  vMax: number;
  /** Lower v-bound in normalised coordinates (0 when no mass lies below the shift). */
  vMin: number;
  /** log vMax (−Infinity when vMax = 0). */
  logVMax: number;
  /** log(−vMin) (−Infinity when vMin = 0). */
  logVMinAbs: number;
  /** Evaluations of logDensity spent. */
  evaluations: number;
}

/** Margin added to a located log-scale supremum. @internal */
export function margin(b: number): number {
  return RECTANGLE_MARGIN_ABSOLUTE + RECTANGLE_MARGIN_RELATIVE * Math.abs(b);
}

/**
 * Computes the bounding rectangle of the region
 * {(u, v): 0 < u ≤ f(v/u^r + s)^(1/(r+1))} with f normalised by its sup
 * (plus margin), so that u ∈ (0, 1]:
 * vMax = sup over x > s of (x − s)·f̃(x)^(r/(r+1)), vMin = −sup over x < s of
 * (s − x)·f̃(x)^(r/(r+1)), f̃ = f·exp(−logDensityBound). All searches run in
 * log space with {@link maximizeLog}.
 *
 * @param api - API name for messages
 * @param t - the checked target
 * @param power - r > 0
 * @param shiftOption - user-given shift, or undefined for the mode
 * @param cell - for a target whose logDensity is constant on cells wider
 *   than the doubles of its coordinate (a standardised target: logDensity(z)
 *   is f at the double nearest loc + 2^k·z), the width of the cell at a
 *   point: the v-bound at the located supremum z* is widened by a factor
 *   1 + 2·cell(z*)/|z* − s|, because within a cell (z − s) grows while f
 *   stays the same
 * @throws {@link InvalidTargetError} when a bound is infinite (density unbounded at an end,
 *   tails too heavy for this power) or when the mode hint is not a mode
 * @throws {@link ImproperDensityError} when a tail of the density does not decay
 * @throws {@link NonFiniteDensityError} when logDensity returns NaN or +Infinity (inside the support)
 * @internal
 */
export function computeRectangle(api: string, t: CheckedTarget, power: number, shiftOption: number | undefined, cell?: (x: number) => number): Rectangle {
  const { lower, upper } = t;
  const logDensity = t.logDensity;
  let evaluations = 0;
  let infiniteAt: number | undefined;
  /** Setup evaluation of log f: counted, checked; +Infinity at a finite end is recorded as "unbounded there". */
  const lf = (x: number): number => {
    evaluations++;
    const v = logDensity(x);
    if (v === Infinity && (x === lower || x === upper)) {
      infiniteAt = x;
      return -Infinity;
    }
    return checkLogDensity(api, x, v);
  };

  // 1. sup of log f (u-bound: sup f^(1/(r+1)) = exp(sup log f / (r + 1))).
  const m = maximizeLog(api, lf, lower, upper, { hint: t.mode });
  if (m.risingTail === 'upper' && upper === Infinity) {
    throw new ImproperDensityError(
      `${api}: logDensity keeps rising as x → +Infinity (value ${m.value} at x = ${m.x}): the density does not decay in the upper tail, so its mass is infinite`,
    );
  }
  if (m.risingTail === 'lower' && lower === -Infinity) {
    throw new ImproperDensityError(
      `${api}: logDensity keeps rising as x → -Infinity (value ${m.value} at x = ${m.x}): the density does not decay in the lower tail, so its mass is infinite`,
    );
  }
  const pm = polish(lf, m.x, m.value, lower, upper);
  let L = pm.value;
  let argmax = pm.x;
  // Finite ends: the density must stay bounded as x approaches them.
  const ends: Array<[number, 1 | -1, string]> = [];
  if (Number.isFinite(lower)) ends.push([lower, 1, 'lower']);
  if (Number.isFinite(upper)) ends.push([upper, -1, 'upper']);
  const endValue = new Map<number, number>();
  for (const [e, dir, name] of ends) {
    const r = probeEnd(lf, e, dir, upper - lower);
    if (infiniteAt === e || r.unbounded) {
      throw new InvalidTargetError(
        `${api}: the density is unbounded at the ${name} end x = ${e} of the support ` +
          (infiniteAt === e
            ? `(logDensity(${e}) = +Infinity)`
            : `(logDensity rises by ${r.lastRise.toPrecision(3)} per factor 256 closer to the end, reaching ${r.best} at x = ${r.bestX})`) +
          `, so sup f^(1/(r+1)) is infinite for every power r: ratio-of-uniforms needs a bounded density. ` +
          `Sample Y = log(${dir > 0 ? 'X − lower' : 'upper − X'}) instead (density f(${dir > 0 ? 'lower + e^y' : 'upper − e^y'})·e^y, bounded when f has an integrable power singularity at the end) and map back, or use a method for unbounded densities`,
      );
    }
    endValue.set(e, r.best);
    if (r.best > L) {
      L = r.best;
      argmax = r.bestX;
    }
  }
  if (infiniteAt !== undefined) {
    // +Infinity at an end not caught above cannot happen (ends are finite), but stay loud.
    throw new NonFiniteDensityError(api, infiniteAt, Infinity);
  }

  // 2. The mode hint, when it becomes the shift, must be a mode (within a relative 1e-6 in log f).
  if (t.mode !== undefined) {
    let lm = lf(t.mode);
    const ev = endValue.get(t.mode);
    if (ev !== undefined && ev > lm) lm = ev;
    const tol = 1e-6 * (1 + Math.abs(L));
    if (shiftOption === undefined && !(L - lm <= tol)) {
      throw new InvalidTargetError(
        `${api}: target.mode = ${t.mode} is not a mode: logDensity there is ${lm}, but logDensity(${argmax}) = ${L} is larger by ${L - lm}; fix the hint, or pass options.shift to choose the shift explicitly`,
      );
    }
    if (lm >= L) {
      L = lm;
      argmax = t.mode;
    }
  }
  const s = shiftOption ?? t.mode ?? argmax;
  const LM = L + margin(L);
  const k = power / (power + 1);
  const scale = halfWidth(lf, argmax, L, lower, upper);

  // 3. v-bounds on each side of the shift.
  let logVMax = -Infinity;
  if (s < upper) {
    const a = Math.max(s, lower);
    const hp = (x: number): number => {
      if (!(x > s)) return -Infinity;
      const v = lf(x);
      return v === -Infinity ? -Infinity : log(x - s) + k * (v - LM);
    };
    const r = sideSup(api, hp, a, upper, s + scale, scale);
    if (r !== undefined) {
      if (r.rising && upper === Infinity) throw tailError(api, lf, power, s, scale, 1);
      logVMax = r.value + margin(r.value) + cellWidening(cell, r.x, s);
      if (Number.isFinite(upper)) logVMax = Math.min(logVMax, log(upper - s));
    }
  }
  let logVMinAbs = -Infinity;
  if (s > lower) {
    const b = Math.min(s, upper);
    const hm = (x: number): number => {
      if (!(x < s)) return -Infinity;
      const v = lf(x);
      return v === -Infinity ? -Infinity : log(s - x) + k * (v - LM);
    };
    const r = sideSup(api, hm, lower, b, s - scale, scale);
    if (r !== undefined) {
      if (r.rising && lower === -Infinity) throw tailError(api, lf, power, s, scale, -1);
      logVMinAbs = r.value + margin(r.value) + cellWidening(cell, r.x, s);
      if (Number.isFinite(lower)) logVMinAbs = Math.min(logVMinAbs, log(s - lower));
    }
  }
  if (logVMax === -Infinity && logVMinAbs === -Infinity) {
    throw new InvalidTargetError(`${api}: found no mass of the target on either side of shift = ${s} over the support [${lower}, ${upper}]`);
  }
  return {
    shift: s,
    logDensityMax: L,
    logDensityBound: LM,
    argmax,
    vMax: exp(logVMax),
    vMin: logVMinAbs === -Infinity ? 0 : -exp(logVMinAbs),
    logVMax,
    logVMinAbs,
    evaluations,
  };
}

/** log(1 + 2·cell(x)/|x − s|): the widening of a v-bound located at x for a density constant on cells (0 without cells). */
function cellWidening(cell: ((x: number) => number) | undefined, x: number, s: number): number {
  if (cell === undefined) return 0;
  const d = Math.abs(x - s);
  const w = cell(x);
  return d > 0 && w > 0 ? log1p((2 * w) / d) : 0;
}

/**
 * Sup of a v-side function over [a, b]; undefined when every probe is
 * −Infinity (no mass on that side of the shift: the side is empty).
 */
function sideSup(
  api: string,
  h: (x: number) => number,
  a: number,
  b: number,
  hint: number,
  scale: number,
): { value: number; x: number; rising: boolean } | undefined {
  let finiteSeen = false;
  const hh = (x: number): number => {
    const v = h(x);
    if (v > -Infinity) finiteSeen = true;
    return v;
  };
  const c = hint >= a && hint <= b ? hint : Number.isFinite(a) && Number.isFinite(b) ? a + (b - a) / 2 : undefined;
  try {
    const r = maximizeLog(api, hh, a, b, { hint: c, scale });
    const risingEnd = r.risingTail === undefined ? undefined : r.risingTail === 'upper' ? b : a;
    const p = polish(hh, r.x, r.value, a, b);
    return { value: p.value, x: p.x, rising: risingEnd !== undefined && !Number.isFinite(risingEnd) };
  } catch (e) {
    if (e instanceof InvalidTargetError && !finiteSeen) return undefined;
    throw e;
  }
}

/**
 * Probes log f towards the finite end e by factors of 256, from a distance
 * `min(width/4, max(1, |e|·2^-20))` down to the closest representable
 * distance. The density is declared unbounded at e when log f is still
 * rising at the last step, by more than {@link UNBOUNDED_RISE} and by at least
 * half the previous step's rise (a power or log singularity rises by a
 * constant or slowly shrinking amount per step; a bounded density's rise
 * shrinks geometrically), and is then the largest value seen. Returns the
 * largest value seen, including at e itself.
 */
function probeEnd(
  lf: (x: number) => number,
  e: number,
  dir: 1 | -1,
  width: number,
): { unbounded: boolean; best: number; bestX: number; lastRise: number } {
  let best = lf(e);
  let bestX = e;
  let last = -Infinity;
  let lastRise = NaN;
  let prevRise = NaN;
  let d = Math.min(width / 4, Math.max(1, Math.abs(e) * pow(2, -20)));
  for (let j = 0; j < 200 && d >= 1e-300; j++, d /= 256) {
    const x = e + dir * d;
    if (x === e) break;
    const v = lf(x);
    if (v > best) {
      best = v;
      bestX = x;
    }
    if (v > -Infinity && last > -Infinity) {
      prevRise = lastRise;
      lastRise = v - last;
    }
    last = v;
  }
  if (!(lastRise === lastRise)) return { unbounded: false, best, bestX, lastRise: 0 };
  const shrinking = prevRise === prevRise && lastRise <= 0.5 * prevRise;
  return { unbounded: lastRise > UNBOUNDED_RISE && !shrinking && last >= best, best, bestX, lastRise };
}

/**
 * Scans the doubles within about ±32 ulps of x for a larger value of h.
 * Golden-section search stops at a relative bracket of 1e-15, which is
 * several ulps: for a density whose scale is within a few thousand ulps of
 * its location (sd 1e-9 at 1e4), the value there can still be short of the
 * sup over representable points by more than the margin.
 */
function polish(h: (x: number) => number, x: number, value: number, lower: number, upper: number): { x: number; value: number } {
  let bestX = x;
  let best = value;
  if (x === 0 || !Number.isFinite(x)) return { x, value };
  const step = (Math.abs(x) * Number.EPSILON) / 2;
  for (let j = -32; j <= 32; j++) {
    if (j === 0) continue;
    const y = x + j * step;
    if (!(y >= lower && y <= upper)) continue;
    const v = h(y);
    if (v > best) {
      best = v;
      bestX = y;
    }
  }
  return { x: bestX, value: best };
}

/**
 * A rough length scale of the target: the distance from x0 at which log f
 * first drops 1 below L, found by doubling or halving (at most 200 steps).
 */
function halfWidth(lf: (x: number) => number, x0: number, L: number, lower: number, upper: number): number {
  const dir = upper - x0 >= x0 - lower ? 1 : -1;
  const room = dir > 0 ? upper - x0 : x0 - lower;
  let d = Math.min(1, room / 2);
  if (!(d > 0)) return 1;
  if (lf(x0 + dir * d) >= L - 1) {
    for (let i = 0; i < 200 && 2 * d < room && lf(x0 + dir * 2 * d) >= L - 1; i++) d *= 2;
    return 2 * d < room ? 2 * d : d;
  }
  for (let i = 0; i < 200 && d > 1e-300; i++) {
    d /= 2;
    if (lf(x0 + dir * d) >= L - 1) break;
  }
  return d > 0 ? d : 1;
}

/**
 * The error for an infinite v-bound in a tail: measures the tail's decay
 * exponent α (f ~ |x|^(−α)) to say which power would bound it.
 */
function tailError(api: string, lf: (x: number) => number, power: number, s: number, scale: number, dir: 1 | -1): Error {
  const x1 = s + dir * scale * pow(2, 30);
  const x2 = s + dir * scale * pow(2, 40);
  const alpha = -(lf(x2) - lf(x1)) / (log(Math.abs(x2 - s)) - log(Math.abs(x1 - s)));
  const side = dir > 0 ? 'x > shift' : 'x < shift';
  const fn = dir > 0 ? '(x − shift)' : '(shift − x)';
  const lim = dir > 0 ? '+Infinity' : '-Infinity';
  const head =
    `${api}: the bounding rectangle is infinite: sup over ${side} of ${fn}·f(x)^(r/(r+1)) is infinite as x → ${lim} ` +
    `(power r = ${power}, shift = ${s}). The ${dir > 0 ? 'upper' : 'lower'} tail decays like |x|^(−${alpha.toPrecision(3)}) ` +
    `(exponent measured between x = ${x1.toPrecision(3)} and ${x2.toPrecision(3)})`;
  if (!(alpha > 1)) {
    return new ImproperDensityError(`${head}, no faster than |x|^(−1): the mass appears to be infinite, and no power can bound it`);
  }
  const need = 1 / (alpha - 1);
  return new InvalidTargetError(
    `${head}, but power r bounds only tails decaying at least like |x|^(−(r+1)/r) = |x|^(−${((power + 1) / power).toPrecision(3)}); ` +
      `choose power >= 1/(α − 1) ≈ ${need.toPrecision(3)} (a larger power bounds heavier tails)`,
  );
}

/**
 * Largest share of the target's mass that may lie beyond ±Number.MAX_VALUE
 * before {@link checkMassBeyondDoubles} refuses the target: 2^−53, the
 * resolution of the uniforms (a lower bound of the share is compared with it). @internal
 */
export const MAX_MASS_BEYOND_DOUBLES = /* @__PURE__ */ pow(2, -53);

/**
 * The map z = (x − loc)/2^k of a rectangle built for a standardised target
 * (src/methods/transform/standardise.ts), as {@link checkMassBeyondDoubles}
 * needs it. @internal
 */
export interface CoordinateMap {
  readonly loc: number;
  readonly scale: number;
  readonly log2Scale: number;
  readonly description: string;
}

/**
 * Mass beyond the largest double (issue 17): the exact draw, rounded to
 * nearest, would be ±Infinity with the probability the target puts beyond
 * ±1.8e308, but no candidate there can be tested against the density (x
 * overflows), so such candidates would be rejected and that mass silently
 * dropped. Where the support reaches the edge E (±Number.MAX_VALUE; for a
 * rectangle built in a standardised coordinate, the x of z = ±MAX_VALUE when
 * that is nearer), log f at E and at the midpoint of loc and E give the local
 * tail exponent f ∝ |x − loc|^−(1+α) and the tail mass T ≈ |E − loc|·f(E)/α
 * beyond E. The region's area bounds the total mass from above (∫f/f̃max ≤
 * (r+1)(vMax − vMin), times 2^k in x for a standardised rectangle), so their
 * ratio is a lower bound of the share beyond E (power-law extrapolation at
 * E). When it exceeds {@link MAX_MASS_BEYOND_DOUBLES} the target is refused
 * with {@link InvalidTargetError}; α ≤ 0 there (no decay) is an
 * {@link ImproperDensityError}. A value at either probe that is not finite
 * (−Infinity, NaN, +Infinity) skips the check on that side: the probes serve
 * this check only. `t` is the target in x. `onRefusalInX` is called with the
 * error before it is thrown when the edge is ±MAX_VALUE in x itself (a refusal
 * that building in another coordinate cannot lift).
 * @returns the evaluations spent
 * @internal
 */
export function checkMassBeyondDoubles(api: string, t: CheckedTarget, rect: Rectangle, power: number, map?: CoordinateMap, onRefusalInX?: (e: Error) => void): number {
  const M = Number.MAX_VALUE;
  const loc = map === undefined ? 0 : map.loc;
  let evaluations = 0;
  const logArea = log(power + 1) + log(rect.vMax - rect.vMin) + (map === undefined ? 0 : map.log2Scale * Math.LN2);
  for (const dir of [1, -1] as const) {
    // the edge of what the rectangle's candidates can reach: ±MAX_VALUE in x, or x(±MAX_VALUE) in z
    const reach = map === undefined ? dir * M : loc + dir * map.scale * M;
    const E = dir > 0 ? Math.min(M, reach) : Math.max(-M, reach);
    if (dir > 0 ? t.upper < E : t.lower > E) continue;
    const half = loc + 0.5 * (E - loc);
    // a value that is not a finite number or −Infinity out there (e.g. NaN from Infinity − Infinity in
    // the user's formula) is read as "no information": these two points are probed for this check only
    const lE = t.logDensity(E);
    evaluations++;
    if (typeof lE !== 'number' || !(lE > -Infinity && lE < Infinity)) continue;
    const lHalf = t.logDensity(half);
    evaluations++;
    if (typeof lHalf !== 'number' || !(lHalf > -Infinity && lHalf < Infinity)) continue;
    const alpha = (lHalf - lE) / Math.LN2 - 1;
    const where = Math.abs(E) === M ? `${dir > 0 ? '+' : '-'}1.8e308 (the largest double` : `x = ${E} (z = ${dir > 0 ? '+' : '-'}1.8e308, the largest double, in the standardised coordinate ${map === undefined ? '' : map.description}`;
    if (!(alpha > 0)) {
      const e = new ImproperDensityError(`${api}: the density does not decay towards ${where}; logDensity ${lHalf} at ${half}, ${lE} at ${E}): the mass beyond it is infinite`);
      if (Math.abs(E) === M) onRefusalInX?.(e);
      throw e;
    }
    const logShare = log(0.5 * Math.abs(E - loc)) + Math.LN2 + lE - rect.logDensityBound - log(alpha) - logArea;
    if (logShare > log(MAX_MASS_BEYOND_DOUBLES)) {
      const e = new InvalidTargetError(
        `${api}: at least about ${exp(logShare).toPrecision(2)} of the mass lies beyond ${where}; local tail f ~ |x|^(−${(1 + alpha).toPrecision(4)}) there): such draws would be ${Math.abs(E) === M ? `${dir > 0 ? '+' : '-'}Infinity` : 'out of reach'}, and candidates there cannot be tested, so exactdraw refuses the target rather than drop that mass; sample log|x| instead, or truncate the support`,
      );
      if (Math.abs(E) === M) onRefusalInX?.(e);
      throw e;
    }
  }
  return evaluations;
}

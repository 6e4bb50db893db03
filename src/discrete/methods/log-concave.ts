/**
 * Universal rejection for log-concave pmfs: a flat hat over the centre and
 * geometric hats over both tails, anchored at measured points. @internal
 *
 * @remarks
 * For a log-concave pmf p with mode m, Devroye (1987, Computing 39) bounds
 * the normalized pmf by p_m · min(1, e^(1 − p_m|k − m|)): flat within about
 * 1/p_m of the mode, geometric beyond. That needs the normalized p_m, which
 * an unnormalized logPmf does not give; this method measures the two
 * distances instead. With h = logPmf and F = h(m):
 * - on each side it finds a point r where h has dropped by at least 0.3
 *   (a first guess aiming at a drop of 0.6, from the slope and curvature at
 *   the mode, then doubling; a drop near 0.6 minimizes the hat area for a
 *   normal-like pmf);
 * - centre, l ≤ k ≤ r: hat F (h ≤ F at the mode); squeeze: the chord from
 *   (m, F) to (r, h(r)), below h by concavity, so most centre draws need no
 *   evaluation;
 * - tail, k = r + j, j ≥ 1: hat h(r) + j·s with s the secant slope of h
 *   over [r − δ, r] (δ = ⌊(r − m)/4⌋ ≥ 1), above h by concavity (a wider δ
 *   than 1 keeps rounding noise in logPmf out of the slope).
 * Every hat is raised by {@link DISCRETE_LOG_MARGIN}. The secant slopes at the
 * measured points must decrease outward (a discrete second-difference test),
 * else {@link ShapeViolationError}; each evaluation while sampling is checked
 * against the hat ({@link EnvelopeViolationError}) and the squeeze
 * ({@link ShapeViolationError}). Setup: the mode's two neighbours and three to
 * five points per side (the edge, the secant's other end, one point beyond).
 * @internal
 */
import { checkLogDensity } from '../../core/evaluate.js';
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, ImproperDensityError, ShapeViolationError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import { DISCRETE_LOG_MARGIN, MAX_DISCRETE_K, type SetupEvaluator } from '../_internals/setup.js';
import type { DiscreteSampler } from '../types.js';
import { discreteDraws } from '../_internals/draws.js';
import { exp, expm1, log } from '../../vendor/math.js';

/** One side of the hat. @internal */
export interface LogConcaveSide {
  /** End of the centre on this side (r or l). */
  readonly edge: number;
  /** logPmf at the edge. */
  readonly hEdge: number;
  /** Tail slope per step outward (< 0), or NaN when the side has no tail (the support ends at the edge). */
  readonly slope: number;
  /** Chord slope from the mode to the edge, per step outward (≤ 0; 0 when edge = mode). */
  readonly chord: number;
}

/** The hat of {@link buildLogConcaveHat}. @internal */
export interface LogConcaveHat {
  readonly m: number;
  readonly F: number;
  readonly right: LogConcaveSide;
  readonly left: LogConcaveSide;
  /** Hat masses relative to e^(F + margin): centre, right tail, left tail. */
  readonly massCentre: number;
  readonly massRight: number;
  readonly massLeft: number;
}

function side(ev: SetupEvaluator, m: number, F: number, dir: 1 | -1): LogConcaveSide {
  const api = ev.api;
  const end = dir > 0 ? ev.t.upper : ev.t.lower;
  if (m === end) return { edge: m, hEdge: F, slope: NaN, chord: 0 };
  const h1 = ev.h(m + dir);
  const s0 = h1 - F; // ≤ 0 at a mode
  const hb = ev.h(m - dir);
  const c = hb > -Infinity ? h1 - 2 * F + hb : ev.h(m + 2 * dir) - 2 * h1 + F;
  const a = c < 0 && Number.isFinite(c) ? -c / 2 : 0;
  const b = -s0;
  let d: number;
  if (a > 0) d = (-b + Math.sqrt(b * b + 4 * a * 0.6)) / (2 * a);
  else d = b > 0 && Number.isFinite(b) ? 0.6 / b : 1;
  d = Math.max(1, Math.round(d));
  let r = m;
  let hr = F;
  for (let it = 0; ; it++) {
    r = m + dir * d;
    if (dir > 0 ? r >= end : r <= end) r = end;
    if (Math.abs(r) > MAX_DISCRETE_K) {
      throw new ImproperDensityError(`${api}: target.logPmf has not dropped by 0.3 from its mode ${m} within ${d} steps toward ${dir > 0 ? '+' : '-'}Infinity; the pmf does not decay`);
    }
    hr = ev.h(r);
    if (hr > F + DISCRETE_LOG_MARGIN) {
      throw new ShapeViolationError(`${api}: logPmf(${r}) = ${hr} exceeds logPmf at the mode ${m} (${F}); the pmf is not unimodal, so it is not log-concave`, [Math.min(m, r), Math.max(m, r)]);
    }
    if (F - hr >= 0.3 || r === end) break;
    if (it > 1100) throw new ImproperDensityError(`${api}: target.logPmf does not drop from its mode ${m}; the pmf does not decay`);
    d *= 2;
  }
  const dist = Math.abs(r - m);
  const chord = dist > 0 ? (hr - F) / dist : 0;
  if (s0 < chord - DISCRETE_LOG_MARGIN) {
    throw new ShapeViolationError(
      `${api}: the pmf is not log-concave: the slope of logPmf next to the mode ${m} (${s0}) is below its chord slope to ${r} (${chord}) (second differences must be <= 0)`,
      [Math.min(m, r), Math.max(m, r)],
    );
  }
  if (r === end) return { edge: r, hEdge: hr, slope: NaN, chord };
  const delta = Math.max(1, Math.floor(dist / 4));
  const hq = ev.h(r - dir * delta);
  const slope = (hr - hq) / delta;
  if (!(slope < 0)) {
    throw new ShapeViolationError(`${api}: the pmf is not log-concave: logPmf rises toward ${r} from ${r - dir * delta} (${hq} to ${hr}) after dropping from the mode ${m}`, [Math.min(m, r), Math.max(m, r)]);
  }
  if (slope > chord + DISCRETE_LOG_MARGIN) {
    throw new ShapeViolationError(
      `${api}: the pmf is not log-concave: the slope of logPmf at ${r} (${slope}) exceeds its chord slope from the mode ${m} (${chord}) (second differences must be <= 0)`,
      [Math.min(m, r), Math.max(m, r)],
    );
  }
  // one point beyond the edge: the next difference must not exceed the tail slope
  const hn = ev.h(r + dir);
  if (hn - hr > slope + DISCRETE_LOG_MARGIN) {
    throw new ShapeViolationError(
      `${api}: the pmf is not log-concave: logPmf(${r + dir}) - logPmf(${r}) = ${hn - hr} exceeds the slope ${slope} measured before ${r} (second differences must be <= 0)`,
      [Math.min(r, r + dir), Math.max(r, r + dir)],
    );
  }
  return { edge: r, hEdge: hr, slope, chord };
}

/** Builds the hat (setup only); throws {@link ShapeViolationError} if the measured points are not log-concave. @internal */
export function buildLogConcaveHat(ev: SetupEvaluator, m: number): LogConcaveHat {
  const F = ev.h(m);
  const right = side(ev, m, F, 1);
  const left = side(ev, m, F, -1);
  const tail = (s: LogConcaveSide): number => (Number.isNaN(s.slope) ? 0 : exp(s.hEdge - F + s.slope) / -expm1(s.slope));
  return { m, F, right, left, massCentre: right.edge - left.edge + 1, massRight: tail(right), massLeft: tail(left) };
}

/** The sampler over a {@link LogConcaveHat}. @internal */
export function logConcaveSampler(
  api: string,
  hat: LogConcaveHat,
  logPmf: (k: number) => number,
  lo: number,
  hi: number,
  u: Uniform,
  counters: Counters,
  maxRejections: number,
): DiscreteSampler {
  const { m, F } = hat;
  const G = F + DISCRETE_LOG_MARGIN; // centre hat
  const r = hat.right.edge;
  const l = hat.left.edge;
  const hr = hat.right.hEdge + DISCRETE_LOG_MARGIN;
  const hl = hat.left.hEdge + DISCRETE_LOG_MARGIN;
  const sR = hat.right.slope;
  const sL = hat.left.slope;
  const cR = hat.right.chord;
  const cL = hat.left.chord;
  const nC = hat.massCentre;
  const cut1 = nC + hat.massRight;
  const total = cut1 + hat.massLeft;
  const draw = (): number => {
    let rej = 0;
    for (;;) {
      counters.proposals++;
      const t = u() * total;
      let k: number;
      let g: number;
      if (t < nC) {
        k = l + Math.floor(t);
        const v = 1 - u();
        const sq = k >= m ? F + (k - m) * cR : F + (m - k) * cL;
        if (v <= exp(sq - G)) return k;
        g = G;
        const hk = logPmf(k);
        counters.densityEvaluations++;
        checkLogDensity(api, k, hk);
        if (hk > g) throw new EnvelopeViolationError(api, k, hk, g);
        if (hk < sq - DISCRETE_LOG_MARGIN) {
          throw new ShapeViolationError(`${api}: logPmf(${k}) = ${hk} is below the chord from the mode ${m} (${sq}); the pmf is not log-concave`, [Math.min(k, m), Math.max(k, m)]);
        }
        if (v <= exp(hk - g)) return k;
      } else {
        const right = t < cut1;
        const s = right ? sR : sL;
        const j = 1 + Math.floor(log(1 - u()) / s);
        k = right ? r + j : l - j;
        const v = 1 - u();
        if (k >= lo && k <= hi && Math.abs(k) <= MAX_DISCRETE_K) {
          g = (right ? hr : hl) + j * s;
          const hk = logPmf(k);
          counters.densityEvaluations++;
          checkLogDensity(api, k, hk);
          if (hk > g) throw new EnvelopeViolationError(api, k, hk, g);
          if (v <= exp(hk - g)) return k;
        }
      }
      if (++rej >= maxRejections) throw new StalledSamplerError(api, rej, counters.samples, counters.proposals);
    }
  };
  return discreteDraws(api, draw, counters);
}

/**
 * Finding poles at the finite ends of a support, and estimating the mass
 * the change of variables cannot represent. @internal
 *
 * @packageDocumentation
 */
import { checkLogDensity } from '../../core/evaluate.js';
import { ImproperDensityError, InvalidTargetError } from '../../core/errors.js';
import type { CheckedTarget } from '../../core/validate.js';
import type { PoleSide, PoleTarget } from '../../targets/end-distance.js';
import { MIN_POLE_DISTANCE } from './change-of-variables.js';
import type { PoleTransform } from './change-of-variables.js';
import { exp } from '../../vendor/math.js';

/** Factor between consecutive probe distances towards an end. */
const PROBE_FACTOR = 256;
/** Bound on the probes towards one end (256^−140 is far below 2^−1022). */
const PROBE_STEPS = 140;
/** Probes whose rises must all exceed {@link MIN_RISE} for a pole. */
const RISE_RUN = 4;
/** Least rise of log f per factor 256 closer to the end (1e-3 per halving). */
const MIN_RISE = 8e-3;
/** Probing stops early (no pole) after three probes without a rise once within this fraction of the starting distance. */
const EARLY_STOP_DISTANCE = 1e-8;
/**
 * The change of variables refuses a target when the estimated mass below its smallest distance exceeds this.
 *
 * @example
 * ```ts
 * exactSampler(gammaTarget(0.01)); // throws: about 8e-4 of the mass lies below 2^−1022
 * ```
 */
export const MAX_UNREPRESENTED_MASS = 1e-12;

/** What {@link detectPoles} found. @internal */
export interface PoleFinding {
  /** The poles, or undefined. */
  readonly side: PoleSide | undefined;
  /** logDensity calls made. */
  readonly evaluations: number;
  /** For each pole, what was seen (for messages). */
  readonly notes: readonly string[];
}

/**
 * Probes log f towards each finite end at distances shrinking by factors of
 * 256 (from a quarter of the width, or of max(1, |e|) on a half-line, down
 * to 2^−1022 or to the spacing of the doubles at e): a pole is a log-density
 * still rising at the last four probes, by more than 8e-3 each (1e-3 per
 * halving of the distance) and not shrinking geometrically (the last rise at
 * least half of the one three steps before), or +Infinity at the end itself.
 * A power singularity |x − e|^(α−1) rises by (1 − α)·log 256 per step.
 * Probing stops early, with no pole, after three probes without such a rise
 * once the distance is below 1e-8 of the starting one (about six
 * evaluations for a bounded end).
 * @internal
 */
export function detectPoles(target: PoleTarget, t: CheckedTarget): PoleFinding {
  const a = t.lower;
  const b = t.upper;
  const lf = t.logDensity;
  let evaluations = 0;
  const notes: string[] = [];
  const probe = (e: number, dir: 1 | -1, f: ((d: number) => number) | undefined): boolean => {
    if (!Number.isFinite(e)) return false;
    const g = f ?? ((d: number): number => lf(e + dir * d));
    evaluations++;
    if (lf(e) === Infinity) {
      notes.push(`logDensity(${e}) = +Infinity`);
      return true;
    }
    const other = dir > 0 ? b : a;
    let d = (Number.isFinite(other) ? Math.abs(other - e) : Math.max(1, Math.abs(e))) / 4;
    let last = -Infinity;
    const rises: number[] = [];
    let closest = d;
    const near = d * EARLY_STOP_DISTANCE;
    let flat = 0;
    for (let k = 0; k < PROBE_STEPS && d >= MIN_POLE_DISTANCE; k++, d /= PROBE_FACTOR) {
      if (f === undefined && e + dir * d === e) break;
      evaluations++;
      const v = g(d);
      if (v === Infinity) {
        notes.push(`logDensity is +Infinity at distance ${d} from the end`);
        return true;
      }
      if (v !== v) return false;
      if (v > -Infinity && last > -Infinity) {
        rises.push(v - last);
        flat = v - last > MIN_RISE ? 0 : flat + 1;
      } else if (v === -Infinity) {
        flat++;
      }
      last = v;
      closest = d;
      // bounded near the end (three probes without a rise, within 1e-8 of the width): no pole
      if (flat >= 3 && d < near) return false;
    }
    const m = rises.length;
    if (m < RISE_RUN) return false;
    for (let i = m - RISE_RUN; i < m; i++) if (!(rises[i] > MIN_RISE)) return false;
    if (!(rises[m - 1] >= 0.5 * rises[m - RISE_RUN])) return false;
    notes.push(`logDensity rises by about ${(rises[m - 1] / 8).toPrecision(3)} per halving of the distance, down to a distance ${closest.toPrecision(3)}`);
    return true;
  };
  const lo = probe(a, 1, typeof target.logDensityFromLower === 'function' ? target.logDensityFromLower.bind(target) : undefined);
  const hi = probe(b, -1, typeof target.logDensityFromUpper === 'function' ? target.logDensityFromUpper.bind(target) : undefined);
  const side: PoleSide | undefined = lo && hi ? 'both' : lo ? 'lower' : hi ? 'upper' : undefined;
  return { side, evaluations, notes };
}

/** Grid points of the coarse maximum in {@link checkRepresentable}. */
const MAX_GRID = 128;

/**
 * Estimates, for each pole that `tr` keeps, the mass below its smallest
 * represented distance, relative to the height of the transformed density
 * (a tangent bound: below its lowest point y0 the transformed log-density is
 * taken to decay at least as fast as its secant over [y0, y0 ± 1]), and
 * throws when it may exceed {@link MAX_UNREPRESENTED_MASS}; a transformed
 * density that does not decay towards the pole means infinite mass.
 * Also locates the maximum of the transformed density (the best point of a
 * 129-point grid, refined by golden-section search between its neighbours)
 * as a mode hint for the sampler of Y. Returns it with the logDensity calls
 * made. @internal
 */
export function checkRepresentable(api: string, tr: PoleTransform): { evaluations: number; mode: number } {
  const g = tr.target.logDensity;
  const [yLo, yHi] = tr.target.support ?? [-Infinity, Infinity];
  let evaluations = 0;
  const ev = (y: number): number => {
    evaluations++;
    const v: unknown = g(y);
    return checkLogDensity(api, tr.toX(y), v);
  };
  const lo = Math.max(yLo, -745);
  const hi = Math.min(yHi, 710);
  let lmax = -Infinity;
  let best = 0;
  for (let i = 0; i <= MAX_GRID; i++) {
    const v = ev(lo + ((hi - lo) * i) / MAX_GRID);
    if (v > lmax) {
      lmax = v;
      best = i;
    }
  }
  const mode = goldenMax(ev, lo + ((hi - lo) * Math.max(0, best - 1)) / MAX_GRID, lo + ((hi - lo) * Math.min(MAX_GRID, best + 1)) / MAX_GRID);
  lmax = Math.max(lmax, mode.value);
  const ends: [number, 1 | -1, number, string][] = [];
  if (tr.minDistanceLower === tr.minDistanceLower) ends.push([yLo, 1, tr.lower, 'lower']);
  if (tr.minDistanceUpper === tr.minDistanceUpper) ends.push([tr.map === 'logit' ? yHi : yLo, tr.map === 'logit' ? -1 : 1, tr.upper, 'upper']);
  for (const [y0, dir, e, name] of ends) {
    const l0 = ev(y0);
    const l1 = ev(y0 + dir);
    lmax = Math.max(lmax, l0, l1);
    const slope = l1 - l0;
    const dmin = name === 'lower' ? tr.minDistanceLower : tr.minDistanceUpper;
    if (!(lmax > -Infinity)) throw new InvalidTargetError(`${api}: the transformed density ${tr.description} is 0 everywhere it was probed`);
    if (l0 === -Infinity) continue;
    if (!(slope > 0)) {
      throw new ImproperDensityError(
        `${api}: near the ${name} end ${e} the density grows like |x − ${e}|^(−1) or faster (after ${tr.description} the density does not decay towards the end: logDensity ${l0} at distance ${dmin}, ${l1} at e^${dir}·${dmin}), so its mass is infinite`,
      );
    }
    const lost = exp(l0 - lmax) / slope;
    if (lost > MAX_UNREPRESENTED_MASS) {
      throw new InvalidTargetError(
        `${api}: about ${lost.toPrecision(3)} of the mass (estimated) lies within ${dmin} of the ${name} end ${e}, closer than the change of variables ${tr.description} represents; such draws cannot be returned as distinct doubles` +
          (e !== 0 ? ' (give the target logDensityFromLower/logDensityFromUpper, its log-density by the distance to the end, to represent distances down to 2^-1022)' : ''),
      );
    }
  }
  return { evaluations, mode: mode.value >= lmax ? mode.x : lo + ((hi - lo) * best) / MAX_GRID };
}

/** Golden-section search for the maximum of h on [a, b] (80 steps: the bracket shrinks by 0.618^80 ≈ 2e-17). */
function goldenMax(h: (x: number) => number, a: number, b: number): { x: number; value: number } {
  const r = (Math.sqrt(5) - 1) / 2;
  let x1 = b - r * (b - a);
  let x2 = a + r * (b - a);
  let f1 = h(x1);
  let f2 = h(x2);
  for (let k = 0; k < 80 && b - a > 0; k++) {
    if (f1 >= f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - r * (b - a);
      f1 = h(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + r * (b - a);
      f2 = h(x2);
    }
  }
  return f1 >= f2 ? { x: x1, value: f1 } : { x: x2, value: f2 };
}

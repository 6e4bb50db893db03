/**
 * The scan of the piecewise method: where to look at the target before any
 * envelope is built. @internal
 *
 * @packageDocumentation
 */
import { maximizeLog } from '../../bounds/maximize.js';
import { ImproperDensityError, InvalidTargetError, NonFiniteDensityError, ShapeViolationError } from '../../core/errors.js';
import type { CheckedTarget } from '../../core/validate.js';

/**
 * Counted, checked access to the target. Every call of `logDensity` (and of
 * `dLogDensity`) made while building goes through here, so that the counts
 * are exact and the evaluation budget bounds every setup loop. @internal
 */
export class Evaluator {
  /** Calls of logDensity so far. */
  evaluations = 0;
  /** Calls of dLogDensity so far. */
  derivativeEvaluations = 0;

  /**
   * @param api - API name for messages
   * @param logf - the log-density
   * @param dlogf - its derivative, or undefined (secant construction)
   * @param budget - maximal number of logDensity calls
   */
  constructor(
    readonly api: string,
    readonly logf: (x: number) => number,
    readonly dlogf: ((x: number) => number) | undefined,
    readonly budget: number,
  ) {}

  /** logDensity(x), checked for NaN and +Infinity. */
  l(x: number): number {
    if (++this.evaluations > this.budget) {
      throw new ShapeViolationError(
        `${this.api}: setup used ${this.budget} evaluations of logDensity without reaching a valid envelope; the target's shape could not be classified (a derivative inconsistent with logDensity, or a density with features at every scale?)`,
      );
    }
    const v = this.logf(x);
    if (v !== v || v === Infinity || typeof v !== 'number') throw new NonFiniteDensityError(this.api, x, v);
    return v;
  }

  /**
   * dLogDensity(x) at a point where logDensity is `l`; NaN when there is no
   * derivative, when l is -Infinity, or when the derivative is ±Infinity
   * (no usable tangent there). A NaN derivative at a point of positive
   * density throws.
   */
  g(x: number, l: number): number {
    const d = this.dlogf;
    if (d === undefined || l === -Infinity) return NaN;
    this.derivativeEvaluations++;
    const v = d(x);
    if (typeof v !== 'number' || v !== v) throw new NonFiniteDensityError(`${this.api} (dLogDensity)`, x, v);
    return v === Infinity || v === -Infinity ? NaN : v;
  }
}

/** A scanned point. @internal */
export interface ScanPoint {
  x: number;
  l: number;
  g: number;
}

/** Result of {@link scanTarget}. @internal */
export interface ScanResult {
  /** Points, increasing, inside the effective support, with l (and g). */
  points: ScanPoint[];
  /** Effective lower end: finite (a point of `points`) or -Infinity (a tail). */
  lower: number;
  /** Effective upper end. */
  upper: number;
  /** Centre of the rays. */
  centre: number;
  /** Largest log-density seen. */
  logMax: number;
  /** The window that received the uniform grid. */
  core: [number, number];
}

/** Doublings of a ray beyond which a ray stops as soon as the density decreases (2^64 units). */
const RAY_SOFT_STEPS = 104;
/** Hard bound on the doublings of a ray (beyond it x overflows anyway). */
const RAY_HARD_STEPS = 1200;
/** A ray stops once the log-density is this far below the maximum and still decreasing. */
const RAY_DROP = 1000;
/** The uniform grid covers the window where ray probes are within this of the maximum (or rising). */
const CORE_DROP = 40;
/** Geometric probes towards a finite end of the support. */
const APPROACH_STEPS = 64;

/**
 * Scans the target: a centre (the mode hint or a global maximisation),
 * geometric rays from it to both ends (which see features at every scale
 * and the decay of the tails), geometric approaches to finite ends (which
 * reveal a density unbounded there), a uniform grid of `corePoints` points
 * over the window holding the visible mass, and the caller's extra points.
 * @internal
 */
export function scanTarget(
  api: string,
  t: CheckedTarget,
  ev: Evaluator,
  corePoints: number,
  extra: readonly number[],
  useDerivative: boolean,
): ScanResult {
  const lower = t.lower;
  const upper = t.upper;
  let c: number | undefined;
  let lc = -Infinity;
  if (t.mode !== undefined) {
    lc = ev.l(t.mode);
    if (lc > -Infinity) c = t.mode;
  }
  if (c === undefined) {
    const r = maximizeLog(api, (x: number) => ev.l(x), lower, upper, {});
    if (r.risingTail === 'upper' && upper === Infinity) {
      throw new ImproperDensityError(`${api}: no decay found in the upper tail: logDensity keeps rising towards +Infinity (best point ${r.x}, logDensity ${r.value})`);
    }
    if (r.risingTail === 'lower' && lower === -Infinity) {
      throw new ImproperDensityError(`${api}: no decay found in the lower tail: logDensity keeps rising towards -Infinity (best point ${r.x}, logDensity ${r.value})`);
    }
    c = r.x;
    lc = ev.l(c);
    if (!(lc > -Infinity)) {
      throw new InvalidTargetError(`${api}: the maximisation ended at x = ${c} where logDensity is -Infinity; give target.mode inside the support`);
    }
  }
  const centre = c;
  const all: ScanPoint[] = [{ x: centre, l: lc, g: NaN }];
  let logMax = lc;
  let unit = Math.pow(2, -40) * Math.max(1, Math.abs(centre));
  if (Number.isFinite(lower) && Number.isFinite(upper)) unit = Math.min(unit, (upper - lower) * Math.pow(2, -40));
  if (!(unit > 0)) unit = Number.MIN_VALUE;

  const rayUp = ray(+1);
  const rayDown = ray(-1);

  function ray(dir: 1 | -1): ScanPoint[] {
    const end = dir > 0 ? upper : lower;
    const out: ScanPoint[] = [];
    let prevX = centre;
    let prevL = lc;
    let dec = 0;
    let zeros = 0;
    let stopped = false;
    for (let k = 0; k <= RAY_HARD_STEPS; k++) {
      const x = centre + dir * unit * Math.pow(2, k);
      if (!Number.isFinite(x)) break;
      if (dir > 0 ? x >= end : x <= end) break;
      if (x === prevX) continue;
      const l = ev.l(x);
      out.push({ x, l, g: NaN });
      if (l > logMax) logMax = l;
      if (l === -Infinity) zeros++;
      else zeros = 0;
      if (l > -Infinity && l < prevL) dec++;
      else if (l > -Infinity) dec = 0;
      prevX = x;
      if (l > -Infinity) prevL = l;
      if (zeros >= 3) { stopped = true; break; }
      if (l > -Infinity && l < logMax - RAY_DROP && dec >= 3) { stopped = true; break; }
      if (k >= RAY_SOFT_STEPS && dec >= 3) { stopped = true; break; }
    }
    if (Number.isFinite(end)) {
      // Approach the finite end geometrically, then the end itself.
      const base = out.length > 0 ? out[out.length - 1].x : centre;
      const span = Math.abs(end - base);
      const rises: number[] = [];
      let last = out.length > 0 ? out[out.length - 1].l : lc;
      let lastX = base;
      for (let k = 1; k <= APPROACH_STEPS && span > 0; k++) {
        const x = end - dir * span * Math.pow(2, -k);
        if (x === end || x === lastX) break;
        const l = ev.l(x);
        out.push({ x, l, g: NaN });
        if (l > logMax) logMax = l;
        if (l > -Infinity && last > -Infinity) rises.push(l - last);
        last = l;
        lastX = x;
      }
      checkBoundedAtEnd(api, dir, end, rises, lastX);
      const le = ev.l(end);
      if (le > logMax) logMax = le;
      out.push({ x: end, l: le, g: NaN });
    } else if (!stopped) {
      const lastFinite = out.filter((p) => p.l > -Infinity);
      const p = lastFinite[lastFinite.length - 1];
      throw new ImproperDensityError(
        `${api}: no decay found in the ${dir > 0 ? 'upper' : 'lower'} tail: along geometric probes up to x = ${p === undefined ? prevX : p.x} the log-density (${p === undefined ? '-Infinity' : p.l}) does not keep decreasing; the mass may be infinite`,
      );
    }
    return out;
  }

  // The window that gets the uniform grid: up to one probe beyond the outermost
  // probe that is within CORE_DROP of the maximum or higher than the probe before it.
  const coreUp = coreEnd(rayUp, upper);
  const coreDown = coreEnd(rayDown, lower);
  function coreEnd(r: ScanPoint[], end: number): number {
    let j = -1;
    let prev = lc;
    for (let i = 0; i < r.length; i++) {
      const l = r[i].l;
      if (l >= logMax - CORE_DROP || l > prev) j = i;
      prev = l;
    }
    if (j + 1 < r.length) return r[j + 1].x;
    return r.length > 0 ? r[r.length - 1].x : Number.isFinite(end) ? end : centre;
  }
  for (const p of rayUp) all.push(p);
  for (const p of rayDown) all.push(p);
  const a = coreDown;
  const b = coreUp;
  if (b > a) {
    for (let i = 1; i <= corePoints; i++) {
      const s = i / (corePoints + 1);
      const x = a * (1 - s) + b * s;
      if (x > a && x < b) all.push({ x, l: ev.l(x), g: NaN });
    }
  }
  for (const x of extra) all.push({ x, l: ev.l(x), g: NaN });
  for (const p of all) if (p.l > logMax) logMax = p.l;

  all.sort((p, q) => p.x - q.x);
  const pts: ScanPoint[] = [];
  for (const p of all) if (pts.length === 0 || pts[pts.length - 1].x !== p.x) pts.push(p);

  // Effective support: leading and trailing runs of zero density are cut down to one point.
  let first = 0;
  while (first + 1 < pts.length && pts[first].l === -Infinity && pts[first + 1].l === -Infinity) first++;
  let last = pts.length - 1;
  while (last - 1 > first && pts[last].l === -Infinity && pts[last - 1].l === -Infinity) last--;
  const kept = pts.slice(first, last + 1);
  const effLower = kept[0].l === -Infinity || Number.isFinite(lower) ? kept[0].x : -Infinity;
  const effUpper = kept[kept.length - 1].l === -Infinity || Number.isFinite(upper) ? kept[kept.length - 1].x : Infinity;
  if (useDerivative) for (const p of kept) p.g = ev.g(p.x, p.l);
  return { points: kept, lower: effLower, upper: effUpper, centre, logMax, core: [a, b] };
}

/**
 * Throws when the log-density keeps rising towards a finite end of the
 * support (the last 8 geometric approach steps each rise by more than 1e-3
 * and the rises do not shrink): the density is unbounded there.
 */
function checkBoundedAtEnd(api: string, dir: 1 | -1, end: number, rises: number[], closest: number): void {
  const m = rises.length;
  if (m < 8) return;
  for (let i = m - 8; i < m; i++) if (!(rises[i] > 1e-3)) return;
  if (!(rises[m - 1] >= 0.5 * rises[m - 8])) return;
  throw new InvalidTargetError(
    `${api}: the density appears unbounded at the ${dir > 0 ? 'upper' : 'lower'} end ${end} of the support: logDensity rises by about ${rises[m - 1].toPrecision(3)} per halving of the distance down to x = ${closest}; no envelope of finite height exists (sample Y = log|X − ${end}| instead, whose density is bounded)`,
  );
}

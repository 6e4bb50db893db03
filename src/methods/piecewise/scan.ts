/**
 * The scan of the piecewise method: where to look at the target before any
 * envelope is built. @internal
 *
 * @packageDocumentation
 */
import { maximizeLog } from '../../bounds/maximize.js';
import { ImproperDensityError, InvalidTargetError } from '../../core/errors.js';
import type { Evaluator } from '../../core/evaluate.js';
import type { CheckedTarget } from '../../core/validate.js';
import { pow } from '../../vendor/math.js';

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

/**
 * Doublings of a ray (of 2^−40·max(1, |centre|)) beyond which it stops as
 * soon as the density has decreased three times in a row: the rays reach
 * 2^64·max(1, |centre|) ≈ 1.8e19·max(1, |centre|) on both sides, so a second
 * mode far from the first is still seen (as a rise between two probes).
 */
const RAY_SOFT_STEPS = 104;
/** Hard bound on the doublings of a ray (beyond it x overflows anyway). */
const RAY_HARD_STEPS = 1200;
/** Probes per doubling of a ray (ratio √2 between consecutive distances). */
const RAY_PER_OCTAVE = 2;
/**
 * The uniform grids: one per level, each over the window where ray probes
 * are within e^drop of the maximum (or rising), with an equal share of the
 * scan points. Nested windows give fine resolution near the mass whatever
 * the tails: for a Gaussian body they are all a few sd wide, for a Cauchy
 * body the inner ones are.
 */
const CORE_DROPS = [5, 10, 20, 40, 80] as const;
/** Geometric probes towards a finite end of the support. */
const APPROACH_STEPS = 64;

/**
 * Scans the target: a centre (the mode hint or a global maximisation),
 * geometric rays from it to both ends with two probes per doubling of the
 * distance (which see features at every scale and the decay of the tails),
 * geometric approaches to finite ends (which reveal a density unbounded
 * there), uniform grids sharing `corePoints` points over nested windows
 * holding the visible mass (each twice as far from the centre as the
 * outermost ray probe within e^5, e^10, e^20, e^40, e^80 of the maximum or
 * above its predecessor), and the caller's extra points.
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
    lc = ev.logDensity(t.mode);
    if (lc > -Infinity) c = t.mode;
  }
  if (c === undefined) {
    const r = maximizeLog(api, (x: number) => ev.logDensity(x), lower, upper, {});
    if (r.risingTail === 'upper' && upper === Infinity) {
      throw new ImproperDensityError(`${api}: no decay found in the upper tail: logDensity keeps rising towards +Infinity (best point ${r.x}, logDensity ${r.value})`);
    }
    if (r.risingTail === 'lower' && lower === -Infinity) {
      throw new ImproperDensityError(`${api}: no decay found in the lower tail: logDensity keeps rising towards -Infinity (best point ${r.x}, logDensity ${r.value})`);
    }
    c = r.x;
    lc = ev.logDensity(c);
    if (!(lc > -Infinity)) {
      throw new InvalidTargetError(`${api}: the maximisation ended at x = ${c} where logDensity is -Infinity; give target.mode inside the support`);
    }
  }
  const centre = c;
  const all: ScanPoint[] = [{ x: centre, l: lc, g: NaN }];
  let logMax = lc;
  let unit = pow(2, -40) * Math.max(1, Math.abs(centre));
  if (Number.isFinite(lower) && Number.isFinite(upper)) unit = Math.min(unit, (upper - lower) * pow(2, -40));
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
    for (let k = 0; k <= RAY_HARD_STEPS * RAY_PER_OCTAVE; k++) {
      const x = centre + dir * unit * pow(2, k / RAY_PER_OCTAVE);
      if (!Number.isFinite(x)) break;
      if (dir > 0 ? x >= end : x <= end) break;
      if (x === prevX) continue;
      const l = ev.logDensity(x);
      out.push({ x, l, g: NaN });
      if (l > logMax) logMax = l;
      if (l === -Infinity) zeros++;
      else zeros = 0;
      if (l > -Infinity && l < prevL) dec++;
      else if (l > -Infinity) dec = 0;
      prevX = x;
      if (l > -Infinity) prevL = l;
      if (zeros >= 3) { stopped = true; break; }
      if (k >= RAY_SOFT_STEPS * RAY_PER_OCTAVE && dec >= 3) { stopped = true; break; }
    }
    if (Number.isFinite(end)) {
      // Approach the finite end geometrically, then the end itself.
      const base = out.length > 0 ? out[out.length - 1].x : centre;
      const span = Math.abs(end - base);
      const rises: number[] = [];
      let last = out.length > 0 ? out[out.length - 1].l : lc;
      let lastX = base;
      for (let k = 1; k <= APPROACH_STEPS && span > 0; k++) {
        const x = end - dir * span * pow(2, -k);
        if (x === end || x === lastX) break;
        const l = ev.logDensity(x);
        out.push({ x, l, g: NaN });
        if (l > logMax) logMax = l;
        if (l > -Infinity && last > -Infinity) rises.push(l - last);
        last = l;
        lastX = x;
      }
      checkBoundedAtEnd(api, dir, end, rises, lastX);
      const le = ev.logDensity(end);
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

  // The windows that get uniform grids: twice the distance from the centre to
  // the outermost ray probe that is within e^drop of the maximum or higher
  // than the probe before it (within the support).
  function coreEnd(r: ScanPoint[], end: number, dir: 1 | -1, drop: number): number {
    let j = -1;
    let prev = lc;
    for (let i = 0; i < r.length; i++) {
      const l = r[i].l;
      if (l >= logMax - drop || l > prev) j = i;
      prev = l;
    }
    const d = j >= 0 ? Math.abs(r[j].x - centre) : r.length > 0 ? Math.abs(r[0].x - centre) : 0;
    const x = centre + dir * 2 * d;
    if (Number.isFinite(end) && (dir > 0 ? x > end : x < end)) return end;
    return Number.isFinite(x) ? x : dir * Number.MAX_VALUE;
  }
  for (const p of rayUp) all.push(p);
  for (const p of rayDown) all.push(p);
  const levels = CORE_DROPS.length;
  let a = Infinity;
  let b = -Infinity;
  for (let k = 0; k < levels; k++) {
    const lo = coreEnd(rayDown, lower, -1, CORE_DROPS[k]);
    const hi = coreEnd(rayUp, upper, +1, CORE_DROPS[k]);
    if (lo < a) a = lo;
    if (hi > b) b = hi;
    if (!(hi > lo)) continue;
    const m = Math.floor(corePoints / levels) + (k < corePoints % levels ? 1 : 0);
    // offsets k/levels interleave the grids of coinciding windows
    for (let i = 0; i < m; i++) {
      const t = (i + (k + 1) / (levels + 1)) / m;
      const x = lo * (1 - t) + hi * t;
      if (x > lo && x < hi) all.push({ x, l: ev.logDensity(x), g: NaN });
    }
  }
  for (const x of extra) all.push({ x, l: ev.logDensity(x), g: NaN });
  for (const p of all) if (p.l > logMax) logMax = p.l;

  all.sort((p, q) => p.x - q.x);
  // merge points within 1024 ulps of each other (their chords would be mostly rounding)
  const pts: ScanPoint[] = [];
  for (const p of all) {
    const q = pts[pts.length - 1];
    if (q === undefined || !(p.x - q.x <= 1024 * ulp(p.x)) || p.x === upper) pts.push(p);
  }

  // Effective support: leading and trailing runs of zero density are cut down to one point.
  let first = 0;
  while (first + 1 < pts.length && pts[first].l === -Infinity && pts[first + 1].l === -Infinity) first++;
  let last = pts.length - 1;
  while (last - 1 > first && pts[last].l === -Infinity && pts[last - 1].l === -Infinity) last--;
  const kept = pts.slice(first, last + 1);
  const effLower = kept[0].l === -Infinity || Number.isFinite(lower) ? kept[0].x : -Infinity;
  const effUpper = kept[kept.length - 1].l === -Infinity || Number.isFinite(upper) ? kept[kept.length - 1].x : Infinity;
  checkBeyondZeros(api, ev, kept, lower, upper);
  if (useDerivative) for (const p of kept) p.g = ev.derivative(p.x, p.l);
  return { points: kept, lower: effLower, upper: effUpper, centre, logMax, core: [a, b] };
}

/**
 * Octaves of the probes beyond an end where the scan found the density to
 * be 0: up to 2^20 times the larger of the width of the positive part and
 * the distance from it to the zero.
 */
const ZERO_GAP_OCTAVES = 20;
/** Cap on the probes beyond one zero, and on the bisection steps locating a gap's ends. */
const ZERO_GAP_MAX_PROBES = 80;

/**
 * Where the scan cut the support at a zero of the density, probes further
 * out: from the zero, at distances δ·2^(k/2) (δ its distance from the
 * nearest point of positive density, two probes per octave, up to 2^20
 * times the larger of δ and the width of the positive part, within the
 * support). A positive density there means the support is not an interval
 * and the scan would have dropped a component, so the target is refused
 * with {@link InvalidTargetError} naming the gap (located by bisection)
 * instead of being sampled without it.
 */
function checkBeyondZeros(api: string, ev: Evaluator, kept: readonly ScanPoint[], lower: number, upper: number): void {
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of kept) {
    if (p.l === -Infinity) continue;
    if (p.x < lo) lo = p.x;
    if (p.x > hi) hi = p.x;
  }
  if (!(hi >= lo)) return;
  const width = Math.max(hi - lo, ulp(hi) * 1024, ulp(lo) * 1024);
  for (const dir of [-1, 1] as const) {
    const end = kept[dir > 0 ? kept.length - 1 : 0];
    if (end.l !== -Infinity) continue; // not cut at a zero
    const edge = dir > 0 ? hi : lo;
    const bound = dir > 0 ? upper : lower;
    const delta = Math.abs(end.x - edge);
    const reach = pow(2, ZERO_GAP_OCTAVES) * Math.max(width, delta);
    let zeroAt = end.x;
    for (let k = 0; k < 2 * ZERO_GAP_MAX_PROBES; k++) {
      const d = delta * pow(2, k / 2);
      const x = end.x + dir * d;
      if (!Number.isFinite(x) || d > reach || (dir > 0 ? x > bound : x < bound)) break;
      const l = ev.logDensity(x);
      if (l === -Infinity) {
        zeroAt = x;
        continue;
      }
      // locate the gap's ends by bisection (error path only)
      let a = edge;
      let b = end.x;
      for (let i = 0; i < ZERO_GAP_MAX_PROBES; i++) {
        const m = a + 0.5 * (b - a);
        if (m === a || m === b) break;
        if (ev.logDensity(m) > -Infinity) a = m;
        else b = m;
      }
      let c = zeroAt;
      let e = x;
      for (let i = 0; i < ZERO_GAP_MAX_PROBES; i++) {
        const m = c + 0.5 * (e - c);
        if (m === c || m === e) break;
        if (ev.logDensity(m) > -Infinity) e = m;
        else c = m;
      }
      const g0 = Math.min(b, c);
      const g1 = Math.max(b, c);
      throw new InvalidTargetError(
        `${api}: logDensity is -Infinity on about [${g0}, ${g1}] but finite on both sides (at x = ${edge} and at x = ${x}, logDensity ${l}): the support is not an interval, and the envelope would leave out the part beyond the gap; sample each interval with its own support and mix the draws by their masses`,
      );
    }
  }
}

/** Spacing of the doubles at x (2^−52·|x|, at least the smallest normal). */
function ulp(x: number): number {
  return Math.max(Math.abs(x) * pow(2, -52), pow(2, -1022));
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

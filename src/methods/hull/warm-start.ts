/**
 * Warm start of the hull engine for a sequence of related targets (the
 * full conditionals of a Gibbs sampler): start points placed from the mode
 * and scale of the previous target's hull instead of a search. @internal
 *
 * @packageDocumentation
 */
import type { Hull } from './hull.js';
import { probeSlope } from './start.js';
import type { Probe, StartResult, StartSearch } from './start.js';

/** Where the previous target's mass was: a centre (its mode estimate) and a length scale. @internal */
export interface WarmCentre {
  centre: number;
  scale: number;
}

/** Probes the bracketing loop may add after the first two or three (then setup's own refinement takes over). @internal */
export const WARM_MAX_EXTRA_PROBES = 6;

/**
 * Start points for a target near a previous one.
 *
 * @remarks
 * The centre c is the target's mode hint when it has one, else the previous
 * centre; the scale σ is the previous scale. With tangents the first probes
 * are c − σ and c + σ (the two tangents of a normal touching at ±σ give the
 * smallest envelope two tangents can: 1.32 times the area of the density,
 * common practice); derivative-free, c − σ, c and c + σ (three points are
 * the least a secant hull needs). A point beyond a finite end moves halfway
 * to it. When these do not bracket the mode (the derivative, or the values,
 * do not change direction), further probes go where a quadratic fit of the
 * probes closest to that side puts the mode, one scale further out, at most
 * {@link WARM_MAX_EXTRA_PROBES} of them; a fit that puts the mode beyond a
 * finite end stops the loop (the mode is at that end or close to it).
 * Validity is not this function's business: setup refines the hull until
 * it is valid and integrable, as for any start. Every probe becomes a
 * touch point.
 * @internal
 */
export function warmStartPoints(s: StartSearch, lower: number, upper: number, modeHint: number | undefined, prev: WarmCentre, pool: ProbePool = new ProbePool()): StartResult {
  pool.clear();
  const useD = s.useDerivative;
  let c = modeHint !== undefined ? modeHint : prev.centre;
  if (c < lower) c = lower;
  if (c > upper) c = upper;
  const sigma = prev.scale;
  const left = inside(c - sigma, c, lower, upper);
  const right = inside(c + sigma, c, lower, upper);
  if (left > lower && left < c) pool.probe(s, left);
  if (!useD && c > lower && c < upper) pool.probe(s, c);
  if (right < upper && right > c) pool.probe(s, right);
  if (pool.size() === 0) pool.probe(s, c);
  for (let extra = 0; extra < WARM_MAX_EXTRA_PROBES; extra++) {
    const x = nextBracketProbe(pool, useD, lower, upper, sigma);
    if (x !== x) break;
    pool.probe(s, x);
  }
  return { probes: pool.finish(), scale: sigma };
}

/** A point one scale from the centre, moved halfway to a finite end it would cross. */
function inside(x: number, from: number, lower: number, upper: number): number {
  if (x <= lower) return lower === -Infinity ? x : from + 0.5 * (lower - from);
  if (x >= upper) return upper === Infinity ? x : from + 0.5 * (upper - from);
  return x;
}

/** A probe whose fields are rewritten when its pool is reused. */
interface PooledProbe {
  x: number;
  l: number;
  g: number;
}

/**
 * Storage of the warm start's probes, reused from one target to the next
 * (a Gibbs step builds a hull per draw; fresh arrays and objects for every
 * step were about a third of its allocation). The probes handed to setup
 * are valid until the next {@link ProbePool.clear}. @internal
 */
export class ProbePool {
  /** The probes of the current start, in the order evaluated. */
  readonly probes: Probe[] = [];
  /** The finite probes sorted by x (scratch of {@link nextBracketProbe}). */
  readonly sorted: Probe[] = [];
  private readonly store: PooledProbe[] = [];
  /** Probes of the current start (`probes` is cut to this length by {@link ProbePool.finish}). */
  private count = 0;

  /**
   * Forgets the probes (their objects are reused). The arrays keep their
   * length until {@link ProbePool.finish}: `length = 0` would drop their
   * backing stores, and every push after it would allocate a new one.
   */
  clear(): void {
    this.count = 0;
  }

  /** Cuts {@link ProbePool.probes} to the probes of the current start and returns it. */
  finish(): Probe[] {
    if (this.probes.length !== this.count) this.probes.length = this.count;
    return this.probes;
  }

  /** Evaluates the log-density (and the derivative when the search uses it and the value is finite) at x and keeps the probe. */
  probe(s: StartSearch, x: number): void {
    const l = s.evaluate(x);
    const g = probeSlope(s, x, l);
    const n = this.count++;
    let p = this.store[n];
    if (p === undefined) {
      p = { x, l, g };
      this.store.push(p);
    } else {
      p.x = x;
      p.l = l;
      p.g = g;
    }
    if (n < this.probes.length) this.probes[n] = p;
    else this.probes.push(p);
  }

  /** Number of probes of the current start. */
  size(): number {
    return this.count;
  }

  /** The finite probes in increasing x, in {@link ProbePool.sorted} (insertion sort: few probes). */
  sortByX(): Probe[] {
    const a = this.sorted;
    const all = this.probes;
    let m = 0;
    for (let i = 0; i < this.count; i++) {
      const p = all[i];
      if (!(p.l > -Infinity)) continue;
      if (m < a.length) a[m] = p;
      else a.push(p);
      m++;
    }
    if (a.length !== m) a.length = m;
    for (let i = 1; i < a.length; i++) {
      const p = a[i];
      let j = i - 1;
      while (j >= 0 && a[j].x > p.x) {
        a[j + 1] = a[j];
        j--;
      }
      a[j + 1] = p;
    }
    return a;
  }
}

/**
 * The next probe towards the mode when the probes do not bracket it, or NaN
 * when they do (or when the mode appears to lie at a finite end, or no
 * sensible point is found).
 */
function nextBracketProbe(pool: ProbePool, useD: boolean, lower: number, upper: number, sigma: number): number {
  const a = pool.sortByX();
  const n = a.length;
  if (n === 0) return NaN;
  // direction in which the mode lies: -1 left of every probe, +1 right of every probe, 0 bracketed
  let side: number;
  if (useD) {
    for (let i = 0; i < n; i++) if (!Number.isFinite(a[i].g)) return NaN;
    // the derivative decreases: all negative puts the mode left of every probe, all positive right
    side = a[0].g < 0 ? -1 : a[n - 1].g > 0 ? 1 : 0;
  } else {
    if (n < 2) return NaN;
    let im = 0;
    for (let i = 1; i < n; i++) if (a[i].l > a[im].l) im = i;
    side = im === 0 ? -1 : im === n - 1 ? 1 : 0;
  }
  if (side === 0) return NaN;
  // the two (derivative) or three (values) probes nearest that side
  const e = side < 0 ? a[0] : a[n - 1];
  const bound = side < 0 ? lower : upper;
  let m = NaN;
  let sc = NaN;
  if (useD && n >= 2) {
    const f = side < 0 ? a[1] : a[n - 2];
    const cc = (f.g - e.g) / (f.x - e.x);
    if (cc < 0) {
      m = e.x - e.g / cc;
      sc = 1 / Math.sqrt(-cc);
    }
  } else if (!useD && n >= 3) {
    const i0 = side < 0 ? 0 : n - 3;
    const p0 = a[i0];
    const p1 = a[i0 + 1];
    const p2 = a[i0 + 2];
    const d1 = (p1.l - p0.l) / (p1.x - p0.x);
    const d2 = (p2.l - p1.l) / (p2.x - p1.x);
    const curv = (2 * (d2 - d1)) / (p2.x - p0.x);
    if (curv < 0) {
      m = 0.5 * (p0.x + p1.x) - d1 / curv;
      sc = Math.sqrt(-1 / curv);
    }
  }
  if (!(sc > 0 && sc < Infinity) || !(m === m)) {
    // no usable curvature: step out by twice the spread (or the scale)
    const spread = n >= 2 ? a[n - 1].x - a[0].x : sigma;
    sc = spread > 0 ? spread : sigma;
    m = e.x + side * sc;
  }
  // the mode fitted at or beyond a finite end: the hull's end piece covers it
  if (side < 0 ? m <= lower : m >= upper) return NaN;
  let x = m + side * sc;
  if (side < 0 ? !(x > lower) : !(x < upper)) x = m + 0.5 * (bound - m);
  if (side < 0 ? !(x < e.x) : !(x > e.x)) x = e.x + side * sc;
  if (side < 0 ? !(x > lower) : !(x < upper)) return NaN;
  if (!Number.isFinite(x) || x === e.x) return NaN;
  return x;
}

/**
 * The centre and scale of a hull's target, from its touch points (no
 * evaluation): with tangents the zero of the derivative interpolated
 * between the two touch points where it changes sign, and the scale of a
 * quadratic log-density with that derivative change; without, the vertex
 * and curvature of the parabola through the highest touch point and its
 * neighbours. Takes `fallback`'s values for what cannot be estimated.
 * Writes the estimate into `into` (which may be `fallback` itself; a fresh
 * object when not given) and returns it.
 * @internal
 */
export function hullCentre(h: Hull, fallback: WarmCentre, into: WarmCentre = { centre: 0, scale: 1 }): WarmCentre {
  const k = h.k;
  const tx = h.touchX;
  const tl = h.touchLogDensity;
  let centre = NaN;
  let scale = NaN;
  if (k === 0) return copyCentre(fallback.centre, fallback.scale, into);
  let im = -1;
  for (let i = 0; i < k; i++) if (tl[i] > -Infinity && (im < 0 || tl[i] > tl[im])) im = i;
  if (im < 0) return copyCentre(fallback.centre, fallback.scale, into);
  if (h.tangent) {
    const tg = h.touchDerivative;
    for (let i = 0; i + 1 < k; i++) {
      const g0 = tg[i];
      const g1 = tg[i + 1];
      if (g0 >= 0 && g1 <= 0 && g0 > g1) {
        const w = tx[i + 1] - tx[i];
        centre = tx[i] + (g0 / (g0 - g1)) * w;
        scale = Math.sqrt(w / (g0 - g1));
        break;
      }
    }
  } else if (im > 0 && im < k - 1 && tl[im - 1] > -Infinity && tl[im + 1] > -Infinity) {
    const x0 = tx[im - 1];
    const x1 = tx[im];
    const x2 = tx[im + 1];
    const d1 = (tl[im] - tl[im - 1]) / (x1 - x0);
    const d2 = (tl[im + 1] - tl[im]) / (x2 - x1);
    const curv = (2 * (d2 - d1)) / (x2 - x0);
    if (curv < 0) {
      centre = 0.5 * (x0 + x1) - d1 / curv;
      scale = Math.sqrt(-1 / curv);
      if (!(centre >= x0 && centre <= x2)) centre = x1;
    }
  }
  if (!Number.isFinite(centre)) centre = tx[im];
  if (!(scale > 0 && scale < Infinity)) {
    const w = k >= 2 ? (tx[k - 1] - tx[0]) / (k - 1) : fallback.scale;
    scale = w > 0 && w < Infinity ? w : fallback.scale;
  }
  return copyCentre(centre, scale, into);
}

function copyCentre(centre: number, scale: number, into: WarmCentre): WarmCentre {
  into.centre = centre;
  into.scale = scale;
  return into;
}

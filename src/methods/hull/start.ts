/**
 * Automatic start points for the hull engine: locate the mode (from the
 * target's hint, or by a bracketing search), then place touch points on both
 * sides at a distance scaled by the local curvature. @internal
 *
 * @packageDocumentation
 */
import { ImproperDensityError, InvalidTargetError } from '../../core/errors.js';
import { twoTo } from '../../vendor/math.js';

/** A probed point: x, log-density, derivative (NaN when not asked for). @internal */
export interface Probe {
  readonly x: number;
  readonly l: number;
  readonly g: number;
}

/** What the search may evaluate. @internal */
export interface StartSearch {
  /** API name for messages. */
  readonly api: string;
  /** Whether to evaluate derivatives. */
  readonly useDerivative: boolean;
  /** Counted, checked log-density. */
  readonly evaluate: (x: number) => number;
  /** Counted, checked derivative. */
  readonly derivative: (x: number) => number;
}

/**
 * The derivative a probe at x with log-density l carries: evaluated (counted,
 * checked) when the search uses derivatives and l is finite, else NaN.
 * @internal
 */
export function probeSlope(s: StartSearch, x: number, l: number): number {
  return s.useDerivative && l > -Infinity ? s.derivative(x) : NaN;
}

/** Result of {@link automaticStartPoints}. @internal */
export interface StartResult {
  /** Every point evaluated, in order. */
  readonly probes: Probe[];
  /** Curvature-based length scale near the mode. */
  readonly scale: number;
}

/** Iteration cap of the mode search. @internal */
export const MODE_SEARCH_MAX_STEPS = 400;
/** Iteration cap of the placement on each side of the mode. @internal */
export const SIDE_MAX_STEPS = 100;
/** Bounds on the drop of log-density from the mode to a side touch point. @internal */
export const SIDE_DROP_MIN = 0.125;
/** @internal */
export const SIDE_DROP_MAX = 2;
/** Beyond this |x| a search that still climbs declares the density improper. @internal */
export const FAR = 1e300;

function tinyStep(x: number): number {
  return Math.max(Math.abs(x) * 4.440892098500626e-16, 5e-324);
}

/**
 * Finds start points for a hull.
 *
 * @remarks
 * With a mode hint m strictly inside the support and a derivative, the hint
 * is not evaluated: the first touch point is m + h (h = 1, or a quarter of a
 * bounded support), whose derivative g gives the scale σ² ≈ −h/g of a
 * quadratic log-density with its maximum at m; the next point goes to
 * m − σ, and a third to m + σ only when h was far from σ. Each side point
 * is accepted when the estimated drop of log-density from the mode lies in
 * [1/8, 2] (about σ/2 to 2σ for a normal), otherwise it is moved by the
 * factor √(0.5/drop), which is exact for a normal and converges geometrically
 * for exponential tails. A side point where the target still climbs
 * (derivative pointing outward, or a higher value) proves the hint wrong: the
 * mode estimate moves there and the search continues outward. A mode at an
 * end of the support is evaluated, and the step from it is 1/|g|, the
 * scale of an exponential tail. Without a hint the mode is located first:
 * with a derivative by secant steps on the derivative (Newton with a
 * curvature estimated from the last two points), expanding until the
 * derivative changes sign and then refining in the bracket; without one by
 * expanding a bracket of values and parabolic steps. Every evaluated point
 * is returned: all become touch points, so no evaluation is wasted.
 * @internal
 */
export function automaticStartPoints(s: StartSearch, lower: number, upper: number, modeHint: number | undefined): StartResult {
  const probes: Probe[] = [];
  const useD = s.useDerivative;
  let lo = lower;
  let hi = upper;
  const probe = (x: number): Probe => {
    const l = s.evaluate(x);
    const p = { x, l, g: probeSlope(s, x, l) };
    probes.push(p);
    return p;
  };
  const bounded = lo > -Infinity && hi < Infinity;
  let scale = bounded ? Math.min(1, 0.25 * (hi - lo)) : 1;

  let m: number;
  let lm = NaN;
  let gm = NaN;
  let located = false;
  if (modeHint !== undefined) {
    m = modeHint;
    const interior = m > lo && m < hi;
    if (interior && useD) {
      gm = 0; // assumed at an interior mode; verified by the side points
      located = true;
    } else {
      const p = probe(m);
      if (p.l > -Infinity) {
        lm = p.l;
        gm = p.g;
        located = true;
      }
    }
  } else {
    m = NaN;
  }
  if (!located) {
    const r = useD ? searchWithDerivative(s, probe, lo, hi, scale) : searchWithValues(s, probe, lo, hi, scale);
    m = r.m;
    lm = r.lm;
    gm = r.gm;
    scale = r.scale;
    lo = r.lo;
    hi = r.hi;
  }

  let lastDist = NaN;
  const side = (dir: number): void => {
    if (dir > 0 ? !(m < hi) : !(m > lo)) return;
    let d = scale;
    const atEnd = m === lower || m === upper;
    if (atEnd && gm === gm && gm * dir < 0 && Number.isFinite(gm)) d = 1 / Math.abs(gm);
    let lastX = NaN;
    let climbs = 0;
    for (let it = 0; it < SIDE_MAX_STEPS; it++) {
      const bnd = dir > 0 ? hi : lo;
      let x = m + dir * d;
      if (dir > 0 ? !(x < bnd) : !(x > bnd)) x = m + 0.5 * (bnd - m);
      if (x === m) x = m + dir * tinyStep(m);
      if (dir > 0 ? !(x < bnd) : !(x > bnd)) return;
      if (x === lastX) return;
      lastX = x;
      const p = probe(x);
      if (p.l === -Infinity) {
        // beyond the effective support: for a T-concave target nothing lies further out
        if (dir > 0) hi = x;
        else lo = x;
        d = 0.25 * Math.abs(x - m);
        continue;
      }
      const climbing = useD ? p.g * dir > 0 : lm === lm ? p.l > lm : false;
      if (climbing) {
        // the mode lies further out: move the estimate, with accelerating steps
        if (!(Math.abs(x) < FAR)) improperClimb(s, p, dir);
        m = x;
        lm = p.l;
        gm = p.g;
        climbs++;
        d *= climbs < 30 ? 2 : twoTo(Math.min(climbs - 28, 60));
        if (it === SIDE_MAX_STEPS - 1) improperClimb(s, p, dir);
        continue;
      }
      const dist = Math.abs(x - m);
      lastDist = dist;
      const drop = lm === lm ? lm - p.l : useD ? -(p.g - (gm === gm ? gm : 0)) * (x - m) * 0.5 : NaN;
      if (drop >= SIDE_DROP_MIN && drop <= SIDE_DROP_MAX) return;
      let f = drop > 0 ? Math.sqrt(0.5 / drop) : 16;
      if (f > 1e8) f = 1e8;
      d = dist * f;
      if (!(d > 0)) return;
    }
  };
  side(1);
  // the other side starts from the distance found on this one
  if (lastDist > 0 && lastDist < Infinity) scale = lastDist;
  side(-1);
  return { probes, scale };
}

interface Located {
  m: number;
  lm: number;
  gm: number;
  scale: number;
  lo: number;
  hi: number;
}

function defaultStart(lo: number, hi: number): number {
  if (lo === -Infinity && hi === Infinity) return 0;
  if (lo === -Infinity) return hi - Math.max(1, Math.abs(hi) * 1e-8);
  if (hi === Infinity) return lo + Math.max(1, Math.abs(lo) * 1e-8);
  return 0.5 * lo + 0.5 * hi;
}

/** A first point of finite log-density, expanding around the default start. */
function firstFinite(s: StartSearch, probe: (x: number) => Probe, lo: number, hi: number, h: number): Probe {
  const x0 = defaultStart(lo, hi);
  let p = probe(x0);
  if (p.l > -Infinity) return p;
  let step = h;
  for (let it = 0; it < 60; it++) {
    for (const dir of [1, -1]) {
      const bnd = dir > 0 ? hi : lo;
      let x = x0 + dir * step;
      if (dir > 0 ? !(x < bnd) : !(x > bnd)) x = x0 + (bnd - x0) * (1 - twoTo(-(it + 1)));
      if (dir > 0 ? !(x < bnd) : !(x > bnd)) continue;
      p = probe(x);
      if (p.l > -Infinity) return p;
    }
    step *= 4;
  }
  throw new InvalidTargetError(`${s.api}: target.logDensity is -Infinity at every point probed in [${lo}, ${hi}]; give a mode hint or startPoints where the density is positive`);
}

function improperClimb(s: StartSearch, p: Probe, dir: number): never {
  throw new ImproperDensityError(
    `${s.api}: logDensity is still increasing at x = ${p.x} (logDensity = ${p.l}) towards ${dir > 0 ? '+' : '-'}Infinity: the tail does not decay (infinite mass) or the mode lies beyond ±1e300`,
  );
}

/** Mode search with derivatives: Newton/secant steps on the derivative, then a bracket. */
function searchWithDerivative(s: StartSearch, probe: (x: number) => Probe, lo: number, hi: number, h0: number): Located {
  const p0 = firstFinite(s, probe, lo, hi, h0);
  let a: Probe | undefined; // g > 0 (mode to the right), largest x
  let b: Probe | undefined; // g < 0 (mode to the left), smallest x
  let h = h0;
  let last = p0;
  let prev: Probe | undefined;
  const done = (p: Probe, scale: number): Located => ({ m: p.x, lm: p.l, gm: p.g, scale, lo, hi });
  const classify = (p: Probe): boolean => {
    if (p.g > 0) {
      if (a === undefined || p.x > a.x) a = p;
    } else if (p.g < 0) {
      if (b === undefined || p.x < b.x) b = p;
    } else if (p.g === 0) {
      return true;
    }
    return false;
  };
  if (p0.g !== p0.g) return done(p0, h0);
  if (classify(p0)) return done(p0, h0);
  for (let it = 0; it < MODE_SEARCH_MAX_STEPS; it++) {
    let x: number;
    if (a !== undefined && b !== undefined) {
      const w = b.x - a.x;
      const s2 = w / (a.g - b.g);
      const sc = Math.sqrt(s2);
      let r = a.x + a.g * s2;
      if (!(r > a.x + 0.01 * w)) r = a.x + 0.01 * w;
      if (!(r < b.x - 0.01 * w)) r = b.x - 0.01 * w;
      if (w <= 4 * sc || r === a.x || r === b.x) {
        const best = a.l >= b.l ? a : b;
        return done(best, sc > 0 && sc < Infinity ? sc : w);
      }
      x = r;
    } else {
      const p = (a ?? b) as Probe;
      const dir = a !== undefined ? 1 : -1;
      let step = h;
      if (prev !== undefined && prev !== p && prev.g === prev.g && Number.isFinite(prev.g)) {
        const c = (p.g - prev.g) / (p.x - prev.x);
        if (c < 0) {
          const newton = Math.abs(p.g / c);
          if (newton > 0 && newton < Infinity) step = newton;
        }
      }
      h = Math.max(it < 30 ? 4 * h : h * twoTo(Math.min(it - 28, 60)), step);
      x = p.x + dir * step;
      const bnd = dir > 0 ? hi : lo;
      if (dir > 0 ? !(x < bnd) : !(x > bnd)) {
        x = p.x + 0.5 * (bnd - p.x);
        if (x === p.x || Math.abs(bnd - p.x) <= 1e-12 * Math.max(1, Math.abs(p.x))) {
          // the mode is at the end of the support
          if (bnd === -Infinity || bnd === Infinity) improperClimb(s, p, dir);
          const e = probe(bnd);
          return e.l > -Infinity ? done(e, h0) : done(p, h0);
        }
      }
      if (!(Math.abs(x) < FAR)) improperClimb(s, p, dir);
      prev = p;
    }
    const q = probe(x);
    last = q;
    if (q.l === -Infinity || q.g !== q.g) {
      // outside the effective support while climbing: the mode lies before x
      if (a !== undefined && b === undefined) hi = x;
      else if (b !== undefined && a === undefined) lo = x;
      else break;
      continue;
    }
    if (classify(q)) return done(q, h0);
    if (it === MODE_SEARCH_MAX_STEPS - 1 && (a === undefined || b === undefined)) improperClimb(s, q, a !== undefined ? 1 : -1);
    if (a !== undefined && b !== undefined) {
      // converged when the Newton correction at q is under half a scale
      const other = q.g > 0 ? b : a;
      const c = (other.g - q.g) / (other.x - q.x);
      if (c < 0 && Math.abs(q.g / c) <= 0.5 / Math.sqrt(-c)) return done(q, 1 / Math.sqrt(-c));
    }
  }
  return done(last, h0);
}

/** Mode search from values: expand a bracket a < b < c with l(b) ≥ l(a), l(c), then parabolic steps. */
function searchWithValues(s: StartSearch, probe: (x: number) => Probe, lo: number, hi: number, h0: number): Located {
  const p0 = firstFinite(s, probe, lo, hi, h0);
  const done = (p: Probe, scale: number, l: number, u: number): Located => ({ m: p.x, lm: p.l, gm: NaN, scale, lo: l, hi: u });
  const place = (from: number, dir: number, step: number): number => {
    const bnd = dir > 0 ? hi : lo;
    let x = from + dir * step;
    if (dir > 0 ? !(x < bnd) : !(x > bnd)) x = from + 0.5 * (bnd - from);
    return x;
  };
  // first step: find the ascent direction
  let x1 = place(p0.x, 1, h0);
  let pA: Probe;
  let pB: Probe;
  let dir: number;
  const p1 = x1 !== p0.x ? probe(x1) : p0;
  if (p1 !== p0 && p1.l > p0.l) {
    pA = p0;
    pB = p1;
    dir = 1;
  } else {
    x1 = place(p0.x, -1, h0);
    const pm = x1 !== p0.x ? probe(x1) : p0;
    if (pm !== p0 && pm.l > p0.l) {
      pA = p0;
      pB = pm;
      dir = -1;
    } else {
      // p0 is at least as high as both neighbours
      return refine(pm, p0, p1);
    }
  }
  // expand in the ascent direction
  for (let it = 0; it < MODE_SEARCH_MAX_STEPS; it++) {
    const step = Math.abs(pB.x - pA.x) * (it < 30 ? 2 : twoTo(Math.min(it - 28, 60)));
    const bnd = dir > 0 ? hi : lo;
    let x = pB.x + dir * step;
    if (dir > 0 ? !(x < bnd) : !(x > bnd)) {
      x = pB.x + 0.5 * (bnd - pB.x);
      if (x === pB.x || Math.abs(bnd - pB.x) <= 1e-12 * Math.max(1, Math.abs(pB.x))) {
        if (bnd === -Infinity || bnd === Infinity) improperClimb(s, pB, dir);
        const e = probe(bnd);
        return done(e.l > -Infinity && e.l >= pB.l ? e : pB, Math.abs(pB.x - pA.x), lo, hi);
      }
    }
    if (!(Math.abs(x) < FAR)) improperClimb(s, pB, dir);
    const pC = probe(x);
    if (pC.l > pB.l) {
      pA = pB;
      pB = pC;
      continue;
    }
    if (pC.l === -Infinity) {
      if (dir > 0) hi = x;
      else lo = x;
    }
    return dir > 0 ? refine(pA, pB, pC) : refine(pC, pB, pA);
  }
  return improperClimb(s, pB, dir);

  function refine(a0: Probe, b0: Probe, c0: Probe): Located {
    let a = a0;
    let b = b0;
    let c = c0;
    let scale = Math.max(b.x - a.x, c.x - b.x);
    for (let it = 0; it < MODE_SEARCH_MAX_STEPS; it++) {
      if (!(a.l > -Infinity) || !(c.l > -Infinity)) return done(b, scale, lo, hi);
      const d1 = (b.l - a.l) / (b.x - a.x);
      const d2 = (c.l - b.l) / (c.x - b.x);
      const curv = (2 * (d2 - d1)) / (c.x - a.x);
      if (!(curv < 0)) return done(b, scale, lo, hi);
      const sc = Math.sqrt(-1 / curv);
      // vertex of the parabola through a, b, c: p(x) = l_a + d1 (x - a) + (curv/2)(x - a)(x - b)
      const vx = 0.5 * (a.x + b.x) - d1 / curv;
      scale = sc;
      let x = vx;
      const wA = b.x - a.x;
      const wC = c.x - b.x;
      if (Math.abs(x - b.x) <= 0.5 * sc) return done(b, sc, lo, hi);
      if (!(x > a.x && x < c.x) || Math.abs(x - b.x) < 1e-3 * Math.max(wA, wC)) {
        x = wA > wC ? b.x - 0.382 * wA : b.x + 0.382 * wC;
      }
      const q = probe(x);
      if (q.l > b.l) {
        if (x < b.x) {
          c = b;
          b = q;
        } else {
          a = b;
          b = q;
        }
      } else if (x < b.x) {
        a = q;
      } else {
        c = q;
      }
    }
    return done(b, scale, lo, hi);
  }
}

/**
 * Construction of the strip table of the fast path: placement of the strips
 * from a coarse look at the target through its hull, evaluation at the strip
 * boundaries, shape checks, provable constant bounds per strip, the exact
 * tails, and the region list the alias table is built from. @internal
 *
 * @remarks
 * Notation: the body [x_0, x_n] is cut into n strips [x_i, x_{i+1}]; l_i is
 * logDensity(x_i), y_i = T(f(x_i)/e^ref) its transformed value (T = log or
 * T(f) = −1/√f, relative to ref = max l_i), c_i the chord slope of strip i
 * in transformed space. The target is assumed T-concave (the hull engine's
 * assumption), so
 *
 * 1. f is unimodal (T is increasing and T(f) concave, hence unimodal);
 * 2. on every strip f ≥ the back-transformed chord ≥ min(f(x_i), f(x_{i+1}))
 *    (a concave function lies above its chords): this is the strip's
 *    constant squeeze m_i;
 * 3. outside a chord's interval T(f) lies below the chord's extension
 *    (Gilks 1992): the chords of strips i − 1 and i + 1, extended over strip
 *    i, bound T(f) from above there;
 * 4. if f(x_{i−1}) > f(x_i), the mode lies left of x_i, so f is
 *    non-increasing on strip i and sup f = f(x_i); if f(x_{i+2}) > f(x_{i+1}),
 *    f is non-decreasing on strip i and sup f = f(x_{i+1}) (by 1).
 *
 * The constant envelope M_i of strip i is therefore the larger endpoint
 * value where 4 applies (every strip but the one or two around the mode),
 * and otherwise the maximum over the strip of the minimum of the lines of 3
 * — a concave function, maximal at an end or where the lines cross — or of
 * the hull's own envelope on the strip, whichever is lower (both are valid
 * upper bounds). Every bound is thus derived from values of the target and
 * T-concavity alone; a draw-time evaluation that contradicts one contradicts
 * T-concavity at the evaluated point and its neighbouring boundaries, which is
 * reported as a {@link ShapeViolationError}. The bounds carry no extra margin:
 * like the hull's, they are exact up to the rounding of the target's own
 * values, which the checks absorb with the hull tolerance
 * ({@link HULL_LOG_TOLERANCE_ABSOLUTE}).
 *
 * The tails beyond the body are bounded by the extension of the outermost
 * chords (3 again): exponential pieces (T = log) or 1/(a + b·d)² pieces
 * (inverse-sqrt), sampled exactly by inversion and accepted by evaluating
 * the target.
 *
 * Placement. A coarse grid (about 80 points at quantiles of the hull's
 * envelope on a logistic scale, so that the tails get as many points as the
 * body, plus the hull's touch points and finite support ends) gives a
 * piecewise exponential model of f. The body is the range between the
 * model's `tailMass` and 1 − `tailMass` quantiles (or a finite support end
 * where the density is not negligible). Three quarters of the strips are
 * placed at equal mass of √f: the area of the caps (between M_i and m_i) of
 * a strip of width w is about w²·|f'|, and widths proportional to f^(−1/2)
 * make the total about 4·√(max f)·∫√f / n (for a standard normal 5.7/n,
 * against 7.8/n for equal widths; for Student-t(3) 8/n against 68/n). The
 * other quarter of the boundaries go at equal mass of f, which keeps the
 * core resolved when √f has heavy tails (for a Cauchy-like target ∫√f grows
 * like the log of the body's width, and √f alone would spend most strips
 * far out). Boundaries that coincide are merged. The placement only affects
 * efficiency, never exactness.
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { ImproperDensityError, InvalidTargetError } from '../../core/errors.js';
import { checkLogDensity } from '../../core/evaluate.js';
import { notConcave, shapeError } from '../envelope/concavity.js';
import { gapError } from '../envelope/gaps.js';
import type { HullView } from '../envelope/hull-view.js';
import { T_LOG, logHeight, pieceConstant, pieceLogArea } from '../envelope/transforms.js';
import { stripRegions } from './strip-table.js';
import type { StripTable, TailPiece } from './strip-table.js';
import { exp, log, log1p } from '../../vendor/math.js';

/** Number of quantiles of the hull's envelope in the coarse grid. @internal */
export const COARSE_POINTS = 81;
/** The coarse quantiles run from this probability to 1 minus it, on a logistic scale. @internal */
export const COARSE_EDGE = 1e-10;

/** Inputs of {@link buildStripTable}. @internal */
export interface StripTableInput {
  readonly api: string;
  readonly hull: HullView;
  readonly logDensity: (x: number) => number;
  readonly counters: Counters;
  readonly strips: number;
  readonly tailMass: number;
}

/** ∫_0^w exp(p·(A + (B − A)·t/w)) dt for relative log values A, B ≤ about 0 (−∞ allowed, treated as a steep drop). */
function expLinearMass(A: number, B: number, w: number, p: number): number {
  if (A === -Infinity && B === -Infinity) return 0;
  if (A === -Infinity) A = B - 30;
  else if (B === -Infinity) B = A - 30;
  const a = p * A;
  const d = p * (B - A);
  if (Math.abs(d) < 1e-9) return w * exp(a + 0.5 * d);
  return (w * (exp(a + d) - exp(a))) / d;
}

/** The s in [0, w] where ∫_0^s exp(p·(A + (B − A)·t/w)) dt = m (the inverse of {@link expLinearMass}). */
function expLinearInverse(A: number, B: number, w: number, p: number, m: number): number {
  if (A === -Infinity) A = B - 30;
  else if (B === -Infinity) B = A - 30;
  const a = p * A;
  const d = p * (B - A);
  let s: number;
  if (Math.abs(d) < 1e-9) s = m / exp(a + 0.5 * d);
  else s = (w / d) * log1p((m * d) / (w * exp(a)));
  if (!(s >= 0)) s = s !== s ? 0.5 * w : 0;
  return s > w ? w : s;
}

function makeTail(kind: number, lo: number, hi: number, ax: number, ay: number, slope: number): TailPiece {
  const hx = slope > 0 ? hi : lo;
  const dir = slope > 0 ? -1 : 1;
  const w = hi - lo;
  const sig = Math.abs(slope);
  const th = hx === Infinity || hx === -Infinity ? Infinity : ay + slope * (hx - ax);
  const logArea = th === Infinity || th !== th ? Infinity : pieceLogArea(kind, th, sig, w);
  const q = logArea < Infinity ? pieceConstant(kind, th, sig, w) : NaN;
  return { lo, hi, anchor: ax, anchorValue: ay, slope, highEnd: hx, direction: dir, width: w, rate: sig, highValue: th, inversion: q, logArea };
}


/**
 * Builds the strip table from a hull after setup (see the module remarks).
 * @internal
 */
export function buildStripTable(inp: StripTableInput): StripTable {
  const { api, hull: h, logDensity, counters } = inp;
  const kind = h.kind;
  const lower = h.lower;
  const upper = h.upper;
  const evaluate = (x: number): number => {
    counters.setupEvaluations++;
    return checkLogDensity(api, x, logDensity(x));
  };

  // ----- coarse model ---------------------------------------------------------
  const ps: number[] = [];
  const S = log((1 - COARSE_EDGE) / COARSE_EDGE);
  for (let i = 0; i < COARSE_POINTS; i++) ps.push(1 / (1 + exp(S - (2 * S * i) / (COARSE_POINTS - 1))));
  const pts = new Map<number, number>();
  for (let i = 0; i < h.touchPointCount(); i++) pts.set(h.touchPointX(i), h.touchPointLogDensity(i));
  const qs = h.envelopeQuantiles(ps);
  if (lower > -Infinity) qs.push(lower);
  if (upper < Infinity) qs.push(upper);
  for (const x of qs) if (!pts.has(x) && x >= lower && x <= upper) pts.set(x, evaluate(x));
  const cx = Array.from(pts.keys()).sort((a, b) => a - b);
  const cl = cx.map((x) => pts.get(x) as number);
  let ref0 = -Infinity;
  for (const v of cl) if (v > ref0) ref0 = v;
  const C = cx.length;
  const rel = cl.map((v) => v - ref0);
  const gapMass = (g: number, p: number): number => expLinearMass(rel[g], rel[g + 1], cx[g + 1] - cx[g], p);
  let F = 0;
  for (let g = 0; g + 1 < C; g++) F += gapMass(g, 1);
  if (!(F > 0 && F < Infinity) || C < 2) {
    throw new InvalidTargetError(`${api}: the table could not locate the target's mass from its hull (coarse mass ${F} on [${cx[0]}, ${cx[C - 1]}])`);
  }
  // point at model mass m from the left (p = 1), within gap g
  const locate = (m: number, p: number, from: readonly number[], fromRel: readonly number[]): number => {
    let acc = 0;
    for (let g = 0; g + 1 < from.length; g++) {
      const w = from[g + 1] - from[g];
      const gm = expLinearMass(fromRel[g], fromRel[g + 1], w, p);
      if (acc + gm >= m) {
        const s = expLinearInverse(fromRel[g], fromRel[g + 1], w, p, m - acc);
        const x = from[g] + s;
        return x > from[g + 1] ? from[g + 1] : x;
      }
      acc += gm;
    }
    return from[from.length - 1];
  };
  const eps = inp.tailMass;
  const negligible = log(eps);
  let L = locate(eps * F, 1, cx, rel);
  let R: number;
  {
    // right quantile: from the right, by symmetry of the walk
    const rx = cx.map((x) => -x).reverse();
    const rr = rel.slice().reverse();
    R = -locate(eps * F, 1, rx, rr);
  }
  if (lower > -Infinity && cx[0] === lower && rel[0] >= negligible) L = lower;
  if (upper < Infinity && cx[C - 1] === upper && rel[C - 1] >= negligible) R = upper;
  if (!(R > L)) {
    // the mass sits on (nearly) one point: use the coarse range
    L = cx[0];
    R = cx[C - 1];
  }
  // model nodes on [L, R]
  const interp = (x: number): number => {
    let g = 0;
    while (g + 2 < C && cx[g + 1] <= x) g++;
    const w = cx[g + 1] - cx[g];
    const A = rel[g];
    const B = rel[g + 1];
    if (A === -Infinity || B === -Infinity) return x === cx[g] ? A : x === cx[g + 1] ? B : Math.max(A, B) - 15;
    return A + ((B - A) * (x - cx[g])) / w;
  };
  const nx: number[] = [L];
  const nl: number[] = [interp(L)];
  for (let g = 0; g < C; g++) {
    if (cx[g] > L && cx[g] < R) {
      nx.push(cx[g]);
      nl.push(rel[g]);
    }
  }
  nx.push(R);
  nl.push(interp(R));

  // ----- strip boundaries: equal mass of √f, refined by equal mass of f ----------
  const want = inp.strips;
  const nF = Math.floor(want / 4);
  const interior = (p: number, count: number): number[] => {
    const out: number[] = [];
    if (count < 2) return out;
    // per gap of the model: its mass (expLinearMass), then each point by expLinearInverse
    const ng = nx.length - 1;
    const gmass = new Array<number>(ng);
    let G = 0;
    for (let g = 0; g < ng; g++) {
      gmass[g] = expLinearMass(nl[g], nl[g + 1], nx[g + 1] - nx[g], p);
      G += gmass[g];
    }
    let g = 0;
    let acc = 0;
    for (let i = 1; i < count; i++) {
      const m = (G * i) / count;
      while (g + 1 < ng && acc + gmass[g] < m) acc += gmass[g++];
      const w = nx[g + 1] - nx[g];
      const rem = m - acc;
      // a gap of zero mass (both ends -Infinity) can only be the last: its far end, or its middle when nothing remains
      const x = nx[g] + (nl[g] === -Infinity && nl[g + 1] === -Infinity ? (rem < 0 ? 0 : rem > 0 ? w : 0.5 * w) : expLinearInverse(nl[g], nl[g + 1], w, p, rem));
      if (x > L && x < R) out.push(x);
    }
    return out;
  };

  // both lists are increasing: merge them, dropping duplicates
  const qa = interior(0.5, want - nF);
  const qb = interior(1, nF);
  const bx: number[] = [L];
  for (let ia = 0, ib = 0; ia < qa.length || ib < qb.length; ) {
    const x = ib >= qb.length || (ia < qa.length && qa[ia] <= qb[ib]) ? qa[ia++] : qb[ib++];
    if (x > bx[bx.length - 1]) bx.push(x);
  }
  if (R > bx[bx.length - 1]) bx.push(R);
  const n = bx.length - 1;
  if (n < 1) throw new InvalidTargetError(`${api}: the table has no strip of positive width on [${L}, ${R}]`);

  // ----- values, shape checks ---------------------------------------------------
  const x = Float64Array.from(bx);
  const l = new Float64Array(n + 1);
  let ref = -Infinity;
  // the ends may be coarse points already evaluated; inner boundaries are new points
  for (let i = 0; i <= n; i++) {
    const xi = x[i];
    let v: number;
    if ((i === 0 || i === n) && pts.has(xi)) v = pts.get(xi) as number;
    else {
      const raw = logDensity(xi);
      counters.setupEvaluations++;
      v = checkLogDensity(api, xi, raw);
    }
    l[i] = v;
    if (v > ref) ref = v;
  }
  if (ref === -Infinity) throw new InvalidTargetError(`${api}: logDensity is -Infinity at every strip boundary on [${L}, ${R}]`);
  let f0 = 0;
  while (l[f0] === -Infinity) f0++;
  let f1 = n;
  while (l[f1] === -Infinity) f1--;
  for (let i = f0; i <= f1; i++) {
    if (l[i] === -Infinity) {
      // locate the gap around x_i (between the nearest boundaries of finite log-density) and name it
      let j = i + 1;
      while (l[j] === -Infinity) j++;
      gapError(api, (z: number) => checkLogDensity(api, z, logDensity(z)), x[i - 1], x[i], x[j], l[j]);
    }
  }
  const y = new Float64Array(n + 1);
  const e = new Float64Array(n + 1); // f(x_i)/e^ref
  const isLog = kind === T_LOG;
  for (let i = 0; i <= n; i++) {
    const d = l[i] - ref;
    const ei = exp(d);
    e[i] = ei;
    // transformValue inlined: log: d; inverse-sqrt: −e^(−d/2) = −1/√(e^d)
    y[i] = isLog ? d : -exp(-0.5 * d);
  }
  const c = new Float64Array(n);
  for (let i = 0; i < n; i++) c[i] = l[i] > -Infinity && l[i + 1] > -Infinity ? (y[i + 1] - y[i]) / (x[i + 1] - x[i]) : NaN;
  // T-concavity at every inner boundary: y_i not below the chord of its neighbours (notConcave, inlined
  // with its tolerance; the exact test runs only where the quick one fails)
  for (let i = f0 + 1; i < f1; i++) {
    const interp = y[i - 1] + (y[i + 1] - y[i - 1]) * ((x[i] - x[i - 1]) / (x[i + 1] - x[i - 1]));
    if (y[i] - interp >= 0) continue;
    if (notConcave(kind, x[i - 1], y[i - 1], l[i - 1], x[i], y[i], l[i], x[i + 1], y[i + 1], l[i + 1])) {
      throw shapeError(
        api,
        kind,
        `the chord slopes of the transformed density must not increase, but they are ${c[i - 1]} on [${x[i - 1]}, ${x[i]}] and ${c[i]} on [${x[i]}, ${x[i + 1]}] (log-density ${l[i - 1]}, ${l[i]}, ${l[i + 1]})`,
        x[i - 1],
        x[i + 1],
      );
    }
  }

  // ----- bounds per strip -----------------------------------------------------------
  const logUp = new Float64Array(n);
  const logLo = new Float64Array(n);
  const up = new Float64Array(n);
  const lo = new Float64Array(n);
  const sL = new Float64Array(n);
  const sR = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const la = l[i];
    const lb = l[i + 1];
    sL[i] = i >= 1 ? c[i - 1] : NaN;
    sR[i] = i + 1 < n ? c[i + 1] : NaN;
    logLo[i] = la < lb ? la : lb;
    lo[i] = la < lb ? e[i] : e[i + 1];
    let u: number;
    let ue = NaN;
    if (la === -Infinity && lb === -Infinity) {
      u = -Infinity;
      ue = 0;
    } else if (i >= 1 && l[i - 1] > la) {
      u = la;
      ue = e[i];
    } else if (i + 2 <= n && l[i + 2] > lb) {
      u = lb;
      ue = e[i + 1];
    } else {
      // around the mode: the minimum of the neighbouring chords' extensions, maximised over the strip
      const a = x[i];
      const b = x[i + 1];
      const hasL = sL[i] === sL[i];
      const hasR = sR[i] === sR[i];
      let t = Infinity;
      if (hasL || hasR) {
        const lineL = (z: number): number => (hasL ? y[i] + sL[i] * (z - a) : Infinity);
        const lineR = (z: number): number => (hasR ? y[i + 1] + sR[i] * (z - b) : Infinity);
        const env = (z: number): number => Math.min(lineL(z), lineR(z));
        t = Math.max(env(a), env(b));
        if (hasL && hasR && sL[i] > sR[i]) {
          // crossing of the two lines
          const z = (y[i + 1] - sR[i] * b - (y[i] - sL[i] * a)) / (sL[i] - sR[i]);
          if (z > a && z < b) t = Math.max(t, env(z));
        }
      }
      const secant = t !== t ? Infinity : logHeight(kind, t) + ref;
      const hullBound = h.maxLogEnvelope(x[i], x[i + 1]);
      u = Math.min(secant, hullBound);
      const top = la > lb ? la : lb;
      if (!(u >= top)) u = top; // rounding: the bound can never be below the values it bounds
      if (!(u < Infinity)) {
        throw new ImproperDensityError(`${api}: no finite envelope on the strip [${x[i]}, ${x[i + 1]}] (hull bound ${hullBound})`);
      }
    }
    logUp[i] = u;
    up[i] = ue === ue ? ue : exp(u - ref);
  }

  // ----- tails --------------------------------------------------------------------------
  let left: TailPiece | null = null;
  let right: TailPiece | null = null;
  // a tail beyond an end of the body: the extension of the outermost strip's chord (same messages for both sides)
  const tail = (left: boolean): TailPiece => {
    const e = left ? 0 : n;
    const ci = c[left ? 0 : n - 1];
    const where = `the ${left ? 'left' : 'right'} tail ${left ? 'below' : 'above'} ${x[e]}`;
    if (!(ci === ci)) throw new ImproperDensityError(`${api}: cannot bound ${where}: the ${left ? 'first' : 'last'} strip has density 0 at one end`);
    const p = left ? makeTail(kind, lower, x[0], x[0], y[0], ci) : makeTail(kind, x[n], upper, x[n], y[n], ci);
    if (!(p.logArea < Infinity)) {
      throw new ImproperDensityError(`${api}: ${where} is not integrable under the ${left ? 'first' : 'last'} strip's chord (slope ${ci}); the target may not be ${kind === T_LOG ? 'log-concave' : 'T-concave'} or its tail may not decay`);
    }
    return p;
  };
  if (lower < x[0] && l[0] > -Infinity) left = tail(true);
  if (upper > x[n] && l[n] > -Infinity) right = tail(false);

  // ----- regions ------------------------------------------------------------------------
  const leftArea = left === null ? 0 : exp(left.logArea);
  const rightArea = right === null ? 0 : exp(right.logArea);
  const regions = stripRegions(n, x, logUp, up, lo, leftArea, rightArea);
  const total = regions.sureArea + regions.capArea + regions.tailArea;
  if (!(total > 0 && total < Infinity)) {
    throw new ImproperDensityError(`${api}: the table's envelope area is ${total} (relative to e^${ref}) on [${lower}, ${upper}]`);
  }
  return {
    api, kind, ref, lower, upper, n, x, l, y, chordSlope: c, logUp, logLo, up, lo, leftLineSlope: sL, rightLineSlope: sR, left, right,
    ...regions, piecewise: null,
  };
}

/**
 * Robust global maximisation of a log-scale function over an interval, shared
 * by the bound searches of every method. @internal
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../core/errors.js';
import { checkLogDensity } from '../core/evaluate.js';
import { twoTo } from '../vendor/math.js';

/** Options of {@link maximizeLog}. @internal */
export interface MaximizeOptions {
  /** A point believed to be near the maximum (e.g. the target's mode). */
  hint?: number;
  /** Typical length scale of the function around `hint`; default from the support. */
  scale?: number;
  /** Points of the uniform grid in the mapped coordinate (default 257). */
  gridSize?: number;
  /** Number of grid-local maxima refined by golden-section search (default 6). */
  refine?: number;
}

/** Result of {@link maximizeLog}. @internal */
export interface MaximizeResult {
  /** Best point found. */
  x: number;
  /** Value of the function at `x` (the estimated supremum). */
  value: number;
  /** Function evaluations spent. */
  evaluations: number;
  /**
   * Set when the supremum is approached towards an end of the interval where
   * the function is still rising at the last probe: `'lower'` or `'upper'`.
   * This signals an infinite supremum (or one that cannot be located).
   */
  risingTail: 'lower' | 'upper' | undefined;
}

const GOLDEN = 0.6180339887498949;
const RAY_STEPS = 64;
/** Rise over the last probes of a ray that counts as "still rising". */
const RISE_TOLERANCE = 1e-7;

/**
 * Maximises `h` over `[lower, upper]` where `h` returns log-scale values
 * (`-Infinity` allowed, `NaN` and `+Infinity` are errors).
 *
 * @remarks
 * Multi-start: (1) geometric probes from the centre towards both ends
 * (c ± s·2^k, and a + (c − a)·2^−k towards finite ends), which finds features
 * at any scale and reveals tails that keep rising; (2) a uniform grid in a
 * coordinate that maps the support to a finite interval; (3) golden-section
 * refinement around the best few local maxima of all probes. The cost is a
 * few hundred evaluations, paid once at setup.
 * @internal
 */
export function maximizeLog(
  api: string,
  h: (x: number) => number,
  lower: number,
  upper: number,
  opts: MaximizeOptions = {},
): MaximizeResult {
  let evaluations = 0;
  const xs: number[] = [];
  const hs: number[] = [];
  const f = (x: number): number => {
    evaluations++;
    return checkLogDensity(api, x, h(x));
  };
  const probe = (x: number): number => {
    if (!(x >= lower && x <= upper) || !Number.isFinite(x)) return -Infinity;
    const v = f(x);
    xs.push(x);
    hs.push(v);
    return v;
  };

  // Centre and scale.
  let c: number;
  if (opts.hint !== undefined && Number.isFinite(opts.hint) && opts.hint >= lower && opts.hint <= upper) c = opts.hint;
  else if (Number.isFinite(lower) && Number.isFinite(upper)) c = lower + (upper - lower) / 2;
  else if (Number.isFinite(lower)) c = lower + 1;
  else if (Number.isFinite(upper)) c = upper - 1;
  else c = 0;
  let s = opts.scale ?? (Number.isFinite(lower) && Number.isFinite(upper) ? (upper - lower) / 4 : 1);
  if (!(s > 0) || !Number.isFinite(s)) s = 1;

  const hc = probe(c);
  // (1) Rays.
  const risingUp = ray(+1);
  const risingDown = ray(-1);

  function ray(dir: 1 | -1): boolean {
    const end = dir > 0 ? upper : lower;
    const finiteEnd = Number.isFinite(end);
    let last: number[] = [hc];
    const span = finiteEnd ? Math.abs(end - c) : Infinity;
    if (span === 0) return false;
    for (let k = -40; k <= RAY_STEPS; k++) {
      const d = s * twoTo(k);
      if (finiteEnd && d >= span) break;
      const x = c + dir * d;
      if (!Number.isFinite(x) || x === c) continue;
      last.push(probe(x));
    }
    if (finiteEnd) {
      // Approach the finite end geometrically, then the end itself.
      for (let k = 1; k <= RAY_STEPS; k++) {
        const x = end - dir * span * twoTo(-k);
        if (x === end || x === c) break;
        last.push(probe(x));
      }
      const he = probe(end);
      if (he !== -Infinity) last.push(he);
    }
    last = last.filter((v) => v > -Infinity);
    const m = last.length;
    if (m < 5) return false;
    const tail = last.slice(m - 5);
    let rising = true;
    for (let i = 1; i < tail.length; i++) if (!(tail[i] > tail[i - 1])) rising = false;
    const best = Math.max(...last);
    return rising && tail[4] - tail[0] > RISE_TOLERANCE && tail[4] >= best;
  }

  // (2) Uniform grid in the mapped coordinate t in (0, 1).
  const n = Math.max(17, opts.gridSize ?? 257);
  for (let i = 1; i < n; i++) probe(fromUnit(i / n, lower, upper, c, s));

  // (3) Refine the best few local maxima of all probes.
  const order = xs.map((_, i) => i).sort((a, b) => xs[a] - xs[b]);
  const sx = order.map((i) => xs[i]);
  const sh = order.map((i) => hs[i]);
  const candidates: number[] = [];
  for (let i = 0; i < sx.length; i++) {
    const left = i > 0 ? sh[i - 1] : -Infinity;
    const right = i < sx.length - 1 ? sh[i + 1] : -Infinity;
    if (sh[i] > -Infinity && sh[i] >= left && sh[i] >= right) candidates.push(i);
  }
  candidates.sort((a, b) => sh[b] - sh[a]);
  let bestX = NaN;
  let bestH = -Infinity;
  for (let i = 0; i < sx.length; i++) if (sh[i] > bestH) { bestH = sh[i]; bestX = sx[i]; }
  const nRefine = Math.min(candidates.length, opts.refine ?? 6);
  for (let j = 0; j < nRefine; j++) {
    const i = candidates[j];
    const a = i > 0 ? sx[i - 1] : sx[i];
    const b = i < sx.length - 1 ? sx[i + 1] : sx[i];
    if (!(b > a)) continue;
    const r = golden(f, a, b, sx[i], sh[i]);
    if (r.value > bestH) { bestH = r.value; bestX = r.x; }
  }
  if (bestH === -Infinity) {
    throw new InvalidTargetError(
      `${api}: no mass found: the function is -Infinity at all ${evaluations} probes over [${lower}, ${upper}] (check logDensity and support)`,
    );
  }
  let risingTail: 'lower' | 'upper' | undefined;
  if (risingUp) risingTail = 'upper';
  else if (risingDown) risingTail = 'lower';
  return { x: bestX, value: bestH, evaluations, risingTail };
}

/** Maps t in (0, 1) onto the support around centre c with scale s. @internal */
export function fromUnit(t: number, lower: number, upper: number, c: number, s: number): number {
  if (Number.isFinite(lower) && Number.isFinite(upper)) return lower + (upper - lower) * t;
  if (Number.isFinite(lower)) return lower + (s * t) / (1 - t);
  if (Number.isFinite(upper)) return upper - (s * (1 - t)) / t;
  const z = 2 * t - 1;
  return c + (s * z) / (1 - z * z);
}

/** Golden-section maximisation on [a, b] starting from a known interior value; 80 iterations at most. */
function golden(f: (x: number) => number, a: number, b: number, x0: number, h0: number): { x: number; value: number } {
  let bestX = x0;
  let bestH = h0;
  let x1 = b - GOLDEN * (b - a);
  let x2 = a + GOLDEN * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let it = 0; it < 80 && b - a > 1e-15 * (Math.abs(a) + Math.abs(b)) + 1e-300; it++) {
    if (f1 >= f2) {
      b = x2; x2 = x1; f2 = f1;
      x1 = b - GOLDEN * (b - a);
      f1 = f(x1);
    } else {
      a = x1; x1 = x2; f1 = f2;
      x2 = a + GOLDEN * (b - a);
      f2 = f(x2);
    }
  }
  if (f1 > bestH) { bestH = f1; bestX = x1; }
  if (f2 > bestH) { bestH = f2; bestX = x2; }
  return { x: bestX, value: bestH };
}

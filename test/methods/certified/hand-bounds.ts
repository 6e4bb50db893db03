/**
 * Hand-written interval bounds for the certified sampler's tests, derived
 * here with pencil and paper (each derivation in a comment), independent of
 * the code under test. Every bound is widened outward by WIDEN in log space
 * to absorb the rounding of Math.* (not correctly rounded).
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import type { Target } from '../../../src/index.js';

/** Outward widening of hand bounds in log space (covers Math.* rounding by many orders). */
export const WIDEN = 1e-9;

const LOG_SQRT_2PI = 0.9189385332046727; // log √(2π), common practice

function lse(v: readonly number[]): number {
  let m = -Infinity;
  for (const x of v) if (x > m) m = x;
  if (m === -Infinity || m === Infinity) return m;
  let s = 0;
  for (const x of v) s += Math.exp(x - m);
  return m + Math.log(s);
}

const widenLo = (v: number): number => (!Number.isFinite(v) ? v : v - WIDEN * (1 + Math.abs(v)));
const widenHi = (v: number): number => (!Number.isFinite(v) ? v : v + WIDEN * (1 + Math.abs(v)));

/** Range of (x − μ)² over [a, b]: 0 inside, else the nearer end; the farther end is the max. */
function sqRange(a: number, b: number, mu: number): [number, number] {
  const da = a - mu;
  const db = b - mu;
  const lo = a <= mu && mu <= b ? 0 : Math.min(da * da, db * db);
  return [lo, Math.max(da * da, db * db)];
}

/**
 * A normal mixture Σ wᵢ N(μᵢ, σᵢ²) with exact hand bounds:
 * log of each term is cᵢ − (x − μᵢ)²/(2σᵢ²), a parabola, bounded over [a, b]
 * by sqRange; log-sum-exp is increasing in each term, so the bounds of the sum
 * are the log-sum-exps of the term bounds. The derivative of log Σ is
 * Σ pᵢ(x)·(−(x − μᵢ)/σᵢ²) with weights pᵢ ≥ 0 summing to 1 (a convex
 * combination), so it lies between the smallest and the largest of the
 * component derivatives over [a, b].
 * cdf: Σ wᵢ Φ((x − μᵢ)/σᵢ) from @stdlib/stats-base-dists-normal-cdf.
 * `lieAbout` drops components from the bounds (not from the density): a bound
 * that lies.
 */
export function mixture(ws: number[], mus: number[], sds: number[], lieAbout: number[] = []): Target & { cdf: (x: number) => number } {
  const total = ws.reduce((p, q) => p + q, 0);
  const c = ws.map((w, i) => Math.log(w / total) - Math.log(sds[i]) - LOG_SQRT_2PI);
  const inB = ws.map((_, i) => !lieAbout.includes(i));
  return {
    logDensity: (x: number) => lse(c.map((ci, i) => ci - (0.5 * (x - mus[i]) ** 2) / sds[i] ** 2)),
    logDensityBounds: (a: number, b: number) => {
      const lo: number[] = [];
      const hi: number[] = [];
      for (let i = 0; i < ws.length; i++) {
        if (!inB[i]) continue;
        const [q0, q1] = sqRange(a, b, mus[i]);
        const s2 = 2 * sds[i] ** 2;
        lo.push(c[i] - q1 / s2);
        hi.push(c[i] - q0 / s2);
      }
      return [widenLo(lse(lo)), widenHi(lse(hi))] as const;
    },
    dLogDensityBounds: (a: number, b: number) => {
      let lo = Infinity;
      let hi = -Infinity;
      for (let i = 0; i < ws.length; i++) {
        if (!inB[i]) continue;
        const v2 = sds[i] ** 2;
        lo = Math.min(lo, -(b - mus[i]) / v2);
        hi = Math.max(hi, -(a - mus[i]) / v2);
      }
      const e = 1e-9;
      return [lo - e * (1 + Math.abs(lo)), hi + e * (1 + Math.abs(hi))] as const;
    },
    modes: mus.filter((_, i) => inB[i]),
    cdf: (x: number) => ws.reduce((p, w, i) => p + (w / total) * normalCdf(x, mus[i], sds[i]), 0),
  };
}

/** Range of sin²(k·x) over [a, b] (k > 0): the end values, 1 if a zero of cos(kx) is inside, 0 if a zero of sin(kx) is inside. */
function sin2Range(k: number, a: number, b: number): [number, number] {
  if (!(Number.isFinite(a) && Number.isFinite(b)) || k * (b - a) >= Math.PI) return [0, 1];
  const fa = Math.sin(k * a) ** 2;
  const fb = Math.sin(k * b) ** 2;
  let lo = Math.min(fa, fb);
  let hi = Math.max(fa, fb);
  // zeros of sin(kx): x = jπ/k; maxima of sin²: x = (j + 1/2)π/k
  const j0 = Math.ceil((k * a) / Math.PI);
  if ((j0 * Math.PI) / k <= b) lo = 0;
  const j1 = Math.ceil((k * a) / Math.PI - 0.5);
  if (((j1 + 0.5) * Math.PI) / k <= b) hi = 1;
  return [Math.max(0, lo - 1e-12), Math.min(1, hi + 1e-12)];
}

/**
 * The worked example f(x) = exp(−x²/2)(sin²6x + 3cos²x·sin²4x + 1) on the line.
 * Bounds: −x²/2 by sqRange; g = sin²6x + 3cos²x·sin²4x + 1 is a sum of
 * non-negative products, so its range is at most [1 + lo₆ + 3·lo_c·lo₄,
 * 1 + hi₆ + 3·hi_c·hi₄] with cos² = 1 − sin². Derivative: (log f)′ = −x + g′/g
 * with g ≥ 1 and |g′| = |6 sin 12x + 3(−sin 2x·sin²4x + 4 cos²x·sin 8x)| ≤ 6 + 3(1 + 4) = 21,
 * so (log f)′ ∈ [−b − 21, −a + 21] on [a, b].
 */
export function workedTarget(scaleFactor = 3): Target {
  const g = (x: number): number => Math.sin(6 * x) ** 2 + scaleFactor * Math.cos(x) ** 2 * Math.sin(4 * x) ** 2 + 1;
  return {
    logDensity: (x: number) => -0.5 * x * x + Math.log(g(x)),
    logDensityBounds: (a: number, b: number) => {
      const [q0, q1] = sqRange(a, b, 0);
      const [s6lo, s6hi] = sin2Range(6, a, b);
      const [s1lo, s1hi] = sin2Range(1, a, b);
      const [s4lo, s4hi] = sin2Range(4, a, b);
      const gLo = 1 + s6lo + scaleFactor * (1 - s1hi) * s4lo;
      const gHi = 1 + s6hi + scaleFactor * (1 - s1lo) * s4hi;
      return [widenLo(-0.5 * q1 + Math.log(gLo)), widenHi(-0.5 * q0 + Math.log(gHi))] as const;
    },
    dLogDensityBounds: (a: number, b: number) => [-b - (6 + 5 * scaleFactor) - 1e-6, -a + 6 + 5 * scaleFactor + 1e-6] as const,
  };
}

/**
 * A density with a jump: f(x) = e^(−x) on [0, 3], times `h` on [1, 2). log f = −x + log h·[1 ≤ x < 2].
 * Bounds over [a, b]: −x is decreasing, so [−b, −a], plus log h where the cell lies inside [1, 2)
 * (lower bound) or meets it (upper bound). No derivative bounds (a jump has none).
 * cdf by hand (common practice): integrate piece by piece.
 */
export function jumpTarget(h = 2): Target & { cdf: (x: number) => number } {
  const lh = Math.log(h);
  const e = Math.exp;
  const mass = (x: number): number => {
    // ∫_0^x f
    const x1 = Math.min(x, 1);
    let m = 1 - e(-x1);
    if (x > 1) m += h * (e(-1) - e(-Math.min(x, 2)));
    if (x > 2) m += e(-2) - e(-Math.min(x, 3));
    return m;
  };
  const total = mass(3);
  return {
    logDensity: (x: number) => (x < 0 || x > 3 ? -Infinity : -x + (x >= 1 && x < 2 ? lh : 0)),
    support: [0, 3],
    logDensityBounds: (a: number, b: number) => {
      const inside = a >= 1 && b < 2;
      const meets = b >= 1 && a < 2;
      return [widenLo(-b + (inside ? lh : 0)), widenHi(-a + (meets ? lh : 0))] as const;
    },
    cdf: (x: number) => (x <= 0 ? 0 : x >= 3 ? 1 : mass(x) / total),
  };
}

/**
 * A gamma-like density with parameters k (shape) and θ (scale):
 * log f = (k − 1) log x − x/θ − lgamma(k) − k log θ on (0, ∞), lgamma from
 * @stdlib/math-base-special-gammaln. Bounds: h(x) = (k − 1) log x − x/θ is
 * concave (k ≥ 1) with its maximum at x* = (k − 1)θ, so over [a, b] its max
 * is h(x*) when x* is inside, else the larger end value, and its min is the
 * smaller end value (h(0) = h(∞) = −∞); h′ = (k − 1)/x − 1/θ is decreasing,
 * so h′ ∈ [h′(b), h′(a)] (h′(0) = +∞, h′(∞) = −1/θ).
 */
export function gammaLike(k: number, theta: number, lgamma: (x: number) => number): Target {
  const c = -lgamma(k) - k * Math.log(theta);
  const h = (x: number): number => (x === 0 ? (k === 1 ? 0 : -Infinity) : x === Infinity ? -Infinity : (k - 1) * Math.log(x) - x / theta);
  const dh = (x: number): number => (x === 0 ? Infinity : x === Infinity ? -1 / theta : (k - 1) / x - 1 / theta);
  const xs = (k - 1) * theta;
  return {
    logDensity: (x: number) => (x <= 0 ? -Infinity : c + h(x)),
    support: [0, Infinity],
    logDensityBounds: (a: number, b: number) => {
      const ha = h(a);
      const hb = h(b);
      const hi = a <= xs && xs <= b ? h(xs) : Math.max(ha, hb);
      return [widenLo(c + Math.min(ha, hb)), widenHi(c + hi)] as const;
    },
    dLogDensityBounds: (a: number, b: number) => {
      const lo = dh(b);
      const hi = dh(a);
      return [lo - 1e-9 * (1 + Math.abs(lo)), hi + 1e-9 * (1 + Math.abs(hi))] as const;
    },
    mode: xs,
  };
}

/** Bounds of the second derivative of a single normal's log-density: −1/σ² everywhere (a parabola). */
export function withCurvature(t: Target, sd: number): Target {
  const c = -1 / (sd * sd);
  return { ...t, d2LogDensityBounds: () => [c * (1 + 1e-12), c * (1 - 1e-12)] as const };
}

/**
 * The Cauchy density truncated to [−c, c]: l = −log(1 + x²), with hand bounds of l, l′ and l″.
 * l decreases in |x|. l′ = −2x/(1 + x²) has its extrema −1 at x = 1 and +1 at x = −1.
 * l″ = −2(1 − u)/(1 + u)² with u = x² increases in u on [0, 3] and decreases beyond (max 1/4 at u = 3).
 * Not log-concave (l″ > 0 for |x| > 1) but −1/√f is concave: l″ ≤ (l′)²/2 ⇔ −2(1 − u) ≤ 2u, always.
 * cdf: (atan x + atan c)/(2 atan c) (common practice).
 */
export function truncatedCauchy(c: number): Target & { cdf: (x: number) => number } {
  const l = (x: number): number => -Math.log1p(x * x);
  const l1 = (x: number): number => (-2 * x) / (1 + x * x);
  const g = (u: number): number => (-2 * (1 - u)) / ((1 + u) * (1 + u));
  const w = (v: [number, number]): readonly [number, number] => [v[0] - 1e-9 * (1 + Math.abs(v[0])), v[1] + 1e-9 * (1 + Math.abs(v[1]))];
  const uRange = (a: number, b: number): [number, number] => [a <= 0 && b >= 0 ? 0 : Math.min(a * a, b * b), Math.max(a * a, b * b)];
  return {
    logDensity: (x: number) => (x < -c || x > c ? -Infinity : l(x)),
    support: [-c, c],
    logDensityBounds: (a: number, b: number) => {
      const [u0, u1] = uRange(a, b);
      return w([-Math.log1p(u1), -Math.log1p(u0)]);
    },
    dLogDensityBounds: (a: number, b: number) => {
      const v = [l1(a), l1(b)];
      if (a <= 1 && 1 <= b) v.push(-1);
      if (a <= -1 && -1 <= b) v.push(1);
      return w([Math.min(...v), Math.max(...v)]);
    },
    d2LogDensityBounds: (a: number, b: number) => {
      const [u0, u1] = uRange(a, b);
      const v = [g(u0), g(u1)];
      if (u0 <= 3 && 3 <= u1) v.push(0.25);
      return w([Math.min(...v), Math.max(...v)]);
    },
    cdf: (x: number) => (x <= -c ? 0 : x >= c ? 1 : (Math.atan(x) + Math.atan(c)) / (2 * Math.atan(c))),
  };
}

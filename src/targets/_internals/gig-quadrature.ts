/**
 * Numerical integration for the generalized inverse Gaussian family: the
 * Bessel normalizer and the cdf table. @internal
 *
 * @packageDocumentation
 */
import { InvalidTargetError } from '../../core/errors.js';
import { asinh, exp, log, log1p, pow, sinh } from '../../vendor/math.js';

/** Nodes of 8-point Gauss–Legendre on [−1, 1] (positive half; Abramowitz & Stegun, Table 25.4). */
const GL_X = [0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363] as const;
/** Weights of 8-point Gauss–Legendre (Abramowitz & Stegun, Table 25.4). */
const GL_W = [0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763] as const;

/** Terms below e^(−this) of the largest end the trapezoidal sum. */
const BESSEL_DROP = 50;
/** Bound on the trapezoidal terms of {@link logBesselK}. */
const BESSEL_MAX_TERMS = 2_000_000;
/** The cdf table extends until the integrand is below e^(−this) of its peak. */
const CDF_DROP = 60;
/** Bound on the cells of the cdf table on each side of the peak. */
const CDF_MAX_CELLS = 200_000;

/**
 * log K_ν(z), z > 0, from K_ν(z) = ∫₀^∞ e^(−z cosh t) cosh(νt) dt by the
 * trapezoidal rule (geometric convergence for this even analytic integrand).
 * @internal
 */
export function logBesselK(api: string, nu: number, z: number): number {
  const v = Math.abs(nu);
  const h = 0.2 * Math.min(1, pow(z * z + v * v, -0.25));
  const t0 = asinh(v / z);
  // φ(t) = −z(cosh t − 1) + log cosh(νt), summed as exp(φ − m) with a running max m
  const phi = (t: number): number => {
    const s = sinh(t / 2);
    return -2 * z * s * s + v * t + log1p(exp(-2 * v * t)) - Math.LN2;
  };
  let m = phi(0);
  let sum = 0.5;
  for (let k = 1; k <= BESSEL_MAX_TERMS; k++) {
    const t = k * h;
    const f = phi(t);
    if (f > m) {
      sum = sum * exp(m - f) + 1;
      m = f;
    } else {
      sum += exp(f - m);
    }
    if (t > t0 && f < m - BESSEL_DROP) return -z + m + log(sum * h);
  }
  throw new InvalidTargetError(`${api}: the Bessel normalizer K_p(√(ab)) needed more than ${BESSEL_MAX_TERMS} terms (p = ${nu}, √(ab) = ${z}); use a smaller |p|`);
}

/**
 * The cdf table of GIG(p, a, b) in u = log x: cells with cumulative sums
 * from both ends; see generalizedInverseGaussianTarget for the method.
 * @internal
 */
export class QuadratureCdf {
  private readonly edges: Float64Array;
  private readonly left: Float64Array;
  private readonly right: Float64Array;
  private readonly total: number;
  private readonly psiMax: number;

  constructor(
    api: string,
    private readonly p: number,
    private readonly a: number,
    private readonly b: number,
    private readonly logC: number,
  ) {
    const r = Math.sqrt(p * p + a * b);
    const peak = log(p >= 0 ? (p + r) / a : b / (r - p));
    this.psiMax = this.psi(peak);
    const up = this.walk(api, peak, +1);
    const down = this.walk(api, peak, -1);
    const n = up.length + down.length - 2;
    const edges = new Float64Array(n + 1);
    let k = 0;
    for (let i = down.length - 1; i >= 1; i--) edges[k++] = down[i];
    for (let i = 0; i < up.length; i++) edges[k++] = up[i];
    const cell = new Float64Array(n);
    for (let i = 0; i < n; i++) cell[i] = this.gauss(edges[i], edges[i + 1]);
    const left = new Float64Array(n + 1);
    for (let i = 0; i < n; i++) left[i + 1] = left[i] + cell[i];
    const right = new Float64Array(n + 1);
    for (let i = n - 1; i >= 0; i--) right[i] = right[i + 1] + cell[i];
    this.edges = edges;
    this.left = left;
    this.right = right;
    this.total = left[n];
  }

  /** The total mass of the table, relative to the peak of the integrand (so not 1). */
  get mass(): number {
    return this.total * exp(this.psiMax);
  }

  /** P(X ≤ e^u). */
  cdf(u: number): number {
    const e = this.edges;
    const n = e.length - 1;
    if (u <= e[0]) return 0;
    if (u >= e[n]) return 1;
    const i = this.find(u);
    return Math.min(1, (this.left[i] + this.gauss(e[i], u)) / this.total);
  }

  /** P(X > e^u). */
  sf(u: number): number {
    const e = this.edges;
    const n = e.length - 1;
    if (u <= e[0]) return 1;
    if (u >= e[n]) return 0;
    const i = this.find(u);
    return Math.min(1, (this.right[i + 1] + this.gauss(u, e[i + 1])) / this.total);
  }

  /** log of the integrand in u: log f(e^u) + u. */
  private psi(u: number): number {
    return this.logC + this.p * u - 0.5 * (this.a * exp(u) + this.b * exp(-u));
  }

  /** Cell edges from the peak outwards in direction dir, until the integrand has dropped by CDF_DROP. */
  private walk(api: string, start: number, dir: 1 | -1): number[] {
    const out = [start];
    let u = start;
    for (let k = 0; k < CDF_MAX_CELLS; k++) {
      const eu = exp(u);
      const d1 = Math.abs(this.p - 0.5 * (this.a * eu - this.b / eu));
      const d2 = 0.5 * (this.a * eu + this.b / eu);
      const w = Math.min(1, 1 / Math.max(d1, Math.sqrt(d2), 1e-300));
      u += dir * w;
      out.push(u);
      if (this.psi(u) < this.psiMax - CDF_DROP) return out;
    }
    throw new InvalidTargetError(`${api}: the cdf table needed more than ${CDF_MAX_CELLS} cells on one side (p = ${this.p}, a = ${this.a}, b = ${this.b})`);
  }

  /** ∫ from lo to hi of exp(ψ(u) − ψmax) du by 8-point Gauss–Legendre. */
  private gauss(lo: number, hi: number): number {
    const c = 0.5 * (lo + hi);
    const h = 0.5 * (hi - lo);
    let s = 0;
    for (let j = 0; j < 4; j++) {
      const dx = h * GL_X[j];
      s += GL_W[j] * (exp(this.psi(c - dx) - this.psiMax) + exp(this.psi(c + dx) - this.psiMax));
    }
    return s * h;
  }

  /** Index i with edges[i] <= u < edges[i + 1]. */
  private find(u: number): number {
    const e = this.edges;
    let lo = 0;
    let hi = e.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (e[mid] <= u) lo = mid;
      else hi = mid;
    }
    return lo;
  }
}

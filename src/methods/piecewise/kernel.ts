/**
 * The sampling kernel of the piecewise method. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, NonFiniteDensityError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import type { GuideTable } from '../hull/guide-table.js';
import { T_LOG } from '../hull/transforms.js';
import { LOG_TOLERANCE_ABSOLUTE, LOG_TOLERANCE_RELATIVE } from './grid.js';
import type { Tables } from './grid.js';
import { exp, log1p } from '../../vendor/math.js';

/** Mutable state the kernel reads (tables are replaced after a repair). @internal */
export interface KernelState {
  api: string;
  t: Tables;
  guide: GuideTable;
  logf: (x: number) => number;
  counters: Counters;
  uniform: Uniform;
  maxRejections: number;
  /** Repair instead of throwing on a violation. */
  adapt: boolean;
  /** Set when the kernel stops for a repair: the point, its log-density, the envelope (or squeeze) there, which one. */
  pendingX: number;
  pendingL: number;
  pendingBound: number;
  pendingWhat: 'envelope' | 'squeeze';
}

/**
 * Fills `out[start..n)`. Returns −1 when done, or the index of the draw in
 * progress when a violation was found and `adapt` is set (the candidate is
 * dropped; `pending*` describe it).
 *
 * @remarks
 * Per proposal exactly three uniforms: u1 picks a piece through the guide
 * table (Chen & Asau 1974), u2 inverts the piece's envelope cdf, u3 is the
 * acceptance variable. A candidate with u3 < squeeze/envelope is accepted
 * without evaluating the target; otherwise logDensity is evaluated, checked
 * for NaN/+Infinity and against envelope and squeeze, and the candidate is
 * accepted when u3 < f/envelope. No allocation.
 * @internal
 */
export function piecewiseFill(s: KernelState, out: Float64Array, start: number, n: number): number {
  const api = s.api;
  const t = s.t;
  const lo = t.lo;
  const hi = t.hi;
  const kind = t.kind;
  const xh = t.xh;
  const dir = t.dir;
  const wd = t.w;
  const href = t.href;
  const sig = t.sig;
  const pq = t.q;
  const sqa = t.sqa;
  const sqv = t.sqv;
  const sqs = t.sqs;
  const gt = s.guide;
  const cum = gt.cum;
  const guide = gt.guide;
  const size = gt.size;
  const total = gt.total;
  const ref = t.ref;
  const logf = s.logf;
  const c = s.counters;
  const uniform = s.uniform;
  const maxRejections = s.maxRejections;
  const tolBase = LOG_TOLERANCE_ABSOLUTE + LOG_TOLERANCE_RELATIVE * Math.abs(ref);
  for (let i = start; i < n; i++) {
    let rejections = 0;
    for (;;) {
      c.proposals++;
      const u1 = uniform();
      let j = guide[(u1 * size) | 0];
      const v = u1 * total;
      while (cum[j] <= v) j++;
      const u2 = uniform();
      const w = wd[j];
      const q = pq[j];
      const sg = sig[j];
      const isLog = kind[j] === T_LOG;
      let d: number;
      if (isLog) d = q === 0 ? u2 * w : -log1p(-u2 * q) / sg;
      else d = w === Infinity ? u2 / ((1 - u2) * q) : (u2 * w) / (1 + (1 - u2) * q * w);
      if (d > w) d = w;
      const h = xh[j];
      let x = h + dir[j] * d;
      if (x < lo[j]) x = lo[j];
      else if (x > hi[j]) x = hi[j];
      const u3 = uniform();
      if (x > -Infinity && x < Infinity) {
        const dd = dir[j] > 0 ? x - h : h - x;
        const env = isLog ? href[j] - sg * dd : href[j] - 2 * log1p(sg * dd);
        const sv = sqv[j];
        const sq = sv === -Infinity ? -Infinity : sv + sqs[j] * (x - sqa[j]);
        if (u3 < exp(sq - env)) {
          out[i] = x;
          break;
        }
        const lf = logf(x);
        c.densityEvaluations++;
        if (lf !== lf || lf === Infinity || typeof lf !== 'number') throw new NonFiniteDensityError(api, x, lf);
        const lr = lf - ref;
        const tol = tolBase + LOG_TOLERANCE_RELATIVE * (lr === -Infinity ? 0 : Math.abs(lr));
        if (lr > env + tol || lr < sq - tol) {
          const what = lr > env + tol ? 'envelope' : 'squeeze';
          const bound = (what === 'envelope' ? env : sq) + ref;
          if (s.adapt) {
            s.pendingX = x;
            s.pendingL = lf;
            s.pendingBound = bound;
            s.pendingWhat = what;
            return i;
          }
          throw new EnvelopeViolationError(api, x, lf, bound, what);
        }
        if (u3 < exp(lr - env)) {
          out[i] = x;
          break;
        }
      }
      if (++rejections >= maxRejections) throw new StalledSamplerError(api, rejections, c.samples, c.proposals);
    }
    c.samples++;
  }
  return -1;
}

/** log envelope of piece j at x, relative to t.ref (the kernel's formula). @internal */
export function pieceLogEnvelope(t: Tables, j: number, x: number): number {
  const h = t.xh[j];
  const dd = t.dir[j] > 0 ? x - h : h - x;
  return t.kind[j] === T_LOG ? t.href[j] - t.sig[j] * dd : t.href[j] - 2 * log1p(t.sig[j] * dd);
}

/** log squeeze of piece j at x, relative to t.ref (−Infinity: none). @internal */
export function pieceLogSqueeze(t: Tables, j: number, x: number): number {
  const sv = t.sqv[j];
  return sv === -Infinity ? -Infinity : sv + t.sqs[j] * (x - t.sqa[j]);
}

/**
 * The point of piece j at envelope-cdf value u in [0, 1) (the inversion of
 * {@link piecewiseFill}, which inlines it), clamped to the piece. @internal
 */
export function pieceInverse(t: Tables, j: number, u: number): number {
  const w = t.w[j];
  const q = t.q[j];
  let d: number;
  if (t.kind[j] === T_LOG) d = q === 0 ? u * w : -log1p(-u * q) / t.sig[j];
  else d = w === Infinity ? u / ((1 - u) * q) : (u * w) / (1 + (1 - u) * q * w);
  if (d > w) d = w;
  const x = t.xh[j] + t.dir[j] * d;
  return x < t.lo[j] ? t.lo[j] : x > t.hi[j] ? t.hi[j] : x;
}

/** Log-units tolerance of a comparison of a log-density (lr relative to ref) with a bound (the kernel's). @internal */
export function piecewiseTolerance(ref: number, lr: number): number {
  return LOG_TOLERANCE_ABSOLUTE + LOG_TOLERANCE_RELATIVE * (Math.abs(ref) + (lr === -Infinity ? 0 : Math.abs(lr)));
}

/**
 * log envelope and log squeeze (absolute) of the tables at x, with the
 * kernel's arithmetic; −Infinity outside every piece. @internal
 */
export function evaluateTables(t: Tables, x: number): { logEnvelope: number; logSqueeze: number } {
  const n = t.n;
  const lo = t.lo;
  if (!(x === x) || n === 0 || x < lo[0]) return { logEnvelope: -Infinity, logSqueeze: -Infinity };
  let a = 0;
  let b = n - 1;
  while (a < b) {
    const m = (a + b + 1) >> 1;
    if (lo[m] <= x) a = m;
    else b = m - 1;
  }
  // a piece that ends exactly at x may be followed by one starting there; either serves
  if (!(x <= t.hi[a])) return { logEnvelope: -Infinity, logSqueeze: -Infinity };
  return { logEnvelope: pieceLogEnvelope(t, a, x) + t.ref, logSqueeze: pieceLogSqueeze(t, a, x) + t.ref };
}

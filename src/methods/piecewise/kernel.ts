/**
 * The sampling kernel of the piecewise method. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, StalledSamplerError } from '../../core/errors.js';
import { checkLogDensity } from '../../core/evaluate.js';
import type { UniformBlock } from '../../random/uniform-block.js';
import { nextUniform } from '../../random/uniform-block.js';
import type { GuideTable, SHARE_FLOOR } from '../envelope/guide-table.js';
import { restOfUniform } from '../envelope/guide-table.js';
import type { Tables } from '../envelope/piece-tables.js';
import { logTolerance } from '../envelope/tolerance.js';
import { invertPiece, pieceLogEnvelopeAt } from '../envelope/transforms.js';
import { exp } from '../../vendor/math.js';
import { expScreen } from '../envelope/exp-screen.js';

/**
 * Mutable state the kernel reads (tables are replaced after a repair). The
 * kernel itself mutates only `pending*` (and the counters); the repair that
 * follows a pending violation is done by the caller. @internal
 */
export interface KernelState {
  api: string;
  t: Tables;
  guide: GuideTable;
  logf: (x: number) => number;
  counters: Counters;
  /** The uniforms: blocks of an owned MT19937, or one value at a time from an injected source (the same values in the same order). */
  blk: UniformBlock;
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
 * Per proposal two or three uniforms, as in the hull kernel: u1 picks a
 * piece through the guide table (Chen & Asau 1974); the position inverts the
 * piece's envelope cdf at the rest of u1 within the piece when the piece
 * holds at least {@link SHARE_FLOOR} = 2^-12 of the area, else at a fresh
 * uniform; the last is the acceptance variable. A candidate with u3 < squeeze/envelope is accepted
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
  const xh = t.highEnd;
  const dir = t.direction;
  const wd = t.width;
  const href = t.highLogHeight;
  const sig = t.rate;
  const pq = t.inversion;
  const sqa = t.squeezeAnchor;
  const sqv = t.squeezeValue;
  const sqs = t.squeezeSlope;
  const gt = s.guide;
  const cum = gt.cum;
  const guide = gt.guide;
  const size = gt.size;
  const total = gt.total;
  const area = t.area;
  const ref = t.ref;
  const logf = s.logf;
  const c = s.counters;
  const blk = s.blk;
  const maxRejections = s.maxRejections;
  for (let i = start; i < n; i++) {
    let rejections = 0;
    for (;;) {
      c.proposals++;
      const u1 = nextUniform(blk);
      let j = guide[(u1 * size) | 0];
      const v = u1 * total;
      while (cum[j] <= v) j++;
      // the position in the piece: the rest of u1, or a fresh uniform in a piece below SHARE_FLOOR
      let u2 = restOfUniform(cum, j, area[j], v, total);
      if (u2 < 0) u2 = nextUniform(blk);
      const sg = sig[j];
      const kj = kind[j];
      const d = invertPiece(kj, pq[j], sg, wd[j], u2);
      const h = xh[j];
      let x = h + dir[j] * d;
      if (x < lo[j]) x = lo[j];
      else if (x > hi[j]) x = hi[j];
      const u3 = nextUniform(blk);
      if (x > -Infinity && x < Infinity) {
        const env = pieceLogEnvelopeAt(kj, href[j], sg, dir[j] > 0 ? x - h : h - x);
        const sv = sqv[j];
        const sq = sv === -Infinity ? -Infinity : sv + sqs[j] * (x - sqa[j]);
        // the squeeze test u3 < exp(y), screened without exp first (same decisions; envelope/exp-screen.ts)
        const y = sq - env;
        if (u3 < expScreen(y) || u3 < exp(y)) {
          out[i] = x;
          break;
        }
        const raw = logf(x);
        c.densityEvaluations++;
        const lf = checkLogDensity(api, x, raw);
        const lr = lf - ref;
        const tol = logTolerance(ref, lr);
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


/**
 * The sampling kernel of the hull engine. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, StalledSamplerError } from '../../core/errors.js';
import { checkLogDensity } from '../../core/evaluate.js';
import type { UniformBlock } from '../../random/uniform-block.js';
import { nextUniform } from '../../random/uniform-block.js';
import { logTolerance } from '../envelope/tolerance.js';
import { T_LOG, invertPiece } from '../envelope/transforms.js';
import { checkBeyondZero } from '../envelope/gaps.js';
import { expScreen } from '../envelope/exp-screen.js';
import { restOfUniform } from '../envelope/guide-table.js';
import type { SHARE_FLOOR } from '../envelope/guide-table.js';
import { nonFiniteDerivative } from './hull.js';
import type { Hull } from './hull.js';
import { explainViolation } from './shape-checks.js';
import { exp, log } from '../../vendor/math.js';

/**
 * Fills `out[0..n)` with draws from the target under the hull `h`.
 *
 * @remarks
 * Per proposal the kernel consumes two or three uniforms, read through
 * `blk` (blocks of an owned MT19937, or one value at a time from an injected
 * source: the same values in the same order either way): u1 selects a
 * piece j through the guide table; the position inverts the piece's
 * envelope cdf at the rest of u1 within the piece, (u1·total − cum[j−1]) /
 * area[j], which given j is uniform on [0, 1), when the piece holds at least
 * {@link SHARE_FLOOR} = 2^-12 of the envelope's area (so that at least 41 of
 * u1's 53 bits remain for it), and at a fresh uniform u2 otherwise (the
 * tails, and the pieces of a large hull); the last uniform, u3, is the
 * acceptance variable. The candidate is accepted without evaluating the
 * target when u3 < squeeze/envelope (strict, so that u3 = 0 under a zero
 * squeeze still evaluates). Otherwise logDensity is evaluated (and counted),
 * checked for NaN/+Infinity, against the envelope and against the squeeze
 * (both within the hull tolerance), and the candidate is accepted when
 * u3 < f/envelope. The kernel mutates the hull for adaptation: every evaluated candidate, accepted or not, becomes a
 * touch point while the hull has room (the updating step of Gilks & Wild
 * 1992; see {@link Hull.insert}); one where the density is 0 outside the
 * touch points shrinks the effective support instead. No
 * allocation happens here; the guide table is rebuilt lazily after insertions.
 * The counts of samples and proposals are kept in locals and added on exit
 * (also when an error is thrown).
 * @internal
 */
export function hullFill(
  h: Hull,
  out: Float64Array,
  n: number,
  counters: Counters,
  blk: UniformBlock,
  maxRejections: number,
): void {
  const api = h.api;
  const lo = h.lo;
  const hi = h.hi;
  const ax = h.lineAnchor;
  const at = h.lineValue;
  const sl = h.lineSlope;
  const sqx = h.squeezeAnchor;
  const sqt = h.squeezeValue;
  const sqs = h.squeezeSlope;
  const hx = h.highEnd;
  const dir = h.direction;
  const wd = h.width;
  const sig = h.rate;
  const pq = h.inversion;
  const gt = h.guideTable;
  const cum = gt.cum;
  const guide = gt.guide;
  const kind = h.kind;
  const area = h.area;
  const isLog = kind === T_LOG;
  const logf = h.target.logDensity;
  const ref = h.ref;
  let proposals = 0;
  let i = 0;
  try {
    for (; i < n; i++) {
      let rejections = 0;
      for (;;) {
        if (h.dirty) {
          h.flush();
          h.buildGuide();
        }
        proposals++;
        const u1 = nextUniform(blk);
        let j = guide[(u1 * gt.size) | 0];
        const v = u1 * gt.total;
        while (cum[j] <= v) j++;
        // the position in the piece: the rest of u1, or a fresh uniform in a piece below SHARE_FLOOR
        let u2 = restOfUniform(cum, j, area[j], v, gt.total);
        if (u2 < 0) {
          // nextUniform written out: V8 did not inline a third call site, and u2, merged with that call's
          // boxed result, was boxed on every draw (16 bytes per draw, bench/alloc.mjs)
          let p = blk.pos;
          if (p >= blk.len) {
            blk.refill();
            p = 0;
          }
          blk.pos = p + 1;
          u2 = blk.buf[p];
        }
        const d = invertPiece(kind, pq[j], sig[j], wd[j], u2);
        let x = hx[j] + dir[j] * d;
        if (x < lo[j]) x = lo[j];
        else if (x > hi[j]) x = hi[j];
        const t = at[j] + sl[j] * (x - ax[j]);
        const sv = sqt[j];
        const c = sv === -Infinity ? -Infinity : sv + sqs[j] * (x - sqx[j]);
        const u3 = nextUniform(blk);
        let lenv: number;
        let lsq: number;
        if (isLog) {
          // the squeeze test u3 < exp(y), decided without exp where the screen suffices (same decisions)
          const y = c - t;
          if (u3 < expScreen(y) || u3 < exp(y)) {
            out[i] = x;
            break;
          }
          lenv = t;
          lsq = c;
        } else {
          const r = t / c;
          if (u3 < r * r) {
            out[i] = x;
            break;
          }
          lenv = -2 * log(-t);
          lsq = c === -Infinity ? -Infinity : -2 * log(-c);
        }
        const raw = logf(x);
        counters.densityEvaluations++;
        const lf = checkLogDensity(api, x, raw);
        const lr = lf - ref;
        const tol = logTolerance(ref, lr);
        if (lr > lenv + tol) {
          explainViolation(h, x, lf, `target is above the envelope at x = ${x} (log target ${lf}, log envelope ${lenv + ref})`);
          throw new EnvelopeViolationError(api, x, lf, lenv + ref, 'envelope');
        }
        if (lr < lsq - tol) {
          explainViolation(h, x, lf, `target is below the squeeze at x = ${x} (log target ${lf}, log squeeze ${lsq + ref})`);
          throw new EnvelopeViolationError(api, x, lf, lsq + ref, 'squeeze');
        }
        if (lf === -Infinity) beyondCut(h, counters, x);
        // updating step (Gilks & Wild 1992): every evaluated candidate becomes a touch point
        adapt(h, x, lf);
        if (u3 < exp(lr - lenv)) {
          out[i] = x;
          break;
        }
        if (++rejections >= maxRejections) {
          throw new StalledSamplerError(api, rejections, counters.samples + i, counters.proposals + proposals);
        }
      }
    }
  } finally {
    counters.samples += i;
    counters.proposals += proposals;
  }
}

/**
 * A candidate of density 0 beyond the outermost touch point is about to cut
 * the support: first look beyond it ({@link checkBeyondZero}, counted as
 * density evaluations), so that a positive part further out is a
 * {@link ShapeViolationError} rather than silently dropped. Rare path: runs
 * once per cut.
 */
function beyondCut(h: Hull, counters: Counters, x: number): void {
  const k = h.k;
  if (k === 0) return;
  const tx = h.touchX;
  const below = x < tx[0] && x > h.lower;
  const above = x > tx[k - 1] && x < h.upper;
  if (!below && !above) return;
  const api = h.api;
  const logf = h.target.logDensity;
  const evaluate = (y: number): number => {
    counters.densityEvaluations++;
    return checkLogDensity(api, y, logf(y));
  };
  checkBeyondZero(api, evaluate, x, below ? tx[0] : tx[k - 1], below ? h.lower : h.upper, tx[k - 1] - tx[0]);
}

/** Inserts an evaluated candidate as a touch point (evaluating the derivative when the hull uses tangents). */
function adapt(h: Hull, x: number, lf: number): void {
  if (lf === -Infinity) {
    h.insert(x, lf, NaN, false);
    return;
  }
  if (h.k >= h.maxK) return;
  let g = NaN;
  if (h.tangent) {
    const dl = h.target.dLogDensity as (x: number) => number;
    g = dl(x);
    h.derivativeEvaluations++;
    if (g !== g || typeof g !== 'number') nonFiniteDerivative(h.api, x, g);
    if (g === Infinity || g === -Infinity) return;
  }
  h.insertDeferred(x, lf, g);
}

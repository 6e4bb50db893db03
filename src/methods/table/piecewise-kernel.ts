/**
 * The rare-path steps of the strip-table kernel for a table built over a
 * piecewise envelope (`piecewiseSampler(target, { fast: true })`): its
 * tails and caps. The builder of such tables (piecewise-build.ts) hands
 * them to the kernel through {@link PiecewiseStrips}, so that the kernel of
 * {@link tableSampler} (whose tables have none) does not bundle them. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError } from '../../core/errors.js';
import type { UniformBlock } from '../../random/uniform-block.js';
import { nextUniform } from '../../random/uniform-block.js';
import { pieceInverse, pieceLogEnvelope, pieceLogSqueeze } from '../envelope/piece-tables.js';
import { logTolerance } from '../envelope/tolerance.js';
import { evaluate } from './kernel.js';
import { R_LEFT_TAIL } from './strip-table.js';
import type { KernelState, PiecewiseStrips } from './strip-table.js';
import { exp, log } from '../../vendor/math.js';

/**
 * A tail region of a table built over a piecewise envelope: one of its
 * pieces picked by area (pos) and drawn from as the piecewise kernel does (a
 * fresh uniform for the position, one for acceptance). An evaluation outside
 * the piece's envelope or squeeze throws {@link EnvelopeViolationError}.
 * @internal
 */
export function piecewiseTailCandidate(st: KernelState, counters: Counters, pw: PiecewiseStrips, type: number, pos: number, blk: UniformBlock): number {
  const t = pw.tables;
  const ref = st.table.ref;
  const idx = type === R_LEFT_TAIL ? pw.tailL : pw.tailR;
  const cum = type === R_LEFT_TAIL ? pw.cumL : pw.cumR;
  const v = pos * cum[cum.length - 1];
  let k = 0;
  while (k + 1 < cum.length && cum[k] <= v) k++;
  const j = idx[k];
  const x = pieceInverse(t, j, nextUniform(blk));
  const u3 = nextUniform(blk);
  if (!(x > -Infinity && x < Infinity)) {
    st.accepted = false;
    return x;
  }
  const env = pieceLogEnvelope(t, j, x);
  const sq = pieceLogSqueeze(t, j, x);
  if (u3 < exp(sq - env)) {
    st.accepted = true;
    return x;
  }
  const lf = evaluate(st, counters, x);
  checkPiecewise(st.table.api, x, lf, ref, env, sq);
  st.accepted = u3 < exp(lf - ref - env);
  return x;
}

/** A cap of a table over a piecewise envelope at x in strip i with height hv: the piece's squeeze and envelope at x, then the target. Sets `st.accepted`. @internal */
export function piecewiseCap(st: KernelState, counters: Counters, pw: PiecewiseStrips, i: number, x: number, hv: number): void {
  const t = pw.tables;
  const ref = st.table.ref;
  let j = pw.first[i];
  const jEnd = pw.last[i];
  while (j < jEnd && t.hi[j] < x) j++;
  const th = log(hv);
  const sq = pieceLogSqueeze(t, j, x);
  if (th < sq) {
    st.accepted = true;
    return;
  }
  const env = pieceLogEnvelope(t, j, x);
  if (th >= env) {
    st.accepted = false;
    return;
  }
  const lf = evaluate(st, counters, x);
  checkPiecewise(st.table.api, x, lf, ref, env, sq);
  st.accepted = th < lf - ref;
}

/** Throws EnvelopeViolationError when lf lies above the piece's envelope or below its squeeze (relative logs env, sq). */
function checkPiecewise(api: string, x: number, lf: number, ref: number, env: number, sq: number): void {
  const lr = lf - ref;
  const tol = logTolerance(ref, lr);
  if (lr > env + tol) throw new EnvelopeViolationError(api, x, lf, env + ref, 'envelope');
  if (lr < sq - tol) throw new EnvelopeViolationError(api, x, lf, sq + ref, 'squeeze');
}

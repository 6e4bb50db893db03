/**
 * Draw loop of the certified sampler: guide-table cell selection, inversion
 * inside the cell's exponential (or flat) envelope, squeeze test, density
 * test checked against the proven envelope and squeeze, and refinement on
 * rejection (OS*). @internal
 *
 * @packageDocumentation
 */
import { checkLogDensity } from '../../core/evaluate.js';
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import { GuideTable, restOfUniform } from '../envelope/guide-table.js';
import type { SHARE_FLOOR } from '../envelope/guide-table.js';
import { logSumExp } from './build.js';
import type { BoundsOracle, CellStore } from './cells.js';
import { splitCell, splitPoint } from './cells.js';
import { exp, log, log1p } from '../../vendor/math.js';

/** Floats per cell in the kernel's packed table: lo, hi, peak, log height, rate, inversion constant, squeeze anchor, height, slope, and the smallest squeeze/envelope ratio on the cell. @internal */
export const HOT_STRIDE = 10;

/**
 * Refinement on rejection stops once (squeeze area)/(envelope area) reaches
 * this (or at the cell budget): past it, more cells mostly cost memory and
 * cache misses for a gain below 0.1 % in acceptance. @internal
 */
export const REFINE_UNTIL = 0.999;

/** Everything a certified sampler draws with. @internal */
export class CertifiedState {
  readonly api: string;
  readonly cells: CellStore;
  readonly oracle: BoundsOracle;
  readonly logDensity: (x: number) => number;
  readonly uniform: Uniform;
  readonly counters: Counters;
  readonly maxCells: number;
  readonly maxRejections: number;
  readonly refineOnRejection: boolean;
  readonly guide: GuideTable;
  /** Linear areas relative to the largest, for the guide table. */
  lin: Float64Array;
  /** The kernel's per-cell data, interleaved ({@link HOT_STRIDE} floats per cell): one or two cache lines per candidate. */
  hot: Float64Array;
  logEnvelopeArea = 0;
  logSqueezeArea = 0;
  /** Whether refinement on rejection is still on (below {@link REFINE_UNTIL} and the budget). */
  refining = false;
  /** Cells split on rejection after setup. */
  refinements = 0;
  /** Cells where a candidate was rejected, waiting to be split (in batches, so that a table rebuild serves many splits). */
  pending: Int32Array = new Int32Array(64);
  pendingCount = 0;
  /** 1 for a cell in {@link CertifiedState.pending}. */
  marked: Uint8Array = new Uint8Array(0);

  constructor(
    api: string,
    cells: CellStore,
    oracle: BoundsOracle,
    logDensity: (x: number) => number,
    uniform: Uniform,
    counters: Counters,
    maxCells: number,
    maxRejections: number,
    refineOnRejection: boolean,
  ) {
    this.api = api;
    this.cells = cells;
    this.oracle = oracle;
    this.logDensity = logDensity;
    this.uniform = uniform;
    this.counters = counters;
    this.maxCells = maxCells;
    this.maxRejections = maxRejections;
    this.refineOnRejection = refineOnRejection;
    this.guide = new GuideTable(cells.capacity);
    this.lin = new Float64Array(cells.capacity);
    this.hot = new Float64Array(cells.capacity * HOT_STRIDE);
    this.marked = new Uint8Array(cells.capacity);
    this.rebuild();
  }

  /** Recomputes the totals, the packed table and the guide table (after setup and after each split). */
  rebuild(): void {
    const c = this.cells;
    const n = c.n;
    if (this.lin.length < c.capacity) {
      this.lin = new Float64Array(c.capacity);
      this.hot = new Float64Array(c.capacity * HOT_STRIDE);
      this.marked = new Uint8Array(c.capacity);
      this.guide.useStorage(new Float64Array(c.capacity), new Int32Array(c.capacity)); // setup only
    }
    const logE = logSumExp(c.logEnv, n);
    this.logEnvelopeArea = logE;
    this.logSqueezeArea = logSumExp(c.logSq, n);
    const lin = this.lin;
    const h = this.hot;
    for (let j = 0; j < n; j++) {
      lin[j] = exp(c.logEnv[j] - logE);
      const o = j * HOT_STRIDE;
      h[o] = c.lo[j];
      h[o + 1] = c.hi[j];
      h[o + 2] = c.eP[j];
      h[o + 3] = c.eH[j];
      h[o + 4] = c.eR[j];
      h[o + 5] = c.eQ[j];
      h[o + 6] = c.sA[j];
      h[o + 7] = c.sH[j];
      h[o + 8] = c.sS[j];
      h[o + 9] = minRatio(c, j);
    }
    this.guide.build(lin, n);
    this.pendingCount = 0;
    this.marked.fill(0);
    this.refining = this.refineOnRejection && n < this.maxCells && this.logSqueezeArea - logE < log(REFINE_UNTIL);
  }
}

/**
 * The smallest value of squeeze/envelope on cell `j` (both are log-linear
 * on the cell, so the smallest log ratio is at an end, or 0 towards an
 * infinite end where the ratio vanishes), shrunk by 1e-12 relative; 0
 * without a squeeze. @internal
 */
export function minRatio(c: CellStore, j: number): number {
  const sh = c.sH[j];
  const eh = c.eH[j];
  if (sh === -Infinity || !(eh < Infinity) || eh === -Infinity) return 0;
  const a = c.lo[j];
  const b = c.hi[j];
  const p = c.eP[j];
  const r = c.eR[j];
  const ss = c.sS[j];
  const sa = c.sA[j];
  const d = (x: number): number => sh + ss * (x - sa) - (eh - r * Math.abs(x - p));
  let m = Infinity;
  if (Number.isFinite(a)) m = Math.min(m, d(a));
  else if (ss - r > 0 || ss - r !== ss - r) m = -Infinity; // towards −∞ the log ratio falls with slope ss − r... (ratio → 0)
  if (Number.isFinite(b)) m = Math.min(m, d(b));
  else if (ss + r < 0) m = -Infinity;
  if (!(m < Infinity) || m !== m) return 0;
  const q = exp(m) * (1 - 1e-12);
  return q > 0 && q < 1 ? q : q >= 1 ? 1 - 1e-12 : 0;
}

/**
 * Fills `out[0..n)` with draws. Two or three uniforms per candidate: the
 * cell; the position, the rest of the cell-selecting uniform when the cell
 * holds at least {@link SHARE_FLOOR} = 2^-12 of the envelope's area, else a
 * fresh uniform; the acceptance variable. @internal
 */
export function certifiedFill(s: CertifiedState, out: Float64Array, n: number): void {
  const u = s.uniform;
  const cnt = s.counters;
  const logf = s.logDensity;
  const maxRej = s.maxRejections;
  let h = s.hot;
  let lin = s.lin;
  let cum = s.guide.cum;
  let guide = s.guide.guide;
  let size = s.guide.size;
  let total = s.guide.total;
  for (let i = 0; i < n; i++) {
    let rejections = 0;
    for (;;) {
      const u1 = u();
      const v1 = u1 * total;
      let j = guide[(u1 * size) | 0];
      while (cum[j] <= v1) j++;
      const o = j * HOT_STRIDE;
      const a = h[o];
      const b = h[o + 1];
      const p = h[o + 2];
      const r = h[o + 4];
      // the position in the cell: the rest of u1, or a fresh uniform in a cell below SHARE_FLOOR (as the hull kernel)
      let u2 = restOfUniform(cum, j, lin[j], v1, total);
      if (u2 < 0) u2 = u();
      let x: number;
      if (r === 0) {
        x = a + u2 * (b - a);
      } else {
        const t = -log1p(-u2 * h[o + 5]) / r;
        x = p === a ? a + t : b - t;
      }
      if (x < a) x = a;
      else if (x > b) x = b;
      const lg = h[o + 3] - r * Math.abs(x - p);
      const sh = h[o + 7];
      const ls = sh === -Infinity ? -Infinity : sh + h[o + 8] * (x - h[o + 6]);
      const v = 1 - u(); // in (0, 1]
      cnt.proposals++;
      // v <= the cell's smallest squeeze/envelope ratio: under the squeeze wherever x is (no exp needed)
      if (v <= h[o + 9] || (ls > -Infinity && v <= exp(ls - lg))) {
        out[i] = x;
        cnt.samples++;
        break;
      }
      const lf = logf(x);
      cnt.densityEvaluations++;
      checkLogDensity(s.api, x, lf);
      if (lf > lg) throw new EnvelopeViolationError(s.api, x, lf, lg);
      if (lf < ls) throw new EnvelopeViolationError(s.api, x, lf, ls, 'squeeze');
      if (v <= exp(lf - lg)) {
        out[i] = x;
        cnt.samples++;
        break;
      }
      if (++rejections >= maxRej) throw new StalledSamplerError(s.api, rejections, cnt.samples, cnt.proposals);
      if (s.refining && s.marked[j] === 0 && s.cells.stuck[j] === 0 && refineLater(s, j)) {
        h = s.hot;
        lin = s.lin;
        cum = s.guide.cum;
        guide = s.guide.guide;
        size = s.guide.size;
        total = s.guide.total;
      }
    }
  }
}

/**
 * Queues cell `j` for splitting (refinement on rejection). When the queue
 * holds max(1, cells/64) cells, or would reach the budget, they are split and
 * the table is rebuilt once: the envelope changes only through past
 * rejections, as in OS*, and a rebuild costs O(cells) for many splits.
 * Returns whether the table was rebuilt.
 * @internal
 */
function refineLater(s: CertifiedState, j: number): boolean {
  const c = s.cells;
  if (s.pendingCount === s.pending.length) {
    const p = new Int32Array(2 * s.pending.length);
    p.set(s.pending);
    s.pending = p;
  }
  s.pending[s.pendingCount++] = j;
  s.marked[j] = 1;
  const batch = Math.max(1, c.n >> 6);
  if (s.pendingCount < batch && c.n + s.pendingCount < s.maxCells) return false;
  const k = s.pendingCount;
  for (let i = 0; i < k && c.n < s.maxCells; i++) {
    const q = s.pending[i];
    const m = splitPoint(c.lo[q], c.hi[q]);
    if (m !== m) {
      c.stuck[q] = 1;
      continue;
    }
    splitCell(s.api, c, q, m, s.oracle);
    s.refinements++;
  }
  s.rebuild();
  return true;
}

/**
 * Draw loop of the certified sampler: guide-table cell selection, inversion
 * inside the cell's exponential (or flat) envelope, squeeze test, density
 * test checked against the proven envelope and squeeze, and refinement on
 * rejection (OS*). @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, NonFiniteDensityError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import { GuideTable } from '../hull/guide-table.js';
import { logSumExp } from './build.js';
import type { BoundsOracle, CellStore } from './cells.js';
import { splitCell, splitPoint } from './cells.js';

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
  logEnvelopeArea = 0;
  logSqueezeArea = 0;
  /** Cells split on rejection after setup. */
  refinements = 0;

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
    this.rebuild();
  }

  /** Recomputes the totals and the guide table (after setup and after each split). */
  rebuild(): void {
    const c = this.cells;
    const n = c.n;
    if (this.lin.length < c.capacity) {
      this.lin = new Float64Array(c.capacity);
      this.guide.grow(c.capacity);
    }
    const logE = logSumExp(c.logEnv, n);
    this.logEnvelopeArea = logE;
    this.logSqueezeArea = logSumExp(c.logSq, n);
    const lin = this.lin;
    for (let j = 0; j < n; j++) lin[j] = Math.exp(c.logEnv[j] - logE);
    this.guide.build(lin, n);
  }
}

/**
 * Fills `out[0..n)` with draws. Three uniforms per candidate: cell, position,
 * acceptance. @internal
 */
export function certifiedFill(s: CertifiedState, out: Float64Array, n: number): void {
  const c = s.cells;
  const u = s.uniform;
  const cnt = s.counters;
  const logf = s.logDensity;
  const maxRej = s.maxRejections;
  for (let i = 0; i < n; i++) {
    let rejections = 0;
    for (;;) {
      const g = s.guide;
      const j = g.lookup(u());
      const a = c.lo[j];
      const b = c.hi[j];
      const r = c.eR[j];
      const p = c.eP[j];
      const u2 = u();
      let x: number;
      if (r === 0) {
        x = a + u2 * (b - a);
      } else {
        const t = -Math.log1p(-u2 * c.eQ[j]) / r;
        x = p === a ? a + t : b - t;
      }
      if (x < a) x = a;
      else if (x > b) x = b;
      const lg = c.eH[j] - r * Math.abs(x - p);
      const sh = c.sH[j];
      const ls = sh === -Infinity ? -Infinity : sh + c.sS[j] * (x - c.sA[j]);
      const v = 1 - u(); // in (0, 1]
      cnt.proposals++;
      if (ls > -Infinity && v <= Math.exp(ls - lg)) {
        out[i] = x;
        cnt.samples++;
        break;
      }
      const lf = logf(x);
      cnt.densityEvaluations++;
      if (lf !== lf || lf === Infinity || typeof lf !== 'number') throw new NonFiniteDensityError(s.api, x, lf);
      if (lf > lg) throw new EnvelopeViolationError(s.api, x, lf, lg);
      if (lf < ls) throw new EnvelopeViolationError(s.api, x, lf, ls, 'squeeze');
      if (v <= Math.exp(lf - lg)) {
        out[i] = x;
        cnt.samples++;
        break;
      }
      if (++rejections >= maxRej) throw new StalledSamplerError(s.api, rejections, cnt.samples, cnt.proposals);
      if (s.refineOnRejection && c.n < s.maxCells && c.stuck[j] === 0) {
        const m = splitPoint(a, b);
        if (m !== m) c.stuck[j] = 1;
        else {
          splitCell(s.api, c, j, m, s.oracle);
          s.refinements++;
          s.rebuild();
        }
      }
    }
  }
}

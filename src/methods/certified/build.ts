/**
 * Branch-and-bound construction of a certified envelope: start cells from the
 * support ends and the mode hints, then split the cells whose envelope area
 * minus squeeze area is largest (a max-heap in typed arrays) until the
 * squeeze holds the wanted share of the envelope area or the cell budget is
 * spent. @internal
 *
 * @packageDocumentation
 */
import { ImproperDensityError, ShapeViolationError } from '../../core/errors.js';
import { BoundsOracle, CellStore, addCell, fillCell, logDiffExp, splitCell, splitPoint } from './cells.js';
import { exp, log } from '../../vendor/math.js';

/** Log-sum-exp of `v[0..n)`. @internal */
export function logSumExp(v: Float64Array, n: number): number {
  let m = -Infinity;
  for (let i = 0; i < n; i++) if (v[i] > m) m = v[i];
  if (m === -Infinity || m === Infinity) return m;
  let s = 0;
  for (let i = 0; i < n; i++) s += exp(v[i] - m);
  return m + log(s);
}

/** Max-heap of cell indices keyed by a Float64 priority (typed arrays, grows by doubling). @internal */
class CellHeap {
  idx: Int32Array;
  key: Float64Array;
  size = 0;
  constructor(capacity: number) {
    this.idx = new Int32Array(capacity);
    this.key = new Float64Array(capacity);
  }
  push(j: number, k: number): void {
    if (this.size === this.idx.length) {
      const i2 = new Int32Array(2 * this.size);
      i2.set(this.idx);
      const k2 = new Float64Array(2 * this.size);
      k2.set(this.key);
      this.idx = i2;
      this.key = k2;
    }
    let p = this.size++;
    const idx = this.idx;
    const key = this.key;
    while (p > 0) {
      const q = (p - 1) >> 1;
      if (key[q] >= k) break;
      idx[p] = idx[q];
      key[p] = key[q];
      p = q;
    }
    idx[p] = j;
    key[p] = k;
  }
  /** Removes and returns the index with the largest key (−1 when empty). */
  pop(): number {
    if (this.size === 0) return -1;
    const idx = this.idx;
    const key = this.key;
    const top = idx[0];
    const n = --this.size;
    const j = idx[n];
    const k = key[n];
    let p = 0;
    for (;;) {
      let c = 2 * p + 1;
      if (c >= n) break;
      if (c + 1 < n && key[c + 1] > key[c]) c++;
      if (key[c] <= k) break;
      idx[p] = idx[c];
      key[p] = key[c];
      p = c;
    }
    idx[p] = j;
    key[p] = k;
    return top;
  }
}

/** Priority of a cell: log(envelope area − squeeze area); +Infinity for an unbounded envelope. @internal */
export function cellGap(c: CellStore, j: number): number {
  const e = c.logEnv[j];
  if (e === Infinity || e !== e) return Infinity;
  return logDiffExp(e, c.logSq[j]);
}

/** Parameters of {@link buildCells}. @internal */
export interface BuildSpec {
  readonly api: string;
  readonly lower: number;
  readonly upper: number;
  /** Finite interior edges (mode hints), any order, duplicates allowed. */
  readonly edges: readonly number[];
  readonly targetAcceptance: number;
  readonly maxCells: number;
}

/** Result of {@link buildCells}. @internal */
export interface BuiltCells {
  readonly cells: CellStore;
  readonly logEnvelopeArea: number;
  readonly logSqueezeArea: number;
  readonly rounds: number;
}

/** Describes a cell for messages. */
function cellText(c: CellStore, j: number): string {
  return `[${c.lo[j]}, ${c.hi[j]}] (logDensityBounds gives [${c.bLo[j]}, ${c.bHi[j]}])`;
}

/**
 * Builds the cells. Throws {@link ShapeViolationError} when a finite cell
 * keeps an upper bound of +Infinity (a pole, or bounds too loose) at the
 * budget or at rounding width, and {@link ImproperDensityError} when an
 * infinite cell cannot be given an integrable envelope (no decay proven).
 * @internal
 */
export function buildCells(spec: BuildSpec, o: BoundsOracle): BuiltCells {
  const { api, lower, upper, maxCells } = spec;
  const pts: number[] = [lower];
  const inner = spec.edges.filter((x) => x > lower && x < upper).sort((p, q) => p - q);
  for (const x of inner) if (x > pts[pts.length - 1]) pts.push(x);
  pts.push(upper);
  const c = new CellStore(Math.max(16, Math.min(1024, 2 * pts.length)));
  const pl = new Float64Array(pts.length);
  const ph = new Float64Array(pts.length);
  for (let i = 0; i < pts.length; i++) {
    if (Number.isFinite(pts[i])) {
      o.value(pts[i], pts[i]);
      pl[i] = o.lo;
      ph[i] = o.hi;
    } else {
      pl[i] = NaN;
      ph[i] = NaN;
    }
  }
  for (let i = 0; i + 1 < pts.length; i++) {
    const j = addCell(c, pts[i], pts[i + 1], pl[i], ph[i], pl[i + 1], ph[i + 1]);
    fillCell(api, c, j, o);
  }
  if (c.n > maxCells) {
    throw new ShapeViolationError(`${api}: the mode hints make ${c.n} start cells, more than options.maxCells = ${maxCells}`);
  }
  const heap = new CellHeap(Math.max(16, c.n * 2));
  for (let j = 0; j < c.n; j++) heap.push(j, cellGap(c, j));
  const logTarget = log(spec.targetAcceptance);
  let rounds = 0;
  let logE = logSumExp(c.logEnv, c.n);
  let logS = logSumExp(c.logSq, c.n);
  // Each round splits at least one cell or stops, so at most maxCells rounds.
  for (; rounds < maxCells; rounds++) {
    if (logE < Infinity && logS - logE >= logTarget) break;
    if (c.n >= maxCells || heap.size === 0) break;
    const batch = Math.min(Math.max(1, c.n >> 3), maxCells - c.n, heap.size);
    const picked: number[] = [];
    for (let i = 0; i < batch; i++) {
      const j = heap.pop();
      if (j < 0) break;
      if (i > 0 && cellGap(c, j) < Infinity && logE === Infinity) {
        // while some envelope is unbounded, split only the unbounded cells
        heap.push(j, cellGap(c, j));
        break;
      }
      picked.push(j);
    }
    for (const j of picked) {
      const m = splitPoint(c.lo[j], c.hi[j]);
      if (m !== m) {
        c.stuck[j] = 1;
        if (c.logEnv[j] === Infinity) throw unbounded(api, c, j, 'the cell cannot be split further (its width is at rounding level)');
        continue;
      }
      const k = splitCell(api, c, j, m, o);
      heap.push(j, cellGap(c, j));
      heap.push(k, cellGap(c, k));
    }
    logE = logSumExp(c.logEnv, c.n);
    logS = logSumExp(c.logSq, c.n);
  }
  if (logE === Infinity || logE !== logE) {
    let worst = 0;
    for (let j = 0; j < c.n; j++) if (!(c.logEnv[j] < Infinity)) { worst = j; break; }
    throw unbounded(api, c, worst, `no finite envelope within options.maxCells = ${maxCells} cells`);
  }
  if (logE === -Infinity) {
    throw new ImproperDensityError(`${api}: target.logDensityBounds bounds the density by 0 on the whole support [${lower}, ${upper}]; there is no mass to draw from`);
  }
  return { cells: c, logEnvelopeArea: logE, logSqueezeArea: logS, rounds };
}

/** The error for a cell whose envelope is unbounded or not integrable. @internal */
export function unbounded(api: string, c: CellStore, j: number, why: string): Error {
  const a = c.lo[j];
  const b = c.hi[j];
  if (Number.isFinite(a) && Number.isFinite(b)) {
    return new ShapeViolationError(
      `${api}: the density has no finite bound on the cell ${cellText(c, j)}: ${why}. A pole (even an integrable one) cannot be covered by these envelopes; transform the variable or truncate the support away from it`,
      [a, b],
    );
  }
  return new ImproperDensityError(
    `${api}: no integrable envelope on the infinite cell ${cellText(c, j)} (derivative bounds [${c.dLo[j]}, ${c.dHi[j]}]): ${why}. The tail must be proven to decay: give target.dLogDensityBounds with an upper bound < 0 on [a, Infinity) (> 0 on (-Infinity, b]), or a finite support`,
  );
}

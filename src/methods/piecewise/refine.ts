/**
 * Refinement of the piecewise method's grid: every step that evaluates the
 * target and adds points. {@link settle} halves until the classification can
 * be trusted (curvature changes pinned, every cell with an envelope line);
 * {@link refine} halves where envelope and squeeze differ most and moves the
 * tails outwards until the area ratio is reached; {@link insert} adds the
 * point of a repair. Each is bounded by depth counters, round limits and the
 * evaluator's budget. @internal
 *
 * @packageDocumentation
 */
import { ShapeViolationError } from '../../core/errors.js';
import type { Tables } from '../envelope/piece-tables.js';
import { HULL_LOG_TOLERANCE_ABSOLUTE, HULL_LOG_TOLERANCE_RELATIVE } from '../envelope/tolerance.js';
import {
  CELL_ATOMIC, CELL_BOUNDARY, CELL_CONCAVE, CELL_CONVEX, CELL_MIXED, CELL_MONOTONE, CELL_NEGLIGIBLE, CELL_UNKNOWN, CELL_ZERO,
  MIXED_LIMIT, PIN_ROUNDS, SETTLE_MAX_ROUNDS, TAIL_LOG, TAIL_NONE, mid,
} from './cells.js';
import { cellEnvelope, gridTables, tails } from './cell-envelope.js';
import { classify, monotone } from './classify.js';
import type { Grid } from './grid.js';
import { exp, log, log1p } from '../../vendor/math.js';

/**
 * Classifies and halves, until no cell needs halving: mixed and unknown
 * cells, cells without an envelope line, and the two cells on both sides
 * of every point where a concave cell meets a convex one (up to
 * {@link PIN_ROUNDS} halvings, or until the cells at the change become
 * linear within rounding). Bounded by depth counters and the evaluation budget.
 * @internal
 */
export function settle(grid: Grid): void {
  for (let round = 0; ; round++) {
    if (round > SETTLE_MAX_ROUNDS) {
      throw new ShapeViolationError(`${grid.api}: the shape classification did not settle after ${SETTLE_MAX_ROUNDS} rounds of halvings (${grid.cells} cells)`);
    }
    classify(grid);
    const n = grid.cells;
    const cls = grid.cls;
    const depth = grid.depth;
    const flag = new Uint8Array(n);
    let flagged = false;
    const mark = (i: number, limit: number): void => {
      if (i < 0 || i >= n) return;
      const c = cls[i];
      if (c === CELL_ZERO || c === CELL_ATOMIC || c === CELL_NEGLIGIBLE) return;
      if (depth[i] < limit && flag[i] === 0) {
        flag[i] = 1;
        flagged = true;
      }
    };
    for (let i = 0; i < n; i++) {
      const c = cls[i];
      if (c === CELL_MIXED) {
        if (depth[i] < PIN_ROUNDS) {
          if (!grid.tangent) mark(i - 1, PIN_ROUNDS);
          mark(i, PIN_ROUNDS);
          if (!grid.tangent) mark(i + 1, PIN_ROUNDS);
        } else if (monotone(grid, i)) {
          cls[i] = CELL_MONOTONE;
        } else if (depth[i] < MIXED_LIMIT) {
          mark(i, MIXED_LIMIT);
        } else {
          grid.shapeFailure(i, 'the log-density changes curvature and direction inside it');
        }
      } else if (c === CELL_UNKNOWN && !grid.tangent) {
        // an undetermined end point: halve the wider cell next to it (the
        // verdict there is uncertain because its neighbours differ in width)
        for (const j of [i, i + 1]) {
          if (grid.pc[j] !== CELL_UNKNOWN) continue;
          const wl = grid.x[j] - grid.x[j - 1];
          const wr = grid.x[j + 1] - grid.x[j];
          let k = wl >= wr ? j - 1 : j;
          const ck = cls[k];
          if (ck === CELL_ZERO || ck === CELL_ATOMIC || ck === CELL_NEGLIGIBLE) k = i;
          if (depth[k] < MIXED_LIMIT) mark(k, MIXED_LIMIT);
          else grid.shapeFailure(k, 'the curvature at its ends stays undetermined within rounding');
        }
        if (grid.pc[i] !== CELL_UNKNOWN && grid.pc[i + 1] !== CELL_UNKNOWN) {
          if (depth[i] < MIXED_LIMIT) mark(i, MIXED_LIMIT);
          else grid.shapeFailure(i, 'no curvature information could be obtained for it');
        }
      } else if (c === CELL_UNKNOWN || (c === CELL_BOUNDARY && grid.sa[i] !== grid.sa[i] && grid.sb[i] !== grid.sb[i]) || (c === CELL_CONCAVE && grid.sa[i] !== grid.sa[i] && grid.sb[i] !== grid.sb[i])) {
        if (depth[i] < MIXED_LIMIT) mark(i, MIXED_LIMIT);
        else grid.shapeFailure(i, 'no valid envelope line could be found for it');
      }
    }
    // direct changes between concave and convex: pin them. A change with
    // linear cells between is already resolved to rounding: those cells have
    // a curvature below the rounding allowance, so either construction holds
    // on them within the check tolerance.
    for (let i = 0; i + 1 < n; i++) {
      const c = cls[i];
      const d = cls[i + 1];
      if ((c === CELL_CONCAVE && d === CELL_CONVEX) || (c === CELL_CONVEX && d === CELL_CONCAVE)) {
        mark(i, PIN_ROUNDS);
        mark(i + 1, PIN_ROUNDS);
      }
    }
    if (!flagged) return;
    split(grid, flag, true);
  }
}

/**
 * Halves every flagged cell (evaluating its midpoint). With `pin`, the
 * halves count one more halving in their lineage; refinement halvings do
 * not. Returns the number of midpoints whose value contradicts the
 * current envelope or squeeze of their cell (possible only if the cell's
 * class was wrong; the next classification sees the new point).
 */
function split(grid: Grid, flag: Uint8Array, pin: boolean): number {
  const n = grid.cells;
  const nx: number[] = [];
  const nl: number[] = [];
  const ng: number[] = [];
  const nd: number[] = [];
  let surprises = 0;
  const checkable = !pin && grid.cls.length === n;
  for (let i = 0; i < n; i++) {
    nx.push(grid.x[i]);
    nl.push(grid.l[i]);
    ng.push(grid.g[i]);
    if (flag[i] === 1) {
      const a = grid.x[i];
      const b = grid.x[i + 1];
      const m = mid(a, b);
      if (m > a && m < b) {
        const lm = grid.ev.logDensity(m);
        const gm = grid.tangent ? grid.ev.derivative(m, lm) : NaN;
        if (checkable && contradicts(grid, i, m, lm)) surprises++;
        nx.push(m);
        nl.push(lm);
        ng.push(gm);
        const d = grid.depth[i] + (pin ? 1 : 0);
        nd.push(d, d);
        continue;
      }
    }
    nd.push(grid.depth[i]);
  }
  nx.push(grid.x[n]);
  nl.push(grid.l[n]);
  ng.push(grid.g[n]);
  grid.x = nx;
  grid.l = nl;
  grid.g = ng;
  grid.depth = nd;
  grid.surprises += surprises;
  return surprises;
}

/** Whether the value lm at m lies above the envelope or below the squeeze of cell i (current classification). */
function contradicts(grid: Grid, i: number, m: number, lm: number): boolean {
  const e = cellEnvelope(grid, i, m);
  const tol = HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * (Math.abs(lm === -Infinity ? 0 : lm) + Math.abs(e.env === -Infinity ? 0 : e.env));
  return lm > e.env + tol || lm < e.sq - tol;
}

/**
 * Refines until (envelope area)/(squeeze area) ≤ ratio or the piece cap:
 * each round halves every cell whose envelope-minus-squeeze area is at
 * least 30% of the largest, and moves a tail outwards (to its envelope
 * median) when the tail is among them; then settles and recomputes the
 * tails. Returns the final tables.
 * @internal
 */
export function refine(grid: Grid, ratio: number, maxPieces: number, maxRounds: number): Tables {
  let t = gridTables(grid);
  const logRatio = log(ratio);
  for (let round = 0; round < maxRounds; round++) {
    if (t.logEnvelopeArea - t.logSqueezeArea <= logRatio || t.n >= maxPieces) break;
    const top = t.logEnvelopeArea - t.ref;
    const n = grid.cells;
    const gapCell = new Float64Array(n);
    let lowGap = 0;
    let upGap = 0;
    let maxGap = 0;
    for (let j = 0; j < t.n; j++) {
      const gap = exp(t.logAreas[j] - top) - exp(t.logSqueezeAreas[j] - top);
      const lo = t.lo[j];
      if (lo === -Infinity) lowGap += gap;
      else if (t.hi[j] === Infinity) upGap += gap;
      else {
        const i = grid.cellIndex(lo);
        if (i >= 0) gapCell[i] += gap;
      }
    }
    for (let i = 0; i < n; i++) if (gapCell[i] > maxGap) maxGap = gapCell[i];
    maxGap = Math.max(maxGap, lowGap, upGap);
    if (!(maxGap > 0)) break;
    const flag = new Uint8Array(n);
    let count = 0;
    for (let i = 0; i < n; i++) {
      if (gapCell[i] >= 0.3 * maxGap && grid.cls[i] !== CELL_ATOMIC && grid.cls[i] !== CELL_ZERO && grid.cls[i] !== CELL_NEGLIGIBLE) {
        flag[i] = 1;
        count++;
      }
    }
    const extendLow = lowGap >= 0.3 * maxGap;
    const extendUp = upGap >= 0.3 * maxGap;
    if (count === 0 && !extendLow && !extendUp) break;
    split(grid, flag, false);
    if (extendUp) extend(grid, 1);
    if (extendLow) extend(grid, -1);
    settle(grid);
    tails(grid);
    t = gridTables(grid);
  }
  return t;
}

/** Adds a point beyond the outermost one, at the median of the tail's envelope. */
function extend(grid: Grid, o: 1 | -1): void {
  const t = o > 0 ? grid.upperTail : grid.lowerTail;
  if (t.kind === TAIL_NONE) return;
  const d = t.kind === TAIL_LOG ? Math.LN2 / t.sig : 1 / t.sig;
  const xn = t.x + o * d;
  if (!Number.isFinite(xn) || xn === t.x) return;
  const ln = grid.ev.logDensity(xn);
  const gn = grid.tangent ? grid.ev.derivative(xn, ln) : NaN;
  const envAt = t.kind === TAIL_LOG ? t.l - t.sig * d : t.l - 2 * log1p(t.sig * d);
  if (ln > envAt + HULL_LOG_TOLERANCE_ABSOLUTE + HULL_LOG_TOLERANCE_RELATIVE * Math.abs(ln)) grid.surprises++;
  grid.addOutside(o, xn, ln, gn);
}

/**
 * Inserts an evaluated point (a repair after a violation at x), then
 * settles and recomputes the tails. The point may lie in a tail.
 * @internal
 */
export function insert(grid: Grid, xv: number, lv: number): void {
  const gv = grid.tangent ? grid.ev.derivative(xv, lv) : NaN;
  const x = grid.x;
  if (xv < x[0]) {
    grid.addOutside(-1, xv, lv, gv);
  } else if (xv > x[x.length - 1]) {
    grid.addOutside(1, xv, lv, gv);
  } else {
    const i = grid.cellIndex(xv);
    if (i < 0 || x[i] === xv) return;
    grid.addInside(i, xv, lv, gv);
  }
  settle(grid);
  tails(grid);
}

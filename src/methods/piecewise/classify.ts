/**
 * Classification of the piecewise method's grid: the shape class of every
 * cell between consecutive points and the slopes of its outer lines, from the
 * evaluated values (and derivatives); and what the classes say about the
 * target (approximate curvature changes and extrema). Reads and writes only
 * the per-cell arrays of the {@link Grid}; evaluates nothing. @internal
 *
 * @remarks
 * Shape classes of a cell [a, b] (log f is written l):
 * - concave (`CELL_CONCAVE`), convex (`CELL_CONVEX`), linear within
 *   rounding (`CELL_LINEAR`), from the data:
 *   with derivatives, l'(a) ≥ s ≥ l'(b) (concave) or l'(a) ≤ s ≤ l'(b)
 *   (convex), s the chord slope; without, the chord slopes of the cell and
 *   its neighbours (second divided differences at both ends).
 * - `CELL_MIXED`: the data contradict both (a curvature change, a kink or a
 *   jump inside); `CELL_UNKNOWN` (no curvature data yet).
 * - `CELL_ZERO` l = -Infinity at both ends (no mass); `CELL_BOUNDARY` at one end (the
 *   edge of the density's support, or a zero of it).
 * - `CELL_ATOMIC` no double lies strictly between a and b, so the only possible
 *   draws are a and b; `CELL_MONOTONE` a tiny cell around a curvature change, taken
 *   as monotone because the slopes around it share their sign (set by
 *   {@link settle}); `CELL_NEGLIGIBLE` a cell of zero area in double precision
 *   ({@link NEGLIGIBLE_DROP}).
 *
 * @packageDocumentation
 */
import {
  CELL_ATOMIC, CELL_BOUNDARY, CELL_CONCAVE, CELL_CONVEX, CELL_LINEAR, CELL_MIXED, CELL_MONOTONE, CELL_NEGLIGIBLE, CELL_UNKNOWN, CELL_ZERO,
  NEGLIGIBLE_DROP, PIECEWISE_NOISE, SECANT_DEVIATION_ABSOLUTE, SECANT_DEVIATION_RELATIVE, combine, compatible, isAtomic, mid,
} from './cells.js';
import type { Grid } from './grid.js';

/** Computes the class and outer slopes of every cell of the grid. @internal */
export function classify(grid: Grid): void {
  const n = grid.cells;
  const x = grid.x;
  const l = grid.l;
  const g = grid.g;
  const cls = new Array<number>(n);
  const pc = grid.tangent ? [] : pointClasses(grid);
  let top = -Infinity;
  for (const v of l) if (v > top) top = v;
  const negligible = top - NEGLIGIBLE_DROP;
  for (let i = 0; i < n; i++) {
    const la = l[i];
    const lb = l[i + 1];
    if (la === -Infinity && lb === -Infinity) cls[i] = CELL_ZERO;
    else if (la < negligible && lb < negligible) cls[i] = CELL_NEGLIGIBLE;
    else if (isAtomic(x[i], x[i + 1])) cls[i] = CELL_ATOMIC;
    else if (la === -Infinity || lb === -Infinity) cls[i] = CELL_BOUNDARY;
    else if (grid.tangent) {
      const ga = g[i];
      const gb = g[i + 1];
      if (!Number.isFinite(ga) || !Number.isFinite(gb)) cls[i] = CELL_UNKNOWN;
      else {
        const s = grid.chord(i);
        const e = grid.chordNoise(i) + PIECEWISE_NOISE * (Math.abs(ga) + Math.abs(gb));
        const dl = ga - s;
        const dr = s - gb;
        const cc = dl >= -e && dr >= -e;
        const cv = dl <= e && dr <= e;
        cls[i] = cc && cv ? CELL_LINEAR : cc ? CELL_CONCAVE : cv ? CELL_CONVEX : CELL_MIXED;
      }
    } else {
      cls[i] = combine(pc[i], pc[i + 1]);
    }
  }
  const sa = new Array<number>(n).fill(NaN);
  const sb = new Array<number>(n).fill(NaN);
  for (let i = 0; i < n; i++) {
    const c = cls[i];
    if (c === CELL_CONCAVE || c === CELL_CONVEX) {
      if (grid.tangent) {
        sa[i] = g[i];
        sb[i] = g[i + 1];
      } else {
        if (i > 0 && compatible(c, cls[i - 1]) && lendable(grid, i - 1, i)) sa[i] = grid.chord(i - 1);
        if (i + 1 < n && compatible(c, cls[i + 1]) && lendable(grid, i + 1, i)) sb[i] = grid.chord(i + 1);
      }
    } else if (c === CELL_BOUNDARY) {
      // the outer line at the finite end, trusted when the cell beyond it is concave
      if (l[i] === -Infinity) {
        if (i + 1 < n && (cls[i + 1] === CELL_CONCAVE || cls[i + 1] === CELL_LINEAR) && (grid.tangent || lendable(grid, i + 1, i))) {
          sb[i] = grid.tangent ? g[i + 1] : grid.chord(i + 1);
        }
      } else if (i > 0 && (cls[i - 1] === CELL_CONCAVE || cls[i - 1] === CELL_LINEAR) && (grid.tangent || lendable(grid, i - 1, i))) {
        sa[i] = grid.tangent ? g[i] : grid.chord(i - 1);
      }
    }
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(sa[i])) sa[i] = NaN;
    if (!Number.isFinite(sb[i])) sb[i] = NaN;
  }
  grid.cls = cls;
  grid.sa = sa;
  grid.sb = sb;
  grid.pc = pc;
}

/** Secant construction: curvature class of each point from the chords on its two sides (0: no triple; CELL_UNKNOWN: undetermined). */
function pointClasses(grid: Grid): number[] {
  const n = grid.x.length;
  const l = grid.l;
  const pc = new Array<number>(n).fill(0);
  for (let j = 1; j + 1 < n; j++) {
    if (l[j - 1] === -Infinity || l[j] === -Infinity || l[j + 1] === -Infinity) continue;
    const k = grid.chord(j) - grid.chord(j - 1);
    const e = grid.chordNoise(j) + grid.chordNoise(j - 1);
    if (k < -e) pc[j] = CELL_CONCAVE;
    else if (k > e) pc[j] = CELL_CONVEX;
    else {
      // "linear" only if the curvature this allows, |l''| ≲ 2e/(w0 + w1),
      // moves log f from a chord by a negligible amount on both cells
      const w0 = grid.x[j] - grid.x[j - 1];
      const w1 = grid.x[j + 1] - grid.x[j];
      const w = Math.max(w0, w1);
      const dev = (e * w * w) / (w0 + w1);
      pc[j] = dev <= SECANT_DEVIATION_ABSOLUTE + SECANT_DEVIATION_RELATIVE * Math.abs(l[j]) ? CELL_LINEAR : CELL_UNKNOWN;
    }
  }
  return pc;
}

/** Secant construction: whether the chord of cell j is accurate enough to serve as an outer line over cell i. */
function lendable(grid: Grid, j: number, i: number): boolean {
  const w = grid.x[i + 1] - grid.x[i];
  const lmag = Math.max(Math.abs(grid.l[i]), Math.abs(grid.l[i + 1]));
  return grid.chordNoise(j) * w <= SECANT_DEVIATION_ABSOLUTE + SECANT_DEVIATION_RELATIVE * lmag;
}

/** Whether the chords of the cells on both sides of cell i share a strict sign with its own. @internal */
export function monotone(grid: Grid, i: number): boolean {
  const n = grid.cells;
  const s = grid.chord(i);
  if (grid.tangent) {
    const ga = grid.g[i];
    const gb = grid.g[i + 1];
    return (s > 0 && ga > 0 && gb > 0) || (s < 0 && ga < 0 && gb < 0);
  }
  const left = i > 0 ? grid.chord(i - 1) : s;
  const right = i + 1 < n ? grid.chord(i + 1) : s;
  return (s > 0 && left > 0 && right > 0) || (s < 0 && left < 0 && right < 0);
}

/** Approximate locations of curvature changes (between concave and convex runs, and the tiny cells pinning them). @internal */
export function inflections(grid: Grid): number[] {
  const out: number[] = [];
  let last = -1;
  for (let i = 0; i < grid.cells; i++) {
    const c = grid.cls[i];
    if (c === CELL_MONOTONE || (c === CELL_ATOMIC && grid.l[i] > -Infinity && grid.l[i + 1] > -Infinity)) {
      out.push(mid(grid.x[i], grid.x[i + 1]));
      last = -1;
    } else if (c === CELL_CONCAVE || c === CELL_CONVEX) {
      if (last >= 0 && grid.cls[last] !== c) out.push(mid(grid.x[last + 1], grid.x[i]));
      last = i;
    } else if (c !== CELL_LINEAR) last = -1;
  }
  return out;
}

/** Approximate locations of local extrema of log f (sign changes of the slope on the grid). @internal */
export function extrema(grid: Grid): number[] {
  const out: number[] = [];
  const n = grid.x.length;
  for (let j = 1; j + 1 < n; j++) {
    if (!(grid.l[j - 1] > -Infinity && grid.l[j] > -Infinity && grid.l[j + 1] > -Infinity)) continue;
    const s0 = grid.tangent && Number.isFinite(grid.g[j]) ? grid.g[j] : grid.chord(j - 1);
    const s1 = grid.tangent && Number.isFinite(grid.g[j + 1]) ? grid.g[j + 1] : grid.chord(j);
    if ((s0 > 0 && s1 <= 0) || (s0 < 0 && s1 >= 0)) {
      if (grid.tangent) {
        // interpolate the derivative's zero on [x_j, x_{j+1}]
        const t = s0 / (s0 - s1);
        out.push(grid.x[j] + t * (grid.x[j + 1] - grid.x[j]));
      } else out.push(grid.x[j]);
    }
  }
  return out;
}

/**
 * Envelope building of the piecewise method's grid: the envelope and squeeze
 * that the class of a cell allows at a point, the kind and decay rate of
 * both tails, and the flat tables of the whole envelope (assembled piece by
 * piece in pieces.ts). Reads the classified {@link Grid} and writes only its
 * tails; evaluates nothing. @internal
 *
 * @remarks
 * Envelopes (lines in log space, i.e. exponential pieces), valid given the
 * class: concave, the minimum of the two outer lines (tangents at a and b,
 * or without derivatives the chords of the neighbouring cells extended)
 * above, the chord below; convex, the chord above, the maximum of the outer
 * lines below; linear, the chord for both; boundary, the outer line at the
 * finite end (the density is log-concave next to its zeros, because a convex
 * function cannot reach -Infinity at a finite point); atom and monotone,
 * the larger endpoint value above and the smaller below.
 *
 * @packageDocumentation
 */
import { ImproperDensityError, ShapeViolationError } from '../../core/errors.js';
import type { Tables } from '../envelope/piece-tables.js';
import {
  CELL_ATOMIC, CELL_BOUNDARY, CELL_CONCAVE, CELL_CONVEX, CELL_LINEAR, CELL_MONOTONE, CELL_NEGLIGIBLE, CELL_ZERO,
  PIECEWISE_NOISE, TAIL_INV_SQRT, TAIL_LOG, TAIL_NONE,
} from './cells.js';
import type { Tail } from './cells.js';
import type { Grid } from './grid.js';
import { buildTables } from './pieces.js';
import { exp, log } from '../../vendor/math.js';

/** Envelope and squeeze (absolute logs) of cell i at x, from its class and outer lines. @internal */
export function cellEnvelope(grid: Grid, i: number, x: number): { env: number; sq: number } {
  const a = grid.x[i];
  const b = grid.x[i + 1];
  const la = grid.l[i];
  const lb = grid.l[i + 1];
  const c = grid.cls[i];
  const A = la + grid.sa[i] * (x - a);
  const B = lb + grid.sb[i] * (x - b);
  const chord = la === -Infinity || lb === -Infinity ? -Infinity : la + grid.chord(i) * (x - a);
  switch (c) {
    case CELL_CONCAVE: {
      const env = grid.sa[i] !== grid.sa[i] ? B : grid.sb[i] !== grid.sb[i] ? A : Math.min(A, B);
      return { env, sq: chord };
    }
    case CELL_CONVEX: {
      const sq = grid.sa[i] !== grid.sa[i] ? (grid.sb[i] !== grid.sb[i] ? -Infinity : B) : grid.sb[i] !== grid.sb[i] ? A : Math.max(A, B);
      return { env: chord, sq };
    }
    case CELL_LINEAR:
      return { env: chord, sq: chord };
    case CELL_BOUNDARY:
      return { env: la === -Infinity ? B : A, sq: -Infinity };
    case CELL_ATOMIC:
    case CELL_MONOTONE:
      return { env: Math.max(la, lb), sq: Math.min(la, lb) };
    case CELL_NEGLIGIBLE:
      return { env: Math.max(la, lb), sq: -Infinity };
    case CELL_ZERO:
      return { env: -Infinity, sq: -Infinity };
    default:
      return { env: Infinity, sq: -Infinity };
  }
}

/** Determines both tails of the grid (throws when a tail cannot be bounded). @internal */
export function tails(grid: Grid): void {
  grid.lowerTail = grid.lower === -Infinity ? tail(grid, -1) : { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
  grid.upperTail = grid.upper === Infinity ? tail(grid, 1) : { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
}

/**
 * The tail beyond the outermost point in direction `o`: exponential when
 * the outermost cell is concave (or linear) and the density decreases
 * outwards, else T = −1/√f when T(f) is concave on the outermost cell(s)
 * and decreasing (Hörmann 1995), else an error that names the tail.
 */
function tail(grid: Grid, o: 1 | -1): Tail {
  const n = grid.x.length;
  const api = grid.api;
  const side = o > 0 ? 'upper' : 'lower';
  const k = o > 0 ? n - 1 : 0;
  const k1 = k - o;
  const k2 = k - 2 * o;
  const xk = grid.x[k];
  const lk = grid.l[k];
  if (n < 2 || !(lk > -Infinity)) {
    throw new ImproperDensityError(`${api}: no decay found in the ${side} tail (the scan ended at x = ${xk})`);
  }
  const cell = o > 0 ? n - 2 : 0;
  const cls = grid.cls[cell];
  const chord = grid.chord(cell);
  const slope = grid.tangent && Number.isFinite(grid.g[k]) ? grid.g[k] : chord;
  const out = o * slope; // rate of change of log f moving outwards
  if ((cls === CELL_CONCAVE || cls === CELL_LINEAR || cls === CELL_NEGLIGIBLE) && out < 0) return { kind: TAIL_LOG, x: xk, l: lk, sig: -out };
  // T(f) = −1/√f relative to f(x_k): T = −e^{−(l − l_k)/2}, so T(x_k) = −1 and T' = −T·l'/2.
  const T1 = -exp(-0.5 * (grid.l[k1] - lk));
  const w1 = Math.abs(xk - grid.x[k1]);
  const tChordOut = (o * (-1 - T1)) / w1; // dT/dx on the outer cell
  let tConcave = false;
  let tSlope = NaN;
  if (grid.tangent && Number.isFinite(grid.g[k]) && Number.isFinite(grid.g[k1])) {
    const tk = 0.5 * grid.g[k];
    const tk1 = -0.5 * T1 * grid.g[k1];
    const tl = o > 0 ? tk1 : tk;
    const tr = o > 0 ? tk : tk1;
    const e = PIECEWISE_NOISE * (Math.abs(tl) + Math.abs(tr) + (2 + Math.abs(T1)) / w1);
    tConcave = tl - tChordOut >= -e && tChordOut - tr >= -e;
    tSlope = tk;
  } else if (k2 >= 0 && k2 < n && grid.l[k2] > -Infinity) {
    const T2 = -exp(-0.5 * (grid.l[k2] - lk));
    const w2 = Math.abs(grid.x[k1] - grid.x[k2]);
    const tChordIn = (o > 0 ? T1 - T2 : T2 - T1) / w2;
    const cl = o > 0 ? tChordIn : tChordOut;
    const cr = o > 0 ? tChordOut : tChordIn;
    const e = PIECEWISE_NOISE * ((2 + Math.abs(T1) + Math.abs(T2)) / Math.min(w1, w2) + Math.abs(cl) + Math.abs(cr));
    tConcave = cl - cr >= -e;
    tSlope = tChordOut;
  }
  const tOut = o * tSlope;
  if (tConcave && tOut < 0 && Number.isFinite(tOut)) return { kind: TAIL_INV_SQRT, x: xk, l: lk, sig: -tOut };
  if (!(out < 0)) {
    throw new ImproperDensityError(
      `${api}: no decay found in the ${side} tail: at the outermost scanned point x = ${xk} logDensity is ${lk} and its slope outwards is ${out} (not negative); the mass may be infinite`,
    );
  }
  const r0 = log(Math.abs(grid.x[k1] - grid.centre));
  const r1 = log(Math.abs(xk - grid.centre));
  const alpha = r1 > r0 ? -(lk - grid.l[k1]) / (r1 - r0) : NaN;
  if (alpha <= 1) {
    throw new ImproperDensityError(
      `${api}: the ${side} tail decays like |x|^(−${alpha.toPrecision(3)}) near x = ${xk}; with an exponent ≤ 1 the mass is infinite`,
    );
  }
  throw new ShapeViolationError(
    `${api}: the ${side} tail beyond x = ${xk} is neither log-concave nor T-concave for T(f) = −1/√f (it decays like |x|^(−${alpha.toPrecision(3)}), slower than |x|^−2); piecewise envelopes cannot bound it. Use ratioOfUniformsSampler with power ≥ 1/(α − 1), or truncate the target`,
    o > 0 ? [xk, Infinity] : [-Infinity, xk],
  );
}

/** Builds the flat tables of the grid's current envelope ({@link buildTables}). @internal */
export function gridTables(grid: Grid): Tables {
  return buildTables(grid);
}

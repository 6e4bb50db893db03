/**
 * Envelope building of the piecewise method: the pieces of every classified
 * cell and the tails, assembled into the flat tables the kernel reads.
 * @internal
 *
 * @packageDocumentation
 */
import { ShapeViolationError } from '../../core/errors.js';
import { logSumExp } from '../envelope/arith.js';
import type { Tables } from '../envelope/piece-tables.js';
import { T_INV_SQRT, T_LOG, pieceConstant, pieceLogArea } from '../envelope/transforms.js';
import { CELL_ATOMIC, CELL_BOUNDARY, CELL_CONCAVE, CELL_CONVEX, CELL_LINEAR, CELL_MONOTONE, CELL_NEGLIGIBLE, CELL_ZERO, CLASS_NAMES, TAIL_LOG, TAIL_NONE } from './cells.js';
import type { CellView, Tail } from './cells.js';
import { exp } from '../../vendor/math.js';

/** Growable piece lists (setup only). */
class PieceLists {
  lo: number[] = [];
  hi: number[] = [];
  kind: number[] = [];
  xh: number[] = [];
  dir: number[] = [];
  href: number[] = [];
  sig: number[] = [];
  sqa: number[] = [];
  sqv: number[] = [];
  sqs: number[] = [];
  shape: number[] = [];
  cell: number[] = [];

  /** Adds a piece on [lo, hi] with envelope line y0 + s·(x − x0) and squeeze line v0 + t·(x − x1) (v0 = -Infinity: none). */
  add(lo: number, hi: number, x0: number, y0: number, s: number, x1: number, v0: number, t: number, shape: number, cell: number): void {
    if (!(hi > lo)) return;
    this.lo.push(lo);
    this.hi.push(hi);
    this.kind.push(T_LOG);
    if (s > 0) {
      this.xh.push(hi);
      this.dir.push(-1);
      this.href.push(y0 + s * (hi - x0));
      this.sig.push(s);
    } else {
      this.xh.push(lo);
      this.dir.push(1);
      this.href.push(y0 + s * (lo - x0));
      this.sig.push(-s);
    }
    this.sqa.push(x1);
    this.sqv.push(v0);
    this.sqs.push(t);
    this.shape.push(shape);
    this.cell.push(cell);
  }

  /** Adds a tail piece. */
  addTail(t: Tail, dir: number, ref: number, cell: number): void {
    this.lo.push(dir > 0 ? t.x : -Infinity);
    this.hi.push(dir > 0 ? Infinity : t.x);
    this.kind.push(t.kind === TAIL_LOG ? T_LOG : T_INV_SQRT);
    this.xh.push(t.x);
    this.dir.push(dir);
    this.href.push(t.l - ref);
    this.sig.push(t.sig);
    this.sqa.push(t.x);
    this.sqv.push(-Infinity);
    this.sqs.push(0);
    this.shape.push(0);
    this.cell.push(cell);
  }
}

/** Builds the flat tables of the envelope of a classified grid (tails determined). @internal */
export function buildTables(g: CellView): Tables {
  const n = g.cells;
  let ref = -Infinity;
  for (const v of g.l) if (v > ref) ref = v;
  const P = new PieceLists();
  if (g.lowerTail.kind !== TAIL_NONE) P.addTail(g.lowerTail, -1, ref, -1);
  for (let i = 0; i < n; i++) cellPieces(g, P, i, ref);
  if (g.upperTail.kind !== TAIL_NONE) P.addTail(g.upperTail, 1, ref, n);
  const m = P.lo.length;
  if (m === 0) throw new ShapeViolationError(`${g.api}: the envelope has no piece of positive area`);
  const t: Tables = {
    n: m,
    lo: Float64Array.from(P.lo),
    hi: Float64Array.from(P.hi),
    kind: Uint8Array.from(P.kind),
    highEnd: Float64Array.from(P.xh),
    direction: Float64Array.from(P.dir),
    width: new Float64Array(m),
    highLogHeight: Float64Array.from(P.href),
    rate: Float64Array.from(P.sig),
    inversion: new Float64Array(m),
    squeezeAnchor: Float64Array.from(P.sqa),
    squeezeValue: Float64Array.from(P.sqv),
    squeezeSlope: Float64Array.from(P.sqs),
    logAreas: new Float64Array(m),
    logSqueezeAreas: new Float64Array(m),
    shape: Uint8Array.from(P.shape),
    ref,
    logEnvelopeArea: -Infinity,
    logSqueezeArea: -Infinity,
    area: new Float64Array(m),
  };
  for (let j = 0; j < m; j++) {
    const w = t.hi[j] - t.lo[j];
    t.width[j] = w;
    const kind = t.kind[j];
    if (kind === T_LOG) {
      t.inversion[j] = pieceConstant(T_LOG, t.highLogHeight[j], t.rate[j], w);
      t.logAreas[j] = pieceLogArea(T_LOG, t.highLogHeight[j], t.rate[j], w);
    } else {
      t.inversion[j] = pieceConstant(T_INV_SQRT, -1, t.rate[j], w);
      t.logAreas[j] = t.highLogHeight[j] + pieceLogArea(T_INV_SQRT, -1, t.rate[j], w);
    }
    const sv = t.squeezeValue[j];
    if (sv === -Infinity || w === Infinity) t.logSqueezeAreas[j] = -Infinity;
    else {
      const s0 = sv + t.squeezeSlope[j] * (t.lo[j] - t.squeezeAnchor[j]);
      const s1 = sv + t.squeezeSlope[j] * (t.hi[j] - t.squeezeAnchor[j]);
      t.logSqueezeAreas[j] = pieceLogArea(T_LOG, Math.max(s0, s1), Math.abs(t.squeezeSlope[j]), w);
    }
    if (!(t.logAreas[j] < Infinity)) {
      throw new ShapeViolationError(`${g.api}: internal: the envelope piece on [${t.lo[j]}, ${t.hi[j]}] has no finite area`, [t.lo[j], t.hi[j]]);
    }
  }
  let top = -Infinity;
  for (let j = 0; j < m; j++) if (t.logAreas[j] > top) top = t.logAreas[j];
  if (!(top > -Infinity)) throw new ShapeViolationError(`${g.api}: the envelope has no piece of positive area`);
  for (let j = 0; j < m; j++) t.area[j] = exp(t.logAreas[j] - top);
  t.logEnvelopeArea = logSumExp(t.logAreas) + ref;
  t.logSqueezeArea = logSumExp(t.logSqueezeAreas) + ref;
  return t;
}

/** Pieces of cell i (relative to ref). */
function cellPieces(g: CellView, P: PieceLists, i: number, ref: number): void {
  const a = g.x[i];
  const b = g.x[i + 1];
  const la = g.l[i] - ref;
  const lb = g.l[i + 1] - ref;
  const c = g.cls[i];
  const sa = g.sa[i];
  const sb = g.sb[i];
  const w = b - a;
  switch (c) {
    case CELL_ZERO:
      return;
    case CELL_LINEAR: {
      const s = (lb - la) / w;
      P.add(a, b, a, la, s, a, la, s, c, i);
      return;
    }
    case CELL_ATOMIC:
    case CELL_MONOTONE: {
      P.add(a, b, a, Math.max(la, lb), 0, a, Math.min(la, lb), 0, c, i);
      return;
    }
    case CELL_NEGLIGIBLE: {
      P.add(a, b, a, Math.max(la, lb), 0, a, -Infinity, 0, c, i);
      return;
    }
    case CELL_BOUNDARY: {
      if (la === -Infinity) P.add(a, b, b, lb, sb, a, -Infinity, 0, c, i);
      else P.add(a, b, a, la, sa, a, -Infinity, 0, c, i);
      return;
    }
    case CELL_CONCAVE:
    case CELL_CONVEX: {
      const s = (lb - la) / w;
      const hasA = sa === sa;
      const hasB = sb === sb;
      let z: number;
      if (hasA && hasB) {
        const den = sa - sb;
        let tz = den !== 0 ? (s - sb) / den : 0.5;
        if (!(tz >= 0)) tz = 0;
        if (tz > 1) tz = 1;
        z = a + w * tz;
        if (z < a) z = a;
        if (z > b) z = b;
      } else z = hasA ? b : a;
      if (c === CELL_CONCAVE) {
        if (z > a) P.add(a, z, a, la, sa, a, la, s, c, i);
        if (b > z) P.add(z, b, b, lb, sb, a, la, s, c, i);
      } else {
        // convex: chord above; outer lines below (none when neither exists)
        if (!hasA && !hasB) {
          P.add(a, b, a, la, s, a, -Infinity, 0, c, i);
          return;
        }
        if (z > a) P.add(a, z, a, la, s, a, la, sa, c, i);
        if (b > z) P.add(z, b, a, la, s, b, lb, sb, c, i);
      }
      return;
    }
    default:
      g.shapeFailure(i, `internal: unresolved class ${CLASS_NAMES[c]}`);
  }
}


/**
 * Storage of the piecewise method's grid: the evaluated points (x, log f and
 * its derivative), and per cell between consecutive points its halving depth,
 * shape class and outer-line slopes; the two tails; and the primitive reads
 * and insertions every other grid module builds on. @internal
 *
 * @remarks
 * The grid's work is split by responsibility: this module holds the state;
 * {@link classify} (classify.ts) fills in the shape classes;
 * {@link cellEnvelope} and {@link tails} (cell-envelope.ts) give the envelope
 * and squeeze each class allows and the tails, and {@link gridTables} the
 * flat tables (through pieces.ts); {@link settle}, {@link refine} and
 * {@link insert} (refine.ts) halve, extend and repair the grid.
 *
 * @packageDocumentation
 */
import { ShapeViolationError } from '../../core/errors.js';
import type { Evaluator } from '../../core/evaluate.js';
import { lastAtOrBelow } from '../envelope/arith.js';
import { PIECEWISE_NOISE, TAIL_NONE } from './cells.js';
import type { CellView, Tail } from './cells.js';
import type { ScanPoint } from './scan.js';

/**
 * The evaluated grid and everything derived from it. The state changes only
 * through classify.ts ({@link classify}) and refine.ts ({@link settle},
 * {@link refine}, {@link insert}), each bounded by the evaluator's budget and
 * by depth counters.
 * @internal
 */
export class Grid implements CellView {
  x: number[];
  l: number[];
  g: number[];
  /** Per cell: halvings spent on locating shape changes in its lineage. */
  depth: number[];
  /** Per cell: shape class. */
  cls: number[] = [];
  /** Per cell: slope of the outer line through the left end (NaN: none). */
  sa: number[] = [];
  /** Secant construction: curvature class of each point (0: no triple, CELL_UNKNOWN: undetermined). */
  pc: number[] = [];
  /** Per cell: slope of the outer line through the right end (NaN: none). */
  sb: number[] = [];
  lowerTail: Tail = { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
  upperTail: Tail = { kind: TAIL_NONE, x: NaN, l: NaN, sig: NaN };
  /** Points whose value contradicted the envelope they were inserted into (setup and repairs). */
  surprises = 0;

  /**
   * @param api - API name for messages
   * @param ev - counted access to the target
   * @param tangent - use dLogDensity
   * @param pts - scanned points (increasing)
   * @param lower - effective lower end (-Infinity: a tail)
   * @param upper - effective upper end (+Infinity: a tail)
   * @param centre - centre of the scan (for tail exponents in messages)
   */
  constructor(
    readonly api: string,
    readonly ev: Evaluator,
    readonly tangent: boolean,
    pts: readonly ScanPoint[],
    readonly lower: number,
    readonly upper: number,
    readonly centre: number,
  ) {
    this.x = pts.map((p) => p.x);
    this.l = pts.map((p) => p.l);
    this.g = pts.map((p) => p.g);
    this.depth = new Array<number>(Math.max(0, pts.length - 1)).fill(0);
  }

  /** Number of cells. */
  get cells(): number {
    return this.x.length - 1;
  }

  /** Chord slope of cell i in log space. */
  chord(i: number): number {
    return (this.l[i + 1] - this.l[i]) / (this.x[i + 1] - this.x[i]);
  }

  /** Rounding allowance of the chord slope of cell i. */
  chordNoise(i: number): number {
    const la = this.l[i];
    const lb = this.l[i + 1];
    return (PIECEWISE_NOISE * (Math.abs(la) + Math.abs(lb) + 2)) / (this.x[i + 1] - this.x[i]) + PIECEWISE_NOISE * Math.abs(this.chord(i));
  }

  /** Index of the cell whose left end is `a` (binary search), or −1. */
  cellIndex(a: number): number {
    const x = this.x;
    const lo = lastAtOrBelow(x, 0, x.length - 2, a);
    return lo >= 0 && x[lo] <= a && a < x[lo + 1] ? lo : -1;
  }

  /** Throws the ShapeViolationError of a cell that cannot be bounded. */
  shapeFailure(i: number, why: string): never {
    const a = this.x[i];
    const b = this.x[i + 1];
    throw new ShapeViolationError(
      `${this.api}: cannot bound the target on [${a}, ${b}] (logDensity ${this.l[i]} and ${this.l[i + 1]}): ${why}, even after ${this.depth[i]} halvings`,
      [a, b],
    );
  }

  /** Adds a point beyond the outermost one in direction `o` (a new cell of depth 0). */
  addOutside(o: 1 | -1, xv: number, lv: number, gv: number): void {
    if (o > 0) {
      this.x.push(xv);
      this.l.push(lv);
      this.g.push(gv);
      this.depth.push(0);
    } else {
      this.x.unshift(xv);
      this.l.unshift(lv);
      this.g.unshift(gv);
      this.depth.unshift(0);
    }
  }

  /** Adds a point strictly inside cell i; both halves keep the cell's depth. */
  addInside(i: number, xv: number, lv: number, gv: number): void {
    this.x.splice(i + 1, 0, xv);
    this.l.splice(i + 1, 0, lv);
    this.g.splice(i + 1, 0, gv);
    this.depth.splice(i, 1, this.depth[i], this.depth[i]);
  }
}

/**
 * The strip table of the fast path: the data both table builders produce
 * and the table kernel reads, and the region list the alias table is built
 * from. @internal
 *
 * @packageDocumentation
 */
import type { Counters } from '../../core/counters.js';
import type { UniformBlock } from '../../random/uniform-block.js';
import type { Tables } from '../envelope/piece-tables.js';

/** Region types of the alias table. @internal */
export const R_SURE = 0;
/** The cap of a strip, between its squeeze and its envelope. @internal */
export const R_CAP = 2;
/** The left tail. @internal */
export const R_LEFT_TAIL = 3;
/** The right tail. @internal */
export const R_RIGHT_TAIL = 4;

/** A tail piece: the back-transform of a line on [lo, hi], sampled from its high end `hx`. @internal */
export interface TailPiece {
  lo: number;
  hi: number;
  /** Anchor of the line (an end of the body) and its transformed value there. */
  anchor: number;
  anchorValue: number;
  /** Slope of the line in transformed space. */
  slope: number;
  highEnd: number;
  direction: number;
  width: number;
  rate: number;
  highValue: number;
  inversion: number;
  /** Relative log area (add ref). */
  logArea: number;
}

/** The regions of a strip table and their relative areas (see {@link stripRegions}). @internal */
export interface StripRegions {
  /** Regions: type, strip index, relative area. */
  readonly regionType: Int8Array;
  readonly regionStrip: Int32Array;
  readonly regionArea: Float64Array;
  readonly regions: number;
  /** Relative areas: sure rectangles, caps, tails. */
  readonly sureArea: number;
  readonly capArea: number;
  readonly tailArea: number;
}

/** The strip table (everything but the alias cells); its regions are those of {@link stripRegions}. @internal */
export interface StripTable extends StripRegions {
  readonly api: string;
  readonly kind: number;
  /** Reference log height: relative values are those of f/e^ref. */
  readonly ref: number;
  /** Effective support. */
  readonly lower: number;
  readonly upper: number;
  /** Number of strips. */
  readonly n: number;
  /** Boundaries x_0..x_n. */
  readonly x: Float64Array;
  /** logDensity at the boundaries. */
  readonly l: Float64Array;
  /** Transformed values at the boundaries (relative to ref). */
  readonly y: Float64Array;
  /** Chord slopes (NaN where an end has density 0). */
  readonly chordSlope: Float64Array;
  /** Per strip: log of the constant envelope M_i (absolute). */
  readonly logUp: Float64Array;
  /** Per strip: log of the constant squeeze m_i (absolute). */
  readonly logLo: Float64Array;
  /** Per strip: M_i/e^ref and m_i/e^ref. */
  readonly up: Float64Array;
  readonly lo: Float64Array;
  /** Per strip: slopes of the left and right upper lines (chords of the neighbours; NaN when absent). */
  readonly leftLineSlope: Float64Array;
  readonly rightLineSlope: Float64Array;
  /** Tails (null when empty). */
  readonly left: TailPiece | null;
  readonly right: TailPiece | null;
  /** Set when the table was built over a piecewise envelope (then the T-concave fields y, c, sL, sR, left, right are unused). */
  readonly piecewise: PiecewiseStrips | null;
}

/** What the kernel's rare-path steps read of a table sampler's state (`TableState` of kernel.ts). @internal */
export interface KernelState {
  readonly table: StripTable;
  readonly logDensity: (x: number) => number;
  /** Outcome of the last slow-path candidate: true when accepted. */
  accepted: boolean;
}

/** The piecewise part of a strip table built over a piecewise envelope. @internal */
export interface PiecewiseStrips {
  /** The piecewise envelope the table was built on. */
  readonly tables: Tables;
  /** Per strip: indices of its first and last piece (equal when a piece is subdivided; a run of light pieces otherwise). */
  readonly first: Int32Array;
  readonly last: Int32Array;
  /** Pieces of the left tail region, left to right, and their cumulative relative areas. */
  readonly tailL: Int32Array;
  readonly cumL: Float64Array;
  /** Pieces of the right tail region, left to right, and their cumulative relative areas. */
  readonly tailR: Int32Array;
  readonly cumR: Float64Array;
  /**
   * The kernel's steps for a tail region and a cap of this envelope
   * (`piecewiseTailCandidate`, `piecewiseCap` of piecewise-kernel.ts), set
   * by the builder so that only the tables that have such strips bundle them.
   */
  readonly tail: (st: KernelState, counters: Counters, pw: PiecewiseStrips, type: number, pos: number, blk: UniformBlock) => number;
  readonly cap: (st: KernelState, counters: Counters, pw: PiecewiseStrips, i: number, x: number, hv: number) => void;
}

/**
 * The regions of a table of n strips with boundaries x, per-strip constant
 * envelope `up` and squeeze `lo` (relative heights; `logUp` −Infinity for a
 * strip of zero density), and tails of relative areas `leftArea`,
 * `rightArea` (0: none): for each strip its sure rectangle w·lo and its cap
 * w·(up − lo), where positive, then the tails. Shared by both table builders.
 * @internal
 */
export function stripRegions(n: number, x: Float64Array, logUp: Float64Array, up: Float64Array, lo: Float64Array, leftArea: number, rightArea: number): StripRegions {
  const maxReg = 2 * n + 2;
  const regType = new Int8Array(maxReg);
  const regStrip = new Int32Array(maxReg);
  const regArea = new Float64Array(maxReg);
  let r = 0;
  let sureArea = 0;
  let capArea = 0;
  let tailArea = 0;
  const add = (type: number, strip: number, a: number): void => {
    regType[r] = type;
    regStrip[r] = strip;
    regArea[r] = a;
    r++;
  };
  for (let i = 0; i < n; i++) {
    const w = x[i + 1] - x[i];
    if (!(w > 0) || logUp[i] === -Infinity) continue;
    const sa = w * lo[i];
    // the cap's area by subtraction: an absolute error of about 1e-16·w·M, far below any effect on the draws
    const ca = w * (up[i] - lo[i]);
    if (sa > 0) {
      add(R_SURE, i, sa);
      sureArea += sa;
    }
    if (ca > 0) {
      add(R_CAP, i, ca);
      capArea += ca;
    }
  }
  if (leftArea > 0) {
    add(R_LEFT_TAIL, -1, leftArea);
    tailArea += leftArea;
  }
  if (rightArea > 0) {
    add(R_RIGHT_TAIL, n, rightArea);
    tailArea += rightArea;
  }
  return { regionType: regType, regionStrip: regStrip, regionArea: regArea, regions: r, sureArea, capArea, tailArea };
}


/**
 * The alias table of the fast path (Walker 1977; Vose 1991), with the
 * position inside each region folded into the same uniform. @internal
 *
 * @remarks
 * The regions (sure rectangles, caps, tails) get probabilities proportional
 * to their areas. There are K = 2^b cells, K the smallest power of two ≥ the
 * number of regions (cells beyond the regions start with probability 0, so
 * they are pure aliases). Vose's construction gives each cell j a
 * threshold P_j and an alias A_j: a uniform cell j and an independent
 * uniform v in [0, 1) select region j when v < P_j and region A_j
 * otherwise, which selects every region with its exact probability.
 *
 * One uniform does both. With u = k/2^53 (k a 53-bit integer), t = u·K is
 * exact (K is a power of two), j = ⌊t⌋ is the integer formed by the top b
 * bits of k, and v = t − j, also exact, is the integer formed by the low
 * 53 − b bits divided by 2^(53−b). When k is uniform on [0, 2^53), its top
 * and low bits are independent and uniform, so j is uniform on the cells
 * and v uniform on a grid of step 2^(b−53), independent of j. The condition
 * v < P_j selects the region with probability P_j rounded up to that grid
 * (an error of at most 2^(b−53) per cell, e.g. 2^−41 with 4,096 cells).
 *
 * Given the region, v is uniform on [0, P_j) or [P_j, 1), and the pieces
 * of one region's probability (its own cell, and the alias parts of other
 * cells) are laid end to end: a region of total cell mass T_r receiving the
 * piece [v0, v1) at offset o maps v to the position (o + v − v0)/T_r in
 * [0, 1), uniform over the whole region. For a sure rectangle of strip
 * [a, a + w] the kernel computes the draw in one step, x = B + v·S with
 * B = a + w·(o − v0)/T_r and S = w/T_r > 0. For the other regions it
 * stores B = (o − v0)/T_r (the position offset) and S = −(r + 1) < 0,
 * which both marks the slow path and names the region; so does a sure
 * strip narrower than {@link FAST_STRIP_MIN_ULPS} spacings of the doubles
 * at its ends, where the rounding of B would show (issue 17).
 *
 * With MT19937 through `@stdlib/random-base-mt19937` (`normalized()`),
 * k = (o₁ ≫ 5)·2^26 + (o₂ ≫ 6) for two consecutive 32-bit outputs o₁, o₂,
 * so the cell index is the top b bits of o₁ and the position uses its
 * remaining 27 − b bits followed by the top 26 bits of o₂.
 * An injected uniform with fewer random bits (say 32) leaves fewer bits for
 * the position (32 − b): still exact in the selection of regions, coarser
 * in position. An injected uniform whose values are not multiples of 2^−53
 * is used the same way; t and v are then rounded, by at most one unit in
 * the last place.
 * @internal
 */
import type { StripTable } from './strip-table.js';
import { R_SURE } from './strip-table.js';

/**
 * Narrowest sure strip, in units of the spacing of the doubles at its ends,
 * that the one-step formula x = B + v·S draws from: B is rounded to a double,
 * which shifts the part of the strip a cell maps to by up to half a spacing,
 * so the doubles at the ends of each part get up to ±50 % of their rounded
 * probability wrong — invisible in a strip of millions of doubles, but not
 * in one of a few (normal(1, 1e-13) has strips of tens of doubles). A
 * narrower strip is drawn on the slow path, x = a + w·pos rounded once,
 * which is the exact draw rounded to nearest up to the resolution of pos. @internal
 */
export const FAST_STRIP_MIN_ULPS = 65536;

/** Spacing of the doubles at |x| (2^−52·|x|, at least the smallest subnormal step). */
function spacing(x: number): number {
  return Math.max(x * 2.220446049250313e-16, 5e-324);
}

/** Doubles per cell: P, B0, S0, B1, S1. @internal */
export const CELL_STRIDE = 5;

/** Alias cells of a strip table. @internal */
export interface AliasCells {
  /** Number of cells, a power of two. */
  readonly K: number;
  /** log2 K: the number of top bits of the uniform that select the cell. */
  readonly bits: number;
  /** Cells, {@link CELL_STRIDE} doubles each: threshold, then (B, S) of the own and of the alias region. */
  readonly tab: Float64Array;
  /** Per region: 1/T_r, the scale from the cell variable to the position in the region. */
  readonly invT: Float64Array;
}

/** Builds the alias cells of `t` (setup only). @internal */
export function buildAliasCells(t: StripTable): AliasCells {
  const nr = t.regions;
  let bits = 1;
  while (1 << bits < nr) bits++;
  const K = 1 << bits;
  let total = 0;
  for (let r = 0; r < nr; r++) total += t.regionArea[r];
  const q = new Float64Array(K);
  for (let r = 0; r < nr; r++) q[r] = (t.regionArea[r] * K) / total;
  const P = new Float64Array(K);
  const A = new Int32Array(K);
  const small = new Int32Array(K);
  const large = new Int32Array(K);
  let ns = 0;
  let nl = 0;
  for (let j = 0; j < K; j++) {
    if (q[j] < 1) small[ns++] = j;
    else large[nl++] = j;
  }
  // Vose 1991: pair a small cell with a large one; the large one keeps (q_l + q_s) − 1
  while (ns > 0 && nl > 0) {
    const s = small[--ns];
    const g = large[--nl];
    P[s] = q[s];
    A[s] = g;
    q[g] = q[g] + q[s] - 1;
    if (q[g] < 1) small[ns++] = g;
    else large[nl++] = g;
  }
  // what is left has q = 1 up to rounding
  let biggest = 0;
  for (let r = 1; r < nr; r++) if (t.regionArea[r] > t.regionArea[biggest]) biggest = r;
  for (const [arr, m] of [[small, ns], [large, nl]] as const) {
    for (let k = 0; k < m; k++) {
      const j = arr[k];
      if (j < nr) {
        P[j] = 1;
        A[j] = j;
      } else {
        // a padding cell left over by rounding: send it to the largest region
        P[j] = 0;
        A[j] = biggest;
      }
    }
  }
  // total cell mass of each region, then offsets of its pieces
  const T = new Float64Array(nr);
  for (let j = 0; j < K; j++) {
    if (j < nr) T[j] += P[j];
    if (P[j] < 1) T[A[j]] += 1 - P[j];
  }
  const off = new Float64Array(nr);
  const tab = new Float64Array(K * CELL_STRIDE);
  const invT = new Float64Array(nr);
  for (let r = 0; r < nr; r++) invT[r] = 1 / T[r];
  const regType = t.regionType;
  const regStrip = t.regionStrip;
  const xs = t.x;
  for (let j = 0; j < K; j++) {
    const base = j * CELL_STRIDE;
    const p = P[j];
    tab[base] = p;
    // slot 0: the cell's own region on v in [0, p); slot 1: the alias on [p, 1)
    for (let slot = 0; slot < 2; slot++) {
      const at = base + 1 + 2 * slot;
      const r = slot === 0 ? j : A[j];
      const v0 = slot === 0 ? 0 : p;
      const mass = slot === 0 ? p : 1 - p;
      if (!(mass > 0) || (slot === 0 && j >= nr)) {
        // never taken (v < 0 and v ≥ 1 are impossible); filled for completeness
        tab[at] = 0;
        tab[at + 1] = -((slot === 0 ? A[j] : j) + 1);
        continue;
      }
      const pos0 = (off[r] - v0) * invT[r];
      off[r] += mass;
      if (regType[r] === R_SURE) {
        const i = regStrip[r];
        const a = xs[i];
        const w = xs[i + 1] - a;
        const S = w * invT[r];
        // a strip narrower than FAST_STRIP_MIN_ULPS doubles takes the slow path (see the remarks)
        if (S > 0 && w >= FAST_STRIP_MIN_ULPS * spacing(Math.max(Math.abs(a), Math.abs(xs[i + 1])))) {
          tab[at] = a + w * pos0;
          tab[at + 1] = S;
          continue;
        }
      }
      tab[at] = pos0;
      tab[at + 1] = -(r + 1);
    }
  }
  return { K, bits, tab, invT };
}

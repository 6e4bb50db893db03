/**
 * Guide table for O(1) expected-time selection of a piece with probability
 * proportional to its area (Chen & Asau 1974; Devroye 1986, III.2.4). @internal
 *
 * @packageDocumentation
 */

/**
 * Cumulative areas plus a guide: `guide[g]` is the first piece whose
 * cumulative area exceeds `g/size` of the total. A lookup with a uniform u
 * starts at `guide[floor(u·size)]` and walks forward while
 * `cum[j] ≤ u·total`. With as many guide entries as pieces the expected walk
 * is below 2 steps (Devroye 1986, III.2.4), whatever the number of pieces.
 *
 * The cumulative entry of the last piece with positive area is set to
 * `+Infinity`, a sentinel that ends every walk without a bounds test (and
 * absorbs rounding in u·total); pieces of zero area are never selected.
 * @internal
 */
export class GuideTable {
  /** Cumulative areas (with the sentinel). */
  declare cum: Float64Array;
  /** Guide entries. */
  declare guide: Int32Array;
  /** Number of guide entries in use. */
  declare size: number;
  /** Sum of the areas. */
  declare total: number;

  /** @param capacity - maximum number of pieces (0: storage comes later through {@link GuideTable.useStorage}) */
  constructor(capacity: number) {
    this.cum = new Float64Array(capacity);
    this.guide = new Int32Array(capacity);
    this.size = 0;
    this.total = 0;
  }

  /** Uses the given arrays (views of a caller's store, each of the same length ≥ the number of pieces) as storage. */
  useStorage(cum: Float64Array, guide: Int32Array): void {
    this.cum = cum;
    this.guide = guide;
  }

  /**
   * Rebuilds the table from `area[0..n)` (non-negative, finite, not all 0).
   * Returns the total.
   */
  build(area: Float64Array, n: number): number {
    const cum = this.cum;
    let s = 0;
    let last = -1;
    for (let j = 0; j < n; j++) {
      const a = area[j];
      s += a;
      cum[j] = s;
      if (a > 0) last = j;
    }
    for (let j = last < 0 ? 0 : last; j < n; j++) cum[j] = Infinity;
    this.total = s;
    const guide = this.guide;
    let j = 0;
    for (let g = 0; g < n; g++) {
      const v = (s * g) / n;
      while (cum[j] <= v) j++;
      guide[g] = j;
    }
    this.size = n;
    return s;
  }

  /** Index of the piece selected by the uniform `u` in [0, 1) (the kernels inline this three-line walk for speed; the tests pin it to this one). */
  lookup(u: number): number {
    const cum = this.cum;
    const v = u * this.total;
    let j = this.guide[(u * this.size) | 0];
    while (cum[j] <= v) j++;
    return j;
  }
}

/**
 * Share of the envelope's area from which a selected piece's position
 * reuses the rest of the piece-selecting uniform (2^-12): at least 41 of
 * its 53 bits then remain for the position. @internal
 */
export const SHARE_FLOOR = 0.000244140625;

/**
 * The rest of the piece-selecting uniform within the selected piece j:
 * with `v = u1·total` and `cum[j−1] ≤ v < cum[j]`, (v − cum[j−1]) / area
 * is uniform on [0, 1) given j (clamped there against rounding). Returns
 * −1 when the piece holds less than {@link SHARE_FLOOR} of `total` (the
 * caller then reads a fresh uniform). Used by the hull, piecewise and
 * certified kernels; small enough for the engine to inline. The floor is
 * written as a literal here (a module constant becomes a `var` in the
 * bundle, which the engine reloads on every use).
 * @internal
 */
export function restOfUniform(cum: Float64Array, j: number, area: number, v: number, total: number): number {
  if (!(area >= total * 0.000244140625)) return -1;
  const u = (v - (j === 0 ? 0 : cum[j - 1])) / area;
  return u >= 0 ? (u < 1 ? u : 0.9999999999999999) : 0;
}

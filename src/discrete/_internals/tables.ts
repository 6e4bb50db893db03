/**
 * Finite tables: weights quantized to integer units, the alias table
 * (Walker 1977; Vose 1991) and the guide table for inversion (Chen & Asau
 * 1974), all in exact integer arithmetic. @internal
 *
 * @remarks
 * **How rounding is handled.** The weights are first turned into integer
 * units m_i with Σ m_i = 2^52 exactly: t_i = w_i · 2^52 / Σw (one rounding,
 * relative error below 3·2^-53), m_i = ⌊t_i⌋, then the units still missing
 * go one each to the largest remainders t_i − m_i (Hamilton's
 * largest-remainder rule), so |m_i − t_i| < 1 for every i (up to the
 * rounding of t_i). A zero weight always gets 0 units; a positive weight
 * below about 2^-53 of the total may get 0 units too (it is then never
 * drawn, an error below one unit like every other). Every later step (Vose's pairing, the cumulative
 * sums of the guide table) works on integers below 2^53, so it is exact.
 * With a uniform u that is a multiple of 2^-53 (the default MT19937 source),
 * index i is drawn with probability exactly m_i / 2^52: off from the
 * normalized weight w_i / Σw by less than 2^-52 + 3·2^-53·w_i/Σw (plus
 * the rounding of Σw itself, summed with Neumaier's compensated sum).
 * @internal
 */
import { InvalidTargetError } from '../../core/errors.js';
import { pow } from '../../vendor/math.js';

/** Units per table: probabilities are multiples of 2^-52. @internal */
export const TABLE_UNITS = 4503599627370496; // 2^52
/** Largest number of entries of a finite table. @internal */
export const MAX_TABLE_ENTRIES = 16777216; // 2^24

/** Tables up to this many entries build in shared scratch arrays (no user code runs while they are in use). */
const SCRATCH_MAX = 4096;
const f64Scratch = /* @__PURE__ */ (() => [new Float64Array(64), new Float64Array(64)])();
const i32Scratch = /* @__PURE__ */ (() => [new Int32Array(64), new Int32Array(64), new Int32Array(64)])();

/**
 * A work array of at least n entries (contents undefined): shared scratch
 * for small tables (a fresh one-draw sampler used to spend much of its setup
 * allocating and collecting them), a new array beyond {@link SCRATCH_MAX}.
 */
function scratchF64(slot: number, n: number): Float64Array {
  if (n > SCRATCH_MAX) return new Float64Array(n);
  if (f64Scratch[slot].length < n) f64Scratch[slot] = new Float64Array(SCRATCH_MAX);
  return f64Scratch[slot];
}
function scratchI32(slot: number, n: number): Int32Array {
  if (n > SCRATCH_MAX) return new Int32Array(n);
  if (i32Scratch[slot].length < n) i32Scratch[slot] = new Int32Array(SCRATCH_MAX);
  return i32Scratch[slot];
}

/**
 * Quantizes non-negative finite weights to integer units summing to
 * {@link TABLE_UNITS} (see the module remarks). `name(i)` names entry i in
 * error messages.
 * @internal
 */
export function quantizeWeights(api: string, w: ArrayLike<number>, name: (i: number) => string): Float64Array {
  const n = w.length;
  if (!(n >= 1)) throw new InvalidTargetError(`${api}: weights must have at least one entry, got length ${n}`);
  if (n > MAX_TABLE_ENTRIES) throw new InvalidTargetError(`${api}: weights has ${n} entries; at most ${MAX_TABLE_ENTRIES} are supported`);
  let max = 0;
  let positive = 0;
  for (let i = 0; i < n; i++) {
    const x = w[i];
    if (typeof x !== 'number' || !(x >= 0) || x === Infinity) {
      throw new InvalidTargetError(`${api}: ${name(i)} must be a finite number >= 0, got ${typeof x === 'string' ? `'${x}'` : String(x)}`);
    }
    if (x > max) max = x;
    if (x > 0) positive++;
  }
  if (max === 0) throw new InvalidTargetError(`${api}: every weight is 0; at least one must be positive (no mass)`);
  // Neumaier sum of w_i / max (each in [0, 1], so no overflow)
  let s = 0;
  let c = 0;
  for (let i = 0; i < n; i++) {
    const x = w[i] / max;
    const t = s + x;
    c += Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s;
    s = t;
  }
  s += c;
  const scale = TABLE_UNITS / s;
  const m = new Float64Array(n);
  const frac = scratchF64(0, n);
  let total = 0;
  for (let i = 0; i < n; i++) {
    const t = (w[i] / max) * scale;
    const f = Math.floor(t);
    m[i] = f;
    frac[i] = t - f;
    total += f;
  }
  let deficit = TABLE_UNITS - total; // exact: total < 2^53
  if (deficit !== 0) {
    const idx = remainderOrder(frac, n, deficit > 0);
    if (deficit > 0) {
      for (let pass = 0; deficit > 0 && pass < 64; pass++) {
        for (let j = 0; j < n && deficit > 0; j++) {
          const i = idx[j];
          if (w[i] > 0) {
            m[i] += 1;
            deficit -= 1;
          }
        }
      }
    } else {
      for (let pass = 0; deficit < 0 && pass < 64; pass++) {
        for (let j = 0; j < n && deficit < 0; j++) {
          const i = idx[j];
          if (m[i] > 0) {
            m[i] -= 1;
            deficit += 1;
          }
        }
      }
    }
    if (deficit !== 0) {
      throw new InvalidTargetError(`${api}: could not quantize ${n} weights (${positive} positive) to ${TABLE_UNITS} units (left ${deficit})`);
    }
  }
  return m;
}

/**
 * Indices ordered by remainder (descending when `desc`, else ascending), ties
 * by index: insertion sort on an Int32Array for short tables (no array of
 * boxed numbers, no comparator closure), the built-in sort beyond. Both give
 * the same order (a total order: remainder, then index).
 */
function remainderOrder(frac: Float64Array, n: number, desc: boolean): Int32Array {
  const idx = scratchI32(0, n);
  for (let i = 0; i < n; i++) idx[i] = i;
  if (n <= 64) {
    for (let i = 1; i < n; i++) {
      const x = idx[i];
      const f = frac[x];
      let j = i - 1;
      while (j >= 0 && (desc ? frac[idx[j]] < f : frac[idx[j]] > f)) {
        idx[j + 1] = idx[j];
        j--;
      }
      idx[j + 1] = x;
    }
    return idx;
  }
  const sorted = Array.from(idx.subarray(0, n));
  sorted.sort(desc ? (a, b) => frac[b] - frac[a] || a - b : (a, b) => frac[a] - frac[b] || a - b);
  idx.set(sorted);
  return idx;
}

/** An alias table over quantized units. @internal */
export interface AliasTable {
  /** Number of cells, a power of two ≥ the number of entries. */
  readonly cells: number;
  /** Units per cell: 2^52 / cells. */
  readonly cellUnits: number;
  /** Threshold of each cell, in units (an integer in [0, cellUnits]). */
  readonly threshold: Float64Array;
  /** Alias of each cell. */
  readonly alias: Int32Array;
}

/**
 * Vose's construction on integer units (exact). Draw: t = u·cells,
 * j = ⌊t⌋, and entry j if (t − j)·cellUnits < threshold[j], else alias[j].
 * @internal
 */
export function buildAlias(units: Float64Array): AliasTable {
  const n = units.length;
  let bits = 0;
  while (pow(2, bits) < n) bits++;
  const K = pow(2, bits);
  const C = TABLE_UNITS / K;
  const mass = scratchF64(1, K);
  mass.set(units);
  mass.fill(0, n, K);
  const P = new Float64Array(K);
  const A = new Int32Array(K);
  const small = scratchI32(1, K);
  const large = scratchI32(2, K);
  let ns = 0;
  let nl = 0;
  for (let j = 0; j < K; j++) {
    if (mass[j] < C) small[ns++] = j;
    else large[nl++] = j;
  }
  while (ns > 0 && nl > 0) {
    const s = small[--ns];
    const l = large[nl - 1];
    P[s] = mass[s];
    A[s] = l;
    mass[l] -= C - mass[s];
    if (mass[l] < C) {
      nl--;
      small[ns++] = l;
    }
  }
  // Exact integer arithmetic: every remaining cell holds exactly C units.
  while (nl > 0) {
    const l = large[--nl];
    P[l] = C;
    A[l] = l;
  }
  while (ns > 0) {
    const s = small[--ns];
    P[s] = C;
    A[s] = s;
  }
  return { cells: K, cellUnits: C, threshold: P, alias: A };
}

/** The probability of each entry implied by an alias table (exact up to the final division). @internal */
export function aliasProbabilities(t: AliasTable, n: number): Float64Array {
  const u = new Float64Array(n);
  for (let j = 0; j < t.cells; j++) {
    const p = t.threshold[j];
    if (p > 0) u[j] += p;
    if (p < t.cellUnits) u[t.alias[j]] += t.cellUnits - p;
  }
  for (let i = 0; i < n; i++) u[i] /= TABLE_UNITS;
  return u;
}

/** A guide table for inversion over cumulative integer units. @internal */
export interface GuideTable {
  /** cum[i] = units of entries 0..i (exact integers; cum[n − 1] = 2^52). */
  readonly cum: Float64Array;
  /** guide[b] = smallest i with cum[i] > b · 2^52 / buckets. */
  readonly guide: Int32Array;
  /** Number of buckets. */
  readonly buckets: number;
}

/**
 * Guide table (Chen & Asau 1974) with as many buckets as entries. Draw:
 * x = u·2^52, i = guide[⌊u·buckets⌋], then i++ while cum[i] ≤ x: the
 * smallest i with cum[i] > x, monotone in u.
 * @internal
 */
export function buildGuide(units: Float64Array): GuideTable {
  const n = units.length;
  const cum = new Float64Array(n);
  let s = 0;
  for (let i = 0; i < n; i++) {
    s += units[i];
    cum[i] = s;
  }
  const buckets = n;
  const guide = new Int32Array(buckets);
  let i = 0;
  for (let b = 0; b < buckets; b++) {
    const x = (b / buckets) * TABLE_UNITS;
    while (i < n - 1 && cum[i] <= x) i++;
    guide[b] = i;
  }
  return { cum, guide, buckets };
}

/** The probability of each entry implied by a guide table. @internal */
export function guideProbabilities(g: GuideTable): Float64Array {
  const n = g.cum.length;
  const p = new Float64Array(n);
  let prev = 0;
  for (let i = 0; i < n; i++) {
    p[i] = (g.cum[i] - prev) / TABLE_UNITS;
    prev = g.cum[i];
  }
  return p;
}

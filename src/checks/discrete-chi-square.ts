/**
 * Chi-square goodness-of-fit check of integer draws against a pmf, with
 * cells pooled so that every expected count is at least 5.
 *
 * @packageDocumentation
 */
import { InvalidOptionError, InvalidTargetError } from '../core/errors.js';
import { checkOptionKeys, showValue } from '../core/validate.js';
import { chiSquareCheck } from './chi-square.js';

/** Result of {@link discreteChiSquareCheck}. */
export interface DiscreteChiSquareResult {
  /** Pearson's X² over the pooled cells. */
  statistic: number;
  /** Upper-tail chi-square p-value with `df` degrees of freedom. */
  pValue: number;
  /** Degrees of freedom: pooled cells minus 1. */
  df: number;
  /** Number of pooled cells. */
  cells: number;
  /** Draws that are not integers inside the support (any such draw makes X² infinite and the p-value 0). */
  outside: number;
}

/** Options of {@link discreteChiSquareCheck}. */
export interface DiscreteChiSquareOptions {
  /**
   * Smallest expected count of a pooled cell.
   * @defaultValue 5
   */
  minExpected?: number;
}

/** Default smallest expected count per pooled cell (common practice; Cochran 1954, from memory). */
export const DISCRETE_CHI_SQUARE_MIN_EXPECTED = 5;
/** Most integers the check sums the pmf over (it throws beyond). */
export const DISCRETE_CHI_SQUARE_MAX_POINTS = 50_000_000;

/**
 * Pearson chi-square check of integer `draws` against a normalized `pmf`
 * on `support`, with cells pooled so that every expected count is at least
 * 5.
 *
 * @remarks
 * The pooling rule: walk the support upward and merge neighbouring
 * integers into one cell until its expected count n·P(cell) reaches
 * `minExpected` (default 5); a remainder below it at the top is merged into
 * the last cell. The lowest cell thus holds the whole lower tail and the
 * last cell the whole upper tail. The threshold 5 is the usual rule for the
 * chi-square approximation (common practice; it goes back to Cochran 1954,
 * from memory; Cochran's own rule is milder, allowing a few cells between 1
 * and 5). Cell probabilities come from summing `pmf` over the integers
 * (Neumaier-compensated), starting at the draws' range and extending into
 * each tail until the terms are below 1e-18 and decreasing; the sum must be 1 within 1e-8 (a pmf that is not
 * normalized throws). Draws that are not integers inside the support count
 * in `outside` and make the p-value 0. The p-value comes from
 * {@link chiSquareCheck}.
 *
 * @param draws - integer draws
 * @param pmf - normalized probability mass function
 * @param support - `[lower, upper]`, integers or infinite ends
 * @param options - pooling threshold
 * @throws {@link InvalidTargetError} for empty draws, a bad support, a pmf that is negative, NaN or does not sum to 1, or fewer than two pooled cells
 * @example
 * ```ts
 * import { discreteChiSquareCheck, discreteSampler, poissonTarget } from 'exactdraw';
 * const t = poissonTarget(3);
 * const draws = discreteSampler(t, { seed: 1, expectedDraws: 1e4 }).fill(new Int32Array(1e4));
 * discreteChiSquareCheck(draws, (k) => Math.exp(t.logPmf(k)), [0, Infinity]).pValue; // > 1e-4
 * ```
 */
export function discreteChiSquareCheck(
  draws: ArrayLike<number>,
  pmf: (k: number) => number,
  support: readonly [number, number],
  options?: DiscreteChiSquareOptions,
): DiscreteChiSquareResult {
  const api = 'discreteChiSquareCheck';
  if (draws === null || typeof draws !== 'object' || !(draws.length > 0)) {
    throw new InvalidTargetError(`${api}: draws must be a non-empty array of integers`);
  }
  if (typeof pmf !== 'function') throw new InvalidTargetError(`${api}: pmf must be a function, got ${typeof pmf}`);
  if (!Array.isArray(support) || support.length !== 2) throw new InvalidTargetError(`${api}: support must be a pair [lower, upper], got ${String(support)}`);
  const lo = support[0];
  const hi = support[1];
  if (!(Number.isInteger(lo) || lo === -Infinity) || !(Number.isInteger(hi) || hi === Infinity) || !(lo <= hi)) {
    throw new InvalidTargetError(`${api}: support must be integers (or infinite ends) with lower <= upper, got [${lo}, ${hi}]`);
  }
  checkOptionKeys(api, options, ['minExpected']);
  const minExpected = options?.minExpected ?? DISCRETE_CHI_SQUARE_MIN_EXPECTED;
  if (typeof minExpected !== 'number' || !(minExpected > 0) || minExpected === Infinity) {
    throw new InvalidOptionError(`${api}: options.minExpected must be a finite number > 0, got ${showValue(minExpected)}`);
  }
  const n = draws.length;
  let outside = 0;
  let kmin = Infinity;
  let kmax = -Infinity;
  for (let i = 0; i < n; i++) {
    const k = draws[i];
    if (!Number.isInteger(k) || k < lo || k > hi) {
      outside++;
      continue;
    }
    if (k < kmin) kmin = k;
    if (k > kmax) kmax = k;
  }
  if (kmin === Infinity) {
    // every draw is outside: anchor the sums at a point of the support
    kmin = kmax = Number.isFinite(lo) ? lo : Number.isFinite(hi) ? hi : 0;
  }
  if (kmax - kmin + 1 > DISCRETE_CHI_SQUARE_MAX_POINTS) {
    throw new InvalidTargetError(`${api}: the draws span ${kmax - kmin + 1} integers; at most ${DISCRETE_CHI_SQUARE_MAX_POINTS} are supported`);
  }
  const p = (k: number): number => {
    const v = pmf(k);
    if (typeof v !== 'number' || !(v >= 0) || v > 1) throw new InvalidTargetError(`${api}: pmf(${k}) = ${String(v)} is not a probability`);
    return v;
  };
  // the tails beyond the draws: sum outward until negligible
  let budget = DISCRETE_CHI_SQUARE_MAX_POINTS - (kmax - kmin + 1);
  const tail = (start: number, step: 1 | -1, end: number): { mass: number; pts: Float64Array } => {
    const vals: number[] = [];
    let s = 0;
    let prev = Infinity;
    for (let k = start; step > 0 ? k <= end : k >= end; k += step) {
      if (--budget < 0) throw new InvalidTargetError(`${api}: the pmf's tail beyond ${start} does not become negligible within ${DISCRETE_CHI_SQUARE_MAX_POINTS} points`);
      const v = p(k);
      vals.push(v);
      s += v;
      if (v < 1e-18 && v <= prev && vals.length > 8) break;
      prev = v;
    }
    return { mass: s, pts: Float64Array.from(vals) };
  };
  const left = tail(kmin - 1, -1, lo);
  const right = tail(kmax + 1, 1, hi);
  // expected per integer from the lowest summed point up
  const L = left.pts.length;
  const span = kmax - kmin + 1;
  const R = right.pts.length;
  const total = L + span + R;
  const prob = new Float64Array(total);
  for (let i = 0; i < L; i++) prob[L - 1 - i] = left.pts[i];
  for (let i = 0; i < span; i++) prob[L + i] = p(kmin + i);
  for (let i = 0; i < R; i++) prob[L + span + i] = right.pts[i];
  let s = 0;
  let c = 0;
  for (let i = 0; i < total; i++) {
    const x = prob[i];
    const t = s + x;
    c += Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s;
    s = t;
  }
  s += c;
  if (!(Math.abs(s - 1) <= 1e-8)) throw new InvalidTargetError(`${api}: the pmf sums to ${s} over [${kmin - L}, ${kmax + R}]; it must be normalized (sum 1 within 1e-8)`);
  const obs = new Float64Array(total);
  const base = kmin - L;
  for (let i = 0; i < n; i++) {
    const k = draws[i];
    if (Number.isInteger(k) && k >= lo && k <= hi) obs[k - base]++;
  }
  // pool upward
  const cellP: number[] = [];
  const cellC: number[] = [];
  let accP = 0;
  let accC = 0;
  const valid = n - outside;
  for (let i = 0; i < total; i++) {
    accP += prob[i] / s;
    accC += obs[i];
    if (valid * accP >= minExpected) {
      cellP.push(accP);
      cellC.push(accC);
      accP = 0;
      accC = 0;
    }
  }
  if (accP > 0 || accC > 0) {
    if (cellP.length === 0) {
      cellP.push(accP);
      cellC.push(accC);
    } else {
      cellP[cellP.length - 1] += accP;
      cellC[cellC.length - 1] += accC;
    }
  }
  if (cellP.length < 2) {
    throw new InvalidTargetError(`${api}: only ${cellP.length} cell has an expected count >= ${minExpected} with ${valid} draws; more draws are needed`);
  }
  // renormalize the cell probabilities exactly to the chiSquareCheck contract
  let cs = 0;
  for (const v of cellP) cs += v;
  for (let i = 0; i < cellP.length; i++) cellP[i] /= cs;
  if (outside > 0) {
    return { statistic: Infinity, pValue: 0, df: cellP.length - 1, cells: cellP.length, outside };
  }
  const r = chiSquareCheck(cellC, cellP);
  return { statistic: r.statistic, pValue: r.pValue, df: r.df, cells: cellP.length, outside };
}

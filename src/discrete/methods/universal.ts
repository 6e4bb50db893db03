/**
 * Universal rejection for log-concave pmfs that sum to at most 1, with a
 * known mode: the hat needs only the mode and logPmf at the mode, so a fresh
 * target costs one setup evaluation. @internal
 *
 * @remarks
 * **The bound.** Let p be log-concave on the integers with mode m and
 * Σ p ≤ 1, and write q = p(m). For d ≥ 1 with p(m + d) = q·e^(−a), a ≥ 0,
 * log-concavity puts every point between m and m + d above the chord:
 * p(m + j) ≥ q·e^(−a·j/d), j = 0..d. Summing, and bounding the sum of a
 * decreasing function below by its integral,
 * 1 ≥ q·Σ_{j=0..d} e^(−aj/d) ≥ q·d·(1 − e^(−a))/a. With c = q·d: if c > 1
 * and a < c − 1, then (1 − e^(−a))/a > (1 − e^(1−c))/(c − 1) (the function
 * decreases in a), so c·(1 − e^(1−c)) < c − 1, i.e. c·e^(1−c) > 1, which no
 * c satisfies (c·e^(1−c) ≤ 1, equality at c = 1). Hence
 * p(m ± d) ≤ q·min(1, e^(1 − q·d)), the inequality of Devroye (1987,
 * Computing 39) (derived here, not copied). A pmf summing to S < 1 (a
 * truncation) satisfies it too, since its normalized mode value q/S only
 * makes the bound looser.
 *
 * **The hat.** Centre: the points with q·d ≤ 1, i.e. |k − m| ≤ D = ⌊1/q⌋,
 * clipped to the support, at height q; tails: k = m ± (D + j), j ≥ 1, at
 * q·e^(1 − q(D + j)), a geometric law in j with ratio e^(−q), kept only on
 * the sides where the support goes on. For a normalized pmf the hat mass is
 * at most about 4 (2 + 2 for small q), so a draw takes at most about 4
 * proposals, each one logPmf evaluation (there is no squeeze: nothing but
 * the mode is measured). Every hat is raised by {@link DISCRETE_LOG_MARGIN};
 * every evaluation is checked against the hat
 * ({@link EnvelopeViolationError}: a promise of log-concavity or of a sum
 * ≤ 1 that the pmf breaks where the sampler looks).
 * @internal
 */
import { checkLogDensity } from '../../core/evaluate.js';
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, InvalidTargetError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import { DISCRETE_LOG_MARGIN, MAX_DISCRETE_K } from '../_internals/setup.js';
import { exp, expm1, log, pow } from '../../vendor/math.js';

/** Smallest pmf value at the mode served by the universal hat (2^-40; the centre then has at most 2^41 points). @internal */
export const UNIVERSAL_MIN_MODE_PMF = /* @__PURE__ */ pow(2, -40);

/** The universal hat of one target (plain numbers; no allocation per draw). @internal */
export interface UniversalHat {
  m: number;
  /** logPmf(m) + margin. */
  G: number;
  /** pmf at the mode, q = e^logPmf(m). */
  q: number;
  /** First and last point of the centre. */
  cLo: number;
  cHi: number;
  /** Centre mass (points × q, relative units of the hat). */
  cMass: number;
  /** Right-tail start (m + D), and its mass; 0 when the support ends inside the centre. */
  rEdge: number;
  rMass: number;
  lEdge: number;
  lMass: number;
  /** log of the tail hat at the edge (j = 0), margin included. */
  tailLog0: number;
}

/**
 * Fills `hat` for a target with mode `m` and logPmf(m) = F on [lo, hi];
 * throws {@link InvalidTargetError} when F > 0 (a pmf summing to at most 1
 * has no value above 1) and returns false when q is below
 * {@link UNIVERSAL_MIN_MODE_PMF} or F is -Infinity (the caller uses another
 * method).
 * @internal
 */
export function setUniversalHat(api: string, hat: UniversalHat, m: number, F: number, lo: number, hi: number): boolean {
  if (F > 1e-9) {
    throw new InvalidTargetError(`${api}: target.normalized is true but logPmf(${m}) = ${F} > 0; a pmf summing to at most 1 has no value above 1`);
  }
  const q = Math.min(1, exp(F));
  if (!(q >= UNIVERSAL_MIN_MODE_PMF)) return false;
  const D = Math.floor(1 / q);
  const cLo = Math.max(lo, m - D);
  const cHi = Math.min(hi, m + D);
  hat.m = m;
  hat.q = q;
  hat.G = F + DISCRETE_LOG_MARGIN;
  hat.cLo = cLo;
  hat.cHi = cHi;
  hat.cMass = (cHi - cLo + 1) * q;
  // tail at distance D + j: log q + 1 − q(D + j) = tailLog0 − q·j
  hat.tailLog0 = F + 1 - q * D + DISCRETE_LOG_MARGIN;
  const tail = (q * exp(1 - q * D - q)) / -expm1(-q);
  hat.rEdge = m + D;
  hat.rMass = m + D < hi ? tail : 0;
  hat.lEdge = m - D;
  hat.lMass = m - D > lo ? tail : 0;
  return true;
}

/** A fresh, empty hat record (filled by {@link setUniversalHat}). @internal */
export function newUniversalHat(): UniversalHat {
  return { m: 0, G: 0, q: 1, cLo: 0, cHi: 0, cMass: 0, rEdge: 0, rMass: 0, lEdge: 0, lMass: 0, tailLog0: 0 };
}

/**
 * One exact draw from the target under `hat` (logPmf called as a method of
 * `target`, so no bound copy is needed).
 * @internal
 */
export function universalDraw(
  api: string,
  hat: UniversalHat,
  target: { logPmf(k: number): number },
  lo: number,
  hi: number,
  u: Uniform,
  counters: Counters,
  maxRejections: number,
): number {
  const { q, G, cLo, cHi, cMass, rEdge, rMass, lEdge, tailLog0 } = hat;
  const cut = cMass + rMass;
  const total = cut + hat.lMass;
  for (let rej = 0; rej < maxRejections; rej++) {
    counters.proposals++;
    const t = u() * total;
    let k: number;
    let g: number;
    if (t < cMass) {
      k = Math.min(cHi, cLo + Math.floor(t / q)); // min: t / q may round up to the count
      g = G;
    } else {
      const j = 1 + Math.floor(log(1 - u()) / -q);
      k = t < cut ? rEdge + j : lEdge - j;
      g = tailLog0 - q * j;
    }
    const v = 1 - u();
    if (!(k >= lo && k <= hi) || Math.abs(k) > MAX_DISCRETE_K) continue;
    const hk = target.logPmf(k);
    counters.densityEvaluations++;
    checkLogDensity(api, k, hk);
    if (hk > g) throw new EnvelopeViolationError(api, k, hk, g);
    if (v <= exp(hk - g)) return k;
  }
  throw new StalledSamplerError(api, maxRejections, counters.samples, counters.proposals);
}

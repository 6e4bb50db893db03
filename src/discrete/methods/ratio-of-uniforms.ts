/**
 * Ratio-of-uniforms for T-concave pmfs (T = −1/√·), on the step function
 * x ↦ p(⌊x⌋) shifted to the centre of the mode's cell. @internal
 *
 * @remarks
 * Kinderman & Monahan (1977): if (U, V) is uniform on
 * R = {(u, v): 0 < v ≤ √f(u/v + c)}, then X = U/V + c has density ∝ f.
 * Here f(x) = p(⌊x⌋)/p(m) with c = m + 1/2, so ⌊X⌋ has the pmf p. R lies in
 * the rectangle (0, 1] × [u₋, u₊] with u₊ = max_{j≥0} (j + 1/2)·√f(m + j)
 * and u₋ = −max_{j≥0} (j + 1/2)·√f(m − j) (the supremum of (x − c)√f(x) over
 * the cell of m ± j). Leydold (2001, ACM TOMS 27) bounds u± by the
 * normalized mass for T-concave pmfs (his "simple" version); an
 * unnormalized logPmf gives no mass, so u± are found here by a search:
 * (j + 1/2)√f(m + j) is unimodal in j when p is T-concave (−1/√p concave),
 * found by doubling then a ternary search on the integers. A search that
 * sees the values rise again refuses the target ({@link ShapeViolationError});
 * every evaluation while sampling is checked against the rectangle
 * ({@link EnvelopeViolationError}). Both ends are raised by a relative
 * 1e-6 against rounding. Needs (j + 1/2)√p(m + j) bounded, i.e. a pmf that
 * decays faster than j^-2.
 * @internal
 */
import { checkLogDensity } from '../../core/evaluate.js';
import type { Counters } from '../../core/counters.js';
import { EnvelopeViolationError, ImproperDensityError, ShapeViolationError, StalledSamplerError } from '../../core/errors.js';
import type { Uniform } from '../../core/types.js';
import { DISCRETE_LOG_MARGIN, MAX_DISCRETE_K, type SetupEvaluator } from '../_internals/setup.js';
import type { DiscreteSampler } from '../types.js';
import { discreteDraws } from '../_internals/draws.js';
import { exp, log } from '../../vendor/math.js';

/** The rectangle of {@link buildRatioRectangle}: logs of u₊ and −u₋. @internal */
export interface RatioRectangle {
  readonly m: number;
  readonly F: number;
  readonly logUPlus: number;
  readonly logUMinus: number;
}

function sideMax(ev: SetupEvaluator, m: number, F: number, dir: 1 | -1): number {
  const api = ev.api;
  const phi = (j: number): number => log(j + 0.5) + 0.5 * (ev.h(m + dir * j) - F);
  // doubling: find j0 < j1 < j2 with phi(j1) >= phi(j0), phi(j1) >= phi(j2)
  let j0 = 0;
  let p0 = phi(0);
  let j1 = 1;
  let p1 = phi(1);
  if (p1 <= p0) return p0 === -Infinity ? -Infinity : Math.max(p0, p1);
  let j2 = 2;
  let p2 = phi(2);
  for (let it = 0; p2 > p1; it++) {
    if (j2 > MAX_DISCRETE_K / 2 || it > 60) {
      throw new ImproperDensityError(`${api}: (j + 1/2)·sqrt(pmf(${m} ${dir > 0 ? '+' : '-'} j)) still grows at j = ${j2}; the pmf does not decay faster than j^-2, so ratio-of-uniforms cannot bound it`);
    }
    j0 = j1;
    p0 = p1;
    j1 = j2;
    p1 = p2;
    j2 = 2 * j2;
    p2 = phi(j2);
  }
  // ternary search on integers in [j0, j2] for the maximum of a unimodal phi
  let a = j0;
  let b = j2;
  for (let it = 0; b - a > 2 && it < 200; it++) {
    const x = a + Math.floor((b - a) / 3);
    const y = b - Math.floor((b - a) / 3);
    if (phi(x) < phi(y)) a = x;
    else b = y;
  }
  let best = -Infinity;
  for (let j = a; j <= b; j++) best = Math.max(best, phi(j));
  if (best < p1 - 1e-9) {
    throw new ShapeViolationError(`${api}: (j + 1/2)·sqrt(pmf) is not unimodal around ${m + dir * j1}; the pmf is not T-concave (T = -1/sqrt)`, [Math.min(m, m + dir * j2), Math.max(m, m + dir * j2)]);
  }
  return Math.max(best, p1);
}

/** Finds the rectangle (setup only). @internal */
export function buildRatioRectangle(ev: SetupEvaluator, m: number): RatioRectangle {
  const F = ev.h(m);
  return { m, F, logUPlus: sideMax(ev, m, F, 1) + 1e-6, logUMinus: sideMax(ev, m, F, -1) + 1e-6 };
}

/** The sampler over a {@link RatioRectangle}. @internal */
export function ratioSampler(
  api: string,
  rect: RatioRectangle,
  logPmf: (k: number) => number,
  lo: number,
  hi: number,
  u: Uniform,
  counters: Counters,
  maxRejections: number,
): DiscreteSampler {
  const { m, F } = rect;
  const up = exp(rect.logUPlus);
  const um = -exp(rect.logUMinus);
  const width = up - um;
  const c = m + 0.5;
  const lower = Math.max(lo, -MAX_DISCRETE_K);
  const upper = Math.min(hi, MAX_DISCRETE_K) + 1;
  const lUp = rect.logUPlus;
  const lUm = rect.logUMinus;
  const draw = (): number => {
    for (let rej = 0; rej < maxRejections; rej++) {
      counters.proposals++;
      const v = 1 - u();
      const x = (um + u() * width) / v + c;
      if (!(x >= lower && x < upper)) continue;
      const k = Math.floor(x);
      const hk = logPmf(k);
      counters.densityEvaluations++;
      checkLogDensity(api, k, hk);
      const d = hk - F;
      if (d > DISCRETE_LOG_MARGIN) throw new EnvelopeViolationError(api, k, hk, F + DISCRETE_LOG_MARGIN);
      const j = k - m;
      const lu = log(Math.abs(j) + 0.5) + 0.5 * d;
      const bound = j >= 0 ? lUp : lUm;
      if (lu > bound) throw new EnvelopeViolationError(api, k, hk, F + 2 * (bound - log(Math.abs(j) + 0.5)));
      if (v * v <= exp(d)) return k;
    }
    throw new StalledSamplerError(api, maxRejections, counters.samples, counters.proposals);
  };
  return discreteDraws(api, draw, counters);
}

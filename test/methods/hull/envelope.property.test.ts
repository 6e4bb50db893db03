/**
 * Properties (fast-check): the hull envelope lies above the target and the
 * squeeze below it, at random points, for random family parameters, before
 * and after adaptation, with both transforms where they apply.
 *
 * Tolerance: the documented hull tolerance restated here independently,
 * 1e-9 + 1e-12·(|log f| + |log envelope|) in log units (rounding in the
 * targets' own log-densities; see HULL_LOG_TOLERANCE_ABSOLUTE).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { adaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import type { AdaptiveRejectionOptions, AdaptiveRejectionSampler } from '../../../src/methods/adaptive-rejection.js';
import { evaluateEnvelope } from '../../../src/methods/envelope/description.js';
import type { Target } from '../../../src/core/types.js';
import { betaTarget } from '../../../src/targets/beta.js';
import { gammaTarget } from '../../../src/targets/gamma.js';
import { logisticTarget } from '../../../src/targets/logistic.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { studentTTarget } from '../../../src/targets/student-t.js';
import { truncate } from '../../../src/targets/truncate.js';

const RUNS = Number(process.env.HULL_RUNS ?? 100);
const ADAPT_DRAWS = 1500;
const SEED_OFFSET = Number(process.env.HULL_SEED ?? 0);

/** Checks envelope >= target >= squeeze at xs (points outside the support are skipped). */
function checkAt(s: AdaptiveRejectionSampler, t: Target, xs: readonly number[], stage: string): void {
  const env = s.envelope;
  const [lo, hi] = env.support;
  for (const x of xs) {
    if (!(x >= lo && x <= hi)) continue;
    const lf = t.logDensity(x);
    const { logEnvelope, logSqueeze } = evaluateEnvelope(env, x);
    const tol = 1e-9 + 1e-12 * (Math.abs(lf === -Infinity ? 0 : lf) + Math.abs(logEnvelope));
    if (lf > -Infinity) {
      if (!(logEnvelope >= lf - tol)) expect.fail(`${stage}: envelope below target at x = ${x}: log f = ${lf}, log envelope = ${logEnvelope}`);
    }
    if (!(logSqueeze <= lf + tol)) expect.fail(`${stage}: squeeze above target at x = ${x}: log f = ${lf}, log squeeze = ${logSqueeze}`);
  }
}

/** Points around and between the touch points, plus the given ones. */
function nearTouch(s: AdaptiveRejectionSampler, fr: readonly number[]): number[] {
  const tp = s.envelope.touchPoints;
  const out: number[] = [];
  for (let i = 0; i < tp.length; i++) {
    const x = tp[i];
    const d = Math.max(Math.abs(x) * 1e-9, 1e-300);
    out.push(x + d, x - d);
    if (i + 1 < tp.length) for (const f of fr) out.push(x + f * (tp[i + 1] - x));
  }
  return out;
}

function property(make: (u: readonly number[]) => { t: Target; points: number[] }, opts: AdaptiveRejectionOptions, seed: number): void {
  fc.assert(
    fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 12, maxLength: 12 }), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }), (u, fr) => {
      const { t, points } = make(u);
      const s = adaptiveRejectionSampler(t, { ...opts, seed: 7 });
      checkAt(s, t, points, 'before adaptation');
      checkAt(s, t, nearTouch(s, fr), 'before adaptation, near touch points');
      s.fill(new Float64Array(ADAPT_DRAWS));
      checkAt(s, t, points, 'after adaptation');
      checkAt(s, t, nearTouch(s, fr), 'after adaptation, near touch points');
    }),
    { numRuns: RUNS, seed: seed + SEED_OFFSET },
  );
}

const lerp = (a: number, b: number, u: number): number => a + (b - a) * u;
const logUniform = (a: number, b: number, u: number): number => Math.exp(lerp(Math.log(a), Math.log(b), u));

/** normal(mean ±1e6, sd 1e-6..1e6), points at mean + sd·z, z in [−12, 12]. */
function normalCase(u: readonly number[]): { t: Target; points: number[] } {
  const mean = lerp(-1e6, 1e6, u[0]);
  const sd = logUniform(1e-6, 1e6, u[1]);
  const points = u.slice(2).map((v) => mean + sd * lerp(-12, 12, v));
  return { t: normalTarget(mean, sd), points };
}
/** gamma(shape 1..1e4, rate 0.1..10), points across the bulk and towards 0. */
function gammaCase(u: readonly number[]): { t: Target; points: number[] } {
  const shape = logUniform(1, 1e4, u[0]);
  const rate = logUniform(0.1, 10, u[1]);
  const mean = shape / rate;
  const sd = Math.sqrt(shape) / rate;
  const points = u.slice(2, 7).map((v) => Math.max(1e-300, mean + sd * lerp(-10, 12, v)));
  for (const v of u.slice(7)) points.push(mean * Math.pow(10, -8 * v));
  return { t: gammaTarget(shape, rate), points };
}
/** beta(a, b in 1..1e3), points in (0, 1), some very close to the ends. */
function betaCase(u: readonly number[]): { t: Target; points: number[] } {
  const a = logUniform(1, 1e3, u[0]);
  const b = logUniform(1, 1e3, u[1]);
  const points = u.slice(2, 8).map((v) => v);
  for (const v of u.slice(8)) points.push(Math.pow(10, -12 * v), 1 - Math.pow(10, -12 * v));
  return { t: betaTarget(a, b), points };
}
/** logistic(location ±1e6, scale 1e-6..1e6). */
function logisticCase(u: readonly number[]): { t: Target; points: number[] } {
  const loc = lerp(-1e6, 1e6, u[0]);
  const scale = logUniform(1e-6, 1e6, u[1]);
  const points = u.slice(2).map((v) => loc + scale * lerp(-40, 40, v));
  return { t: logisticTarget(loc, scale), points };
}
/** A truncation of one of the above to a random window (possibly half-infinite, possibly far in a tail). */
function truncatedCase(u: readonly number[]): { t: Target; points: number[] } {
  const which = Math.floor(u[11] * 3);
  const base = which === 0 ? normalCase(u) : which === 1 ? gammaCase(u) : logisticCase(u);
  const t0 = base.t;
  const m = t0.mode as number;
  const scale = which === 0 ? logUniform(1e-6, 1e6, u[1]) : which === 1 ? Math.sqrt(logUniform(1, 1e4, u[0])) / logUniform(0.1, 10, u[1]) : logUniform(1e-6, 1e6, u[1]);
  const lower = m + scale * lerp(-3, 9, u[9]);
  const upper = u[10] < 0.3 ? Infinity : lower + scale * logUniform(0.01, 10, u[10]);
  const lo = which === 1 ? Math.max(lower, 0) : lower;
  if (!(lo < upper)) return base;
  const t = truncate(t0, lo, upper);
  const w = upper === Infinity ? 10 * scale : upper - lo;
  const points = u.slice(2, 9).map((v) => lo + w * v);
  return { t, points };
}
/** Student-t(df 1..30), inverse-sqrt only (it is not log-concave). */
function studentCase(u: readonly number[]): { t: Target; points: number[] } {
  const df = logUniform(1, 30, u[0]);
  const loc = lerp(-1e3, 1e3, u[1]);
  const scale = logUniform(1e-3, 1e3, u[2]);
  const points = u.slice(3).map((v) => loc + scale * lerp(-1e3, 1e3, v * v * Math.sign(v - 0.5)));
  return { t: studentTTarget(df, loc, scale), points };
}

describe('adaptiveRejectionSampler envelope properties (fast-check)', () => {
  for (const transform of ['log', 'inverse-sqrt'] as const) {
    for (const derivativeFree of [false, true]) {
      const label = `${transform}, ${derivativeFree ? 'secant' : 'tangent'}`;
      it(`adaptiveRejectionSampler(normal) envelope >= target >= squeeze (${label})`, () => {
        property(normalCase, { transform, derivativeFree }, 101);
      });
      it(`adaptiveRejectionSampler(gamma) envelope >= target >= squeeze (${label})`, () => {
        property(gammaCase, { transform, derivativeFree }, 102);
      });
      it(`adaptiveRejectionSampler(beta) envelope >= target >= squeeze (${label})`, () => {
        property(betaCase, { transform, derivativeFree }, 103);
      });
      it(`adaptiveRejectionSampler(logistic) envelope >= target >= squeeze (${label})`, () => {
        property(logisticCase, { transform, derivativeFree }, 104);
      });
      it(`adaptiveRejectionSampler(truncate(...)) envelope >= target >= squeeze (${label})`, () => {
        property(truncatedCase, { transform, derivativeFree }, 105);
      });
    }
  }
  it('adaptiveRejectionSampler(studentT) envelope >= target >= squeeze (inverse-sqrt, tangent and secant)', () => {
    property(studentCase, { transform: 'inverse-sqrt' }, 106);
    property(studentCase, { transform: 'inverse-sqrt', derivativeFree: true }, 107);
  });
});

/** The same target without its mode hint, so that setup has to search for the mode. */
function withoutHint(make: (u: readonly number[]) => { t: Target; points: number[] }): (u: readonly number[]) => { t: Target; points: number[] } {
  return (u) => {
    const { t, points } = make(u);
    const bare: Target = { logDensity: (x) => t.logDensity(x), support: t.support };
    if (t.dLogDensity !== undefined) {
      const d = t.dLogDensity.bind(t);
      return { t: { ...bare, dLogDensity: d }, points };
    }
    return { t: bare, points };
  };
}

describe('adaptiveRejectionSampler envelope properties without a mode hint (fast-check)', () => {
  for (const derivativeFree of [false, true]) {
    const label = derivativeFree ? 'secant' : 'tangent';
    it(`adaptiveRejectionSampler(normal, gamma, beta, truncations; no mode hint) envelope >= target >= squeeze (${label})`, () => {
      property(withoutHint(normalCase), { derivativeFree }, 201);
      property(withoutHint(gammaCase), { derivativeFree }, 202);
      property(withoutHint(betaCase), { derivativeFree, transform: 'inverse-sqrt' }, 203);
      property(withoutHint(truncatedCase), { derivativeFree }, 204);
    });
  }
});

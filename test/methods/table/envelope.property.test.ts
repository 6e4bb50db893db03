/**
 * Properties (fast-check): in every strip of a tableSampler's table the
 * constant envelope lies above the target and the constant squeeze below
 * it; the described envelope (strips and tails) lies above the target and
 * its chord squeeze below it; drawing does not find a violation. Random
 * family parameters, random strip counts, both transforms where they apply.
 *
 * Tolerance: the documented hull tolerance restated here independently,
 * 1e-9 + 1e-12·(|log f| + |log envelope|) in log units (rounding in the
 * targets' own log-densities; see HULL_LOG_TOLERANCE_ABSOLUTE).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Target } from '../../../src/core/types.js';
import { evaluateEnvelope } from '../../../src/methods/envelope/description.js';
import { tableSampler } from '../../../src/methods/table-sampler.js';
import type { TableSamplerOptions } from '../../../src/methods/table-sampler.js';
import { betaTarget } from '../../../src/targets/beta.js';
import { gammaTarget } from '../../../src/targets/gamma.js';
import { normalTarget } from '../../../src/targets/normal.js';
import { studentTTarget } from '../../../src/targets/student-t.js';
import { truncate } from '../../../src/targets/truncate.js';

const RUNS = Number(process.env.TABLE_RUNS ?? 100);
const SEED_OFFSET = Number(process.env.TABLE_SEED ?? 0);

const lerp = (a: number, b: number, u: number): number => a + (b - a) * u;
const logUniform = (a: number, b: number, u: number): number => Math.exp(lerp(Math.log(a), Math.log(b), u));
const tolerance = (lf: number, le: number): number => 1e-9 + 1e-12 * (Math.abs(lf === -Infinity ? 0 : lf) + Math.abs(le === -Infinity || le === Infinity ? 0 : le));

function check(t: Target, opts: TableSamplerOptions, u: readonly number[], extra: readonly number[]): void {
  const s = tableSampler(t, { ...opts, seed: 5 });
  const tb = s.table;
  const env = s.envelope;
  const b = tb.boundaries;
  const n = tb.strips;
  const fail = (msg: string): never => expect.fail(`${msg} (strips ${n}, options ${JSON.stringify(opts)})`);
  // points inside strips: the strip chosen by u, the position by the next u, plus both ends
  const pts: number[] = [...extra];
  for (let k = 0; k + 1 < u.length; k += 2) {
    const i = Math.min(n - 1, Math.floor(u[k] * n));
    const x = b[i] + (b[i + 1] - b[i]) * u[k + 1];
    pts.push(x);
    const lf = t.logDensity(x);
    const up = tb.logUpper[i];
    const lo = tb.logLower[i];
    if (lf > up + tolerance(lf, up)) fail(`strip ${i} [${b[i]}, ${b[i + 1]}]: target above the strip's envelope at x = ${x}: log f = ${lf}, log upper = ${up}`);
    if (lf < lo - tolerance(lf, lo)) fail(`strip ${i} [${b[i]}, ${b[i + 1]}]: target below the strip's squeeze at x = ${x}: log f = ${lf}, log lower = ${lo}`);
  }
  // every strip's squeeze is at most its envelope
  for (let i = 0; i < n; i++) if (!(tb.logLower[i] <= tb.logUpper[i])) fail(`strip ${i}: squeeze ${tb.logLower[i]} above envelope ${tb.logUpper[i]}`);
  const [lo, hi] = env.support;
  for (const x of pts) {
    if (!(x >= lo && x <= hi)) continue;
    const lf = t.logDensity(x);
    const { logEnvelope, logSqueeze } = evaluateEnvelope(env, x);
    if (lf > -Infinity && !(logEnvelope >= lf - tolerance(lf, logEnvelope))) fail(`described envelope below target at x = ${x}: log f = ${lf}, log envelope = ${logEnvelope}`);
    if (!(logSqueeze <= lf + tolerance(lf, logSqueeze))) fail(`described squeeze above target at x = ${x}: log f = ${lf}, log squeeze = ${logSqueeze}`);
  }
  // drawing checks every evaluation against the bounds; a violation would throw
  s.fill(new Float64Array(3000));
}

type Make = (u: readonly number[]) => { t: Target; extra: number[] };

/** normal(mean ±1e6, sd 1e-6..1e6); extra points at mean + sd·z, z in [−40, 40] (the tails). */
const normalCase: Make = (u) => {
  const mean = lerp(-1e6, 1e6, u[0]);
  const sd = logUniform(1e-6, 1e6, u[1]);
  return { t: normalTarget(mean, sd), extra: [u[2], u[3], u[4]].map((v) => mean + sd * lerp(-40, 40, v)) };
};
/** gamma(shape 1..1e4, rate 0.1..10); extra points in the bulk, the far right tail and towards 0. */
const gammaCase: Make = (u) => {
  const shape = logUniform(1, 1e4, u[0]);
  const rate = logUniform(0.1, 10, u[1]);
  const mean = shape / rate;
  const sd = Math.sqrt(shape) / rate;
  return { t: gammaTarget(shape, rate), extra: [mean + sd * lerp(-5, 40, u[2]), mean * Math.pow(10, -8 * u[3]), mean + sd * lerp(-3, 3, u[4])].map((x) => Math.max(1e-300, x)) };
};
/** beta(a, b in 1..1e3); extra points near both ends. */
const betaCase: Make = (u) => {
  const a = logUniform(1, 1e3, u[0]);
  const b = logUniform(1, 1e3, u[1]);
  return { t: betaTarget(a, b), extra: [Math.pow(10, -12 * u[2]), 1 - Math.pow(10, -12 * u[3]), u[4]] };
};
/** A normal truncated to a random window, possibly far in the tail. */
const truncatedCase: Make = (u) => {
  const lower = lerp(-3, 9, u[0]);
  const upper = u[1] < 0.3 ? Infinity : lower + logUniform(0.01, 10, u[1]);
  return { t: truncate(normalTarget(0, 1), lower, upper), extra: [lower + u[2] * 0.1, lower + 20 * u[3], lower + 1e-9 * u[4]] };
};
/** Student-t(df 1..30), inverse-sqrt only; extra points far out. */
const studentCase: Make = (u) => {
  const df = logUniform(1, 30, u[0]);
  const loc = lerp(-1e3, 1e3, u[1]);
  const scale = logUniform(1e-3, 1e3, u[2]);
  return { t: studentTTarget(df, loc, scale), extra: [loc + scale * lerp(-1e4, 1e4, u[3]), loc + scale * lerp(-5, 5, u[4])] };
};

function property(make: Make, opts: TableSamplerOptions, seed: number): void {
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 5, maxLength: 5 }),
      fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 40, maxLength: 40 }),
      fc.integer({ min: 8, max: 3000 }),
      (p, u, strips) => {
        const { t, extra } = make(p);
        check(t, { ...opts, strips }, u, extra);
      },
    ),
    { numRuns: RUNS, seed: seed + SEED_OFFSET },
  );
}

describe('tableSampler envelope properties (fast-check)', () => {
  for (const transform of ['log', 'inverse-sqrt'] as const) {
    it(`tableSampler(normal) strip envelope >= target >= strip squeeze (${transform})`, () => {
      property(normalCase, { transform }, 301);
    });
    it(`tableSampler(gamma) strip envelope >= target >= strip squeeze (${transform})`, () => {
      property(gammaCase, { transform }, 302);
    });
    it(`tableSampler(beta) strip envelope >= target >= strip squeeze (${transform})`, () => {
      property(betaCase, { transform }, 303);
    });
    it(`tableSampler(truncate(normal)) strip envelope >= target >= strip squeeze (${transform})`, () => {
      property(truncatedCase, { transform }, 304);
    });
  }
  it('tableSampler(studentT) strip envelope >= target >= strip squeeze (inverse-sqrt, tangent and secant hulls)', () => {
    property(studentCase, { transform: 'inverse-sqrt' }, 305);
    property(studentCase, { transform: 'inverse-sqrt', derivativeFree: true }, 306);
  });
  it('tableSampler(normal, gamma; secant hull, random tail mass) strip envelope >= target >= strip squeeze', () => {
    property(normalCase, { derivativeFree: true, tailMass: 1e-3 }, 307);
    property(gammaCase, { derivativeFree: true, tailMass: 1e-8 }, 308);
  });
});

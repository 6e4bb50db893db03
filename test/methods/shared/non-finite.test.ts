/**
 * One answer for every method: a logDensity that returns a value that is not
 * a number (here `undefined`, as from a function that forgets to return on
 * part of its domain), NaN or +Infinity is reported as NonFiniteDensityError,
 * at setup or at the first draw-time evaluation that sees it — never as
 * silently lost mass.
 */
import { describe, expect, it } from 'vitest';
import {
  NonFiniteDensityError,
  adaptiveRejectionSampler,
  exactSampler,
  findLogBound,
  normalTarget,
  piecewiseSampler,
  ratioOfUniformsSampler,
  rejectionSampler,
  tableSampler,
  truncate,
  uniformProposal,
} from '../../../src/index.js';
import type { Sampler, Target } from '../../../src/index.js';

/** A truncated normal on [0, 1] whose logDensity returns `bad` on (lo, hi). */
function holed(bad: unknown, lo: number, hi: number): Target {
  const base = truncate(normalTarget(0.5, 0.3), 0, 1);
  return {
    logDensity: (x: number) => (x > lo && x < hi ? (bad as number) : base.logDensity(x)),
    dLogDensity: (x: number) => (base.dLogDensity as (x: number) => number)(x),
    support: [0, 1],
    mode: 0.5,
  };
}

const makers: [string, (t: Target) => Sampler][] = [
  ['rejectionSampler (uniform proposal, given bound)', (t) => rejectionSampler(t, { proposal: uniformProposal(0, 1), logBound: 0.5, seed: 1 })],
  ['rejectionSampler (uniform proposal, found bound)', (t) => rejectionSampler(t, { proposal: uniformProposal(0, 1), seed: 1 })],
  ['adaptiveRejectionSampler', (t) => adaptiveRejectionSampler(t, { seed: 1 })],
  ['adaptiveRejectionSampler (derivative-free)', (t) => adaptiveRejectionSampler(t, { seed: 1, derivativeFree: true })],
  ['adaptiveRejectionSampler ({ fast: true })', (t) => adaptiveRejectionSampler(t, { seed: 1, fast: true })],
  ['tableSampler', (t) => tableSampler(t, { seed: 1 })],
  ['piecewiseSampler', (t) => piecewiseSampler(t, { seed: 1 })],
  ['piecewiseSampler ({ fast: true })', (t) => piecewiseSampler(t, { seed: 1, fast: true })],
  ['ratioOfUniformsSampler', (t) => ratioOfUniformsSampler(t, { seed: 1 })],
  ['exactSampler', (t) => exactSampler(t, { seed: 1 })],
];

/** Builds and draws up to 200,000 values; returns the error thrown (setup or draw), or undefined. */
function firstError(make: () => Sampler): unknown {
  try {
    const s = make();
    const out = new Float64Array(20_000);
    for (let k = 0; k < 10; k++) s.fill(out);
  } catch (e) {
    return e;
  }
  return undefined;
}

describe('every method reports a logDensity value that is not a finite number or -Infinity', () => {
  // The hole (0.3, 0.5) holds about a quarter of the mass of this target, so every
  // method either evaluates inside it at setup or proposes there within the
  // first few hundred draws; a method that accepted from its squeeze forever
  // without evaluating would be a missing check, and fails here.
  for (const bad of [undefined, NaN, Infinity, null, '0.5'] as const) {
    for (const [name, make] of makers) {
      it(`${name}: logDensity returning ${typeof bad === 'string' ? `'${bad}'` : String(bad)} on (0.3, 0.5) throws NonFiniteDensityError`, () => {
        const e = firstError(() => make(holed(bad, 0.3, 0.5)));
        expect(e, name).toBeInstanceOf(NonFiniteDensityError);
        const x = (e as NonFiniteDensityError).x;
        expect(x > 0.3 && x < 0.5, `${name}: reported at x = ${x}`).toBe(true);
      });
    }
  }

  it('findLogBound: logDensity returning undefined at its search points throws NonFiniteDensityError', () => {
    expect(() => findLogBound(holed(undefined, 0.3, 0.7), uniformProposal(0, 1))).toThrow(NonFiniteDensityError);
  });

  it('rejectionSampler (uniform proposal): the narrow hole of issue 15, undefined on (0.3, 0.31), is reported, not dropped', () => {
    // before the fix: 0 of 200,000 draws in (0.3, 0.31) and no error (about 762 were due)
    const e = firstError(() => rejectionSampler(holed(undefined, 0.3, 0.31), { proposal: uniformProposal(0, 1), logBound: 0.5, seed: 3 }));
    expect(e).toBeInstanceOf(NonFiniteDensityError);
  });

  it('rejectionSampler and ratioOfUniformsSampler: a squeeze returning undefined throws NonFiniteDensityError naming the squeeze', () => {
    const t = truncate(normalTarget(0.5, 0.3), 0, 1);
    const sq = (x: number): number => (x > 0.3 && x < 0.5 ? (undefined as unknown as number) : -50);
    const e1 = firstError(() => rejectionSampler(t, { proposal: uniformProposal(0, 1), squeeze: sq, seed: 1 }));
    expect(e1).toBeInstanceOf(NonFiniteDensityError);
    expect(String((e1 as Error).message)).toContain('(squeeze)');
    const e2 = firstError(() => ratioOfUniformsSampler(t, { squeeze: sq, seed: 1 }));
    expect(e2).toBeInstanceOf(NonFiniteDensityError);
    expect(String((e2 as Error).message)).toContain('(squeeze)');
  });
});
